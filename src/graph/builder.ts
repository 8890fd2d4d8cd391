// Turns edge lists into a validated CSR Graph in O(n + m): two stable counting sorts
// (by target, then by source) leave every neighbour list sorted without comparisons.
// Every parser and generator goes through here, so validation lives in one place.

import { InputError } from "../errors.js";
import { checkMemory, graphBuildBytes } from "../limits/memory.js";
import { Graph } from "./graph.js";

/** Largest vertex count a Graph may have: per-vertex Int32 arrays stay well under a few GB. */
export const MAX_VERTICES = 100_000_000;

/**
 * Largest |weight| accepted: totals, squares in the eigensolvers and dual certificates stay far
 * inside the double range (weights near 1e308 made totals overflow to Infinity).
 */
export const MAX_EDGE_WEIGHT = 1e100;

export interface BuildOptions {
  /** What to do with a repeated edge: "error" (default) or "merge" (weights add up; unweighted keeps one copy). */
  duplicates?: "error" | "merge";
  /** What to do with an edge {v, v}: "error" (default) or "drop". */
  loops?: "error" | "drop";
  /** Describes each edge for error messages, e.g. i ↦ "line 12". Defaults to "edge #i". */
  describeEdge?: (edgeIndex: number) => string;
}

export interface BuildReport {
  mergedDuplicates: number;
  droppedLoops: number;
}

export interface BuildResult {
  graph: Graph;
  report: BuildReport;
}

/** Thrown by the builder; carries the index of the offending edge so parsers can name the line. */
export class GraphBuildError extends InputError {
  readonly edgeIndex: number;
  constructor(message: string, edgeIndex: number) {
    super(message);
    this.edgeIndex = edgeIndex;
  }
}

function fmtId(x: number): string {
  return Number.isFinite(x) ? String(x) : JSON.stringify(String(x));
}

/**
 * Build a graph on vertices 0..n-1 from parallel endpoint arrays (0-based ids).
 * Validates ids, weights, loops and duplicates according to `options`.
 */
