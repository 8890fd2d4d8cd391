// The compact form of a tree certificate's regions (`packed` in an `sdp-tree` certificate). A closed
// ER_7 search leaves tens of thousands of regions; as JSON arrays each one repeated its whole path
// of fixings and wrote every dual entry as 17–19 decimal digits (about 30 MB in all). Here:
//
// - Regions in preorder of their paths (sorted), each path written relative to the one before: how
//   many fixings it keeps, then its new fixings as 2·vertex + side. In preorder the kept prefix is
//   the path to the common ancestor, so each tree edge is written about once.
// - Numbers as bytes: counts, vertices, bounds and triangle indices as LEB128 varints (the bound
//   zigzagged); shift and μ as IEEE 754 doubles, bit for bit.
// - The dual vector y at a fixed precision where that still proves the region's bound: each y_i is
//   rounded up to a multiple of 2^−k and written as the integer y_i·2^k (zigzag varint), k chosen
//   per region (the coarsest of PRECISIONS that works; 0 = doubles, bit for bit). Rounding y up
//   only adds a non-negative diagonal, so Diag(y') + shift·I − L − 4Σμ_t A_t ⪰ 0 still holds in exact
//   arithmetic; the bound ¼(Σy' + n·shift) + Σμ_t grows by at most n·2^−k/4. The encoder does not
//   rely on that argument: it re-proves each rounded certificate exactly as verify will (the same
//   reduced problem, `verifyTriangleCertificate`, the same rounding to the region's bound) and
//   keeps it only when it proves the region's bound; else the next finer k, else doubles. Decoding
//   is exact (an integer times a power of two), so verify re-proves the very certificate the
//   encoder proved, from the graph alone.
// - The byte string deflated (raw deflate, fixed level: equal certificates give equal text) and
//   written as base64 inside the JSON record, with its length before and after deflate.
//
// Decoding checks the shape only (every read in bounds, nothing left over, vertices below n, sides
// 0/1, finite numbers, the counts the JSON states) and refuses anything else with one line; what
// the numbers prove is checked by `verifyTreeCertificate` as for the plain form. Formats and
// encodings (LEB128, zigzag, raw deflate, base64) are common practice, no source.

import { deflateRawSync, inflateRawSync } from "node:zlib";
import { InputError } from "../../errors.js";
import { checkMemory } from "../../limits/memory.js";
import { floorCutBound } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { roundUp } from "../../linalg/float-rounding.js";
import { verifyTriangleCertificate } from "../relaxation/triangle-dual.js";
import { nodeParity, oddDegreeVertices, parityFloor } from "./parity.js";
import { reducedProblem } from "./reduced-graph.js";
import type { TreeCertificate, TreeRegion } from "./relaxation-tree.js";

/** The one format this build writes and reads; a new layout gets a new name. */
export const TREE_PACKING_FORMAT = "halfplus/tree-regions-1";

export interface PackedTreeRegions {
  format: typeof TREE_PACKING_FORMAT;
  /** How many regions the data holds. */
  regions: number;
  /** Length of the byte string before deflate. */
  bytes: number;
  /** The deflated byte string, base64. */
  data: string;
}

const KIND_EXHAUSTIVE = 0;
const KIND_TRIANGLE = 1;

/**
 * The precisions tried for y, coarsest first: y_i as a multiple of 2^−k. On ER_7 (plain node
 * bound) most regions take 2^−8 or coarser: two bytes per entry instead of eight.
 */
const PRECISIONS = [2, 4, 6, 8, 10, 12, 16, 20, 26, 32, 40];
/** The largest k a decoder accepts (y·2^k must stay an exact integer below 2^53). */
const MOST_PRECISION = 52;

/**
 * y rounded up to multiples of 2^−k, or null when some |y_i|·2^k is not below 2^52 (its integer
 * would not be exact). Scaling by a power of two and Math.ceil are exact in floating point.
 */
function roundedUp(y: readonly number[], k: number): number[] | null {
  const scale = 2 ** k;
  const out = new Array<number>(y.length);
  for (let i = 0; i < y.length; i++) {
    const q = Math.ceil(y[i] * scale);
    if (!(Math.abs(q) < 2 ** 52)) return null;
    out[i] = q / scale;
  }
  return out;
}

