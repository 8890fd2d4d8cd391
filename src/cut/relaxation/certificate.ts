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
//   "lanczos-estimate"  estimate, not a proof: a Ritz pair (θ, u) with ρ = ‖Au − θu‖ guarantees an
//                       eigenvalue in [θ − ρ, θ + ρ] but not that none lies above; we take θ + 2ρ
//                       (+ a relative margin) from the better of two seeded runs. Used above denseLimit.
// A "dense-eig-error-bound" method is not offered: ml-matrix's eigensolver states no backward-error
// constant, so its eigenvalues cannot be turned into a proof without one.

import { InputError, invalidParameter } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { checkMemory } from "../../limits/memory.js";
import { provePsdByCholesky, type PsdProof } from "../../linalg/cholesky.js";
import { lanczosExtreme } from "../../linalg/lanczos.js";
import { shiftedLaplacianOperator } from "../../linalg/operator.js";
import { UNIT_ROUNDOFF, roundoffGamma, roundUp } from "../../linalg/float-rounding.js";
import { checkSeed } from "../../random/seed.js";
import { dualBoundValue } from "./dual-bound.js";
import type { DualCertificate, ShiftProof, SolverStatus, UpperBoundRecord, UpperKind } from "../types.js";

export const SHIFT_PROOFS: readonly ShiftProof[] = ["cholesky", "gershgorin", "lanczos-estimate"];

/** How far a bound resting on this shift can be trusted: Cholesky and Gershgorin are proofs, Lanczos an estimate. */
export function upperKindOf(shiftProof: ShiftProof): UpperKind {
  return shiftProof === "lanczos-estimate" ? "estimate" : "proven";
}

export interface CertifyOptions {
  /** auto (default): Cholesky when n ≤ denseLimit, else a Lanczos estimate (Gershgorin whenever it is as good); or force one. */
  shiftProof?: "auto" | ShiftProof;
  /** Largest n for the dense Cholesky proof (default 3000: n² doubles of memory, n³/6 multiply-adds). */
  denseLimit?: number;
  /** Seed of the Lanczos start vector (default 1; a Lanczos estimate also runs seed + 1, wrapping to 0). */
  solverSeed?: number;
  /** Lanczos residual tolerance relative to ‖L − Diag(y)‖ (default 1e-9). */
  tolerance?: number;
  /** Record name (default "dual-certificate"). */
  name?: string;
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
  const { d, abs } = rowSums(graph);
  let diagError = 0;
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let k = offsets[i]; k < offsets[i + 1]; k++) {
      const j = neighbors[k];
      if (j < i) a[row + j] = weights === null ? 1 : weights[k];
    }
    a[row + i] = y[i] + shift - d[i];
    const deg = offsets[i + 1] - offsets[i];
    const e = roundoffGamma(deg + 3) * (Math.abs(y[i]) + Math.abs(shift) + abs[i]);
    if (e > diagError) diagError = e;
  }
  const rho = extra === undefined ? 0 : extra(a, n);
  if (!(rho >= 0) || !Number.isFinite(rho)) return { proven: false, shift: 0, lambdaMinLowerBound: NaN, failedAt: -1, message: `extra terms' rounding bound is ${rho}` };
  return provePsdByCholesky(a, n, roundUp((diagError + rho) * (1 + 4 * UNIT_ROUNDOFF), 2));
}

interface ShiftEstimate {
  theta: number;
  residual: number;
  normEstimate: number;
  converged: boolean;
  iterations: number;
}

function estimateTop(graph: Graph, y: ArrayLike<number>, seed: number, tolerance: number): ShiftEstimate {
  // The residual enters the shift, so a looser tolerance costs a little bound, never validity;
  // the restart cap keeps clustered spectra near an SDP optimum from running long.
  const l = lanczosExtreme(shiftedLaplacianOperator(graph, y), { which: "largest", k: 1, tolerance, solverSeed: seed, maxRestarts: 100 });
  return { theta: l.values[0], residual: l.residuals[0], normEstimate: l.normEstimate, converged: l.converged, iterations: l.iterations };
}

