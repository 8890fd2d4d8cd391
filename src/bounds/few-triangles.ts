// The few-triangles form of the explicit vector method: one ε for every vertex, V_i = N(i). Then
// Σ_i ε|N(i)| = 2mε and Σ_{ij∈E} |N(i) ∩ N(j)| = 3T (each triangle has three edges, and each of
// them sees the third vertex as a common neighbour), so the guarantee is the closed formula
//   g(ε) = ε·m/π − (3/2)·ε²·T,   0 ≤ ε ≤ 1/√Δ   (Δ the maximum degree),
// maximised at ε* = min(1/√Δ, m/(3πT)). A graph with T ≤ m√Δ/(3π) keeps at least half of its
// triangle-free value m/(π√Δ), a surplus of order m/√Δ; above that, g(ε*) = m²/(6π²T).

import type { Graph } from "../graph/graph.js";
import { sharedTriangleCount } from "../graph/structure/triangles.js";
import { boundApplies, boundDoesNotApply, type LowerBoundRecord } from "./types.js";
import { VECTOR_LINEAR_FACTOR, VECTOR_OVERLAP_FACTOR } from "./vector-guarantee.js";

/** Which side of ε* = min(1/√Δ, m/(3πT)) was taken. */
export type FewTrianglesRegime = "degree-capped" | "triangle-limited";

export interface FewTrianglesRecord extends LowerBoundRecord {
  /** T, the number of triangles. */
  triangles: number;
  /** Δ, the maximum degree. */
  maxDegree: number;
  /** The uniform ε* used (0 for a graph with no edges). */
  eps: number;
  /** degree-capped: ε* = 1/√Δ (few triangles); triangle-limited: ε* = m/(3πT) < 1/√Δ. */
  regime: FewTrianglesRegime;
  /** m√Δ/(3π): with at most this many triangles the form keeps half of m/(π√Δ). */
  halfValueTriangles: number;
}

/** The closed formula g(ε) = (1/2π)·2mε − ½·3Tε² at a uniform ε (the vector guarantee's two coefficients). */
export function fewTrianglesValue(m: number, triangles: number, eps: number): number {
  return VECTOR_LINEAR_FACTOR * 2 * m * eps - VECTOR_OVERLAP_FACTOR * 3 * triangles * eps * eps;
}

/**
 * Few-triangles bound: maxcut ≥ m/2 + max_{0≤ε≤1/√Δ} (εm/π − (3/2)ε²T), the explicit vector method
 * with a uniform ε (a corollary of the guarantee in vector-guarantee.ts; cf. Shearer 1992 for the
 * triangle-free case T = 0). Unweighted graphs only.
 */
export function fewTrianglesBound(graph: Graph): FewTrianglesRecord {
  const name = "few-triangles";
  let maxDegree = 0;
  for (let v = 0; v < graph.n; v++) maxDegree = Math.max(maxDegree, graph.degree(v));
  const m = graph.m;
  const halfValueTriangles = (m * Math.sqrt(maxDegree)) / (3 * Math.PI);
  if (graph.weighted) {
    const b = boundDoesNotApply(name, "proved for unweighted graphs only");
    return { name: b.name, value: b.value, surplus: b.surplus, applies: b.applies, reason: b.reason, triangles: 0, maxDegree, eps: 0, regime: "degree-capped", halfValueTriangles };
  }
  const triangles = m === 0 ? 0 : sharedTriangleCount(graph).total;
  const { eps, regime } = fewTrianglesChoice(m, triangles, maxDegree);
  const surplus = fewTrianglesValue(m, triangles, eps);
  const reason =
    regime === "degree-capped"
      ? `uniform ε = 1/√Δ (Δ = ${maxDegree}; T = ${triangles} triangles, at most m√Δ/(3π)): m/(π√Δ) − 3T/(2Δ)`
      : `uniform ε = m/(3πT) (T = ${triangles} triangles, above m√Δ/(3π)): m²/(6π²T)`;
  // Field by field rather than spread: this record is made several times per sweep job.
  const b = boundApplies(name, m, surplus, reason);
  return { name: b.name, value: b.value, surplus: b.surplus, applies: b.applies, reason: b.reason, triangles, maxDegree, eps, regime, halfValueTriangles };
}

/** ε* = min(1/√Δ, m/(3πT)) and which side of the minimum it is (the vector optimiser's uniform start uses it too). */
export function fewTrianglesChoice(m: number, triangles: number, maxDegree: number): { eps: number; regime: FewTrianglesRegime } {
  const cap = maxDegree === 0 ? 0 : 1 / Math.sqrt(maxDegree);
  // The parabola's vertex m/(3πT) is where the derivative m/π − 3Tε vanishes.
  const vertex = triangles === 0 ? Infinity : m / (3 * Math.PI * triangles);
  return { eps: Math.min(cap, vertex), regime: cap <= vertex ? "degree-capped" : "triangle-limited" };
}
