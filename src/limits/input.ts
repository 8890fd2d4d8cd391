// Caps on how much input a reader takes in before it refuses, so that /dev/zero, a runaway pipe
// or a lying header ends in a one-line error naming the input instead of gigabytes of memory.

import { createReadStream, statSync } from "node:fs";
import { InputError } from "../errors.js";
import { checkMemory, formatBytes } from "./memory.js";

/**
 * Longest graph6/sparse6 line (256 MiB): graph6 up to about 56,000 vertices, sparse6 up to about
 * 10^8 edges. A nauty stream may hold any number of lines; each is decoded on its own.
 */
export const MAX_LINE_BYTES = 2 ** 28;

/** Largest whole-file input (edge list, gset, DIMACS): one Buffer, whose length Node caps at 2^32 − 1. */
export const MAX_WHOLE_FILE_BYTES = 2 ** 32 - 1;

/** Describe why a path cannot be read as input, or null when it is a regular file or a pipe. */
export function unreadableKind(path: string): string | null {
  let st;
  try {
    st = statSync(path);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    return code === "ENOENT" ? "no such file" : code === "EACCES" ? "permission denied" : `cannot read (${code ?? String(e)})`;
  }
  if (st.isDirectory()) return "is a directory";
  if (st.isFile() || st.isFIFO()) return null;
  return "is not a regular file (a device or socket); use - to read standard input";
}

/**
 * The whole of a text input ("-": standard input) as UTF-8, refused beyond `maxBytes` with a
 * message naming it and `what` it was meant to hold.
 */
export async function readTextInput(path: string, stdin: NodeJS.ReadableStream, maxBytes: number, what: string): Promise<string> {
  const name = path === "-" ? "stdin" : path;
  if (path !== "-") {
    const why = unreadableKind(path);
    if (why !== null) throw new InputError(`${path}: ${why}`);
  }
  const stream = path === "-" ? stdin : createReadStream(path);
  const chunks: Buffer[] = [];
  let size = 0;
  try {
    for await (const c of stream) {
      const b = typeof c === "string" ? Buffer.from(c) : (c as Buffer);
      size += b.length;
      if (size > maxBytes) throw new InputError(`${name}: ${what} input is larger than ${formatBytes(maxBytes)}; split it into smaller files`);
      if (size > 2 ** 26 && (size & (2 ** 26 - 1)) < b.length) checkMemory(3 * size, name);
      chunks.push(b);
    }
  } catch (e) {
    if (e instanceof InputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    if (typeof code === "string") throw new InputError(`${name}: cannot read (${code})`);
    throw e;
  } finally {
    if (path !== "-") (stream as NodeJS.ReadableStream & { destroy(): void }).destroy();
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(Buffer.concat(chunks, size));
  } catch {
    throw new InputError(`${name}: ${what} input is not valid UTF-8 text`);
  }
}
