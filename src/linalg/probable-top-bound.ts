// A probabilistic upper bound on λmax(A), A = Diag(c) − W (c exact within a stated error, W a graph's
// weight matrix), with an explicit failure probability δ, rigorous against rounding.
//
// Source of the idea: Kuczyński & Woźniakowski, "Estimating the largest eigenvalue by the power and
// Lanczos algorithms with a random start", SIAM J. Matrix Anal. Appl. 13 (1992) 1094–1122: with a
// random start, the component along the top eigenvector is small only with small probability, and a
// Chebyshev polynomial of degree d amplifies that component over the rest of the spectrum (their
// Lanczos bound is proved through such a polynomial; Lanczos's Ritz value dominates every polynomial
// filter). We evaluate the Chebyshev filter itself, so the rounding analysis is that of a three-term
// recurrence and needs no exact-arithmetic Lanczos.
//
// The inequality. Let b ~ N(0, I) (the seeded generator modelled as exact Gaussians), v a unit
// eigenvector of λ1 = λmax(A), c₁ = vᵀb ~ N(0, 1), so P(|c₁| < x) ≤ x·√(2/π) and with
// x = δ·√(π/2) the event E = {|c₁| ≥ x} has probability ≥ 1 − δ. Take any lo < top, the doubles
// α = fl(2/(top − lo)) > 0, β = fl(−(top + lo)/(top − lo)) and S = αA + βI (exactly). The computed
// recurrence t₀ = b, t₁ = fl(S t₀), t_{j+1} = fl(2S t_j − t_{j−1}) satisfies
// t̂_{j+1} = 2S t̂_j − t̂_{j−1} + f_j (f₀ for t₁), and by linearity t̂_d = T_d(S)b + Σ_{j<d} U_{d−1−j}(S) f_j
// (T, U Chebyshev polynomials of the first and second kind). Projecting on v, with s₁ = αλ1 + β:
//   |T_d(s₁)|·|c₁| ≤ ‖t̂_d‖ + Σ_j |U_{d−1−j}(s₁)|·‖f_j‖.
// If s₁ = cosh τ ≥ 1: U_k(s₁) ≤ min(k + 1, e^τ/sinh τ)·T_k(s₁) and T_{d−1−j}(s₁) ≤ T_d(s₁)/T_{j+1}(s₁)
// (cosh(x + y) ≥ cosh x·cosh y), so on E
//   x ≤ |c₁| ≤ g(τ) := ‖t̂_d‖/cosh(dτ) + Σ_j min(d − j, e^τ/sinh τ)·φ_j/cosh((j + 1)τ),   φ_j ≥ ‖f_j‖.
// g is non-increasing, so for any τ* with g(τ*) < x, τ < τ*, i.e. λ1 < (cosh τ* − β)/α; and if s₁ < 1,
// λ1 < (1 − β)/α, which is smaller. This holds for any lo, top and d (they only make it tight), so the
// bound is valid on E whatever they are. The rounding allowance φ_j (Higham's γ_k, §3.1): each entry of
// fl(S x) is a sum of deg + 1 products plus two operations, then one subtraction, so
//   ‖f_j‖ ≤ γ_K·(2α(max|ĉ_i| + max_i Σ_k|w_ik|)‖t̂_j‖ + 2α‖ẑ‖ + 2|β|‖t̂_j‖ + 2‖p̂‖ + ‖t̂_{j−1}‖) + 2α·e·‖t̂_j‖,
// K = maximum degree + 4, ẑ = fl(A t̂_j), p̂ = fl(αẑ + βt̂_j), e the error of the diagonal, and every
// norm is rounded up. τ* is found by bisection, each g evaluated in floating point and accepted only
// when g·(1 + 10⁻⁶) < x·(1 − 10⁻¹²) (the evaluation's own error is below 10⁻¹⁰ relative for d ≤ 10⁶).

import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { Rng } from "../random/prng.js";
import { roundoffGamma, roundUp, UNIT_ROUNDOFF } from "./float-rounding.js";

/** Stream of the generator for the random start, apart from every other use of the seed. */
const START_STREAM = 0x70726f62;

