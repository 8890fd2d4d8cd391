// Thick-restart Lanczos for the k largest or smallest eigenpairs of a symmetric operator,
// with full (twice-applied) Gram–Schmidt reorthogonalisation and explicit final residuals.

import { InputError, invalidParameter } from "../errors.js";
import { Rng } from "../random/prng.js";
import { checkSeed } from "../random/seed.js";
import { symmetricEigen } from "./dense-eigen.js";
import type { SymmetricOperator } from "./operator.js";
import { operatorToDense } from "./operator.js";
import { axpy, dot, fillNormal, norm2, normalize, scale } from "./vector.js";

export type EigenEnd = "largest" | "smallest";

export interface LanczosOptions {
  /** Number of eigenpairs wanted (default 1). */
  k?: number;
  /** Which end of the spectrum (default "largest"). */
  which?: EigenEnd;
  /** Stop when every wanted residual ‖Au − θu‖ ≤ tolerance·‖A‖ (‖A‖ estimated by the extreme Ritz values); default 1e-10. */
  tolerance?: number;
  /** Krylov basis size before a restart (default max(40, 2k + 20), at most n). */
  maxBasis?: number;
  /** Restart budget (default 300). */
  maxRestarts?: number;
  /** Seed of the random start vector (default 1). */
  solverSeed?: number;
  /** Start vector instead of a random one (copied; must have length n and be non-zero). */
  start?: Float64Array;
  /** The basis may use at most this many bytes (default 1 GiB); the basis shrinks to fit, down to k + 10 vectors. */
  maxMemoryBytes?: number;
  /** For k > 1, search the deflated operator for copies of repeated eigenvalues (default true). */
  checkMultiplicity?: boolean;
  /** Up to this n the operator is made dense and decomposed exactly (default 2·maxBasis). */
  denseBelow?: number;
}

export interface LanczosResult {
  /** Rayleigh quotients of the returned vectors, from the wanted end inwards (largest first for "largest"). */
  values: Float64Array;
  /** Unit eigenvector estimates, one per value. */
  vectors: Float64Array[];
  /** Explicit residual norms ‖A u − θ u‖ with ‖u‖ = 1: each interval [θ − r, θ + r] contains an eigenvalue. */
  residuals: Float64Array;
  /** Operator applications (matrix–vector products). */
  iterations: number;
  restarts: number;
  /** Every residual met the tolerance. */
  converged: boolean;
  /** max |Ritz value| seen: a lower estimate of ‖A‖₂, the scale of the tolerance. */
  normEstimate: number;
  basisSize: number;
  method: "lanczos" | "dense";
  solverSeed: number;
}

const OWNER = "lanczos";
const ROW_BLOCK = 256;

function checkOptions(op: SymmetricOperator, o: LanczosOptions): void {
  const n = op.n;
  const k = o.k ?? 1;
  if (!Number.isInteger(k) || k < 1 || k > n) throw invalidParameter(OWNER, "k", `should be an integer between 1 and n = ${n}`, k);
  if (o.which !== undefined && o.which !== "largest" && o.which !== "smallest") {
    throw invalidParameter(OWNER, "which", "should be largest or smallest", o.which);
  }
  if (o.tolerance !== undefined && !(o.tolerance > 0 && o.tolerance < 1)) {
    throw invalidParameter(OWNER, "tolerance", "should be a number in (0, 1)", o.tolerance);
  }
  if (o.maxBasis !== undefined && !(Number.isInteger(o.maxBasis) && o.maxBasis >= k + 2)) {
    throw invalidParameter(OWNER, "maxBasis", `should be an integer of at least k + 2 = ${k + 2}`, o.maxBasis);
  }
  if (o.maxRestarts !== undefined && !(Number.isInteger(o.maxRestarts) && o.maxRestarts >= 0)) {
    throw invalidParameter(OWNER, "maxRestarts", "should be a non-negative integer", o.maxRestarts);
  }
  checkSeed(OWNER, "solverSeed", o.solverSeed);
  if (o.start !== undefined && o.start.length !== n) {
    throw new InputError(`${OWNER}: \`start\` has ${o.start.length} entries, expected n = ${n}`);
  }
}

