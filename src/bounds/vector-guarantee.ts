// The explicit vector method's guarantee, computed exactly and only here: rounding the unit
// vectors ∝ e_i − ε_i·Σ_{k∈V_i} e_k by a random hyperplane has expected surplus at least
// (1/2π)·Σ_i ε_i|V_i| − ½·Σ_{ij∈E} ε_i ε_j |V_i ∩ V_j|   (unweighted graphs).

import type { Graph } from "../graph/graph.js";
import { boundApplies, boundDoesNotApply, type LowerBoundRecord } from "./types.js";
import { resolveVectorSets, vectorEdgeTerms, type VectorEdgeTerms, type VectorSetOptions, type VectorSets } from "./vector-sets.js";

export interface VectorGuaranteeRecord extends LowerBoundRecord {
  /** (1/2π)·Σ_i ε_i|V_i|. */
  linearTerm: number;
  /** ½·Σ_{ij∈E} ε_i ε_j |V_i ∩ V_j|. */
  overlapTerm: number;
  /** Edges ij with V_i ∩ V_j non-empty (with V = N: the edges lying in a triangle). */
  overlapEdges: number;
}

/** The guarantee for already-resolved sets and edge terms (shared with the rounding, which computes them once). */
export function vectorMethodGuaranteeFor(graph: Graph, sets: VectorSets, terms: VectorEdgeTerms = vectorEdgeTerms(graph, sets)): VectorGuaranteeRecord {
  const name = "vector-method";
  const { offsets, eps } = sets;
  let linear = 0;
  for (let i = 0; i < graph.n; i++) linear += eps[i] * (offsets[i + 1] - offsets[i]);
  linear /= 2 * Math.PI;
  let overlap = 0;
  let overlapEdges = 0;
  const nb = graph.neighbors;
  for (let i = 0; i < graph.n; i++) {
    for (let a = graph.offsets[i]; a < graph.offsets[i + 1]; a++) {
      const j = nb[a];
      const k = terms.overlap[a];
      if (j > i && k > 0) {
        overlap += eps[i] * eps[j] * k;
        overlapEdges++;
      }
    }
  }
  overlap /= 2;
  const base = { linearTerm: linear, overlapTerm: overlap, overlapEdges };
  if (graph.weighted) {
    return { ...boundDoesNotApply(name, "the vector-method guarantee is proved for unweighted graphs"), ...base };
  }
  const what = sets.neighbourhoods ? "V_i = N(i)" : "the given V_i";
  return {
    ...boundApplies(name, graph.totalWeight, linear - overlap, `explicit vector method with ${what}: (1/2π)Σ ε_i|V_i| − ½Σ_{ij∈E} ε_iε_j|V_i∩V_j|`),
    ...base,
  };
}

/** Guarantee of the explicit vector method for sets V_i and weights ε_i (defaults V_i = N(i), ε_i = 1/√|V_i|). */
export function vectorMethodGuarantee(graph: Graph, options: VectorSetOptions = {}): VectorGuaranteeRecord {
  return vectorMethodGuaranteeFor(graph, resolveVectorSets(graph, options));
}