interface EstablishedShift {
  shift: number;
  shiftProof: ShiftProof;
  proven: boolean;
  converged: boolean;
  details: Record<string, number | string | boolean | null>;
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
  const est = estimateTop(graph, y, seed, tol);
  const scale = Math.max(est.normEstimate, 1e-300);
  // Gershgorin costs O(m) and is a proof; where it is as good as the estimate (e.g. regular
  // bipartite graphs at y = 0, or y = 2d), it saves the O(n³) Cholesky and beats an estimate.
  const gersh = gershgorinShift(graph, y);
  const candidate = est.theta + 3 * est.residual + 1e-10 * scale;
  const gValue = dualBoundValue(y, gersh);
  if (gValue <= dualBoundValue(y, candidate) + 1e-9 * Math.abs(gValue)) {
    return { shift: gersh, shiftProof: "gershgorin", proven: true, converged: true, details: { ritzValue: est.theta, ritzResidual: est.residual, lanczosIterations: est.iterations, proof: true } };
  }
  const useCholesky = wanted === "cholesky" || (wanted === "auto" && n <= denseLimit);
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
      details: { ritzValue: best.theta, ritzResidual: best.residual, lanczosIterations: est.iterations + second.iterations, proof: false },
    };
  }
  // Margins grow tenfold per failed attempt; a failure usually means Lanczos missed the top of the spectrum.
  let margin = Math.max(2 * est.residual, 1e-10 * scale);
  let last: PsdProof | null = null;
  for (let attempt = 1; attempt <= 6; attempt++) {
    const shift = roundUp(est.theta + est.residual + margin, 2);
    last = proveShift(graph, y, shift);
    if (last.proven) {
      return {
        shift,
        shiftProof: "cholesky",
        proven: true,
        converged: true,
        details: { ritzValue: est.theta, ritzResidual: est.residual, margin, choleskyShift: last.shift, attempts: attempt, lanczosIterations: est.iterations, proof: true },
      };
    }
    margin *= attempt < 3 ? 10 : 1000;
  }
  // Fall back to the loose but unconditional bound rather than report nothing.
  return {
    shift: gershgorinShift(graph, y),
    shiftProof: "gershgorin",
    proven: true,
    converged: true,
    details: { ritzValue: est.theta, ritzResidual: est.residual, choleskyFailure: last?.message ?? null, proof: true },
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
  const certificate: DualCertificate = { kind: "psd-dual", y: yy, shift: s.shift, shiftProof: s.shiftProof };
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
  /** True when the check is a proof (Cholesky or Gershgorin), false for the Lanczos estimate. */
  proven: boolean;
  /** ¼(Σy + n·shift) rounded up, or NaN when malformed. */
  value: number;
  /** Independent upper estimate θ + ρ of λmax(L − Diag(y)) from a fresh Lanczos run (NaN when malformed). */
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
}

function rejected(shiftProof: string, message: string): CertificateCheck {
  return { ok: false, proven: false, value: NaN, recomputedShift: NaN, shiftProof, message };
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
  if (graph.n === 0) return { ok: true, proven: true, value, recomputedShift: 0, shiftProof: method, message: "empty graph" };

  const est = estimateTop(graph, y, options.solverSeed ?? 7, 1e-10);
  const recomputedShift = est.theta + est.residual;
  // Ritz values lie below λmax, so a shift under one (beyond rounding) is certainly too small.
  const slack = 64 * UNIT_ROUNDOFF * Math.max(1, est.normEstimate);
  if (shift < est.theta - slack) {
    return { ok: false, proven: false, value, recomputedShift, shiftProof: method, message: `shift ${shift} is below the Ritz value ${est.theta} of L − Diag(y): Diag(y + shift) − L is not PSD` };
  }
  if (method === "gershgorin") {
    const g = gershgorinShift(graph, y);
    const ok = shift >= g;
    return { ok, proven: ok, value, recomputedShift, shiftProof: method, message: ok ? "shift ≥ the Gershgorin bound recomputed from y" : `shift ${shift} is below the Gershgorin bound ${g}` };
  }
  if (method === "cholesky") {
    const limit = options.denseLimit ?? 6000;
    if (graph.n > limit) return { ok: false, proven: false, value, recomputedShift, shiftProof: method, message: `n = ${graph.n} exceeds denseLimit = ${limit}: the Cholesky proof was not redone` };
    const proof = proveShift(graph, y, shift);
    return { ok: proof.proven, proven: proof.proven, value, recomputedShift, shiftProof: method, message: proof.proven ? `re-proved: ${proof.message}` : `Cholesky check failed: ${proof.message}` };
  }
  if (method === "lanczos-estimate") {
    const ok = shift >= recomputedShift - slack;
    return {
      ok,
      proven: false,
      value,
      recomputedShift,
      shiftProof: method,
      message: ok ? "shift ≥ the recomputed Ritz value + residual (an estimate, not a proof)" : `shift ${shift} is below the recomputed estimate ${recomputedShift}`,
    };
  }
  return { ok: false, proven: false, value, recomputedShift, shiftProof: method, message: `unknown shift proof ${JSON.stringify(method)}` };
}
