// Certified max-cut upper bounds from a dual vector y: find a shift λ̄ ≥ λmax(L − Diag(y)), so that
// Diag(y + λ̄) − L ⪰ 0 and ¼(Σy + n·λ̄) ≥ SDP ≥ max cut whatever solver produced y; and re-check one.
//
// Why it is a bound: for a cut x ∈ {±1}ⁿ, cut = ¼xᵀLx = ¼Σy_i + ¼xᵀ(L − Diag(y))x ≤ ¼Σy_i + ¼n·λmax(L − Diag(y)).
// How λ̄ is established (certificate.shiftProof):
//   "cholesky"          proof: a Lanczos estimate θ + ρ + margin, then a floating-point Cholesky
//                       factorisation of Diag(y) + λ̄·I − L with a rounding-error margin
//                       (src/linalg/cholesky.ts states the bound). Dense, O(n³): n ≤ denseLimit.
//   "gershgorin"        proof: λmax ≤ max_i (d_i − y_i + Σ_j |w_ij|) (Gershgorin's circle theorem), rounded up.
//                       Loose in general; chosen automatically whenever it is as good as the estimate.
//   "sparse-cholesky"   proof: the same margins (src/linalg/cholesky.ts, certifyCholesky) on a Cholesky factor
//                       kept inside the envelope of a reverse Cuthill–McKee order (src/linalg/envelope-cholesky.ts);
//                       used above denseLimit when the envelope's predicted work is within sparseWorkLimit
//                       (planar and toroidal graphs), deterministic.
//   "chebyshev-probable" holds with probability ≥ 1 − δ over a seeded Gaussian start: the Chebyshev-filter
//                       form of the Kuczyński–Woźniakowski (1992) bound, rigorous against rounding
//                       (src/linalg/probable-top-bound.ts states the inequality); δ and the seed are in
//                       the certificate so verify re-runs it to the same δ. Used when neither proof fits.
//   "lanczos-estimate"  estimate, not a proof: a Ritz pair (θ, u) with ρ = ‖Au − θu‖ guarantees an
//                       eigenvalue in [θ − ρ, θ + ρ] but not that none lies above; we take θ + 2ρ
//                       (+ a relative margin) from the better of two seeded runs. Used above denseLimit.
// A "dense-eig-error-bound" method is not offered: ml-matrix's eigensolver states no backward-error
// constant, so its eigenvalues cannot be turned into a proof without one.

import { InputError, invalidParameter } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { checkMemory } from "../../limits/memory.js";
import { provePsdByCholesky, type PsdProof } from "../../linalg/cholesky.js";
import { envelopePlan, provePsdByEnvelopeCholesky, type EnvelopePlan } from "../../linalg/envelope-cholesky.js";
import { probableFilterDegree, probableTopBound, type ProbableTopBound } from "../../linalg/probable-top-bound.js";
import { lanczosExtreme } from "../../linalg/lanczos.js";
import { shiftedLaplacianOperator } from "../../linalg/operator.js";
import { UNIT_ROUNDOFF, roundoffGamma, roundUp } from "../../linalg/float-rounding.js";
import { checkSeed } from "../../random/seed.js";
import { dualBoundValue } from "./dual-bound.js";
import type { DualCertificate, ProbableShift, ShiftProof, SolverStatus, UpperBoundRecord, UpperKind } from "../types.js";

export const SHIFT_PROOFS: readonly ShiftProof[] = ["cholesky", "gershgorin", "sparse-cholesky", "chebyshev-probable", "lanczos-estimate"];

/** How far a bound resting on this shift can be trusted: the Cholesky and Gershgorin shifts are proofs, the Chebyshev one probable, Lanczos an estimate. */
export function upperKindOf(shiftProof: ShiftProof): UpperKind {
  return shiftProof === "lanczos-estimate" ? "estimate" : shiftProof === "chebyshev-probable" ? "probable" : "proven";
}

/** Default δ of a probable shift: the bound fails with probability at most 10⁻⁹ over its seeded start vector. */
export const DEFAULT_FAILURE_PROBABILITY = 1e-9;

/** Default work limit of the sparse Cholesky proof, in multiply-adds (a few seconds; a 20,000-vertex torus needs about 4·10⁸). */
export const SPARSE_PROOF_WORK = 5e8;