export interface ProbableTopOptions {
  /** δ in (0, 1): the bound fails with probability at most δ over the start vector. */
  failureProbability: number;
  /** Seed of the Gaussian start vector (stream START_STREAM of Rng). */
  solverSeed: number;
  /** Degree d of the Chebyshev filter: d operator applications, the work of the bound (1 ≤ d ≤ 10⁶). */
  degree: number;
  /** Upper end of the filter's interval: any number above `bottom`; tight when just above λmax. */
  top: number;
  /** Lower end of the filter's interval; tight when at or below λmin. */
  bottom: number;
}

export interface ProbableTopBound {
  /** Upper bound on λmax(A) that fails with probability ≤ failureProbability, or NaN when none was found. */
  bound: number;
  found: boolean;
  failureProbability: number;
  solverSeed: number;
  degree: number;
  top: number;
  bottom: number;
  /** ‖t̂_d‖ and Σφ_j, for the record. */
  filteredNorm: number;
  roundingTotal: number;
  message: string;
}

/** The degree that balances filter growth against rounding for n vertices and δ (a heuristic choice; the bound is valid for any degree). */
export function probableFilterDegree(n: number, failureProbability: number, maxDegreeOfGraph: number): number {
  const x = failureProbability * Math.sqrt(Math.PI / 2);
  // φ ≈ γ_K·10·√n per step; the rounding sum is ≈ 1.6·φ/τ², kept at half of x.
  const phi = roundoffGamma(maxDegreeOfGraph + 4) * 10 * Math.sqrt(Math.max(1, n));
  const tau = Math.min(1, Math.max(0.02, Math.sqrt((3.2 * phi) / x)));
  const d = Math.ceil(Math.log((4 * Math.sqrt(Math.max(1, n))) / x) / tau);
  return Math.max(8, Math.min(20000, d));
}

/** Upward-rounded Euclidean norm of x[0..n). */
function normUp(x: Float64Array): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += x[i] * x[i];
  return roundUp(Math.sqrt(s * (1 + 2 * roundoffGamma(x.length + 2))), 2);
}

/**
 * A bound on λmax(Diag(c) − W) that holds with probability ≥ 1 − δ over the seeded start vector
 * (Kuczyński & Woźniakowski 1992, in the Chebyshev-filter form stated in the file header), where the
 * exact c satisfies |c_i − diagonal_i| ≤ diagonalError. Work: `degree` applications of the matrix.
 */