export function buildGraph(
  n: number,
  us: ArrayLike<number>,
  vs: ArrayLike<number>,
  weights: ArrayLike<number> | null = null,
  options: BuildOptions = {},
): BuildResult {
  const describe = options.describeEdge ?? ((i: number) => `edge #${i}`);
  const loops = options.loops ?? "error";
  const dups = options.duplicates ?? "error";
  if (!Number.isInteger(n) || n < 0) {
    throw new InputError(`invalid vertex count n = ${n}: must be a non-negative integer`);
  }
  if (n > MAX_VERTICES) {
    // Per-vertex arrays alone would take tens of GB; refuse before allocating rather than be killed.
    throw new InputError(`vertex count n = ${n} is more than this machine's graphs can hold (at most ${MAX_VERTICES.toExponential(0)} vertices)`);
  }
  const count = us.length;
  if (vs.length !== count || (weights !== null && weights.length !== count)) {
    throw new InputError(`edge arrays differ in length (${us.length}, ${vs.length}${weights ? `, ${weights.length}` : ""})`);
  }
  if (2 * count > 0x7fffffff) throw new InputError(`too many edges (${count}): at most 2^30 fit in a CSR graph`);
  checkMemory(graphBuildBytes(n, count, weights !== null), `a graph with n = ${n} vertices and m = ${count} edges`);

  // Pass 1: validate and count degrees. `keep` marks dropped loops only when needed.
  const deg = new Int32Array(n + 1);
  let droppedLoops = 0;
  let keep: Uint8Array | null = null;
  for (let e = 0; e < count; e++) {
    const u = us[e];
    const v = vs[e];
    if (!Number.isInteger(u) || !Number.isInteger(v)) {
      throw new GraphBuildError(`${describe(e)}: vertex ids must be integers (got ${fmtId(u)}, ${fmtId(v)})`, e);
    }
    if (u < 0 || u >= n || v < 0 || v >= n) {
      throw new GraphBuildError(`${describe(e)}: vertex id out of range (got ${u}, ${v}; graph has ${n} vertices)`, e);
    }
    if (weights !== null && !(Math.abs(weights[e]) <= MAX_EDGE_WEIGHT)) {
      throw new GraphBuildError(`${describe(e)}: weight must be a finite number of magnitude at most ${MAX_EDGE_WEIGHT} (got ${fmtId(weights[e])})`, e);
    }
    if (u === v) {
      if (loops === "error") throw new GraphBuildError(`${describe(e)}: self-loop at vertex ${u}`, e);
      if (keep === null) keep = new Uint8Array(count).fill(1);
      keep[e] = 0;
      droppedLoops++;
      continue;
    }
    deg[u]++;
    deg[v]++;
  }
  const arcs = 2 * (count - droppedLoops);

  const offsets = new Int32Array(n + 1);
  for (let v = 0; v < n; v++) offsets[v + 1] = offsets[v] + deg[v];
  const neighbors = new Int32Array(arcs);
  const w = weights === null ? null : new Float64Array(arcs);
  const fill = offsets.slice(0, n);

  // Fast path: generators and graph6 emit edges in an order that already leaves every list
  // sorted (by (min, max) or by (max, min)); place arcs directly and fall back at the first
  // arc that would break the order (or repeat an edge).
  if (placeInOrder(count, us, vs, weights, keep, offsets, fill, neighbors, w)) {
    return { graph: new Graph(n, offsets, neighbors, w), report: { mergedDuplicates: 0, droppedLoops } };
  }

  // General path. Pass 2: order arcs by target. Arc 2e is u→v, arc 2e+1 is v→u.
  const byTarget = new Int32Array(arcs);
  fill.set(offsets.subarray(0, n));
  for (let e = 0; e < count; e++) {
    if (keep !== null && keep[e] === 0) continue;
    byTarget[fill[vs[e]]++] = 2 * e;
    byTarget[fill[us[e]]++] = 2 * e + 1;
  }

  // Pass 3: stable placement by source keeps each list sorted by target; duplicates are adjacent.
  fill.set(offsets.subarray(0, n));
  let duplicateArcs = 0;
  for (let i = 0; i < arcs; i++) {
    const a = byTarget[i];
    const e = a >>> 1;
    const src = (a & 1) === 0 ? us[e] : vs[e];
    const dst = (a & 1) === 0 ? vs[e] : us[e];
    const pos = fill[src];
    if (pos > offsets[src] && neighbors[pos - 1] === dst) {
      if (dups === "error") {
        const a0 = Math.min(src, dst), b0 = Math.max(src, dst);
        throw new GraphBuildError(`${describe(e)}: duplicate edge {${a0}, ${b0}}`, e);
      }
      if (w !== null) w[pos - 1] += weights![e];
      duplicateArcs++;
      continue;
    }
    neighbors[pos] = dst;
    if (w !== null) w[pos] = weights![e];
    fill[src] = pos + 1;
  }

  if (duplicateArcs === 0) {
    return { graph: new Graph(n, offsets, neighbors, w), report: { mergedDuplicates: 0, droppedLoops } };
  }
  // Compact the gaps merging left behind.
  const newOffsets = new Int32Array(n + 1);
  const newNb = new Int32Array(arcs - duplicateArcs);
  const newW = w === null ? null : new Float64Array(arcs - duplicateArcs);
  let k = 0;
  for (let v = 0; v < n; v++) {
    for (let i = offsets[v]; i < fill[v]; i++) {
      newNb[k] = neighbors[i];
      if (newW !== null) newW[k] = w![i];
      k++;
    }
    newOffsets[v + 1] = k;
  }
  return {
    graph: new Graph(n, newOffsets, newNb, newW),
    report: { mergedDuplicates: duplicateArcs / 2, droppedLoops },
  };
}

