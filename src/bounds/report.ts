// Every closed-form lower bound for a graph side by side, with how far each sits below the best
// cut found: the gap in surplus terms, absolute and relative to the best surplus.

import { surplusOf } from "../graph/cut-value.js";
import type { Graph } from "../graph/graph.js";
import { edwardsEdgeBound, edwardsVertexBound } from "./edwards.js";
import { triangleFreeBound } from "./triangle-free.js";
import type { LowerBoundRecord } from "./types.js";
import { vectorMethodGuarantee } from "./vector-guarantee.js";

export interface LowerBoundRow extends LowerBoundRecord {
  /** bestSurplus − surplus, or null when the bound does not apply. */
  gap: number | null;
  /** gap / bestSurplus, or null when undefined (bound not applying, or best surplus ≤ 0). */
  relativeGap: number | null;
}

export interface LowerBoundReport {
  /** The best cut the bounds are compared with, and its surplus. */
  bestCut: number;
  bestSurplus: number;
  rows: LowerBoundRow[];
}

/** All closed-form lower bounds, in order: Edwards (edges), Edwards (vertices), triangle-free, vector method. */
export function lowerBounds(graph: Graph): LowerBoundRecord[] {
  const v = vectorMethodGuarantee(graph);
  const vector: LowerBoundRecord = { name: v.name, value: v.value, surplus: v.surplus, applies: v.applies, reason: v.reason };
  return [edwardsEdgeBound(graph), edwardsVertexBound(graph), triangleFreeBound(graph), vector];
}

/** `bestCut` is a cut value or anything carrying one as `value` (a cut record, a bracket's lower end). */
export function lowerBoundReport(graph: Graph, bestCut: number | { value: number }): LowerBoundReport {
  const best = typeof bestCut === "number" ? bestCut : bestCut.value;
  const bestSurplus = surplusOf(graph, best);
  const rows = lowerBounds(graph).map((b): LowerBoundRow => {
    if (!b.applies || b.surplus === null) return { ...b, gap: null, relativeGap: null };
    const gap = bestSurplus - b.surplus;
    return { ...b, gap, relativeGap: bestSurplus > 0 ? gap / bestSurplus : null };
  });
  return { bestCut: best, bestSurplus, rows };
}
