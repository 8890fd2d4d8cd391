// The explicit vector method's guarantee, computed exactly and only here: rounding the unit
// vectors ∝ e_i − ε_i·Σ_{k∈V_i} e_k by a random hyperplane has expected surplus at least
// (1/2π)·Σ_i ε_i|V_i| − ½·Σ_{ij∈E} ε_i ε_j |V_i ∩ V_j|   (unweighted graphs).
//
// The proof, edge by edge: with A = ε_j[i∈V_j] + ε_i[j∈V_i], B = ε_iε_j|V_i∩V_j| and N = ‖x_i‖‖x_j‖,
// the edge's cosine is (B − A)/N and its expected surplus is −arcsin(cos)/π. Since arcsin(c) ≥ c for
// c ≤ 0 and arcsin(c) ≤ (π/2)c for 0 ≤ c ≤ 1, that is at least A/(Nπ) − B/(2N) (the "normed" form);
// then 1 ≤ N ≤ 2 (ε_i²|V_i| ≤ 1) gives A/(2π) − B/2, and Σ_edges A = Σ_i ε_i|V_i|.

import type { Graph } from "../graph/graph.js";
import { perGraph } from "../graph/per-graph.js";
import { boundApplies, boundDoesNotApply, type LowerBoundRecord } from "./types.js";
import { resolveVectorSets, vectorEdgeTerms, type VectorEdgeTerms, type VectorSetOptions, type VectorSets } from "./vector-sets.js";

/**
 * The two coefficients of the guarantee, shared with everything that rearranges it (the optimiser's
 * per-vertex gains, the few-triangles closed form): a cut edge's surplus −arcsin(c)/π is at least
 * (1/π)·(negative part of the cosine) − ½·(positive part), and the norms lie in [1, √2].
 */
export const VECTOR_LINEAR_FACTOR = 1 / (2 * Math.PI);
export const VECTOR_OVERLAP_FACTOR = 1 / 2;

// The record's two possible reasons, built once (a template literal would build a new string per record).
const REASON_TAIL = ": (1/2π)Σ ε_i|V_i| − ½Σ_{ij∈E} ε_iε_j|V_i∩V_j|";
const REASON_NEIGHBOURHOODS = "explicit vector method with V_i = N(i)" + REASON_TAIL;
const REASON_GIVEN_SETS = "explicit vector method with the given V_i" + REASON_TAIL;

export interface VectorGuaranteeRecord extends LowerBoundRecord {
  /** (1/2π)·Σ_i ε_i|V_i|. */
  linearTerm: number;
  /** ½·Σ_{ij∈E} ε_i ε_j |V_i ∩ V_j|. */
  overlapTerm: number;
  /** Edges ij with V_i ∩ V_j non-empty (with V = N: the edges lying in a triangle). */
  overlapEdges: number;
  /**
   * Σ_{ij∈E} (A/(Nπ) − B/(2N)): the bound before the norms N are replaced by their bounds 1 and 2;
   * it lies between the guarantee and the exact expectation (both steps of the proof above).
   */
  normedTerm: number;
}

/** The guarantee for already-resolved sets and edge terms (shared with the rounding, which computes them once). */
export function vectorMethodGuaranteeFor(graph: Graph, sets: VectorSets, terms: VectorEdgeTerms = vectorEdgeTerms(graph, sets)): VectorGuaranteeRecord {
  const name = "vector-method";
  const { offsets, eps } = sets;
  let linear = 0;
  for (let i = 0; i < graph.n; i++) linear += eps[i] * (offsets[i + 1] - offsets[i]);
  linear *= VECTOR_LINEAR_FACTOR;
  let overlap = 0;
  let overlapEdges = 0;
  let normed = 0;
  const nb = graph.neighbors;
  const { member } = terms;
  for (let i = 0; i < graph.n; i++) {
    const ni = 1 + eps[i] * eps[i] * (offsets[i + 1] - offsets[i]);
    for (let a = graph.offsets[i]; a < graph.offsets[i + 1]; a++) {
      const j = nb[a];
      if (j < i) continue;
      const k = terms.overlap[a];
      const b = eps[i] * eps[j] * k;
      if (k > 0) {
        overlap += b;
        overlapEdges++;
      }
      const jInI = member === null ? 1 : member[a];
      const iInJ = member === null ? 1 : member[graph.arcIndex(j, i)];
      const norm = Math.sqrt(ni * (1 + eps[j] * eps[j] * (offsets[j + 1] - offsets[j])));
      normed += ((eps[j] * iInJ + eps[i] * jInI) * 2 * VECTOR_LINEAR_FACTOR - b * VECTOR_OVERLAP_FACTOR) / norm;
    }
  }
  overlap *= VECTOR_OVERLAP_FACTOR;
  // Written out field by field (not spread from boundApplies): the record is made several times
  // per sweep job, and object spread costs more than the sums above on small graphs.
  const b = graph.weighted
    ? boundDoesNotApply(name, "the vector-method guarantee is proved for unweighted graphs")
    : boundApplies(name, graph.totalWeight, linear - overlap, sets.neighbourhoods ? REASON_NEIGHBOURHOODS : REASON_GIVEN_SETS);
  return { name: b.name, value: b.value, surplus: b.surplus, applies: b.applies, reason: b.reason, linearTerm: linear, overlapTerm: overlap, overlapEdges, normedTerm: normed };
}

/** The default choice (V_i = N(i), ε_i = 1/√d_i) with its edge terms and guarantee. */
export interface DefaultVectorChoice {
  sets: VectorSets;
  terms: VectorEdgeTerms;
  guarantee: VectorGuaranteeRecord;
}

/**
 * The default choice, its edge terms and its guarantee, computed once per Graph object: a sweep job
 * asks for them in the vector-method and triangle-free evaluators and again as the optimiser's first
 * start (optimiseVectorChoice). Read-only, like every perGraph result.
 */
export const sharedDefaultVectorChoice: (graph: Graph) => DefaultVectorChoice = perGraph((g) => {
  const sets = resolveVectorSets(g);
  const terms = vectorEdgeTerms(g, sets);
  return { sets, terms, guarantee: vectorMethodGuaranteeFor(g, sets, terms) };
});

/** Guarantee of the explicit vector method for sets V_i and weights ε_i (defaults V_i = N(i), ε_i = 1/√|V_i|). */
export function vectorMethodGuarantee(graph: Graph, options: VectorSetOptions = {}): VectorGuaranteeRecord {
  if (options.sets === undefined && options.eps === undefined && options.epsScale === undefined) {
    // A copy: the shared record stays as computed whatever the caller does with its own.
    const r = sharedDefaultVectorChoice(graph).guarantee;
    return { name: r.name, value: r.value, surplus: r.surplus, applies: r.applies, reason: r.reason, linearTerm: r.linearTerm, overlapTerm: r.overlapTerm, overlapEdges: r.overlapEdges, normedTerm: r.normedTerm };
  }
  return vectorMethodGuaranteeFor(graph, resolveVectorSets(graph, options));
}