export interface CertifyOptions {
  /**
   * auto (default): Cholesky when n ≤ denseLimit (the sparse proof instead when it costs at most a quarter),
   * above it the sparse proof when it fits sparseWorkLimit, else a probable shift or a Lanczos estimate
   * (Gershgorin whenever it is as good); or force one.
   */
  shiftProof?: "auto" | ShiftProof;
  /** Largest n for the dense Cholesky proof (default 3000: n² doubles of memory, n³/6 multiply-adds). */
  denseLimit?: number;
  /** Seed of the Lanczos start vector (default 1; a Lanczos estimate also runs seed + 1, wrapping to 0). */
  solverSeed?: number;
  /** Lanczos residual tolerance relative to ‖L − Diag(y)‖, and a bisection's final bracket (default 1e-9). */
  tolerance?: number;
  /** Record name (default "dual-certificate"). */
  name?: string;
  /**
   * δ of a probable shift (default DEFAULT_FAILURE_PROBABILITY), used above denseLimit when the sparse
   * proof does not fit in sparseWorkLimit; 0 turns probable shifts off (a bare Lanczos estimate instead).
   */
  failureProbability?: number;
  /** Most multiply-adds one sparse Cholesky factorisation may take (default SPARSE_PROOF_WORK; 0 turns the sparse proof off). Deterministic. A bisection repeats factorisations of at most 50 Lanczos products each, at most 48 times. */
  sparseWorkLimit?: number;
}

const OWNER = "certifyDual";

/**
 * Largest n whose shift is proved densely (Cholesky) by default: n² doubles of memory and n³/6
 * multiply-adds. Above it the shift is a Lanczos estimate unless a caller forces a proof.
 */
export const DENSE_PROOF_LIMIT = 3000;

/**
 * Largest |y_i| (and |shift|) accepted in a dual certificate: squares and sums of n such entries
 * stay far inside the double range, so Lanczos and the eigensolver never overflow (an entry of
 * 1e200 used to crash both). Meaningful duals are of the order of the weighted degrees.
 */
export const MAX_DUAL_ENTRY = 1e120;

function checkY(graph: Graph, y: ArrayLike<number>, owner: string): void {
  if (y.length !== graph.n) throw new InputError(`${owner}: \`y\` has ${y.length} entries but the graph has ${graph.n} vertices`);
  for (let i = 0; i < y.length; i++) {
    if (!(Math.abs(y[i]) <= MAX_DUAL_ENTRY)) throw new InputError(`${owner}: \`y\`[${i}] is ${y[i]}, expected a finite number with |y| ≤ ${MAX_DUAL_ENTRY}`);
  }
}

function checkCertifyOptions(o: CertifyOptions): void {
  if (o.shiftProof !== undefined && o.shiftProof !== "auto" && !SHIFT_PROOFS.includes(o.shiftProof)) {
    throw invalidParameter(OWNER, "shiftProof", `should be one of auto, ${SHIFT_PROOFS.join(", ")}`, o.shiftProof);
  }
  if (o.denseLimit !== undefined && !(Number.isInteger(o.denseLimit) && o.denseLimit >= 0)) {
    throw invalidParameter(OWNER, "denseLimit", "should be a non-negative integer", o.denseLimit);
  }
  checkSeed(OWNER, "solverSeed", o.solverSeed);
  if (o.tolerance !== undefined && !(o.tolerance > 0 && o.tolerance < 1)) throw invalidParameter(OWNER, "tolerance", "should be a number in (0, 1)", o.tolerance);
  if (o.failureProbability !== undefined && !(o.failureProbability >= 0 && o.failureProbability < 1)) {
    throw invalidParameter(OWNER, "failureProbability", "should be a number in [0, 1) (0: no probable shifts)", o.failureProbability);
  }
  if (o.sparseWorkLimit !== undefined && !(o.sparseWorkLimit >= 0 && o.sparseWorkLimit <= 1e15)) {
    throw invalidParameter(OWNER, "sparseWorkLimit", "should be a number of multiply-adds between 0 and 1e15", o.sparseWorkLimit);
  }
}

/** Per-row data the rigorous methods need: rounded degrees and Σ_j |w_ij|. */
function rowSums(graph: Graph): { d: Float64Array; abs: Float64Array } {
  const { n, offsets, weights } = graph;
  const d = new Float64Array(n);
  const abs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0, a = 0;
    for (let k = offsets[i]; k < offsets[i + 1]; k++) {
      const w = weights === null ? 1 : weights[k];
      s += w;
      a += Math.abs(w);
    }
    d[i] = s;
    abs[i] = a;
  }
  return { d, abs };
}

/** A rigorous upper bound on λmax(L − Diag(y)) by Gershgorin's theorem: max_i (d_i − y_i + Σ_j |w_ij|), rounded up. */
export function gershgorinShift(graph: Graph, y: ArrayLike<number>): number {
  checkY(graph, y, "gershgorinShift");
  const { d, abs } = rowSums(graph);
  let best = -Infinity;
  for (let i = 0; i < graph.n; i++) {
    const deg = graph.offsets[i + 1] - graph.offsets[i];
    // d_i is a deg-term sum and abs_i another; with the two outer operations the row bound
    // carries at most γ_{2·deg+3}·(|y_i| + 2·abs_i) of rounding.
    const c = d[i] - y[i] + abs[i];
    const bound = c + roundoffGamma(2 * deg + 3) * (Math.abs(y[i]) + 2 * abs[i]);
    if (bound > best) best = bound;
  }
  return graph.n === 0 ? 0 : roundUp(best, 2);
}

