// Degree statistics of a graph: minimum, maximum and mean degree, with a vertex attaining
// each extreme, and the same for weighted degrees when the graph carries weights.

import type { Graph } from "../graph.js";

export interface WeightedDegreeStats {
  min: number;
  max: number;
  mean: number;
  minVertex: number;
  maxVertex: number;
}

export interface DegreeStats {
  n: number;
  /** 0 for the empty graph (n = 0), like `max` and `mean`. */
  min: number;
  max: number;
  /** 2m / n. */
  mean: number;
  /** A vertex of minimum / maximum degree, or -1 when n = 0. */
  minVertex: number;
  maxVertex: number;
  /** Weighted degree Σ_w w(v, w); null when the graph is unweighted (it would equal the degree). */
  weighted: WeightedDegreeStats | null;
}

export function degreeStats(g: Graph): DegreeStats {
  const { n, offsets, weights } = g;
  if (n === 0) return { n, min: 0, max: 0, mean: 0, minVertex: -1, maxVertex: -1, weighted: weights === null ? null : { min: 0, max: 0, mean: 0, minVertex: -1, maxVertex: -1 } };
  let min = Infinity, max = -1, minVertex = -1, maxVertex = -1;
  for (let v = 0; v < n; v++) {
    const d = offsets[v + 1] - offsets[v];
    if (d < min) { min = d; minVertex = v; }
    if (d > max) { max = d; maxVertex = v; }
  }
  let weighted: WeightedDegreeStats | null = null;
  if (weights !== null) {
    let wmin = Infinity, wmax = -Infinity, wmi = -1, wma = -1, sum = 0;
    for (let v = 0; v < n; v++) {
      let s = 0;
      for (let i = offsets[v]; i < offsets[v + 1]; i++) s += weights[i];
      sum += s;
      if (s < wmin) { wmin = s; wmi = v; }
      if (s > wmax) { wmax = s; wma = v; }
    }
    weighted = { min: wmin, max: wmax, mean: sum / n, minVertex: wmi, maxVertex: wma };
  }
  return { n, min, max, mean: (2 * g.m) / n, minVertex, maxVertex, weighted };
}
