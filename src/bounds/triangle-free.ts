// The triangle-free bound maxcut ≥ m/2 + (1/2π)·Σ_i √d_i: the explicit vector method with
// V_i = N(i), ε_i = 1/√d_i, whose overlap term vanishes exactly when no edge lies in a triangle.
// Shearer (1992, "A note on bipartite subgraphs of triangle-free graphs") proved a surplus of this
// order, c·Σ_i √d_i, for every triangle-free graph.

import type { Graph } from "../graph/graph.js";
import { boundDoesNotApply, type LowerBoundRecord } from "./types.js";
import { vectorMethodGuarantee } from "./vector-guarantee.js";

export function triangleFreeBound(graph: Graph): LowerBoundRecord {
  const name = "triangle-free";
  if (graph.weighted) return boundDoesNotApply(name, "proved for unweighted graphs only");
  const g = vectorMethodGuarantee(graph);
  if (g.overlapEdges > 0) {
    return boundDoesNotApply(name, `the graph has triangles (${g.overlapEdges} edges lie in one); see the vector-method guarantee instead`);
  }
  return {
    name,
    value: g.value,
    surplus: g.surplus,
    applies: true,
    reason: "triangle-free: explicit vector method with V_i = N(i), ε_i = 1/√d_i gives surplus ≥ (1/2π)Σ_i √d_i (a bound of this order: Shearer 1992)",
  };
}
