// Direct evaluation of the explicit vector method's guarantee from an adjacency matrix, written
// without src/bounds so that it can check the evaluators and the optimiser there.
import type { Graph } from "../../src/graph/graph.js";

/**
 * (1/2π)·Σ_i ε_i|V_i| − ½·Σ_{ij∈E} ε_iε_j|V_i ∩ V_j| by brute force, O(n³) (the formula as stated;
 * common practice, no source for the evaluation itself).
 */
export function directVectorGuarantee(g: Graph, sets: readonly (readonly number[])[], eps: readonly number[]): number {
  const n = g.n;
  const inSet = sets.map((s) => {
    const a = new Uint8Array(n);
    for (const x of s) a[x] = 1;
    return a;
  });
  let linear = 0;
  for (let i = 0; i < n; i++) linear += eps[i] * sets[i].length;
  let overlap = 0;
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++) {
      if (!g.hasEdge(i, j)) continue;
      let c = 0;
      for (let k = 0; k < n; k++) if (inSet[i][k] && inSet[j][k]) c++;
      overlap += eps[i] * eps[j] * c;
    }
  return linear / (2 * Math.PI) - overlap / 2;
}

/** V_i = N(i) for every vertex, as plain arrays. */
export function neighbourhoodSets(g: Graph): number[][] {
  return Array.from({ length: g.n }, (_, i) => Array.from(g.neighborsOf(i)));
}