type TriangleRegionCertificate = Extract<TreeRegion["certificate"], { kind: "triangle-dual" }>;

/**
 * The coarsest precision at which the region's certificate, y rounded up, still proves its bound
 * (re-proved as verifyTreeCertificate does), with that y; k = 0 and y itself when none does.
 */
function coarsestPrecision(graph: Graph, odd: Int32Array, rootVertex: number, region: TreeRegion, c: TriangleRegionCertificate): { k: number; y: readonly number[] } {
  const side = new Uint8Array(graph.n).fill(255);
  side[rootVertex] = 0;
  for (let i = 0; i < region.vertices.length; i++) side[region.vertices[i]] = region.sides[i];
  const red = reducedProblem(graph, side);
  if (red.graph.n !== c.y.length) return { k: 0, y: c.y };
  const triangles = Int32Array.from(c.triangles), mu = Float64Array.from(c.mu);
  for (const k of PRECISIONS) {
    const y = roundedUp(c.y, k);
    if (y === null) continue;
    const check = verifyTriangleCertificate(red.graph, { kind: "triangle-dual", y: Float64Array.from(y), shift: c.shift, shiftProof: "cholesky", triangles, mu });
    // The region bound as verify derives it: offset (exact) plus the re-proved value, rounded up, then
    // down to an integer, then to the cuts' parity where the fixings decide it (./parity.ts).
    if (check.ok && parityFloor(floorCutBound(roundUp(red.offset + check.value, 1)), nodeParity(odd, side)) <= region.bound) return { k, y };
  }
  return { k: 0, y: c.y };
}

/** A growable little-endian byte buffer. */
class Writer {
  private buf = new Uint8Array(1 << 16);
  private view = new DataView(this.buf.buffer);
  length = 0;
  private room(k: number): void {
    if (this.length + k <= this.buf.length) return;
    let size = this.buf.length * 2;
    while (size < this.length + k) size *= 2;
    const next = new Uint8Array(size);
    next.set(this.buf.subarray(0, this.length));
    this.buf = next;
    this.view = new DataView(next.buffer);
  }
  /** An integer 0 ≤ x ≤ 2^53 as LEB128 (arithmetic, not 32-bit operators, so large values survive). */
  varint(x: number): void {
    this.room(8);
    while (x >= 128) {
      this.buf[this.length++] = (x % 128) | 128;
      x = Math.floor(x / 128);
    }
    this.buf[this.length++] = x;
  }
  byte(x: number): void {
    this.room(1);
    this.buf[this.length++] = x;
  }
  float(x: number): void {
    this.room(8);
    this.view.setFloat64(this.length, x, true);
    this.length += 8;
  }
  bytes(): Uint8Array {
    return this.buf.subarray(0, this.length);
  }
}

const zigzag = (x: number): number => (x >= 0 ? 2 * x : -2 * x - 1);
const unzigzag = (u: number): number => (u % 2 === 0 ? u / 2 : -(u + 1) / 2);

/** Lexicographic order of region paths as (vertex, side) pairs: preorder of the tree. */
function byPath(a: TreeRegion, b: TreeRegion): number {
  const k = Math.min(a.vertices.length, b.vertices.length);
  for (let i = 0; i < k; i++) {
    if (a.vertices[i] !== b.vertices[i]) return a.vertices[i] - b.vertices[i];
    if (a.sides[i] !== b.sides[i]) return a.sides[i] - b.sides[i];
  }
  return a.vertices.length - b.vertices.length;
}

/**
 * The packed form of a search's regions on `graph`. Integer bounds and fixings are required (they
 * are what the search makes); the regions come back from `unpackTreeRegions` in preorder of their
 * paths, each y at the precision chosen here (`exact`: doubles throughout, no re-proof).
 */
