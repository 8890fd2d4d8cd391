// What the commands that run solvers share besides the source options: the options they refuse
// (with a pointer to the right one) and when to show progress.
import type { ParsedArgs } from "../args.js";

/** Options refused by a command that runs solvers, each with what to use instead. */
export const SOLVER_REFUSALS: Readonly<Record<string, string>> = {
  seed: "ambiguous: use --solver-seed N for the randomised solvers, or --graph-seed N (or seed= in the spec) for a random family's graph",
  method: "renamed --effort (auto, exact, heuristic or quick)",
};

/** --progress, --no-progress, or by default only when stderr is a terminal. */
export function progressWanted(args: ParsedArgs, stderr: NodeJS.WritableStream): boolean {
  const p = args.options["progress"];
  return p === true || (p === undefined && (stderr as NodeJS.WriteStream).isTTY === true);
}

/** One line of stage progress: rewritten in place on a terminal, a line of its own otherwise. */
export function writeStage(stderr: NodeJS.WritableStream, label: string, text: string): void {
  const line = `${label}: ${text}`;
  stderr.write((stderr as NodeJS.WriteStream).isTTY === true ? `\r\x1b[2K${line}` : `${line}\n`);
}
