// Linear least squares by Householder QR on a column-major Float64Array: coefficients, standard
// errors, residuals, R², leverage. Never forms XᵀX, so badly conditioned designs (NIST's Longley)
// keep their digits.

import { InputError } from "../errors.js";

/** Everything a least-squares fit of y on the columns of X says, computed once. */
export interface LeastSquaresResult {
  /** Rows (observations) and columns (coefficients). */
  n: number;
  p: number;
  coefficients: Float64Array;
  standardErrors: Float64Array;
  /** (RᵀR)⁻¹ = (XᵀX)⁻¹ as a p×p row-major array, computed from R⁻¹ (never by inverting XᵀX). */
  unscaledCovariance: Float64Array;
  residuals: Float64Array;
  fitted: Float64Array;
  residualSumOfSquares: number;
  /** n − p. */
  df: number;
  /** √(RSS / df); NaN when df = 0. */
  residualStandardDeviation: number;
  /**
   * 1 − RSS/TSS with TSS about the mean of y when X has a constant column, about 0 otherwise
   * (the convention of NIST StRD and most statistics packages).
   */
  rSquared: number;
  /** Diagonal of the hat matrix, hᵢ = ‖row i of Q‖² (thin Q from the same reflectors). */
  leverage: Float64Array;
}

export interface LeastSquaresOptions {
  /** Column names for error messages (default "column 1", "column 2", …). */
  names?: readonly string[];
  /** Who is asking, for error messages (default "leastSquares"). */
  owner?: string;
  /** Skip the thin Q and leverage (saves O(n·p²) when only coefficients are wanted). */
  leverage?: boolean;
}

/**
 * Householder QR of the n×p column-major matrix `a` in place (Golub & Van Loan, Matrix
 * Computations, 4th ed., Algorithm 5.2.1, LAPACK's dgeqr2 convention): on return the upper triangle
 * holds R and each column below the diagonal holds its reflector v (with v₀ = 1 implied), tau[k] its
 * scale, so H_k = I − tau_k·v·vᵀ. Returns the first column k whose pivot is negligible
 * (|R_kk| ≤ 1e-12·‖a_k‖), or −1 when X has full column rank to that tolerance.
 */
export function householderQr(a: Float64Array, n: number, p: number, tau: Float64Array): number {
  let deficient = -1;
  for (let k = 0; k < p; k++) {
    const col = k * n;
    // Scaled 2-norm of the column's tail (and of the whole original column, for the rank test).
    let scale = 0;
    for (let i = k; i < n; i++) scale = Math.max(scale, Math.abs(a[col + i]));
    let norm = 0;
    if (scale > 0) {
      let s = 0;
      for (let i = k; i < n; i++) {
        const v = a[col + i] / scale;
        s += v * v;
      }
      norm = scale * Math.sqrt(s);
    }
    let above = 0;
    for (let i = 0; i < k; i++) above = Math.max(above, Math.abs(a[col + i]));
    const columnSize = Math.max(norm, above);
    if (norm === 0 || norm <= 1e-12 * columnSize) {
      tau[k] = 0;
      if (deficient < 0) deficient = k;
      continue;
    }
    const x0 = a[col + k];
    const alpha = x0 >= 0 ? -norm : norm; // sign chosen so v₀ = x₀ − α does not cancel
    const v0 = x0 - alpha;
    tau[k] = -v0 / alpha; // = (α − x₀)/α
    const inv = 1 / v0;
    for (let i = k + 1; i < n; i++) a[col + i] *= inv;
    a[col + k] = alpha;
    // Apply H_k to the remaining columns: c ← c − tau·v·(vᵀc).
    for (let j = k + 1; j < p; j++) {
      const cj = j * n;
      let dot = a[cj + k];
      for (let i = k + 1; i < n; i++) dot += a[col + i] * a[cj + i];
      dot *= tau[k];
      a[cj + k] -= dot;
      for (let i = k + 1; i < n; i++) a[cj + i] -= dot * a[col + i];
    }
  }
  return deficient;
}