/**
 * Further off-diagonal terms of the matrix a shift proof tests (the multipliers of valid
 * inequalities, src/cut/relaxation/triangle-dual.ts): `add` adds them to the lower triangle of the
 * row-major matrix (which holds w_ij there) and returns ρ ≥ ‖E‖₂, E the exact matrix minus what it
 * wrote (its rounding, zero on the diagonal). A ⪰ Ã_off + Diag(A) − ρ·I, so proving the image with
 * ρ more diagonal error proves A ⪰ 0.
 */
export type OffDiagonalTerms = (a: Float64Array, n: number) => number;

/**
 * Cholesky test that Diag(y) + shift·I − L (+ the `extra` terms) ⪰ 0, i.e. shift ≥ λmax(L − Diag(y)
 * − extra), for the exact weights and y. Off-diagonal entries w_ij are copied exactly; each diagonal
 * entry is computed as fl(fl(y_i + shift) − d̃_i) and carries at most γ_{deg+3}·(|y_i| + |shift| +
 * Σ_j|w_ij|) of error; `extra` adds its own rounding bound ρ to that allowance.
 */
export function proveShift(graph: Graph, y: ArrayLike<number>, shift: number, extra?: OffDiagonalTerms): PsdProof {
  checkY(graph, y, "proveShift");
  if (!Number.isFinite(shift)) throw new InputError(`proveShift: \`shift\` is ${shift}, expected a finite number`);
  const { n, offsets, neighbors, weights } = graph;
  if (n > 46000) throw new InputError(`proveShift: n = ${n} is too large for a dense Cholesky proof (at most 46000)`);
  checkMemory(8 * n * n, `proveShift: a dense Cholesky proof at n = ${n}`);
  const a = new Float64Array(n * n);
  const { diagonal, error } = shiftedDiagonal(graph, y, shift);
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let k = offsets[i]; k < offsets[i + 1]; k++) {
      const j = neighbors[k];
      if (j < i) a[row + j] = weights === null ? 1 : weights[k];
    }
    a[row + i] = diagonal[i];
  }
  const rho = extra === undefined ? 0 : extra(a, n);
  if (!(rho >= 0) || !Number.isFinite(rho)) return { proven: false, shift: 0, lambdaMinLowerBound: NaN, failedAt: -1, message: `extra terms' rounding bound is ${rho}` };
  return provePsdByCholesky(a, n, rho === 0 ? error : roundUp((error + rho) * (1 + 4 * UNIT_ROUNDOFF), 2));
}

/**
 * The diagonal of Diag(y) + shift·I − L in floating point, fl(fl(y_i + shift) − d̃_i), and the most
 * any entry is off: γ_{deg+3}·(|y_i| + |shift| + Σ_j|w_ij|). Off-diagonal entries w_ij are exact.
 */
function shiftedDiagonal(graph: Graph, y: ArrayLike<number>, shift: number): { diagonal: Float64Array; error: number } {
  const { n, offsets } = graph;
  const { d, abs } = rowSums(graph);
  const diagonal = new Float64Array(n);
  let error = 0;
  for (let i = 0; i < n; i++) {
    diagonal[i] = y[i] + shift - d[i];
    const e = roundoffGamma(offsets[i + 1] - offsets[i] + 3) * (Math.abs(y[i]) + Math.abs(shift) + abs[i]);
    if (e > error) error = e;
  }
  return { diagonal, error: error * (1 + 4 * UNIT_ROUNDOFF) };
}

/**
 * The sparse form of `proveShift`: Cholesky of Diag(y) + shift·I − L inside the envelope of `plan`
 * (default: the graph's reverse Cuthill–McKee envelope), with the dense proof's margins.
 */
export function proveShiftSparse(graph: Graph, y: ArrayLike<number>, shift: number, plan: EnvelopePlan = envelopePlan(graph)): PsdProof {
  checkY(graph, y, "proveShiftSparse");
  if (!Number.isFinite(shift)) throw new InputError(`proveShiftSparse: \`shift\` is ${shift}, expected a finite number`);
  const { diagonal, error } = shiftedDiagonal(graph, y, shift);
  return provePsdByEnvelopeCholesky(graph, plan, diagonal, error);
}

/** A rigorous lower bound on λmin(L − Diag(y)) by Gershgorin: min_i (d_i − y_i − Σ_j |w_ij|), rounded down. */
function gershgorinBottom(graph: Graph, y: ArrayLike<number>): number {
  const { d, abs } = rowSums(graph);
  let best = Infinity;
  for (let i = 0; i < graph.n; i++) {
    const deg = graph.offsets[i + 1] - graph.offsets[i];
    const bound = d[i] - y[i] - abs[i] - roundoffGamma(2 * deg + 3) * (Math.abs(y[i]) + 2 * abs[i]);
    if (bound < best) best = bound;
  }
  return -roundUp(-best, 2);
}

