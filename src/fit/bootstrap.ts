// Case-resampling bootstrap for least-squares coefficients. Each resample is a weighted least-squares
// problem (weight = how often a row was drawn), solved by accumulating the weighted rows into a
// p×(p+1) triangle with Givens rotations: a QR factorization in one pass, no n×p copy, no XᵀX.

import { Rng } from "../random/index.js";

export interface BootstrapReplicates {
  resamples: number;
  seed: number;
  /** Resamples whose design was rank-deficient (e.g. every drawn row had the same d): skipped. */
  failed: number;
  /** replicates[j] holds the successful estimates of coefficient j, sorted ascending. */
  sorted: Float64Array[];
}

/**
 * Adds the row w·[x | y] to the upper-triangular augmented factor `r` (p rows, p+1 columns,
 * row-major) by Givens rotations, as in Gentleman's sequential least squares (Applied Statistics
 * AS 75, 1973) but with square roots. `row` is overwritten.
 */
function givensAddRow(r: Float64Array, p: number, row: Float64Array): void {
  const w = p + 1;
  for (let j = 0; j < p; j++) {
    const b = row[j];
    if (b === 0) continue;
    const jj = j * w + j;
    const a = r[jj];
    const h = Math.sqrt(a * a + b * b);
    const c = a / h;
    const s = b / h;
    r[jj] = h;
    for (let k = j + 1; k <= p; k++) {
      const t = r[j * w + k];
      const u = row[k];
      r[j * w + k] = c * t + s * u;
      row[k] = c * u - s * t;
    }
  }
}

/**
 * Seeded percentile bootstrap by case resampling (Efron & Tibshirani, An Introduction to the
 * Bootstrap, 1993, ch. 9 and 13). `columns` are the p predictor columns (length n each) and `y` the
 * response. Predictors are centred on their full-sample means before accumulating (column 0 must be
 * the constant), which keeps each resample's triangle well conditioned; the intercept is mapped back.
 * Resample b draws from `new Rng(seed).fork(b)`, so any resample can be reproduced on its own.
 */
export function bootstrapCoefficients(
  columns: readonly Float64Array[],
  y: Float64Array,
  options: { resamples: number; seed: number },
): BootstrapReplicates {
  const p = columns.length;
  const n = y.length;
  const B = options.resamples;
  const w = p + 1;
  // Centred predictors, row-major with y last: [1, x1 − x̄1, …, y] per row, for cache-friendly passes.
  const means = new Float64Array(p);
  for (let j = 1; j < p; j++) {
    let s = 0;
    const c = columns[j];
    for (let i = 0; i < n; i++) s += c[i];
    means[j] = s / n;
  }
  const rows = new Float64Array(n * w);
  for (let i = 0; i < n; i++) {
    rows[i * w] = 1;
    for (let j = 1; j < p; j++) rows[i * w + j] = columns[j][i] - means[j];
    rows[i * w + p] = y[i];
  }
  // √k for the multiplicities a resample can produce (k ≤ n; large k are rare, computed on demand).
  const SQRT_TABLE = 64;
  const sqrtOf = new Float64Array(SQRT_TABLE);
  for (let k = 0; k < SQRT_TABLE; k++) sqrtOf[k] = Math.sqrt(k);

  const counts = new Int32Array(n);
  const r = new Float64Array(p * w);
  const row = new Float64Array(w);
  const beta = new Float64Array(p);
  const out: Float64Array[] = [];
  for (let j = 0; j < p; j++) out.push(new Float64Array(B));
  const root = new Rng(options.seed);
  let ok = 0;
  let failed = 0;
  for (let b = 0; b < B; b++) {
    const rng = root.fork(b);
    counts.fill(0);
    for (let i = 0; i < n; i++) counts[rng.nextInt(n)]++;
    r.fill(0);
    for (let i = 0; i < n; i++) {
      const k = counts[i];
      if (k === 0) continue;
      const sk = k < SQRT_TABLE ? sqrtOf[k] : Math.sqrt(k);
      const base = i * w;
      for (let j = 0; j < w; j++) row[j] = sk * rows[base + j];
      givensAddRow(r, p, row);
    }
    // Rank test as in the main fit: a pivot negligible against its column's size means the resample
    // cannot separate that coefficient.
    let singular = false;
    for (let j = 0; j < p && !singular; j++) {
      let size = 0;
      for (let i = 0; i <= j; i++) size = Math.max(size, Math.abs(r[i * w + j]));
      if (!(Math.abs(r[j * w + j]) > 1e-12 * size)) singular = true;
    }
    if (singular) {
      failed++;
      continue;
    }
    for (let k = p - 1; k >= 0; k--) {
      let s = r[k * w + p];
      for (let j = k + 1; j < p; j++) s -= r[k * w + j] * beta[j];
      beta[k] = s / r[k * w + k];
    }
    let intercept = beta[0];
    for (let j = 1; j < p; j++) intercept -= means[j] * beta[j];
    out[0][ok] = intercept;
    for (let j = 1; j < p; j++) out[j][ok] = beta[j];
    ok++;
  }
  const sorted = out.map((c) => c.slice(0, ok).sort());
  return { resamples: B, seed: options.seed, failed, sorted };
}

/**
 * Percentile interval from sorted replicates: the (1−level)/2 and (1+level)/2 sample quantiles with
 * linear interpolation between order statistics (Hyndman & Fan 1996, definition 7).
 */
export function percentileInterval(sorted: Float64Array, level: number): { lower: number; upper: number } {
  return { lower: sampleQuantile(sorted, (1 - level) / 2), upper: sampleQuantile(sorted, (1 + level) / 2) };
}

function sampleQuantile(sorted: Float64Array, prob: number): number {
  const n = sorted.length;
  if (n === 0) return NaN;
  const h = (n - 1) * prob;
  const lo = Math.floor(h);
  const hi = Math.min(n - 1, lo + 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