export function packTreeRegions(graph: Graph, certificate: Pick<TreeCertificate, "rootVertex" | "regions">, options: { exact?: boolean } = {}): PackedTreeRegions {
  const w = new Writer();
  const odd = oddDegreeVertices(graph);
  const sorted = certificate.regions.slice().sort(byPath);
  let prevV: readonly number[] = [], prevS: readonly number[] = [];
  for (const r of sorted) {
    let keep = 0;
    const most = Math.min(prevV.length, r.vertices.length);
    while (keep < most && prevV[keep] === r.vertices[keep] && prevS[keep] === r.sides[keep]) keep++;
    w.varint(keep);
    w.varint(r.vertices.length - keep);
    for (let i = keep; i < r.vertices.length; i++) w.varint(2 * r.vertices[i] + r.sides[i]);
    if (!Number.isSafeInteger(r.bound)) throw new Error(`packTreeRegions: region bound ${r.bound} is not an integer`);
    w.varint(zigzag(r.bound));
    const c = r.certificate;
    if (c.kind === "exhaustive") w.byte(KIND_EXHAUSTIVE);
    else {
      w.byte(KIND_TRIANGLE);
      w.varint(c.y.length);
      const { k, y } = options.exact === true ? { k: 0, y: c.y } : coarsestPrecision(graph, odd, certificate.rootVertex, r, c);
      w.byte(k);
      if (k === 0) for (const v of y) w.float(v);
      else for (const v of y) w.varint(zigzag(v * 2 ** k));
      w.float(c.shift);
      w.varint(c.mu.length);
      for (let t = 0; t < c.mu.length; t++) {
        const i = c.triangles[4 * t], j = c.triangles[4 * t + 1], k = c.triangles[4 * t + 2];
        // i < j < k: the gaps are small positive numbers, one byte each on graphs of this size.
        w.varint(i);
        w.varint(j - i);
        w.varint(k - j);
        w.byte(c.triangles[4 * t + 3]);
      }
      for (const m of c.mu) w.float(m);
    }
    prevV = r.vertices;
    prevS = r.sides;
  }
  const raw = w.bytes();
  return { format: TREE_PACKING_FORMAT, regions: sorted.length, bytes: raw.length, data: Buffer.from(deflateRawSync(raw, { level: 9 })).toString("base64") };
}

/** Canonical base64 (RFC 4648 §4: padded, no line breaks): Buffer.from would skip other characters silently. A loop, since a regular expression over megabytes overflows the stack. */
function isBase64(s: string): boolean {
  if (s.length % 4 !== 0) return false;
  const pad = s.endsWith("==") ? 2 : s.endsWith("=") ? 1 : 0;
  for (let i = 0; i < s.length - pad; i++) {
    const c = s.charCodeAt(i);
    const ok = (c >= 65 && c <= 90) || (c >= 97 && c <= 122) || (c >= 48 && c <= 57) || c === 43 || c === 47;
    if (!ok) return false;
  }
  return true;
}

/**
 * The regions of a packed certificate for a graph with n vertices, or a one-line InputError
 * naming `where` and the first fault (a forged, truncated or padded byte string).
 */
