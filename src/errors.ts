// Errors a user can act on. The CLI prints `message` as one line and exits 2;
// anything else is a bug and keeps its stack trace.

/** Bad input: a file, a line, a parameter or an option the user supplied. */
export class InputError extends Error {
  override readonly name = "InputError";
  constructor(message: string) {
    super(message);
  }
}

/** An input error that knows where it happened, e.g. `graphs.g6:12: truncated graph6 line`. */
export function inputErrorAt(where: string | undefined, line: number | undefined, problem: string): InputError {
  const place = where === undefined ? "" : line === undefined ? `${where}: ` : `${where}:${line}: `;
  return new InputError(`${place}${problem}`);
}

/** A parameter outside its valid range, named the way the user wrote it. */
export function invalidParameter(owner: string, name: string, expected: string, got: unknown): InputError {
  return new InputError(`${owner}: invalid \`${name}\`: ${expected} (got ${JSON.stringify(got)})`);
}

export function isInputError(e: unknown): e is InputError {
  return e instanceof InputError;
}
