// Brute-force max cut, the suites' independent oracle: written without src/cut so that it can
// check the solvers and bounds there.
import type { Graph } from "../../src/graph/graph.js";

/**
 * Brute-force max cut for n ≤ 16 (common practice, no source): vertex n−1 fixed on side 0, the
 * other 2^(n−1) assignments visited in Gray-code order, the cut updated edge by edge.
 */
export function bruteForceMaxCut(g: Graph): number {
  const n = g.n;
  if (n <= 1) return 0;
  const side = new Uint8Array(n);
  const adj: [number, number][][] = Array.from({ length: n }, () => []);
  g.forEachEdge((u, v, w) => {
    adj[u].push([v, w]);
    adj[v].push([u, w]);
  });
  let cut = 0;
  let best = 0;
  for (let k = 1; k < 1 << (n - 1); k++) {
    const v = 31 - Math.clz32(k & -k);
    for (const [u, w] of adj[v]) cut += side[u] === side[v] ? w : -w;
    side[v] ^= 1;
    if (cut > best) best = cut;
  }
  return best;
}

/**
 * Cut of a 0/1 partition, edge by edge from the graph's own edge walk (common practice, no source):
 * written apart from src/cut/evaluate.ts so it can check `cutValue` and the records built on it.
 */
export function cutOfPartition(g: Graph, side: ArrayLike<number>): number {
  let cut = 0;
  g.forEachEdge((u, v, w) => {
    if (side[u] !== side[v]) cut += w;
  });
  return cut;
}