/**
 * A shift that bounds λmax(L − Diag(y)) with probability ≥ 1 − δ over the seeded start vector
 * (src/linalg/probable-top-bound.ts), from the matrix L − Diag(y) = Diag(d − y) − W.
 */
export function probableShift(graph: Graph, y: ArrayLike<number>, p: ProbableShift): ProbableTopBound {
  checkY(graph, y, "probableShift");
  const { d, abs } = rowSums(graph);
  const diagonal = new Float64Array(graph.n);
  let error = 0;
  for (let i = 0; i < graph.n; i++) {
    diagonal[i] = d[i] - y[i];
    const e = roundoffGamma(graph.offsets[i + 1] - graph.offsets[i] + 2) * (Math.abs(y[i]) + abs[i]);
    if (e > error) error = e;
  }
  return probableTopBound(graph, diagonal, error * (1 + 4 * UNIT_ROUNDOFF), p);
}

/** The parameters of a probable shift for y: the filter from a Lanczos estimate θ + 3ρ up, Gershgorin's λmin bound down. */
function probableParameters(graph: Graph, y: ArrayLike<number>, theta: number, residual: number, scale: number, delta: number, seed: number): ProbableShift {
  let maxDeg = 0;
  for (let i = 0; i < graph.n; i++) maxDeg = Math.max(maxDeg, graph.offsets[i + 1] - graph.offsets[i]);
  const top = theta + 3 * residual + 1e-9 * scale;
  const bottom = Math.min(gershgorinBottom(graph, y), top - 1e-6 * scale - 1e-300);
  return { failureProbability: delta, solverSeed: seed, degree: probableFilterDegree(graph.n, delta, maxDeg), top, bottom };
}

interface ShiftEstimate {
  theta: number;
  residual: number;
  normEstimate: number;
  converged: boolean;
  iterations: number;
}

function estimateTop(graph: Graph, y: ArrayLike<number>, seed: number, tolerance: number, maxRestarts = 100): ShiftEstimate {
  // The residual enters the shift, so a looser tolerance costs a little bound, never validity;
  // the restart cap keeps clustered spectra near an SDP optimum from running long.
  const l = lanczosExtreme(shiftedLaplacianOperator(graph, y), { which: "largest", k: 1, tolerance, solverSeed: seed, maxRestarts });
  return { theta: l.values[0], residual: l.residuals[0], normEstimate: l.normEstimate, converged: l.converged, iterations: l.iterations };
}

interface EstablishedShift {
  shift: number;
  shiftProof: ShiftProof;
  proven: boolean;
  converged: boolean;
  details: Record<string, number | string | boolean | null>;
  probable?: ProbableShift;
}

/** A shift proven by the sparse (envelope) Cholesky route, with what the route found. */
function sparseProven(shift: number, details: Record<string, number | string | boolean | null>): EstablishedShift {
  return { shift, shiftProof: "sparse-cholesky", proven: true, converged: true, details: { ...details, proof: true } };
}

/**
 * Try Cholesky proofs at θ + ρ + margin with margins growing tenfold, then a thousandfold, per failed
 * attempt (a failure usually means Lanczos missed the top of the spectrum); null after six.
 */
function proveNearEstimate(est: ShiftEstimate, scale: number, prove: (shift: number) => PsdProof): { shift: number; proof: PsdProof; margin: number; attempts: number } | { failure: string } {
  let margin = Math.max(2 * est.residual, 1e-10 * scale);
  let last: PsdProof | null = null;
  for (let attempt = 1; attempt <= 6; attempt++) {
    const shift = roundUp(est.theta + est.residual + margin, 2);
    last = prove(shift);
    if (last.proven) return { shift, proof: last, margin, attempts: attempt };
    margin *= attempt < 3 ? 10 : 1000;
  }
  return { failure: last?.message ?? "no attempt" };
}

/**
 * Multiply-adds of one Lanczos product in `estimateTop`: the 2m arcs of the operator plus about 160n for
 * orthogonalising against a basis of up to 40 vectors (one or two passes). Common practice, no source:
 * read off the code, to compare a Lanczos estimate's work with a factorisation's.
 */
function lanczosProductWork(graph: Graph): number {
  return 2 * graph.m + 160 * graph.n;
}

/**
 * A sparse factorisation costing at most this many Lanczos products may be repeated: the least provable
 * shift is then found by bisection on the proof itself whenever a Lanczos estimate does not converge within
 * about the work of a bisection. On the clustered top spectrum of a near-optimal SDP dual (the toroidal
 * ±1 graphs: G11's top eigenvalues of L − Diag(y) lie within 10⁻⁴ of each other) a tight estimate takes
 * thousands of products; a bisection takes about 20 factorisations. Measured in bench/sdp.bench.mjs.
 */
