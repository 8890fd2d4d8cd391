// sparse6 (nauty's formats.txt): ':' N(n) then (b, x) pairs of 1 + k bits, k = bits of n−1,
// read with a current vertex v (b = 1: v += 1; x > v: v = x; else edge {x, v}), padded with
// ones to whole characters (a 0 first when n = 2^k and the padding could read as a loop).
// Decoding is strict: after the last edge only ≤ 5 bits of that padding may follow (encoders jump
// v only to reach an edge), so most truncations and corruptions are errors. A line cut exactly
// where the rest is itself a complete encoding cannot be caught: sparse6 carries no edge count.

import { InputError, inputErrorAt } from "../../errors.js";
import { EdgeBuffer, MAX_VERTICES as MAX_BUILD_VERTICES, type BuildOptions, type BuildResult } from "../builder.js";
import type { Graph } from "../graph.js";
import { encodeGraphSize, graphSizeFieldLength, readGraphSize } from "./graph-size.js";
import { asBytes, hasPrefix } from "./scan.js";
import { checkMemory, graphBuildBytes } from "../../limits/memory.js";
import { DEFAULT_FILE_NAME, type Where } from "./types.js";
import { assertUnitWeights } from "./unweighted.js";

export const SPARSE6_HEADER = ">>sparse6<<";
const MAX_N = 0x7fffffff;
const MAX_TEXT = 2 ** 29 - 64;

/** Bits needed to write n − 1 in binary (0 for n ≤ 1): the width of x in every pair. */
export function sparse6Width(n: number): number {
  let k = 0;
  for (let x = n - 1; x > 0; x = Math.floor(x / 2)) k++;
  return k;
}

function charName(c: number): string {
  return c >= 32 && c < 127 ? JSON.stringify(String.fromCharCode(c)) : `byte 0x${c.toString(16).padStart(2, "0")}`;
}

/** Bit `pos` of the 6-bit data starting at byte p0. */
function bitAt(buf: Uint8Array, p0: number, pos: number): number {
  const q = Math.floor(pos / 6);
  return ((buf[p0 + q] - 63) >>> (5 - (pos - 6 * q))) & 1;
}

/** The bits [from, total) are valid padding: at most 5 bits, an optional 0 and then only 1s. */
function isPadding(buf: Uint8Array, p0: number, from: number, total: number): boolean {
  if (total - from > 5) return false;
  let pos = from;
  if (pos < total && bitAt(buf, p0, pos) === 0) pos++;
  for (; pos < total; pos++) if (bitAt(buf, p0, pos) !== 1) return false;
  return true;
}

/**
 * Decode the sparse6 line in buf[dataStart, end), where buf[dataStart] is ':'. Loops and
 * repeated edges (legal in sparse6) follow `build`; by default they are errors.
 */
export function decodeSparse6(
  buf: Uint8Array,
  lineStart: number,
  dataStart: number,
  end: number,
  where: Where = {},
  build: BuildOptions = {},
): BuildResult {
  const source = where.file ?? DEFAULT_FILE_NAME;
  const fail = (problem: string) => inputErrorAt(source, where.line, problem);
  if (dataStart >= end || buf[dataStart] !== 58) throw fail("a sparse6 line must start with ':'");
  for (let p = dataStart + 1; p < end; p++) {
    const c = buf[p];
    if (c < 63 || c > 126) throw fail(`invalid sparse6 character ${charName(c)} at column ${p - lineStart + 1}`);
  }
  const sizeLen = graphSizeFieldLength(buf, dataStart + 1, end);
  if (sizeLen === 0) throw fail("truncated sparse6 line: the size field N(n) is incomplete");
  const n = readGraphSize(buf, dataStart + 1, sizeLen);
  if (n > MAX_N - 1) throw fail(`sparse6 graph has n = ${n} vertices; halfplus graphs have fewer than 2^31`);
  const k = sparse6Width(n);
  const p0 = dataStart + 1 + sizeLen;
  const total = 6 * (end - p0);
  const edges = new EdgeBuffer({ capacity: Math.floor(total / (k + 1)) });

  let q = p0; // next byte to load
  let acc = 0; // current byte's 6-bit value
  let left = 0; // bits of acc not yet consumed
  let consumed = 0;
  let v = 0;
  let afterLastEdge = 0; // bit after the last edge's pair: everything from here must be padding
  let outOfRange = -1; // start of a pair pointing past the last vertex
  while (total - consumed >= k + 1) {
    const pairStart = consumed;
    if (left === 0) {
      acc = buf[q++] - 63;
      left = 6;
    }
    left--;
    const b = (acc >>> left) & 1;
    let x = 0;
    let need = k;
    while (need > 0) {
      if (left === 0) {
        acc = buf[q++] - 63;
        left = 6;
      }
      const take = need < left ? need : left;
      left -= take;
      x = x * (1 << take) + ((acc >>> left) & ((1 << take) - 1));
      need -= take;
    }
    consumed += k + 1;
    if (b === 1) v++;
    if (x >= n || v >= n) {
      outOfRange = pairStart; // only padding can point past the last vertex
      break;
    }
    if (x > v) v = x;
    else {
      edges.add(x, v);
      afterLastEdge = consumed;
    }
  }
  if (!isPadding(buf, p0, afterLastEdge, total)) {
    let problem = "corrupt sparse6 line: the bits after the last edge are not valid padding";
    if (outOfRange >= 0 && outOfRange < total - 5) {
      problem = `corrupt sparse6 line: vertex number out of range (n = ${n}) at bit ${outOfRange} of ${total}`;
    } else if (total - afterLastEdge > 5) {
      problem = `truncated or corrupt sparse6 line: ${total - afterLastEdge} bits follow the last edge, but padding is at most 5`;
    }
    throw fail(problem);
  }
  const place = where.line === undefined ? source : `${source}:${where.line}`;
  // A few bytes can declare n = 10^8: size the graph before building it.
  checkMemory(graphBuildBytes(n, edges.length, false), `${place}: sparse6 graph with n = ${n}`);
  if (n > MAX_BUILD_VERTICES) throw fail(`sparse6 graph has n = ${n} vertices; halfplus graphs have at most ${MAX_BUILD_VERTICES.toExponential(0)}`);
  return edges.build(n, { ...build, describeEdge: (i) => `${place}: sparse6 edge ${i + 1}` });
}