/** Exact answer for small operators: densify and decompose. */
function denseExtreme(op: SymmetricOperator, k: number, which: EigenEnd, tol: number, seed: number): LanczosResult {
  const n = op.n;
  const eig = symmetricEigen(operatorToDense(op), n);
  const values = new Float64Array(k);
  const vectors: Float64Array[] = [];
  const residuals = new Float64Array(k);
  const au = new Float64Array(n);
  let normEstimate = 0;
  for (let i = 0; i < n; i++) normEstimate = Math.max(normEstimate, Math.abs(eig.values[i]));
  let converged = true;
  for (let t = 0; t < k; t++) {
    const idx = which === "largest" ? n - 1 - t : t;
    const u = eig.vectors.slice(idx * n, (idx + 1) * n);
    normalize(u);
    const r = rayleighResidual(op, u, au);
    values[t] = r.theta;
    residuals[t] = r.residual;
    vectors.push(u);
    // A dense solver is accurate to about n·u·‖M‖, which may exceed a tight tolerance.
    if (r.residual > Math.max(tol, 1e-15 * n) * Math.max(normEstimate, Number.MIN_VALUE)) converged = false;
  }
  return { values, vectors, residuals, iterations: n, restarts: 0, converged, normEstimate, basisSize: n, method: "dense", solverSeed: seed };
}

/** Rayleigh quotient θ = uᵀAu of a unit vector and the explicit residual ‖Au − θu‖ (au is scratch). */
export function rayleighResidual(op: SymmetricOperator, u: Float64Array, au: Float64Array): { theta: number; residual: number } {
  op.apply(u, au);
  const theta = dot(u, au);
  axpy(-theta, u, au);
  return { theta, residual: norm2(au) };
}

/** One modified Gram–Schmidt pass of `w` against basis vectors first..last−1; adds the coefficients into h (stride hStride) when given. */
function gramSchmidtPass(V: Float64Array, n: number, first: number, last: number, w: Float64Array, h: Float64Array | null, hOffset: number, hStride: number): void {
  for (let i = first; i < last; i++) {
    const vi = V.subarray(i * n, (i + 1) * n);
    const c = dot(vi, w);
    axpy(-c, vi, w);
    if (h !== null) h[hOffset + i * hStride] += c;
  }
}

/**
 * Orthogonalise w against basis vectors 0..count−1: the local Lanczos terms (the newest two
 * vectors) first, then a full pass, and a second full pass only if the norm fell below 1/√2
 * of what the local step left (the DGKS criterion), which keeps the basis orthogonal to working precision.
 */
function orthogonalize(V: Float64Array, n: number, count: number, w: Float64Array, h: Float64Array | null, hOffset: number, hStride: number): void {
  const local = Math.max(0, count - 2);
  gramSchmidtPass(V, n, local, count, w, h, hOffset, hStride);
  for (let pass = 0; pass < 2; pass++) {
    const before = norm2(w);
    gramSchmidtPass(V, n, 0, count, w, h, hOffset, hStride);
    if (norm2(w) > Math.SQRT1_2 * before) break;
  }
}

/**
 * V[:, 0..q) ← V[:, 0..p)·S[:, wanted 0..q), row block by row block through `block` (p·ROW_BLOCK
 * scratch). Its own function so that V8 optimises it at once rather than inside Lanczos's long loop.
 */
function restartBasis(V: Float64Array, S: Float64Array, wanted: Int32Array, n: number, p: number, q: number, block: Float64Array): void {
  for (let r0 = 0; r0 < n; r0 += ROW_BLOCK) {
    const len = Math.min(ROW_BLOCK, n - r0);
    block.fill(0, 0, q * ROW_BLOCK);
    for (let j = 0; j < p; j++) {
      const src = j * n + r0;
      for (let t = 0; t < q; t++) {
        const s = S[j * p + wanted[t]];
        const off = t * ROW_BLOCK;
        for (let x = 0; x < len; x++) block[off + x] += s * V[src + x];
      }
    }
    for (let t = 0; t < q; t++) V.set(block.subarray(t * ROW_BLOCK, t * ROW_BLOCK + len), t * n + r0);
  }
}

/**
 * The k extreme eigenpairs of `op`. The basis holds at most `maxBasis` vectors of length n
 * (memory (maxBasis + 1)·n doubles); on a full basis it keeps the best half of the Ritz vectors
 * (thick restart) and continues from the residual direction. An invariant subspace is left
 * by a fresh random direction, so repeated eigenvalues are found too.
 */