const BISECTION_MAX_RATIO = 50;

/** Factorisations a bisection typically needs: the Lanczos estimate before it gets about their work. */
const BISECTION_PROOFS = 24;

/** Fewest restarts of the Lanczos estimate before a bisection (a basis of 40, then 20 products per restart). */
const ROUGH_RESTARTS = 2;

/** Most factorisations one bisection may take. */
const MAX_BISECTION_PROOFS = 48;

/** Multiply-adds of a dense Cholesky proof: n³/6. */
function denseProofWork(n: number): number {
  return (n * n * n) / 6;
}

/**
 * The least shift `prove` establishes, to within `width`, by bisection on the proof itself. The Ritz
 * value θ is the lower end (λmax ≥ θ, so no smaller shift is provable beyond rounding); the upper end
 * is found by trying θ + ρ and growing the step fourfold per failure. The bisection only aims: the
 * shift returned is one whose proof succeeded, so its validity never rests on monotonicity.
 */
function bisectProvenShift(est: ShiftEstimate, width: number, prove: (shift: number) => PsdProof): { shift: number; proof: PsdProof; attempts: number; lower: number } | { failure: string; attempts: number } {
  let lo = est.theta;
  let step = Math.max(est.residual, width);
  let attempts = 0;
  let hi = NaN;
  let proof: PsdProof | null = null;
  let last = "no attempt";
  while (proof === null) {
    if (attempts >= 12) return { failure: last, attempts };
    const shift = roundUp(lo + step, 2);
    attempts++;
    const p = prove(shift);
    if (p.proven) {
      hi = shift;
      proof = p;
    } else {
      last = p.message;
      lo = shift;
      step *= 4;
    }
  }
  while (hi - lo > width && attempts < MAX_BISECTION_PROOFS) {
    const mid = lo + (hi - lo) / 2;
    if (!(mid > lo && mid < hi)) break;
    attempts++;
    const p = prove(mid);
    if (p.proven) {
      hi = mid;
      proof = p;
    } else lo = mid;
  }
  return { shift: hi, proof, attempts, lower: lo };
}

