// Writing results to stdout with back-pressure, so a stream of 10^6 graphs through
// `halfplus graph -` runs in constant memory.
export function writeLine(out: NodeJS.WritableStream, line: string): Promise<void> | void {
  if (out.write(line + "\n")) return;
  return new Promise((resolve) => out.once("drain", () => resolve()));
}
