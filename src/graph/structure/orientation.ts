// Shared preprocessing for the counting and search routines: CSR relabelled by a vertex
// order (e.g. (degree, id)) so "later in the order" is "larger id", lists kept sorted.

import type { Graph } from "../graph.js";

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
  const { n, offsets, neighbors } = g;
  const rank = new Int32Array(n);
  for (let r = 0; r < n; r++) rank[vertexOf[r]] = r;
  const off = new Int32Array(n + 1);
  for (let r = 0; r < n; r++) {
    const v = vertexOf[r];
    off[r + 1] = off[r] + offsets[v + 1] - offsets[v];
  }
  const nb = new Int32Array(neighbors.length);
  const fill = off.slice(0, n);
  // Appending source ranks in increasing order leaves every target's list sorted (no comparison sort).
  for (let r = 0; r < n; r++) {
    const v = vertexOf[r];
    for (let i = offsets[v]; i < offsets[v + 1]; i++) nb[fill[rank[neighbors[i]]]++] = r;
  }
  return { n, offsets: off, neighbors: nb, rank, vertexOf };
}

/** Vertices sorted by degree ascending, ties by id (counting sort). */
export function degreeOrder(g: Graph): Int32Array {
  const { n, offsets } = g;
  let maxDeg = 0;
  for (let v = 0; v < n; v++) maxDeg = Math.max(maxDeg, offsets[v + 1] - offsets[v]);
  const start = new Int32Array(maxDeg + 2);
  for (let v = 0; v < n; v++) start[offsets[v + 1] - offsets[v] + 1]++;
  for (let d = 0; d <= maxDeg; d++) start[d + 1] += start[d];
  const order = new Int32Array(n);
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