function establishShift(graph: Graph, y: ArrayLike<number>, options: CertifyOptions): EstablishedShift {
  const n = graph.n;
  const seed = options.solverSeed ?? 1;
  const tol = options.tolerance ?? 1e-9;
  const denseLimit = options.denseLimit ?? DENSE_PROOF_LIMIT;
  const wanted = options.shiftProof ?? "auto";
  if (n === 0) return { shift: 0, shiftProof: "gershgorin", proven: true, converged: true, details: {} };
  if (wanted === "gershgorin") {
    return { shift: gershgorinShift(graph, y), shiftProof: "gershgorin", proven: true, converged: true, details: {} };
  }
  const useCholesky = wanted === "cholesky" || (wanted === "auto" && n <= denseLimit);
  // The envelope is sized first (O(n + m), deterministic) whenever a sparse proof may be used: above
  // denseLimit, when forced, and in place of the dense proof when it costs at most a quarter of n³/6
  // (toroidal and other narrow-envelope graphs, e.g. G48: 9·10⁶ against 4.5·10⁹ multiply-adds).
  const limit = options.sparseWorkLimit ?? SPARSE_PROOF_WORK;
  const plan = wanted === "sparse-cholesky" || wanted === "auto" ? envelopePlan(graph) : null;
  const sparse = plan !== null && plan.work <= limit && (!useCholesky || 4 * plan.work <= denseProofWork(n)) ? plan : null;
  // A repeatable sparse proof: the estimate gets about a bisection's work, and a bisection follows if it did not converge.
  const ratio = sparse === null ? Infinity : sparse.work / lanczosProductWork(graph);
  const canBisect = ratio <= BISECTION_MAX_RATIO;
  const restarts = canBisect ? Math.min(100, Math.max(ROUGH_RESTARTS, Math.floor((BISECTION_PROOFS * ratio - 40) / 20))) : 100;
  let est = estimateTop(graph, y, seed, tol, restarts);
  const bisect = canBisect && !est.converged;
  const scale = Math.max(est.normEstimate, 1e-300);
  // Gershgorin costs O(m) and is a proof; where it is as good as the estimate (e.g. regular
  // bipartite graphs at y = 0, or y = 2d), it saves the O(n³) Cholesky and beats an estimate.
  // Before a bisection (an unconverged estimate) it must match the Ritz value itself.
  const gersh = gershgorinShift(graph, y);
  const candidate = bisect ? est.theta + tol * scale : est.theta + 3 * est.residual + 1e-10 * scale;
  const gValue = dualBoundValue(y, gersh);
  if (gValue <= dualBoundValue(y, candidate) + 1e-9 * Math.abs(gValue)) {
    return { shift: gersh, shiftProof: "gershgorin", proven: true, converged: true, details: { ritzValue: est.theta, ritzResidual: est.residual, lanczosIterations: est.iterations, proof: true } };
  }
  let lanczosIterations = est.iterations;
  const notes: Record<string, string | number> = {};
  if (plan !== null && (wanted === "sparse-cholesky" || !useCholesky || sparse !== null)) {
    if (sparse !== null) {
      const proveSparse = (shift: number): PsdProof => proveShiftSparse(graph, y, shift, sparse);
      const envelope = { envelopeEntries: sparse.entries, envelopeWidth: sparse.width, sparseWork: sparse.work };
      if (bisect) {
        const r = bisectProvenShift(est, tol * scale, proveSparse);
        // Gershgorin may still match the bisected shift (the rough Ritz value sat below λmax): prefer the simpler proof.
        if ("proof" in r && gValue <= dualBoundValue(y, r.shift)) {
          return { shift: gersh, shiftProof: "gershgorin", proven: true, converged: true, details: { ritzValue: est.theta, ritzResidual: est.residual, lanczosIterations, attempts: r.attempts, bisection: true, ...envelope, proof: true } };
        }
        if ("proof" in r) return sparseProven(r.shift, { ritzValue: est.theta, ritzResidual: est.residual, lanczosIterations, margin: r.shift - est.theta, unprovenBelow: r.lower, choleskyShift: r.proof.shift, attempts: r.attempts, bisection: true, ...envelope });
        notes.sparseFailure = r.failure;
        // The rough estimate would widen every later margin: estimate again as the other routes expect.
        est = estimateTop(graph, y, seed, tol);
        lanczosIterations += est.iterations;
      } else {
        const r = proveNearEstimate(est, scale, proveSparse);
        if ("proof" in r) return sparseProven(r.shift, { ritzValue: est.theta, ritzResidual: est.residual, lanczosIterations, margin: r.margin, choleskyShift: r.proof.shift, attempts: r.attempts, ...envelope });
        notes.sparseFailure = r.failure;
      }
    } else if (plan.work > limit) notes.sparseRefused = `envelope work ${plan.work} > limit ${limit}`;
    notes.sparseWork = plan.work;
  }
  const base = { ritzValue: est.theta, ritzResidual: est.residual, lanczosIterations };
  const delta = options.failureProbability ?? DEFAULT_FAILURE_PROBABILITY;
  if (!useCholesky && delta > 0 && (wanted === "auto" || wanted === "chebyshev-probable" || wanted === "sparse-cholesky")) {
    const params = probableParameters(graph, y, est.theta, est.residual, scale, delta, (seed + 2) >>> 0);
    const r = probableShift(graph, y, params);
    if (r.found) {
      return {
        shift: r.bound,
        shiftProof: "chebyshev-probable",
        proven: false,
        converged: true,
        details: { ...base, ...notes, failureProbability: delta, filterDegree: params.degree, filterTop: params.top, filterBottom: params.bottom, roundingTotal: r.roundingTotal, proof: false },
        probable: params,
      };
    }
    notes.probableFailure = r.message;
  }
  if (!useCholesky) {
    const second = estimateTop(graph, y, (seed + 1) >>> 0, tol);
    const a = est.theta + 2 * est.residual;
    const b = second.theta + 2 * second.residual;
    const best = a >= b ? est : second;
    const shift = roundUp(Math.max(a, b) + 1e-12 * scale, 2);
    return {
      shift,
      shiftProof: "lanczos-estimate",
      proven: false,
      converged: est.converged && second.converged,
      details: { ...notes, ritzValue: best.theta, ritzResidual: best.residual, lanczosIterations: lanczosIterations + second.iterations, proof: false },
    };
  }
  const r = proveNearEstimate(est, scale, (shift) => proveShift(graph, y, shift));
  if ("proof" in r) {
    return {
      shift: r.shift,
      shiftProof: "cholesky",
      proven: true,
      converged: true,
      details: { ...base, margin: r.margin, choleskyShift: r.proof.shift, attempts: r.attempts, proof: true },
    };
  }
  // Fall back to the loose but unconditional bound rather than report nothing.
  return {
    shift: gershgorinShift(graph, y),
    shiftProof: "gershgorin",
    proven: true,
    converged: true,
    details: { ritzValue: est.theta, ritzResidual: est.residual, choleskyFailure: r.failure, proof: true },
  };
}

/**
 * A certified upper bound from any dual vector y: the record's value is
 * `dualBoundValue(y, shift)`, with the shift established as described in the file header.
 */