export function probableTopBound(graph: Graph, diagonal: ArrayLike<number>, diagonalError: number, options: ProbableTopOptions): ProbableTopBound {
  const { failureProbability: delta, solverSeed, degree: d, top, bottom } = options;
  const n = graph.n;
  if (!(delta > 0 && delta < 1)) throw new InputError(`probableTopBound: invalid \`failureProbability\`: should be a number in (0, 1) (got ${delta})`);
  if (!(Number.isInteger(d) && d >= 1 && d <= 1e6)) throw new InputError(`probableTopBound: invalid \`degree\`: should be an integer between 1 and 1000000 (got ${d})`);
  if (!(Number.isFinite(top) && Number.isFinite(bottom) && top > bottom)) throw new InputError(`probableTopBound: \`top\` (${top}) should be a finite number above \`bottom\` (${bottom})`);
  const base = { failureProbability: delta, solverSeed, degree: d, top, bottom };
  const none = (message: string, filteredNorm = NaN, roundingTotal = NaN): ProbableTopBound => ({ ...base, bound: NaN, found: false, filteredNorm, roundingTotal, message });
  if (n === 0) return { ...base, bound: -Infinity, found: true, filteredNorm: 0, roundingTotal: 0, message: "empty matrix" };

  const { offsets, neighbors, weights } = graph;
  const alpha = 2 / (top - bottom);
  const beta = -(top + bottom) / (top - bottom);
  if (!(alpha > 0 && Number.isFinite(alpha) && Number.isFinite(beta))) return none(`the interval [${bottom}, ${top}] is too narrow or too wide`);
  let maxC = 0, maxW = 0, maxDeg = 0;
  for (let i = 0; i < n; i++) {
    maxC = Math.max(maxC, Math.abs(diagonal[i]));
    let s = 0;
    for (let k = offsets[i]; k < offsets[i + 1]; k++) s += Math.abs(weights === null ? 1 : weights[k]);
    maxW = Math.max(maxW, s);
    maxDeg = Math.max(maxDeg, offsets[i + 1] - offsets[i]);
  }
  // Row sums of |W| rounded up (a sum of deg terms), so ‖|W|‖₂ ≤ maxW.
  maxW = roundUp(maxW * (1 + roundoffGamma(maxDeg + 1)), 2);
  const gammaK = roundoffGamma(maxDeg + 4);
  const rowFactor = roundUp(2 * alpha * (maxC + maxW) * (1 + 4 * UNIT_ROUNDOFF), 2);

  const rng = new Rng(solverSeed, START_STREAM);
  let prev = new Float64Array(n); // t̂_{j−1} (zero before t̂_1)
  let cur = new Float64Array(n); // t̂_j
  let next = new Float64Array(n);
  for (let i = 0; i < n; i++) cur[i] = rng.nextNormal();
  const phi = new Float64Array(d);
  for (let j = 0; j < d; j++) {
    const first = j === 0;
    let zz = 0, pp = 0;
    for (let i = 0; i < n; i++) {
      let z = diagonal[i] * cur[i];
      for (let k = offsets[i]; k < offsets[i + 1]; k++) z -= (weights === null ? 1 : weights[k]) * cur[neighbors[k]];
      const p = alpha * z + beta * cur[i];
      zz += z * z;
      pp += p * p;
      next[i] = first ? p : 2 * p - prev[i];
    }
    const xNorm = normUp(cur);
    const zNorm = roundUp(Math.sqrt(zz * (1 + 2 * roundoffGamma(n + 2))), 2);
    const pNorm = roundUp(Math.sqrt(pp * (1 + 2 * roundoffGamma(n + 2))), 2);
    const prevNorm = first ? 0 : normUp(prev);
    const f = gammaK * (rowFactor * xNorm + 2 * alpha * zNorm + 2 * Math.abs(beta) * xNorm + 2 * pNorm + prevNorm) + 2 * alpha * diagonalError * xNorm;
    phi[j] = roundUp(f * (1 + 16 * UNIT_ROUNDOFF), 2);
    if (!(xNorm < 1e250 && Number.isFinite(phi[j]))) return none(`the filtered vector overflowed at step ${j + 1}: the filter's top end ${top} lies far below λmax`);
    const t = prev;
    prev = cur;
    cur = next;
    next = t;
  }
  const filteredNorm = normUp(cur);
  if (!(filteredNorm < 1e250)) return none(`the filtered vector overflowed: the filter's top end ${top} lies far below λmax`);
  let roundingTotal = 0;
  for (let j = 0; j < d; j++) roundingTotal += phi[j];

  const x = delta * Math.sqrt(Math.PI / 2) * (1 - 1e-12);
  const g = (tau: number): number => {
    const amp = tau > 0 ? Math.exp(tau) / Math.sinh(tau) : Infinity;
    let s = filteredNorm / Math.cosh(d * tau);
    for (let j = 0; j < d; j++) s += (Math.min(d - j, amp) * phi[j]) / Math.cosh((j + 1) * tau);
    return s * (1 + 1e-6);
  };
  // Bracket τ*: g(0) is finite; double until g < x (g → 0 as τ grows), then bisect.
  let hi = Math.max(1e-8, Math.log((4 * filteredNorm) / x + 1) / d);
  let steps = 0;
  while (!(g(hi) < x)) {
    hi *= 2;
    if (++steps > 200 || !Number.isFinite(hi)) return none(`no filter level met the failure probability ${delta} (rounding allowance ${roundingTotal} against ${x})`, filteredNorm, roundingTotal);
  }
  let lo = 0;
  for (let it = 0; it < 60; it++) {
    const mid = (lo + hi) / 2;
    if (g(mid) < x) hi = mid;
    else lo = mid;
  }
  // s* = cosh τ* rounded up, then λ = (s* − β)/α rounded up: two operations, each within u.
  const sStar = roundUp(Math.cosh(hi) * (1 + 4 * UNIT_ROUNDOFF), 2);
  const raw = (sStar - beta) / alpha;
  const bound = roundUp(raw + 4 * UNIT_ROUNDOFF * ((Math.abs(sStar) + Math.abs(beta)) / alpha + Math.abs(raw)), 2);
  return {
    ...base,
    bound,
    found: true,
    filteredNorm,
    roundingTotal,
    message: `λmax ≤ ${bound} with probability ≥ 1 − ${delta} (Chebyshev filter of degree ${d} on [${bottom}, ${top}], seed ${solverSeed})`,
  };
}