export function unpackTreeRegions(packed: PackedTreeRegions, n: number, where = "certificate.packed"): TreeRegion[] {
  const fail = (why: string): never => {
    throw new InputError(`${where}: ${why}`);
  };
  if (packed.format !== TREE_PACKING_FORMAT) fail(`unknown format ${JSON.stringify(String(packed.format)).slice(0, 60)} (this build reads ${TREE_PACKING_FORMAT})`);
  if (!Number.isSafeInteger(packed.regions) || packed.regions < 1) fail(`regions should be a count ≥ 1, got ${String(packed.regions)}`);
  if (!Number.isSafeInteger(packed.bytes) || packed.bytes < 0) fail(`bytes should be a count, got ${String(packed.bytes)}`);
  if (typeof packed.data !== "string" || !isBase64(packed.data)) fail("data is not base64 text");
  // The stated length sizes the inflate: more output than it says is refused, not produced.
  checkMemory(packed.bytes, where);
  let raw: Uint8Array;
  try {
    raw = inflateRawSync(Buffer.from(packed.data, "base64"), { maxOutputLength: Math.max(1, packed.bytes) });
  } catch {
    return fail(`data does not inflate to ${packed.bytes} bytes (corrupt, truncated or longer than stated)`);
  }
  if (raw.length !== packed.bytes) fail(`data inflates to ${raw.length} bytes, ${packed.bytes} stated`);
  const view = new DataView(raw.buffer, raw.byteOffset, raw.byteLength);
  let at = 0;
  let q = 0;
  const varint = (what: string): number => {
    let x = 0, scale = 1;
    for (;;) {
      if (at >= raw.length) return fail(`region ${q}: ${what}: the data ends early`);
      const b = raw[at++];
      x += (b & 127) * scale;
      if (b < 128) break;
      scale *= 128;
      if (scale > 2 ** 53) return fail(`region ${q}: ${what}: a number longer than 2^53`);
    }
    if (!Number.isSafeInteger(x)) fail(`region ${q}: ${what}: ${x} is above 2^53`);
    return x;
  };
  const count = (what: string, most: number): number => {
    const k = varint(what);
    if (k > most) fail(`region ${q}: ${what} ${k} is more than ${most}`);
    return k;
  };
  const float = (what: string): number => {
    if (at + 8 > raw.length) return fail(`region ${q}: ${what}: the data ends early`);
    const x = view.getFloat64(at, true);
    at += 8;
    if (!Number.isFinite(x)) fail(`region ${q}: ${what} is ${x}, expected a finite number`);
    return x;
  };
  const regions: TreeRegion[] = [];
  let prevV: number[] = [], prevS: number[] = [];
  for (; q < packed.regions; q++) {
    const keep = count("kept fixings", prevV.length);
    const add = count("new fixings", Math.max(0, n - 1 - keep));
    const vertices = prevV.slice(0, keep), sides = prevS.slice(0, keep);
    for (let i = 0; i < add; i++) {
      const f = varint("fixing");
      const v = Math.floor(f / 2);
      if (v >= n) fail(`region ${q}: fixing ${keep + i}: vertex ${v} is not below n = ${n}`);
      vertices.push(v);
      sides.push(f % 2);
    }
    const bound = unzigzag(varint("bound"));
    if (at >= raw.length) fail(`region ${q}: certificate kind: the data ends early`);
    const kind = raw[at++];
    let certificate: TreeRegion["certificate"];
    if (kind === KIND_EXHAUSTIVE) certificate = { kind: "exhaustive" };
    else if (kind === KIND_TRIANGLE) {
      // A reduced problem has at most n vertices (z and the free ones); an inequality needs 8 bytes at least.
      const yLen = count("y length", n);
      if (at >= raw.length) fail(`region ${q}: precision of y: the data ends early`);
      const k = raw[at++];
      if (k > MOST_PRECISION) fail(`region ${q}: precision of y 2^-${k} is finer than 2^-${MOST_PRECISION}`);
      const y = new Array<number>(yLen);
      if (k === 0) for (let i = 0; i < yLen; i++) y[i] = float(`y[${i}]`);
      else {
        const scale = 2 ** k;
        for (let i = 0; i < yLen; i++) {
          const u = varint(`y[${i}]`);
          if (u >= 2 ** 53) fail(`region ${q}: y[${i}]: ${u} is not below 2^53`);
          y[i] = unzigzag(u) / scale;
        }
      }
      const shift = float("shift");
      const t = count("inequalities", Math.floor((raw.length - at) / 12));
      const triangles = new Array<number>(4 * t);
      for (let s = 0; s < t; s++) {
        const i = varint(`inequality ${s}`);
        const j = i + varint(`inequality ${s}`);
        const k = j + varint(`inequality ${s}`);
        if (at >= raw.length) fail(`region ${q}: inequality ${s}: the data ends early`);
        triangles[4 * s] = i;
        triangles[4 * s + 1] = j;
        triangles[4 * s + 2] = k;
        triangles[4 * s + 3] = raw[at++];
      }
      const mu = new Array<number>(t);
      for (let s = 0; s < t; s++) mu[s] = float(`mu[${s}]`);
      certificate = { kind: "triangle-dual", y, shift, shiftProof: "cholesky", triangles, mu };
    } else return fail(`region ${q}: unknown certificate kind ${kind}`);
    regions.push({ vertices, sides, bound, certificate });
    prevV = vertices;
    prevS = sides;
  }
  if (at !== raw.length) fail(`${raw.length - at} bytes after the last of ${packed.regions} regions`);
  return regions;
}
