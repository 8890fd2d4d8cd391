// Strongly-regular-graph parameters (n, k, λ, μ) of a graph, or null when it is not strongly regular:
// k-regular, every adjacent pair with λ common neighbours, every non-adjacent pair with μ.

import type { Graph } from "../graph.js";

export interface SrgParameters {
  n: number;
  k: number;
  lambda: number;
  mu: number;
}

/**
 * Counts common neighbours of u with every vertex through paths of length 2 (O(n·k²) total).
 * Complete and edgeless graphs get null: μ or λ would be undefined (the usual convention).
 */
export function srgParameters(g: Graph): SrgParameters | null {
  const n = g.n;
  if (n < 2) return null;
  const k = g.degree(0);
  for (let v = 1; v < n; v++) if (g.degree(v) !== k) return null;
  if (k === 0 || k === n - 1) return null;
  const { offsets, neighbors } = g;
  const common = new Int32Array(n);
  const adjacent = new Uint8Array(n);
  let lambda = -1, mu = -1;
  for (let u = 0; u < n; u++) {
    for (let i = offsets[u]; i < offsets[u + 1]; i++) {
      const w = neighbors[i];
      adjacent[w] = 1;
      for (let j = offsets[w]; j < offsets[w + 1]; j++) common[neighbors[j]]++;
    }
    for (let v = 0; v < n; v++) {
      if (v === u) continue;
      const c = common[v];
      if (adjacent[v] === 1) {
        if (lambda < 0) lambda = c;
        else if (c !== lambda) return null;
      } else {
        if (mu < 0) mu = c;
        else if (c !== mu) return null;
      }
    }
    common.fill(0);
    for (let i = offsets[u]; i < offsets[u + 1]; i++) adjacent[neighbors[i]] = 0;
  }
  return { n, k, lambda, mu };
}
