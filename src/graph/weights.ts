// Facts about a graph's edge weights that several solvers and the verifier rely on, computed in
// one place: whether every weight is an integer, and the sum of the positive weights.

import type { Graph } from "./graph.js";

/** True when every weight is an integer (unweighted graphs included): then every cut value is an integer. */
export function hasIntegerWeights(graph: Graph): boolean {
  const w = graph.weights;
  if (w === null) return true;
  for (let i = 0; i < w.length; i++) if (!Number.isInteger(w[i])) return false;
  return true;
}

/** Sum of the positive edge weights: no cut exceeds it. */
export function positiveWeightSum(graph: Graph): number {
  const w = graph.weights;
  if (w === null) return graph.m;
  let s = 0;
  for (let i = 0; i < w.length; i++) if (w[i] > 0) s += w[i];
  // Each weight is stored twice (u→v and v→u).
  return s / 2;
}
