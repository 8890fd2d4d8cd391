// Shared preprocessing for the counting and search routines: CSR relabelled by a vertex
// order (e.g. (degree, id)) so "later in the order" is "larger id", lists kept sorted.

import type { Graph } from "../graph.js";
import { int32Pool, type ScratchPool } from "../scratch.js";

const fillPool = int32Pool();
const scratchRank = int32Pool(), scratchOff = int32Pool(), scratchNb = int32Pool(), scratchOrder = int32Pool(), scratchStart = int32Pool();

export interface RankedAdjacency {
  n: number;
  /** CSR over new ids 0..n-1; each list sorted ascending by new id. */
  offsets: Int32Array;
  neighbors: Int32Array;
  /** rank[v] = new id of original vertex v; vertexOf[r] = original vertex with new id r. */
  rank: Int32Array;
  vertexOf: Int32Array;
}

/** Ranks by a permutation `vertexOf` (vertexOf[r] = vertex of rank r) and rebuilds sorted CSR in O(n + m). */
export function rankedAdjacency(g: Graph, vertexOf: Int32Array): RankedAdjacency {
  const { n, neighbors } = g;
  return rankInto(g, vertexOf, new Int32Array(n), new Int32Array(n + 1), new Int32Array(neighbors.length));
}

/**
 * `rankedAdjacency(g, degreeOrder(g))` built in scratch arrays that the next call overwrites: for
 * the counting and search routines that use the ranking only until they return and call no other
 * user of it meanwhile (triangles, 4-cycles, long cycles). The caller must not keep any part of it.
 */
export function scratchDegreeRanking(g: Graph): RankedAdjacency {
  const { n, neighbors } = g;
  const order = degreeOrderInto(g, scratchOrder, scratchStart);
  return rankInto(g, order, scratchRank.take(n), scratchOff.take(n + 1), scratchNb.take(neighbors.length));
}

/** Fills rank, off and nb (every entry written) for the order vertexOf. */
function rankInto(g: Graph, vertexOf: Int32Array, rank: Int32Array, off: Int32Array, nb: Int32Array): RankedAdjacency {
  const { n, offsets, neighbors } = g;
  off[0] = 0;
  for (let r = 0; r < n; r++) rank[vertexOf[r]] = r;
  for (let r = 0; r < n; r++) {
    const v = vertexOf[r];
    off[r + 1] = off[r] + offsets[v + 1] - offsets[v];
  }
  const fill = fillPool.take(n); // scratch: every entry written here before use
  for (let r = 0; r < n; r++) fill[r] = off[r];
  // Appending source ranks in increasing order leaves every target's list sorted (no comparison sort).
  for (let r = 0; r < n; r++) {
    const v = vertexOf[r];
    for (let i = offsets[v]; i < offsets[v + 1]; i++) nb[fill[rank[neighbors[i]]]++] = r;
  }
  return { n, offsets: off, neighbors: nb, rank, vertexOf };
}

/** Vertices sorted by degree ascending, ties by id (counting sort). */
export function degreeOrder(g: Graph): Int32Array {
  return degreeOrderInto(g, null, null);
}

/** degreeOrder into pooled arrays (null: fresh ones); the counting-sort buckets are zeroed here. */
function degreeOrderInto(g: Graph, orderPool: ScratchPool<Int32Array> | null, startPool: ScratchPool<Int32Array> | null): Int32Array {
  const { n, offsets } = g;
  let maxDeg = 0;
  for (let v = 0; v < n; v++) maxDeg = Math.max(maxDeg, offsets[v + 1] - offsets[v]);
  const start = startPool === null ? new Int32Array(maxDeg + 2) : startPool.take(maxDeg + 2).fill(0);
  for (let v = 0; v < n; v++) start[offsets[v + 1] - offsets[v] + 1]++;
  for (let d = 0; d <= maxDeg; d++) start[d + 1] += start[d];
  const order = orderPool === null ? new Int32Array(n) : orderPool.take(n);
  for (let v = 0; v < n; v++) order[start[offsets[v + 1] - offsets[v]]++] = v;
  return order;
}

/** Index of the first entry > x in the sorted slice nb[lo..hi) (binary search). */
export function firstAbove(nb: Int32Array, lo: number, hi: number, x: number): number {
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (nb[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