/** Parse one sparse6 line (an optional `>>sparse6<<` prefix and a trailing newline are allowed). */
export function parseSparse6(line: string | Uint8Array, where: Where = {}, build: BuildOptions = {}): Graph {
  const buf = asBytes(line);
  let end = buf.length;
  if (end > 0 && buf[end - 1] === 10) end--;
  if (end > 0 && buf[end - 1] === 13) end--;
  let start = 0;
  if (hasPrefix(buf, 0, end, SPARSE6_HEADER)) start = SPARSE6_HEADER.length;
  if (start < end && buf[start] === 59) {
    throw inputErrorAt(where.file ?? DEFAULT_FILE_NAME, where.line, "incremental sparse6 (a line starting with ';') is not supported");
  }
  return decodeSparse6(buf, 0, start, end, where, build).graph;
}

/** sparse6 bytes of g, ':' included (no header, no newline); edge order and padding as nauty writes them. */
export function sparse6Bytes(g: Graph): Uint8Array {
  assertUnitWeights(g, "sparse6");
  const n = g.n;
  const k = sparse6Width(n);
  const size = encodeGraphSize(n);
  // Every edge takes at least 1 + k bits and at most 2 + 2k (b=1, x=v, b=0, x=u).
  if (1 + size.length + Math.ceil((g.m * (k + 1)) / 6) > MAX_TEXT) {
    throw new InputError(`sparse6 of a graph with ${g.m} edges would exceed the longest string Node can hold`);
  }
  const cap = 1 + size.length + Math.ceil((g.m * (2 * k + 2)) / 6) + 1;
  const out = new Uint8Array(cap);
  out[0] = 58;
  for (let i = 0; i < size.length; i++) out[1 + i] = size.charCodeAt(i);
  let p = 1 + size.length;
  let x = 0; // bits of the character being filled
  let room = 6; // bits still free in it
  const put = (bit: number): void => {
    x = (x << 1) | bit;
    if (--room === 0) {
      out[p++] = 63 + x;
      room = 6;
      x = 0;
    }
  };
  const putWide = (value: number): void => {
    for (let r = k - 1; r >= 0; r--) put((value >>> r) & 1);
  };
  const { offsets, neighbors } = g;
  let last = 0;
  for (let j = 0; j < n; j++) {
    for (let a = offsets[j]; a < offsets[j + 1]; a++) {
      const i = neighbors[a];
      if (i > j) break; // sorted lists: edges {i, j} with i < j come first
      if (j === last) put(0);
      else {
        put(1);
        if (j > last + 1) {
          putWide(j);
          put(0);
        }
        last = j;
      }
      putWide(i);
    }
  }
  if (room !== 6) {
    // Ones, unless n = 2^k and the pad would decode as the loop {n−1, n−1} after v = n−2.
    if (room >= k + 1 && last === n - 2 && n === 2 ** k) x = (x << room) | ((1 << (room - 1)) - 1);
    else x = (x << room) | ((1 << room) - 1);
    out[p++] = 63 + x;
  }
  if (p > MAX_TEXT) throw new InputError(`sparse6 of a graph with ${g.m} edges would exceed the longest string Node can hold`);
  return out.subarray(0, p);
}

/** sparse6 text of g (no newline), optionally with the `>>sparse6<<` header in front. */
export function encodeSparse6(g: Graph, header = false): string {
  const b = sparse6Bytes(g);
  const text = Buffer.from(b.buffer, b.byteOffset, b.length).toString("latin1");
  return header ? SPARSE6_HEADER + text : text;
}
