// Every closed-form lower bound for a graph side by side, with how far each sits below the best
// cut found: the gap in surplus terms, absolute and relative to the best surplus.

import { surplusOf } from "../graph/cut-value.js";
import type { Graph } from "../graph/graph.js";
import { edwardsEdgeBound, edwardsVertexBound } from "./edwards.js";
import { triangleFreeBound } from "./triangle-free.js";
import type { LowerBoundRecord } from "./types.js";
import { fewTrianglesBound } from "./few-triangles.js";
import { vectorOptimisedBound } from "./vector-choice.js";
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

/**
 * All lower bounds of src/bounds, in order: Edwards (edges), Edwards (vertices), triangle-free, vector
 * method (default choice), the few-triangles form, the vector method with the best choice found.
 */
export function lowerBounds(graph: Graph): LowerBoundRecord[] {
  const plain = ({ name, value, surplus, applies, reason }: LowerBoundRecord): LowerBoundRecord => ({ name, value, surplus, applies, reason });
  return [
    edwardsEdgeBound(graph),
    edwardsVertexBound(graph),
    triangleFreeBound(graph),
    plain(vectorMethodGuarantee(graph)),
    plain(fewTrianglesBound(graph)),
    vectorOptimisedBound(graph),
  ];
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