/** y ← H_k y for the k-th reflector stored by householderQr (H_k = I − τ_k v vᵀ, v = (1, qr below the diagonal)). */
function applyReflector(qr: Float64Array, n: number, k: number, tau: Float64Array, y: Float64Array): void {
  if (tau[k] === 0) return;
  const col = k * n;
  let dot = y[k];
  for (let i = k + 1; i < n; i++) dot += qr[col + i] * y[i];
  dot *= tau[k];
  y[k] -= dot;
  for (let i = k + 1; i < n; i++) y[i] -= dot * qr[col + i];
}

/** y ← Qᵀy using the reflectors stored by householderQr. */
export function applyQTranspose(qr: Float64Array, n: number, p: number, tau: Float64Array, y: Float64Array): void {
  for (let k = 0; k < p; k++) applyReflector(qr, n, k, tau, y);
}

/** y ← Qy (reflectors applied in reverse order). */
function applyQ(qr: Float64Array, n: number, p: number, tau: Float64Array, y: Float64Array): void {
  for (let k = p - 1; k >= 0; k--) applyReflector(qr, n, k, tau, y);
}

/** Solve R·x = b in place for the p×p upper triangle R stored in the QR array. */
function backSolve(qr: Float64Array, n: number, p: number, b: Float64Array): void {
  for (let k = p - 1; k >= 0; k--) {
    let s = b[k];
    for (let j = k + 1; j < p; j++) s -= qr[j * n + k] * b[j];
    b[k] = s / qr[k * n + k];
  }
}

/** A design matrix as rows (number[][]) or as columns in one column-major Float64Array. */
export type DesignMatrix = readonly (readonly number[])[] | { columnMajor: Float64Array; rows: number; columns: number };

function toColumnMajor(X: DesignMatrix, owner: string): { a: Float64Array; n: number; p: number } {
  if ("columnMajor" in X) {
    if (X.columnMajor.length !== X.rows * X.columns) {
      throw new InputError(`${owner}: invalid \`X\`: columnMajor has ${X.columnMajor.length} entries, not rows·columns = ${X.rows * X.columns}`);
    }
    return { a: Float64Array.from(X.columnMajor), n: X.rows, p: X.columns };
  }
  const n = X.length;
  const p = n > 0 ? X[0].length : 0;
  const a = new Float64Array(n * p);
  for (let i = 0; i < n; i++) {
    const row = X[i];
    if (row.length !== p) throw new InputError(`${owner}: invalid \`X\`: row ${i + 1} has ${row.length} entries, row 1 has ${p}`);
    for (let j = 0; j < p; j++) a[j * n + i] = row[j];
  }
  return { a, n, p };
}

/**
 * Least squares min ‖y − Xβ‖₂ by Householder QR with one step of iterative refinement
 * (Golub & Van Loan §5.3; refinement as in Björck, Numerical Methods for Least Squares Problems,
 * §2.9), with the classical standard errors s·√((XᵀX)⁻¹)ⱼⱼ, s² = RSS/(n − p).
 * X is n×p with n ≥ p (include a column of ones for an intercept); every entry must be finite.
 */