export function certifyDual(graph: Graph, y: ArrayLike<number>, options: CertifyOptions = {}): UpperBoundRecord {
  checkY(graph, y, OWNER);
  checkCertifyOptions(options);
  // Every method starts from a Lanczos estimate with a basis of at least 12 vectors in 1 GiB
  // (src/linalg/lanczos.ts): refuse before copying y when that cannot fit.
  if (graph.n > 12 && 12 * 8 * graph.n > 2 ** 30) {
    throw new InputError(`${OWNER}: n = ${graph.n} vertices is too many for the Lanczos estimate of the shift (a basis of 12 vectors would exceed 1 GiB)`);
  }
  const t0 = performance.now();
  const yy = Float64Array.from(y);
  const s = establishShift(graph, yy, options);
  const certificate: DualCertificate = { kind: "psd-dual", y: yy, shift: s.shift, shiftProof: s.shiftProof, ...(s.probable === undefined ? {} : { probable: s.probable }) };
  const status: SolverStatus = s.converged ? "converged" : "iteration-limit";
  return {
    method: options.name ?? "dual-certificate",
    value: dualBoundValue(yy, s.shift),
    certificate,
    status,
    seconds: (performance.now() - t0) / 1000,
    details: { ...s.details, shiftProof: s.shiftProof },
  };
}

export interface CertificateCheck {
  /** The certificate is well formed and its shift was re-established from y. */
  ok: boolean;
  /** True when the check is a proof (Cholesky, sparse Cholesky or Gershgorin), false for probable and estimated shifts. */
  proven: boolean;
  /** proven, probable (re-run from the certificate's seed, holds with probability ≥ 1 − failureProbability) or estimate. */
  kind: UpperKind;
  /** For a probable shift: its δ as re-derived. */
  failureProbability?: number;
  /** ¼(Σy + n·shift) rounded up, or NaN when malformed. */
  value: number;
  /** Independent estimate θ + ρ of λmax(L − Diag(y)) from a fresh Lanczos run, of 10 restarts only for the proofs, which are redone (NaN when malformed). */
  recomputedShift: number;
  /** The certificate's claimed shift proof, as written (or "unknown"). */
  shiftProof: string;
  message: string;
}

export interface VerifyOptions {
  /** Seed of the independent Lanczos run (default 7, unlike the certifier's 1). */
  solverSeed?: number;
  /** Largest n for re-running a Cholesky proof (default 6000). */
  denseLimit?: number;
  /** Most multiply-adds for re-running a sparse Cholesky proof (default 10·SPARSE_PROOF_WORK). */
  sparseWorkLimit?: number;
}

function rejected(shiftProof: string, message: string): CertificateCheck {
  return { ok: false, proven: false, kind: "estimate", value: NaN, recomputedShift: NaN, shiftProof, message };
}

/** The probable-shift parameters of a certificate, checked field by field (null when malformed). */
function probableOf(c: DualCertificate): ProbableShift | string {
  const p = (c as { probable?: unknown }).probable;
  if (p === null || typeof p !== "object") return "a chebyshev-probable certificate needs `probable` {failureProbability, solverSeed, degree, top, bottom}";
  const q = p as Record<string, unknown>;
  const num = (k: string): number => (typeof q[k] === "number" ? (q[k] as number) : NaN);
  const r: ProbableShift = { failureProbability: num("failureProbability"), solverSeed: num("solverSeed"), degree: num("degree"), top: num("top"), bottom: num("bottom") };
  if (!(r.failureProbability > 0 && r.failureProbability < 1)) return `probable.failureProbability is ${String(q.failureProbability)}, expected a number in (0, 1)`;
  if (!(Number.isInteger(r.solverSeed) && r.solverSeed >= 0 && r.solverSeed <= 0xffffffff)) return `probable.solverSeed is ${String(q.solverSeed)}, expected a seed`;
  if (!(Number.isInteger(r.degree) && r.degree >= 1 && r.degree <= 1e6)) return `probable.degree is ${String(q.degree)}, expected an integer between 1 and 1000000`;
  if (!(Math.abs(r.top) <= MAX_DUAL_ENTRY && Math.abs(r.bottom) <= MAX_DUAL_ENTRY && r.top > r.bottom)) return `probable.top (${String(q.top)}) should be a finite number above probable.bottom (${String(q.bottom)})`;
  return r;
}

/**
 * Re-check a dual certificate from y and the graph alone (no solver state): the claimed shift must
 * be at least the Ritz value of a fresh Lanczos run (Ritz values never exceed λmax, so failing this
 * refutes the certificate), and, for proof methods, the proof is redone at the claimed shift.
 */
