// The vertex-count field N(n) shared by graph6 and sparse6 (nauty's formats.txt): one byte
// n+63 for n ≤ 62; 126 then 18 bits in 3 bytes for n ≤ 258047; 126 126 then 36 bits in 6 bytes
// for n ≤ 2^36 − 1. Each 6-bit group is stored as its value + 63, most significant first.

import { InputError } from "../../errors.js";

export const MAX_GRAPH_SIZE_FIELD = 68719476735; // 2^36 − 1
const BIAS = 63;

/** N(n) as text: 1, 4 or 8 characters. */
export function encodeGraphSize(n: number): string {
  if (!Number.isInteger(n) || n < 0 || n > MAX_GRAPH_SIZE_FIELD) {
    throw new InputError(`graph6/sparse6 size field: n must be an integer in [0, 2^36 - 1] (got ${n})`);
  }
  if (n <= 62) return String.fromCharCode(n + BIAS);
  if (n <= 258047) {
    return String.fromCharCode(126, ((n >>> 12) & 63) + BIAS, ((n >>> 6) & 63) + BIAS, (n & 63) + BIAS);
  }
  // 36 bits exceed 32-bit shifts: peel 6-bit groups with exact float division (n < 2^53).
  const codes = [126, 126];
  for (let shift = 30; shift >= 0; shift -= 6) codes.push((Math.floor(n / 2 ** shift) % 64) + BIAS);
  return String.fromCharCode(...codes);
}

/** Length of the N(n) field starting at pos (1, 4 or 8, from its leading bytes), or 0 if the line ends first. */
export function graphSizeFieldLength(buf: Uint8Array, pos: number, end: number): number {
  if (pos >= end) return 0;
  let len = 1;
  if (buf[pos] === 126) len = pos + 1 < end && buf[pos + 1] === 126 ? 8 : 4;
  return pos + len <= end ? len : 0;
}

/** Value of the N(n) field of length `len` at pos, or -1 if one of its bytes is outside 63..126. */
export function readGraphSize(buf: Uint8Array, pos: number, len: number): number {
  const first = len === 1 ? pos : len === 4 ? pos + 1 : pos + 2;
  let n = 0;
  for (let i = first; i < pos + len; i++) {
    const c = buf[i] - BIAS;
    if (c < 0 || c > 63) return -1;
    n = n * 64 + c;
  }
  return n;
}

/** Decode N(n) from text (for tests and tools); throws on malformed input. */
export function decodeGraphSize(text: string): number {
  const buf = Buffer.from(text, "latin1");
  const len = graphSizeFieldLength(buf, 0, buf.length);
  if (len === 0) throw new InputError(`graph6/sparse6 size field: truncated (${JSON.stringify(text)})`);
  const n = readGraphSize(buf, 0, len);
  if (n < 0) throw new InputError(`graph6/sparse6 size field: invalid character in ${JSON.stringify(text)}`);
  return n;
}
