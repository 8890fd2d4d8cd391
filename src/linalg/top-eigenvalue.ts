// A quick estimate of the largest eigenvalue of a small dense symmetric matrix: plain Lanczos with
// full reorthogonalisation and no restarts, the largest Ritz value found by Sturm-sequence bisection
// of the tridiagonal matrix (Golub and Van Loan, Matrix Computations, §8.4.1 and §10.1). No
// eigenvector, no residual: callers prove a shift above the estimate by Cholesky, so the estimate
// only has to be close. The Ritz value never exceeds λmax (Cauchy interlacing), so a shift a little
// above it is the natural first try.

import { Rng } from "../random/prng.js";
import { fillNormal, normalize } from "./vector.js";

export interface TopEigenvalueEstimate {
  /** The largest Ritz value: ≤ λmax, and close to it once `settled`. */
  value: number;
  /** How much the value moved over the last five steps (0 when the Krylov space became invariant). */
  lastChange: number;
  /** max |Ritz value| seen: the scale of the matrix. */
  scale: number;
  steps: number;
}

/** Largest eigenvalue of the symmetric tridiagonal matrix (diagonal a[0..k), off-diagonal b[1..k)), by bisection. */
function tridiagonalTop(a: Float64Array, b: Float64Array, k: number): number {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < k; i++) {
    const r = (i > 0 ? Math.abs(b[i]) : 0) + (i + 1 < k ? Math.abs(b[i + 1]) : 0);
    lo = Math.min(lo, a[i] - r);
    hi = Math.max(hi, a[i] + r);
  }
  // Count of eigenvalues below x (Sturm sequence of the LDLᵀ pivots).
  const below = (x: number): number => {
    let c = 0, d = 1;
    for (let i = 0; i < k; i++) {
      d = a[i] - x - (i > 0 ? (b[i] * b[i]) / d : 0);
      if (d === 0) d = -1e-300;
      if (d < 0) c++;
    }
    return c;
  };
  const width = 1e-15 * Math.max(Math.abs(lo), Math.abs(hi), 1e-300);
  for (let it = 0; it < 100 && hi - lo > width; it++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (below(mid) >= k) hi = mid;
    else lo = mid;
  }
  return hi;
}

/**
 * Estimate λmax of the dense symmetric n×n matrix `a` (row-major): at most `maxSteps` Lanczos steps
 * (default n: a full Krylov space is exact in exact arithmetic), stopping once the top Ritz value moves by at most `tolerance`·scale over
 * five steps (default 1e-11). Deterministic for a seed.
 */
export function denseTopEigenvalue(a: Float64Array, n: number, options: { maxSteps?: number; tolerance?: number; solverSeed?: number } = {}): TopEigenvalueEstimate {
  const m = Math.min(n, options.maxSteps ?? n);
  const tol = options.tolerance ?? 1e-11;
  if (n === 0) return { value: -Infinity, lastChange: 0, scale: 0, steps: 0 };
  const Q = new Float64Array((m + 1) * n);
  const alpha = new Float64Array(m);
  const beta = new Float64Array(m + 1);
  const w = new Float64Array(n);
  const q0 = Q.subarray(0, n);
  fillNormal(new Rng(options.solverSeed ?? 1), q0);
  normalize(q0);
  const history: number[] = [];
  let scale = 0;
  let value = -Infinity;
  let steps = 0;
  for (let j = 0; j < m; j++) {
    const oj = j * n;
    for (let i = 0; i < n; i++) {
      let s = 0;
      const row = i * n;
      for (let c = 0; c < n; c++) s += a[row + c] * Q[oj + c];
      w[i] = s;
    }
    let al = 0;
    for (let i = 0; i < n; i++) al += w[i] * Q[oj + i];
    alpha[j] = al;
    // Full reorthogonalisation, one Gram–Schmidt pass against every earlier vector (enough for an
    // eigenvalue estimate; the proof that follows does not rely on it).
    for (let t = 0; t <= j; t++) {
      const o = t * n;
      let c = 0;
      for (let i = 0; i < n; i++) c += w[i] * Q[o + i];
      for (let i = 0; i < n; i++) w[i] -= c * Q[o + i];
    }
    let bn = 0;
    for (let i = 0; i < n; i++) bn += w[i] * w[i];
    bn = Math.sqrt(bn);
    steps = j + 1;
    scale = Math.max(scale, Math.abs(al) + bn);
    const invariant = bn <= 1e-13 * Math.max(scale, 1e-300);
    // The Ritz value every fifth step (the convergence test compares values five steps apart).
    if (steps % 5 === 0 || invariant || steps === m) {
      value = tridiagonalTop(alpha, beta, steps);
      history.push(value);
      if (invariant) return { value, lastChange: 0, scale, steps };
      if (history.length > 1 && value - history[history.length - 2] <= tol * scale) break;
    }
    beta[j + 1] = bn;
    const on = (j + 1) * n;
    for (let i = 0; i < n; i++) Q[on + i] = w[i] / bn;
  }
  const lastChange = history.length > 1 ? value - history[history.length - 2] : Math.max(Math.abs(value), scale);
  return { value, lastChange, scale, steps };
}
