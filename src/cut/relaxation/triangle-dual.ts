// Certified max-cut upper bounds from the SDP relaxation strengthened by triangle inequalities: a
// dual vector y, nonnegative multipliers μ_t on listed triangle inequalities and a proven shift.
//
// The inequalities. For a cut x ∈ {±1}ⁿ and X = xxᵀ, every triple i < j < k satisfies
//   Σ_p s_p·X_p ≤ 1   over its pairs p = (ij, ik, jk),
// for the four sign patterns s with an odd number of minus signs (TRIANGLE_SIGNS): among three ±1
// values at most two pairs differ, so at most two products are −1. Written ⟨A_t, X⟩ ≤ 1 with A_t
// holding s_p/2 at both positions of pair p. (Barahona and Mahjoub, "On the cut polytope", Math.
// Programming 36 (1986); the SDP with these cuts is the strengthening of Rendl, Rinaldi and Wiegele,
// Math. Programming 121 (2010).)
//
// The bound. For any y, μ ≥ 0 and shift ≥ λmax(M), M = L − Diag(y) − 4Σ_t μ_t A_t:
//   cut = ¼xᵀLx ≤ ¼xᵀLx + Σμ_t(1 − xᵀA_t x) = ¼Σy + Σμ_t + ¼xᵀMx ≤ ¼(Σy + n·shift) + Σμ_t,
// and the same holds for every X of the strengthened relaxation (⟨shift·I − M, X⟩ ≥ 0, tr X = n,
// ⟨A_t, X⟩ ≤ 1), so the bound is at least that relaxation's value. shift ≥ λmax(M) is proved by
// Cholesky of Diag(y) + shift·I − L + 4Σμ_t A_t, whose off-diagonal entries are w_ij + 2Σ μ_t s_p
// (`proveShift` with these extra terms and their rounding bound); the sum is `dualBoundValue`.

import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { checkMemory } from "../../limits/memory.js";
import { roundoffGamma, roundUp } from "../../linalg/float-rounding.js";
import { lanczosExtreme } from "../../linalg/lanczos.js";
import { denseOperator } from "../../linalg/operator.js";
import { denseTopEigenvalue } from "../../linalg/top-eigenvalue.js";
import { MAX_DUAL_ENTRY, proveShift, type OffDiagonalTerms } from "./certificate.js";
import { dualBoundValue } from "./dual-bound.js";

/** Signs (s_ij, s_ik, s_jk) of the four triangle inequalities of a triple i < j < k, by pattern 0..3. */
export const TRIANGLE_SIGNS: readonly (readonly [number, number, number])[] = [
  [-1, -1, -1],
  [-1, 1, 1],
  [1, -1, 1],
  [1, 1, -1],
];

/**
 * The evidence of a strengthened bound: max cut ≤ ¼(Σy + n·shift) + Σμ_t, because
 * Diag(y) + shift·I − L + 4Σμ_t A_t ⪰ 0 (proved by Cholesky) and μ ≥ 0.
 */
export interface TriangleCertificate {
  kind: "triangle-dual";
  y: Float64Array;
  shift: number;
  shiftProof: "cholesky";
  /** Four integers per inequality: i < j < k and the sign pattern 0..3 (TRIANGLE_SIGNS). */
  triangles: Int32Array;
  /** Multiplier μ_t ≥ 0 of each inequality. */
  mu: Float64Array;
}

/** Up to this n the shift is estimated by one unrestarted Lanczos run (`denseTopEigenvalue`: 2–3 times faster there on ER_7 and a 3-regular graph with 100 vertices, our measurement). */
const QUICK_ESTIMATE_BELOW = 200;

/** Largest n whose strengthened bound is proved (dense Cholesky; the relaxation is meant for n up to a few thousand). */
export const TRIANGLE_DENSE_LIMIT = 3000;

/** A one-line reason the certificate's lists are malformed, or null. */
export function triangleListProblem(n: number, triangles: ArrayLike<number>, mu: ArrayLike<number>): string | null {
  if (triangles.length % 4 !== 0) return `\`triangles\` holds ${triangles.length} numbers, not four per inequality`;
  if (mu.length * 4 !== triangles.length) return `\`mu\` has ${mu.length} entries for ${triangles.length / 4} inequalities`;
  for (let t = 0; t < mu.length; t++) {
    const i = triangles[4 * t], j = triangles[4 * t + 1], k = triangles[4 * t + 2], p = triangles[4 * t + 3];
    if (![i, j, k, p].every(Number.isInteger) || !(0 <= i && i < j && j < k && k < n)) return `inequality ${t}: vertices (${i}, ${j}, ${k}) should satisfy 0 ≤ i < j < k < n = ${n}`;
    if (!(p >= 0 && p <= 3)) return `inequality ${t}: sign pattern ${p} should be 0, 1, 2 or 3`;
    const m = mu[t];
    if (typeof m !== "number" || !(m >= 0 && m <= MAX_DUAL_ENTRY)) return `\`mu\`[${t}] is ${String(m)}, expected a number in [0, ${MAX_DUAL_ENTRY}]`;
  }
  return null;
}

