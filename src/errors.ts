// Errors a user can act on. The CLI prints `message` as one line and exits 2;
// anything else is a bug and keeps its stack trace.

/** Bad input: a file, a line, a parameter or an option the user supplied. */
export class InputError extends Error {
  override readonly name = "InputError";
  constructor(message: string) {
    // One line however the message was assembled: a file name or parameter may hold a newline.
    super(oneLine(message));
  }
}

/** An input error that knows where it happened, e.g. `graphs.g6:12: truncated graph6 line`. */
export function inputErrorAt(where: string | undefined, line: number | undefined, problem: string): InputError {
  const place = where === undefined ? "" : line === undefined ? `${where}: ` : `${where}:${line}: `;
  return new InputError(`${place}${problem}`);
}

/** A parameter outside its valid range, named the way the user wrote it. */
export function invalidParameter(owner: string, name: string, expected: string, got: unknown): InputError {
  return new InputError(`${owner}: invalid \`${name}\`: ${expected} (got ${echo(got)})`);
}

/**
 * A value quoted for a one-line message: JSON (so control characters come out escaped) and, past
 * `max` characters, cut with the full length said, so a 100 KB spec is not echoed in full.
 */
export function echo(value: unknown, max = 120): string {
  let text: string;
  try {
    text = JSON.stringify(value) ?? String(value);
  } catch {
    text = String(value);
  }
  return text.length <= max ? text : `${text.slice(0, max)}... (${text.length} characters)`;
}

/** Longest message the CLI prints; the rest is cut with a note. */
export const MAX_MESSAGE_LENGTH = 2000;

/** A message as one printable line: control characters escaped (a file name may hold a newline), long ones cut. */
export function oneLine(message: string): string {
  // eslint-disable-next-line no-control-regex
  const flat = message.replace(/[\u0000-\u001f\u007f]/g, (c) => (c === "\n" ? "\\n" : c === "\t" ? "\\t" : c === "\r" ? "\\r" : `\\x${c.charCodeAt(0).toString(16).padStart(2, "0")}`));
  return flat.length <= MAX_MESSAGE_LENGTH ? flat : `${flat.slice(0, MAX_MESSAGE_LENGTH)}... (message cut at ${MAX_MESSAGE_LENGTH} characters)`;
}

export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError;
}