export function leastSquares(X: DesignMatrix, y: ArrayLike<number>, options: LeastSquaresOptions = {}): LeastSquaresResult {
  const owner = options.owner ?? "leastSquares";
  const { a, n, p } = toColumnMajor(X, owner);
  const name = (j: number): string => options.names?.[j] ?? `column ${j + 1}`;
  if (y.length !== n) throw new InputError(`${owner}: invalid \`y\`: has ${y.length} entries but X has ${n} rows`);
  if (p === 0) throw new InputError(`${owner}: invalid \`X\`: no columns`);
  if (n < p) throw new InputError(`${owner}: needs at least ${p} rows for ${p} coefficients (got ${n})`);
  for (let i = 0; i < a.length; i++) {
    if (!Number.isFinite(a[i])) throw new InputError(`${owner}: invalid \`X\`: row ${(i % n) + 1}, ${name(Math.floor(i / n))} is ${a[i]}`);
  }
  for (let i = 0; i < n; i++) if (!Number.isFinite(y[i])) throw new InputError(`${owner}: invalid \`y\`: row ${i + 1} is ${y[i]}`);

  const original = Float64Array.from(a);
  const tau = new Float64Array(p);
  const deficient = householderQr(a, n, p, tau);
  if (deficient >= 0) {
    throw new InputError(`${owner}: ${name(deficient)} is a linear combination of the columns before it (rank-deficient design)`);
  }

  // β from Rβ = (Qᵀy)[0:p], then one refinement step on the computed residual.
  const coefficients = new Float64Array(p);
  const work = Float64Array.from(y as ArrayLike<number>);
  applyQTranspose(a, n, p, tau, work);
  for (let j = 0; j < p; j++) coefficients[j] = work[j];
  backSolve(a, n, p, coefficients);
  const residuals = new Float64Array(n);
  const fitted = new Float64Array(n);
  const computeResiduals = (): void => {
    for (let i = 0; i < n; i++) {
      let f = 0;
      for (let j = 0; j < p; j++) f += original[j * n + i] * coefficients[j];
      fitted[i] = f;
      residuals[i] = y[i] - f;
    }
  };
  computeResiduals();
  work.set(residuals);
  applyQTranspose(a, n, p, tau, work);
  const delta = work.subarray(0, p).slice();
  backSolve(a, n, p, delta);
  for (let j = 0; j < p; j++) coefficients[j] += delta[j];
  computeResiduals();

  let rss = 0;
  for (let i = 0; i < n; i++) rss += residuals[i] * residuals[i];
  const df = n - p;
  const s = df > 0 ? Math.sqrt(rss / df) : NaN;

  // R⁻¹ (upper triangular), then (XᵀX)⁻¹ = R⁻¹R⁻ᵀ.
  const rInv = new Float64Array(p * p);
  for (let c = 0; c < p; c++) {
    const e = new Float64Array(p);
    e[c] = 1;
    backSolve(a, n, p, e);
    for (let r = 0; r < p; r++) rInv[r * p + c] = e[r];
  }
  const unscaledCovariance = new Float64Array(p * p);
  for (let i = 0; i < p; i++) {
    for (let j = 0; j < p; j++) {
      let v = 0;
      for (let k = Math.max(i, j); k < p; k++) v += rInv[i * p + k] * rInv[j * p + k];
      unscaledCovariance[i * p + j] = v;
    }
  }
  const standardErrors = new Float64Array(p);
  for (let j = 0; j < p; j++) standardErrors[j] = s * Math.sqrt(unscaledCovariance[j * p + j]);

  // R² about the mean when some column is constant (an intercept), else about zero.
  let hasConstant = false;
  for (let j = 0; j < p && !hasConstant; j++) {
    const c0 = original[j * n];
    let constant = c0 !== 0;
    for (let i = 1; i < n && constant; i++) constant = original[j * n + i] === c0;
    hasConstant = constant;
  }
  let mean = 0;
  if (hasConstant) {
    for (let i = 0; i < n; i++) mean += y[i];
    mean /= n;
  }
  let tss = 0;
  for (let i = 0; i < n; i++) tss += (y[i] - mean) ** 2;
  const rSquared = tss > 0 ? 1 - rss / tss : NaN;

  const leverage = new Float64Array(options.leverage === false ? 0 : n);
  if (options.leverage !== false) {
    const q = new Float64Array(n);
    for (let j = 0; j < p; j++) {
      q.fill(0);
      q[j] = 1;
      applyQ(a, n, p, tau, q);
      for (let i = 0; i < n; i++) leverage[i] += q[i] * q[i];
    }
  }

  return {
    n,
    p,
    coefficients,
    standardErrors,
    unscaledCovariance,
    residuals,
    fitted,
    residualSumOfSquares: rss,
    df,
    residualStandardDeviation: s,
    rSquared,
    leverage,
  };
}