export function verifyCertificate(graph: Graph, certificate: DualCertificate, options: VerifyOptions = {}): CertificateCheck {
  const method = typeof certificate?.shiftProof === "string" ? certificate.shiftProof : "unknown";
  if (certificate === null || typeof certificate !== "object" || certificate.kind !== "psd-dual") return rejected(method, "not a psd-dual certificate");
  const { y, shift } = certificate;
  if (y === null || typeof y !== "object" || typeof (y as ArrayLike<number>).length !== "number") return rejected(method, "`y` is not an array");
  if (y.length !== graph.n) return rejected(method, `\`y\` has ${y.length} entries but the graph has ${graph.n} vertices`);
  for (let i = 0; i < y.length; i++) {
    if (typeof y[i] !== "number" || !(Math.abs(y[i]) <= MAX_DUAL_ENTRY)) return rejected(method, `\`y\`[${i}] is ${String(y[i])}, expected a finite number with |y| ≤ ${MAX_DUAL_ENTRY}`);
  }
  if (typeof shift !== "number" || !(Math.abs(shift) <= MAX_DUAL_ENTRY)) return rejected(method, `shift is ${String(shift)}, expected a finite number with |shift| ≤ ${MAX_DUAL_ENTRY}`);
  const value = dualBoundValue(y, shift);
  if (graph.n === 0) return { ok: true, proven: true, kind: "proven", value, recomputedShift: 0, shiftProof: method, message: "empty graph" };

  // For the proofs the estimate only screens (the proof itself is redone below), so a few restarts do:
  // any Ritz value is a lower bound on λmax. Estimates and probable shifts are judged against it, so it stays tight there.
  const screenOnly = method === "cholesky" || method === "sparse-cholesky" || method === "gershgorin";
  const est = estimateTop(graph, y, options.solverSeed ?? 7, 1e-10, screenOnly ? 10 : 100);
  const recomputedShift = est.theta + est.residual;
  // Ritz values lie below λmax, so a shift under one (beyond rounding) is certainly too small.
  const slack = 64 * UNIT_ROUNDOFF * Math.max(1, est.normEstimate);
  if (shift < est.theta - slack) {
    return { ok: false, proven: false, kind: "estimate", value, recomputedShift, shiftProof: method, message: `shift ${shift} is below the Ritz value ${est.theta} of L − Diag(y): Diag(y + shift) − L is not PSD` };
  }
  const proof = (ok: boolean, message: string): CertificateCheck => ({ ok, proven: ok, kind: "proven", value, recomputedShift, shiftProof: method, message });
  if (method === "gershgorin") {
    const g = gershgorinShift(graph, y);
    return proof(shift >= g, shift >= g ? "shift ≥ the Gershgorin bound recomputed from y" : `shift ${shift} is below the Gershgorin bound ${g}`);
  }
  if (method === "cholesky") {
    const limit = options.denseLimit ?? 6000;
    if (graph.n > limit) return proof(false, `n = ${graph.n} exceeds denseLimit = ${limit}: the Cholesky proof was not redone`);
    const p = proveShift(graph, y, shift);
    return proof(p.proven, p.proven ? `re-proved: ${p.message}` : `Cholesky check failed: ${p.message}`);
  }
  if (method === "sparse-cholesky") {
    const plan = envelopePlan(graph);
    const limit = options.sparseWorkLimit ?? 10 * SPARSE_PROOF_WORK;
    if (plan.work > limit) return proof(false, `the sparse Cholesky proof needs ${plan.work} multiply-adds, over the limit ${limit}: not redone`);
    const p = proveShiftSparse(graph, y, shift, plan);
    return proof(p.proven, p.proven ? `re-proved in the envelope of ${plan.entries} entries: ${p.message}` : `sparse Cholesky check failed: ${p.message}`);
  }
  if (method === "chebyshev-probable") {
    const params = probableOf(certificate);
    if (typeof params === "string") return { ok: false, proven: false, kind: "probable", value, recomputedShift, shiftProof: method, message: params };
    const r = probableShift(graph, y, params);
    const ok = r.found && shift >= r.bound;
    return {
      ok,
      proven: false,
      kind: "probable",
      failureProbability: params.failureProbability,
      value,
      recomputedShift,
      shiftProof: method,
      message: ok
        ? `shift ≥ ${r.bound}, re-derived from seed ${params.solverSeed}: holds with probability ≥ 1 − ${params.failureProbability}`
        : r.found ? `shift ${shift} is below the re-derived probable bound ${r.bound}` : `the probable bound was not re-derived: ${r.message}`,
    };
  }
  if (method === "lanczos-estimate") {
    const ok = shift >= recomputedShift - slack;
    return {
      ok,
      proven: false,
      kind: "estimate",
      value,
      recomputedShift,
      shiftProof: method,
      message: ok ? "shift ≥ the recomputed Ritz value + residual (an estimate, not a proof)" : `shift ${shift} is below the recomputed estimate ${recomputedShift}`,
    };
  }
  return { ok: false, proven: false, kind: "estimate", value, recomputedShift, shiftProof: method, message: `unknown shift proof ${JSON.stringify(method)}` };
}