export function lanczosExtreme(op: SymmetricOperator, options: LanczosOptions = {}): LanczosResult {
  checkOptions(op, options);
  const n = op.n;
  const k = options.k ?? 1;
  const which = options.which ?? "largest";
  const tol = options.tolerance ?? 1e-10;
  const seed = options.solverSeed ?? 1;
  const maxRestarts = options.maxRestarts ?? 300;
  let p = Math.min(options.maxBasis ?? Math.max(40, 2 * k + 20), n);
  const memory = options.maxMemoryBytes ?? 2 ** 30;
  const fit = Math.floor(memory / (8 * n)) - 1;
  if (fit < p) {
    if (fit < Math.min(k + 10, n)) {
      throw new InputError(`${OWNER}: n = ${n} with k = ${k} needs at least ${(k + 11) * 8 * n} bytes, above maxMemoryBytes = ${memory}`);
    }
    p = fit;
  }
  const denseBelow = options.denseBelow ?? 2 * p;
  if (n <= denseBelow || p >= n - 1) return denseExtreme(op, k, which, tol, seed);

  const rng = new Rng(seed);
  // Slot j holds basis vector j; slot p receives the residual direction that extends the basis.
  const V = new Float64Array((p + 1) * n);
  const H = new Float64Array(p * p); // upper triangle: H[i·p + j] = v_iᵀ A v_j for i ≤ j
  const T = new Float64Array(p * p);
  const block = new Float64Array(p * ROW_BLOCK);
  const v0 = V.subarray(0, n);
  if (options.start !== undefined) v0.set(options.start);
  else fillNormal(rng, v0);
  if (normalize(v0) === 0) throw new InputError(`${OWNER}: \`start\` is the zero vector`);

  let kept = 0; // basis vectors carried over from the last restart (their H block is diagonal)
  let matvecs = 0;
  let restarts = 0;
  let normEstimate = 0;
  let betaLast = 0;
  let theta: Float64Array = new Float64Array(p);
  let S: Float64Array = new Float64Array(p * p);
  const wanted = new Int32Array(p);

  for (;;) {
    for (let j = kept; j < p; j++) {
      const vj = V.subarray(j * n, (j + 1) * n);
      const w = V.subarray((j + 1) * n, (j + 2) * n);
      op.apply(vj, w);
      matvecs++;
      for (let i = 0; i <= j; i++) H[i * p + j] = 0;
      orthogonalize(V, n, j + 1, w, H, j, p);
      let beta = norm2(w);
      const scaleRef = Math.max(normEstimate, Math.abs(H[j * p + j]), Number.MIN_VALUE);
      if (beta <= 1e-12 * scaleRef) {
        // The basis spans an invariant subspace: continue in a fresh random direction, uncoupled.
        fillNormal(rng, w);
        orthogonalize(V, n, j + 1, w, null, 0, 0);
        normalize(w);
        beta = 0;
      } else scale(1 / beta, w);
      normEstimate = Math.max(normEstimate, Math.abs(H[j * p + j]));
      betaLast = beta;
    }

    // Rayleigh–Ritz on the projected matrix (upper triangle mirrored).
    for (let i = 0; i < p; i++) {
      for (let j = i; j < p; j++) {
        T[i * p + j] = H[i * p + j];
        T[j * p + i] = H[i * p + j];
      }
    }
    const eig = symmetricEigen(T, p);
    theta = eig.values;
    // eig.vectors row c is the c-th Ritz coefficient vector; S[j·p + c] = its j-th component.
    S = new Float64Array(p * p);
    for (let c = 0; c < p; c++) for (let j = 0; j < p; j++) S[j * p + c] = eig.vectors[c * p + j];
    for (let t = 0; t < p; t++) wanted[t] = which === "largest" ? p - 1 - t : t;
    normEstimate = Math.max(normEstimate, Math.abs(theta[0]), Math.abs(theta[p - 1]));
    let allConverged = true;
    for (let t = 0; t < k; t++) {
      // A u = θ u + β_p s_{p−1} v_p, so |β_p s_{p−1}| estimates the residual without a product.
      const est = Math.abs(betaLast * S[(p - 1) * p + wanted[t]]);
      if (est > tol * normEstimate) allConverged = false;
    }
    if (allConverged || restarts >= maxRestarts) break;

    // Thick restart: V[:, 0..q) ← V·S[:, wanted 0..q), then the residual direction becomes slot q.
    const q = Math.min(p - 2, k + Math.floor((p - k) / 2));
    restartBasis(V, S, wanted, n, p, q, block);
    V.copyWithin(q * n, p * n, (p + 1) * n);
    H.fill(0);
    for (let t = 0; t < q; t++) H[t * p + t] = theta[wanted[t]];
    kept = q;
    restarts++;
  }

  // Ritz vectors u = V·s, renormalised; values and residuals recomputed explicitly.
  const values = new Float64Array(k);
  const residuals = new Float64Array(k);
  const vectors: Float64Array[] = [];
  const au = new Float64Array(n);
  let converged = true;
  for (let t = 0; t < k; t++) {
    const u = new Float64Array(n);
    for (let j = 0; j < p; j++) axpy(S[j * p + wanted[t]], V.subarray(j * n, (j + 1) * n), u);
    normalize(u);
    const r = rayleighResidual(op, u, au);
    values[t] = r.theta;
    residuals[t] = r.residual;
    vectors.push(u);
    // Orthogonality loss can make the explicit residual exceed the estimate; judge by the explicit one.
    if (r.residual > tol * normEstimate) converged = false;
  }
  const result: LanczosResult = { values, vectors, residuals, iterations: matvecs, restarts, converged, normEstimate, basisSize: p, method: "lanczos", solverSeed: seed };
  if (k > 1 && converged && options.checkMultiplicity !== false) completeMultiplicities(op, result, which, tol, options, rng);
  return result;
}

