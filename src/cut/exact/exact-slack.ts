// How far the true max cut can lie above what an exact search reports when the weights are not
// exact integers: the searches prune with a tolerance and add in floating point, so "optimal"
// means optimal up to this slack. One formula, used by the searches, the bracket and `verify`.

import type { Graph } from "../../graph/graph.js";
import { connectedComponents } from "../../graph/structure/components.js";
import { EXACT_INTEGER_TOTAL, hasIntegerWeights } from "../../graph/weights.js";
import { roundoffGamma as gamma, roundUp } from "../../linalg/float-rounding.js";

/** Gray-code steps between recomputations of its running sums when the weights are not exact integers. */
export const GRAY_RESYNC_STEPS = 64;

/** Largest tabulated block (CutBlock): its table entries are chains of at most 24 sums of 24 terms. */
const MAX_BLOCK = 24;

/**
 * Slack of one connected component with `n` vertices, `m` edges, Σ|w| over both arcs of every edge
 * `absArcs`, and `integral` when every weight is an integer: 0 for exact integers (every sum is
 * exact and pruning needs a gain of 1). Otherwise:
 * - every quantity the searches compare (a node bound, an incumbent, a tabulated block cut, the
 *   final cutValue) is a floating-point sum of at most K = 4(n + m) + 2R² + 2·24² terms (R =
 *   GRAY_RESYNC_STEPS: Gray-code running sums carry at most R steps of rounding before they are
 *   recomputed; branch and bound restores its sums exactly on backtracking) whose absolute values
 *   total at most 4·absArcs, so it is within ε = γ_K·4·absArcs of its exact value (Higham,
 *   Accuracy and Stability of Numerical Algorithms, 2nd ed., §3.1);
 * - a pruned subtree may hold a cut up to margin + 2ε above the incumbent (margin: the pruning
 *   tolerance, `improvementMargin`), and branch and bound's tail bounds chain one such loss per
 *   tail: at most n + 1 of them.
 * Result: max cut ≤ reported value + slack, rounded up.
 */
export function componentSlack(n: number, m: number, absArcs: number, integral: boolean): number {
  if (integral && absArcs <= EXACT_INTEGER_TOTAL) return 0;
  if (n <= 1 || m === 0) return 0;
  const margin = Math.max(1e-12, 1e-11 * absArcs);
  const eps = gamma(4 * (n + m) + 2 * GRAY_RESYNC_STEPS * GRAY_RESYNC_STEPS + 2 * MAX_BLOCK * MAX_BLOCK) * 4 * absArcs;
  return roundUp((n + 1) * (margin + 2 * eps), 2);
}

/** componentSlack of a graph searched as one piece (what Gray code and branch and bound report). */
export function graphSlack(graph: Graph): number {
  const w = graph.weights;
  if (w === null) return componentSlack(graph.n, graph.m, 2 * graph.m, true);
  let abs = 0;
  let integral = true;
  for (let i = 0; i < w.length; i++) {
    abs += Math.abs(w[i]);
    if (!Number.isInteger(w[i])) integral = false;
  }
  return componentSlack(graph.n, graph.m, abs, integral);
}

/**
 * Total slack of `exactMaxCut` on this graph: the sum of its components' slacks, from the graph
 * alone (which components exist and their weights), so `verify` derives it without trusting a record.
 */
export function exactSearchSlack(graph: Graph): number {
  const w = graph.weights;
  if (w === null) return 0;
  const comps = connectedComponents(graph);
  const count = comps.count;
  const nc = new Float64Array(count);
  const arcs = new Float64Array(count);
  const abs = new Float64Array(count);
  const frac = new Uint8Array(count);
  const { offsets } = graph;
  for (let v = 0; v < graph.n; v++) {
    const c = comps.label[v];
    nc[c]++;
    for (let i = offsets[v]; i < offsets[v + 1]; i++) {
      arcs[c]++;
      abs[c] += Math.abs(w[i]);
      if (!Number.isInteger(w[i])) frac[c] = 1;
    }
  }
  let total = 0;
  for (let c = 0; c < count; c++) total += componentSlack(nc[c], arcs[c] / 2, abs[c], frac[c] === 0);
  return total === 0 ? 0 : roundUp(total + gamma(count + 1) * total, 2);
}

/**
 * The closing tolerance of a bracket: how far `upper` may sit above `lower` when `exact` is
 * claimed (0 for exact integer weights). The bracket publishes an exact search's bound (cut +
 * slack) plus twice the slack, so that verify's own re-run (whose cut may differ by the slack)
 * stays below it: 3 slacks and a few roundings in all, inside 4 slacks. The bracket and verify
 * both take it from here, from the graph alone.
 */
export function closingTolerance(graph: Graph): number {
  return hasIntegerWeights(graph) ? 0 : 4 * exactSearchSlack(graph);
}