/** Direct placement in input order; false (leaving garbage to be overwritten) when a list would go unsorted. */
function placeInOrder(
  count: number,
  us: ArrayLike<number>,
  vs: ArrayLike<number>,
  weights: ArrayLike<number> | null,
  keep: Uint8Array | null,
  offsets: Int32Array,
  fill: Int32Array,
  neighbors: Int32Array,
  w: Float64Array | null,
): boolean {
  for (let e = 0; e < count; e++) {
    if (keep !== null && keep[e] === 0) continue;
    const u = us[e], v = vs[e];
    const pu = fill[u], pv = fill[v];
    if ((pu > offsets[u] && neighbors[pu - 1] >= v) || (pv > offsets[v] && neighbors[pv - 1] >= u)) return false;
    neighbors[pu] = v;
    neighbors[pv] = u;
    if (w !== null) {
      w[pu] = weights![e];
      w[pv] = weights![e];
    }
    fill[u] = pu + 1;
    fill[v] = pv + 1;
  }
  return true;
}

/**
 * Growable edge list for parsers and generators: append edges, then `build`.
 * Stores endpoints in typed arrays that double as needed (no per-edge objects).
 */
export class EdgeBuffer {
  private u: Int32Array;
  private v: Int32Array;
  private w: Float64Array | null;
  private tags: Int32Array | null;
  private len = 0;

  /** `weighted` keeps a weight column; `tagged` records an integer per edge (e.g. a line number). */
  constructor(options: { weighted?: boolean; tagged?: boolean; capacity?: number } = {}) {
    const cap = Math.max(16, options.capacity ?? 1024);
    this.u = new Int32Array(cap);
    this.v = new Int32Array(cap);
    this.w = options.weighted ? new Float64Array(cap) : null;
    this.tags = options.tagged ? new Int32Array(cap) : null;
  }

  get length(): number {
    return this.len;
  }

  get weighted(): boolean {
    return this.w !== null;
  }

  private grow(): void {
    const cap = this.u.length * 2;
    const g32 = (a: Int32Array) => {
      const b = new Int32Array(cap);
      b.set(a);
      return b;
    };
    this.u = g32(this.u);
    this.v = g32(this.v);
    if (this.tags !== null) this.tags = g32(this.tags);
    if (this.w !== null) {
      const b = new Float64Array(cap);
      b.set(this.w);
      this.w = b;
    }
  }

  /**
   * Append an edge. Ids must already be integers that fit in 32 bits (parsers check
   * that with the line in hand); range, loops and duplicates are checked in `build`.
   */
  add(u: number, v: number, weight = 1, tag = 0): void {
    if (this.len === this.u.length) this.grow();
    this.u[this.len] = u;
    this.v[this.len] = v;
    if (this.w !== null) this.w[this.len] = weight;
    if (this.tags !== null) this.tags[this.len] = tag;
    this.len++;
  }

  /** The tag recorded with edge i (e.g. its line number). */
  tagOf(i: number): number {
    return this.tags === null ? i : this.tags[i];
  }

  build(n: number, options: BuildOptions = {}): BuildResult {
    const L = this.len;
    return buildGraph(
      n,
      this.u.subarray(0, L),
      this.v.subarray(0, L),
      this.w === null ? null : this.w.subarray(0, L),
      options,
    );
  }
}

/** Convenience for tests and small code: strict build from [u, v] or [u, v, w] tuples. */
export function graphFromEdges(n: number, edges: ReadonlyArray<readonly [number, number] | readonly [number, number, number]>, options: BuildOptions = {}): Graph {
  const us = new Array<number>(edges.length);
  const vs = new Array<number>(edges.length);
  const weighted = edges.some((e) => e.length === 3);
  const ws = weighted ? new Array<number>(edges.length) : null;
  edges.forEach((e, i) => {
    us[i] = e[0];
    vs[i] = e[1];
    if (ws !== null) ws[i] = e.length === 3 ? (e as readonly [number, number, number])[2] : 1;
  });
  return buildGraph(n, us, vs, ws, options).graph;
}
