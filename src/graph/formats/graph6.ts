// graph6 (nauty's formats.txt): N(n) then the upper triangle of the adjacency matrix in
// column order a(0,1) a(0,2) a(1,2) a(0,3) ..., six bits per character (+63), zero-padded.
// Decoding is strict: the length must be exact, every byte in 63..126, the padding zero.

import { InputError, inputErrorAt } from "../../errors.js";
import { buildGraph } from "../builder.js";
import type { Graph } from "../graph.js";
import { encodeGraphSize, graphSizeFieldLength, readGraphSize } from "./graph-size.js";
import { asBytes, hasPrefix } from "./scan.js";
import { DEFAULT_FILE_NAME, type Where } from "./types.js";
import { assertUnitWeights } from "./unweighted.js";

export const GRAPH6_HEADER = ">>graph6<<";
/** Largest n a Graph can hold (builder limit), checked before any allocation. */
const MAX_N = 0x7fffffff;
/** V8's longest string is about 2^29 characters; refuse clearly before trying. */
const MAX_TEXT = 2 ** 29 - 64;
const SMALL_EDGES = 256;

function charName(c: number): string {
  return c >= 32 && c < 127 ? JSON.stringify(String.fromCharCode(c)) : `byte 0x${c.toString(16).padStart(2, "0")}`;
}

/**
 * Decode the graph6 data in buf[dataStart, end) (header already removed); `lineStart` is where
 * the line began, so columns in messages count from the real line start.
 */
export function decodeGraph6(buf: Uint8Array, lineStart: number, dataStart: number, end: number, where: Where = {}): Graph {
  const source = where.file ?? DEFAULT_FILE_NAME;
  const fail = (problem: string) => inputErrorAt(source, where.line, problem);
  if (dataStart >= end) throw fail("empty graph6 line");
  for (let p = dataStart; p < end; p++) {
    const c = buf[p];
    if (c < 63 || c > 126) throw fail(`invalid graph6 character ${charName(c)} at column ${p - lineStart + 1}`);
  }
  const sizeLen = graphSizeFieldLength(buf, dataStart, end);
  if (sizeLen === 0) throw fail("truncated graph6 line: the size field N(n) is incomplete");
  const n = readGraphSize(buf, dataStart, sizeLen);
  if (n > MAX_N - 1) throw fail(`graph6 graph has n = ${n} vertices; halfplus graphs have fewer than 2^31`);
  const bits = (n * (n - 1)) / 2;
  const need = Math.ceil(bits / 6);
  const p0 = dataStart + sizeLen;
  const have = end - p0;
  if (have !== need) {
    const what = have < need ? "truncated graph6 line" : "graph6 line too long";
    throw fail(`${what}: n = ${n} needs ${need} data characters after the size field, found ${have}`);
  }
  const padBits = need * 6 - bits;
  if (padBits > 0 && ((buf[end - 1] - 63) & ((1 << padBits) - 1)) !== 0) {
    throw fail("corrupt graph6 line: the padding bits of the last character are not zero");
  }
  let m = 0;
  for (let p = p0; p < end; p++) {
    let x = buf[p] - 63;
    while (x !== 0) {
      x &= x - 1;
      m++;
    }
  }
  // Small graphs (the bulk of a nauty stream) get plain arrays: far cheaper to allocate than
  // typed arrays with their own backing stores. Large ones get compact typed arrays.
  const us: number[] | Int32Array = m <= SMALL_EDGES ? new Array<number>(m) : new Int32Array(m);
  const vs: number[] | Int32Array = m <= SMALL_EDGES ? new Array<number>(m) : new Int32Array(m);
  let k = 0;
  // Walk the bits in column order: (i, j) runs (0,1) (0,2) (1,2) (0,3) ...
  let i = 0;
  let j = 1;
  for (let p = p0; p < end; p++) {
    const x = buf[p] - 63;
    if (x === 0) {
      // Six absent pairs: advance (i, j) without testing bits.
      i += 6;
      while (i >= j) {
        i -= j;
        j++;
      }
      continue;
    }
    for (let mask = 32; mask !== 0; mask >>>= 1) {
      if ((x & mask) !== 0) {
        us[k] = i;
        vs[k] = j;
        k++;
      }
      if (++i === j) {
        j++;
        i = 0;
      }
    }
  }
  // Edges from a bit matrix are distinct, non-loop and in range; the builder still checks.
  return buildGraph(n, us, vs).graph;
}

/** Parse one graph6 line (an optional `>>graph6<<` prefix and a trailing newline are allowed). */
export function parseGraph6(line: string | Uint8Array, where: Where = {}): Graph {
  const buf = asBytes(line);
  let end = buf.length;
  if (end > 0 && buf[end - 1] === 10) end--;
  if (end > 0 && buf[end - 1] === 13) end--;
  let start = 0;
  if (hasPrefix(buf, 0, end, GRAPH6_HEADER)) start = GRAPH6_HEADER.length;
  return decodeGraph6(buf, 0, start, end, where);
}

/** graph6 bytes of g (no header, no newline). */
export function graph6Bytes(g: Graph): Uint8Array {
  assertUnitWeights(g, "graph6");
  const n = g.n;
  const size = encodeGraphSize(n);
  const bits = (n * (n - 1)) / 2;
  const dataLen = Math.ceil(bits / 6);
  if (size.length + dataLen > MAX_TEXT) {
    throw new InputError(`graph6 of a graph with n = ${n} would take ${size.length + dataLen} characters; write sparse6 instead`);
  }
  const out = Buffer.alloc(size.length + dataLen);
  for (let k = 0; k < size.length; k++) out[k] = size.charCodeAt(k);
  const base = size.length;
  const { offsets, neighbors } = g;
  for (let v = 1; v < n; v++) {
    const col = (v * (v - 1)) / 2;
    for (let a = offsets[v]; a < offsets[v + 1]; a++) {
      const u = neighbors[a];
      if (u >= v) break; // sorted lists: the rest lie below the diagonal
      const idx = col + u;
      const q = Math.floor(idx / 6);
      out[base + q] |= 32 >>> (idx - 6 * q);
    }
  }
  for (let k = base; k < out.length; k++) out[k] += 63;
  return out;
}

/** Longest text encodeGraph6 builds from character codes (an argument list that stays small). */
const SHORT_TEXT = 256;

/** graph6 text of g (no newline), optionally with the `>>graph6<<` header in front. */
export function encodeGraph6(g: Graph, header = false): string {
  const bytes = graph6Bytes(g);
  // Short texts (a sweep embeds one per small graph) as character codes: no Buffer copy and decode.
  const text = bytes.length <= SHORT_TEXT ? String.fromCharCode.apply(null, bytes as unknown as number[]) : Buffer.from(bytes).toString("latin1");
  return header ? GRAPH6_HEADER + text : text;
}
