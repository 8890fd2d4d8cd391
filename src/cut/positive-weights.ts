// The positive-weight bound as a proven number: no cut exceeds the sum of the positive weights,
// and this rounds that sum up past its own floating-point rounding. The bracket publishes it and
// `verify` re-derives it, both through this function.

import type { Graph } from "../graph/graph.js";
import { hasIntegerWeights, positiveWeightSum } from "../graph/weights.js";
import { roundoffGamma, roundUp } from "../linalg/float-rounding.js";

/**
 * max cut ≤ positiveWeightBound(graph): the sum itself for exact integer weights, else rounded up
 * past the rounding of a sum of 2m terms (γ_{2m}, Higham, Accuracy and Stability of Numerical
 * Algorithms, 2nd ed., §3.1).
 */
export function positiveWeightBound(graph: Graph): number {
  const s = positiveWeightSum(graph);
  if (hasIntegerWeights(graph)) return s;
  return roundUp(s + roundoffGamma(2 * graph.m + 2) * s, 2);
}