/**
 * The terms 4Σμ_t A_t for `proveShift`: adds 2μ_t·s_p to the lower-triangle entry of each pair and
 * returns ρ ≥ ‖E‖₂ of the rounding. Entry (i, j) is w_ij plus c_ij further terms, a sum with error
 * ≤ γ_{T+1}·(|w_ij| + Σ 2μ_t) (Higham, Accuracy and Stability, §3.1; ×2 is exact), so the row sums
 * of |E| are ≤ γ_{T+1}·(Σ_j|w_ij| + 4Σ_{t∋i} μ_t), and ‖E‖₂ ≤ max row sum (E is symmetric).
 */
export function triangleTerms(graph: Graph, triangles: ArrayLike<number>, mu: ArrayLike<number>): OffDiagonalTerms {
  return (a, n) => {
    const T = mu.length;
    const mass = new Float64Array(n);
    const terms = new Float64Array(n);
    for (let t = 0; t < T; t++) {
      const m = mu[t];
      if (m === 0) continue;
      const i = triangles[4 * t], j = triangles[4 * t + 1], k = triangles[4 * t + 2];
      const s = TRIANGLE_SIGNS[triangles[4 * t + 3]];
      const h = 2 * m;
      // Lower triangle: row index above column index.
      a[j * n + i] += s[0] * h;
      a[k * n + i] += s[1] * h;
      a[k * n + j] += s[2] * h;
      mass[i] += 2 * h;
      mass[j] += 2 * h;
      mass[k] += 2 * h;
      terms[i] += 2;
      terms[j] += 2;
      terms[k] += 2;
    }
    const { offsets, weights } = graph;
    let rho = 0;
    for (let i = 0; i < n; i++) {
      let abs = 0;
      for (let q = offsets[i]; q < offsets[i + 1]; q++) abs += weights === null ? 1 : Math.abs(weights[q]);
      // The row mass itself is a float sum of deg + terms values: enlarge it by its own γ.
      const row = (abs + mass[i]) * (1 + roundoffGamma(offsets[i + 1] - offsets[i] + terms[i] + 2));
      if (row > rho) rho = row;
    }
    return roundUp(rho * roundoffGamma(T + 2), 2);
  };
}

/** M = L − Diag(y) − 4Σμ_t A_t, dense row-major (for estimates only: proofs go through `proveShift`). */
export function strengthenedMatrix(graph: Graph, y: ArrayLike<number>, triangles: ArrayLike<number>, mu: ArrayLike<number>): Float64Array {
  const { n, offsets, neighbors, weights } = graph;
  checkMemory(8 * n * n, `strengthened bound: a dense ${n}×${n} matrix`);
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    let d = 0;
    for (let q = offsets[i]; q < offsets[i + 1]; q++) {
      const w = weights === null ? 1 : weights[q];
      a[i * n + neighbors[q]] -= w;
      d += w;
    }
    a[i * n + i] += d - y[i];
  }
  for (let t = 0; t < mu.length; t++) {
    const m = mu[t];
    if (m === 0) continue;
    const i = triangles[4 * t], j = triangles[4 * t + 1], k = triangles[4 * t + 2];
    const s = TRIANGLE_SIGNS[triangles[4 * t + 3]];
    const h = 2 * m;
    a[i * n + j] -= s[0] * h;
    a[j * n + i] -= s[0] * h;
    a[i * n + k] -= s[1] * h;
    a[k * n + i] -= s[1] * h;
    a[j * n + k] -= s[2] * h;
    a[k * n + j] -= s[2] * h;
  }
  return a;
}

export interface TriangleBound {
  /** ¼(Σy + n·shift) + Σμ, rounded up (`dualBoundValue`); Infinity when no shift could be proved. */
  value: number;
  certificate: TriangleCertificate;
  proven: boolean;
}

/**
 * Certify (y, triangles, μ): estimate λmax(M) by Lanczos, then prove a shift a little above it by
 * Cholesky, widening the margin tenfold per failed attempt.
 */