/**
 * A single start vector meets each eigenspace in one direction only, so a repeated eigenvalue
 * among the k wanted appears once. Look for what is missing with Lanczos on the deflated operator
 * x ↦ P A P x + c·(I − P)x (P projects out the found vectors; c pushes their span to the far end)
 * and insert every eigenpair that beats the current k-th value, until none does.
 */
function completeMultiplicities(op: SymmetricOperator, res: LanczosResult, which: EigenEnd, tol: number, options: LanczosOptions, rng: Rng): void {
  const n = op.n;
  const k = res.values.length;
  const sign = which === "largest" ? 1 : -1;
  for (let round = 0; round < k; round++) {
    const U = res.vectors;
    const far = -sign * (4 * res.normEstimate + 1);
    const tmp = new Float64Array(n);
    const deflated: SymmetricOperator = {
      n,
      apply(x: Float64Array, out: Float64Array): void {
        tmp.set(x);
        for (const u of U) axpy(-dot(u, tmp), u, tmp);
        op.apply(tmp, out);
        for (const u of U) {
          axpy(-dot(u, out), u, out);
          axpy(far * dot(u, x), u, out);
        }
      },
    };
    const extra = lanczosExtreme(deflated, {
      k: 1,
      which,
      // Deflation perturbs the residual slightly; aim lower so the re-measured one meets `tol`.
      tolerance: Math.max(tol / 10, 1e-15),
      maxBasis: options.maxBasis,
      maxRestarts: options.maxRestarts,
      maxMemoryBytes: options.maxMemoryBytes,
      solverSeed: rng.nextU32(),
      denseBelow: 0,
    });
    res.iterations += extra.iterations;
    const mu = extra.values[0];
    if (!(sign * (mu - res.values[k - 1]) > tol * res.normEstimate) || !extra.converged) return;
    // Re-measure the new vector against the original operator, then insert it in order.
    const u = extra.vectors[0];
    const au = new Float64Array(n);
    const r = rayleighResidual(op, u, au);
    let at = k - 1;
    while (at > 0 && sign * (r.theta - res.values[at - 1]) > 0) at--;
    for (let t = k - 1; t > at; t--) {
      res.values[t] = res.values[t - 1];
      res.residuals[t] = res.residuals[t - 1];
      res.vectors[t] = res.vectors[t - 1];
    }
    res.values[at] = r.theta;
    res.residuals[at] = r.residual;
    res.vectors[at] = u;
    if (r.residual > tol * res.normEstimate) res.converged = false;
  }
}
