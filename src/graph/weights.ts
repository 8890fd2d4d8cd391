// Facts about a graph's edge weights that several solvers and the verifier rely on, computed in
// one place: whether every weight is an exact integer, and the sum of the positive weights.

import type { Graph } from "./graph.js";

/**
 * Largest Σ|w| (over both arcs of every edge) for which integer weights make every partial sum of
 * the searches exact in doubles: sums of at most twice the total weight stay below 2^53.
 */
export const EXACT_INTEGER_TOTAL = 2 ** 52;

/**
 * True when every weight is an integer (unweighted graphs included) and the weights are small
 * enough (Σ|w| ≤ EXACT_INTEGER_TOTAL) that every cut value and partial sum is an exact integer in
 * floating point: then bounds may be rounded down and pruning needs no tolerance. Huge integer
 * weights count as non-integer: their sums round.
 */
export function hasIntegerWeights(graph: Graph): boolean {
  const w = graph.weights;
  if (w === null) return 2 * graph.m <= EXACT_INTEGER_TOTAL;
  let abs = 0;
  for (let i = 0; i < w.length; i++) {
    if (!Number.isInteger(w[i])) return false;
    abs += Math.abs(w[i]);
  }
  return abs <= EXACT_INTEGER_TOTAL;
}

/** Sum of the positive edge weights as computed: no cut exceeds it (for a proven bound see positiveWeightBound in src/cut). */
export function positiveWeightSum(graph: Graph): number {
  const w = graph.weights;
  if (w === null) return graph.m;
  let s = 0;
  for (let i = 0; i < w.length; i++) if (w[i] > 0) s += w[i];
  // Each weight is stored twice (u→v and v→u).
  return s / 2;
}