export function certifyTriangleDual(graph: Graph, y: ArrayLike<number>, triangles: Int32Array, mu: Float64Array, solverSeed = 1): TriangleBound {
  const n = graph.n;
  const owner = "certifyTriangleDual";
  if (n > TRIANGLE_DENSE_LIMIT) throw new InputError(`${owner}: n = ${n} is above ${TRIANGLE_DENSE_LIMIT}, the largest graph whose strengthened bound is proved`);
  if (y.length !== n) throw new InputError(`${owner}: \`y\` has ${y.length} entries but the graph has ${n} vertices`);
  const problem = triangleListProblem(n, triangles, mu);
  if (problem !== null) throw new InputError(`${owner}: ${problem}`);
  const yy = Float64Array.from(y);
  const cert: TriangleCertificate = { kind: "triangle-dual", y: yy, shift: 0, shiftProof: "cholesky", triangles: Int32Array.from(triangles), mu: Float64Array.from(mu) };
  if (n === 0) return { value: dualBoundValue(yy, 0, cert.mu), certificate: cert, proven: true };
  let theta: number, margin: number, slack: number;
  if (n <= QUICK_ESTIMATE_BELOW) {
    // Small n: one unrestarted Lanczos run (no eigenvector needed); the Cholesky proof below decides.
    const est = denseTopEigenvalue(strengthenedMatrix(graph, yy, triangles, mu), n, { solverSeed });
    theta = est.value;
    slack = 0;
    margin = Math.max(2 * est.lastChange, 1e-10 * Math.max(est.scale, 1e-300));
  } else {
    const est = lanczosExtreme(denseOperator(strengthenedMatrix(graph, yy, triangles, mu), n), { which: "largest", k: 1, tolerance: 1e-10, solverSeed, maxRestarts: 100, denseBelow: 0, maxBasis: Math.min(n, 40) });
    theta = est.values[0];
    slack = est.residuals[0];
    margin = Math.max(2 * est.residuals[0], 1e-10 * Math.max(est.normEstimate, 1e-300));
  }
  const extra = triangleTerms(graph, cert.triangles, cert.mu);
  for (let attempt = 1; attempt <= (n <= QUICK_ESTIMATE_BELOW ? 9 : 6); attempt++) {
    const shift = roundUp(theta + slack + margin, 2);
    if (proveShift(graph, yy, shift, extra).proven) {
      cert.shift = shift;
      return { value: dualBoundValue(yy, shift, cert.mu), certificate: cert, proven: true };
    }
    margin *= attempt < 3 || n <= QUICK_ESTIMATE_BELOW ? 10 : 1000;
  }
  return { value: Infinity, certificate: cert, proven: false };
}

export interface TriangleCheck {
  ok: boolean;
  /** The bound the certificate proves (NaN when it fails). */
  value: number;
  message: string;
}

/**
 * Re-check a strengthened certificate from the graph alone: the lists are well formed, every μ_t ≥ 0,
 * and the Cholesky proof of Diag(y) + shift·I − L + 4Σμ_t A_t ⪰ 0 is redone at the claimed shift.
 */
export function verifyTriangleCertificate(graph: Graph, certificate: TriangleCertificate): TriangleCheck {
  const bad = (message: string): TriangleCheck => ({ ok: false, value: NaN, message });
  const c = certificate;
  if (c === null || typeof c !== "object" || c.kind !== "triangle-dual") return bad("not a triangle-dual certificate");
  if (c.shiftProof !== "cholesky") return bad(`shift proof ${String(c.shiftProof)}: only cholesky proves a strengthened bound`);
  const n = graph.n;
  if (c.y?.length !== n) return bad(`\`y\` has ${String(c.y?.length)} entries but the graph has ${n} vertices`);
  for (let i = 0; i < n; i++) if (typeof c.y[i] !== "number" || !(Math.abs(c.y[i]) <= MAX_DUAL_ENTRY)) return bad(`\`y\`[${i}] is ${String(c.y[i])}, expected a finite number`);
  if (typeof c.shift !== "number" || !(Math.abs(c.shift) <= MAX_DUAL_ENTRY)) return bad(`shift is ${String(c.shift)}, expected a finite number`);
  const problem = triangleListProblem(n, c.triangles, c.mu);
  if (problem !== null) return bad(problem);
  if (n > TRIANGLE_DENSE_LIMIT) return bad(`n = ${n} is above ${TRIANGLE_DENSE_LIMIT}: the Cholesky proof was not redone`);
  const proof = proveShift(graph, c.y, c.shift, triangleTerms(graph, c.triangles, c.mu));
  if (!proof.proven) return bad(`Cholesky check failed: ${proof.message}`);
  const value = dualBoundValue(c.y, c.shift, c.mu);
  return { ok: true, value, message: `re-proved with ${c.mu.length} triangle inequalities: max cut ≤ ${value}` };
}
