// Case-resampling bootstrap for least-squares coefficients. Each resample is a weighted least-squares
// problem (weight = how often a row was drawn), solved by accumulating the weighted rows into a
// triangle with square-root-free Givens rotations: a QR factorisation in one pass, no n×p copy, no XᵀX.

import { Rng } from "../random/index.js";

export interface BootstrapReplicates {
  resamples: number;
  solverSeed: number;
  /** Resamples whose design was rank-deficient (e.g. every drawn row had the same d): skipped. */
  failed: number;
  /** replicates[j] holds the successful estimates of coefficient j, sorted ascending. */
  sorted: Float64Array[];
}

const TWO_POW_32 = 4294967296;
const INV_TWO_POW_32 = 1 / TWO_POW_32;

/**
 * Unbiased uniform integer in [0, n) from one 32-bit draw, by multiply-and-shift with rejection of
 * the first 2³² mod n products (Lemire, "Fast random integer generation in an interval", ACM TOMS 29,
 * 2019): about one multiplication per draw instead of a division. `threshold` = 2³² mod n; n < 2²¹
 * so x·n is exact in a double.
 */
function drawIndex(rng: Rng, n: number, threshold: number): number {
  // Split the product into high and low 32-bit halves without `%`, which is a slow call on doubles.
  let m = rng.nextU32() * n;
  let high = Math.floor(m * INV_TWO_POW_32);
  while (m - high * TWO_POW_32 < threshold) {
    m = rng.nextU32() * n;
    high = Math.floor(m * INV_TWO_POW_32);
  }
  return high;
}

/**
 * The weighted least-squares problem of one resample, set up once for all resamples. Row i with
 * weight k (its multiplicity in the resample) is solved in one pass by Gentleman's square-root-free
 * Givens updates of a unit upper-triangular R̄ and diagonal D (Gentleman, "Least squares
 * computations by Givens transformations without square roots", J. Inst. Maths Applics 12, 1973;
 * Applied Statistics algorithm AS 75, 1974): a QR factorisation that takes row weights directly and
 * never forms XᵀX. Predictors are centred on their full-sample means first, which keeps each
 * resample's triangle well conditioned; the intercept is mapped back.
 */
export class WeightedRowsProblem {
  readonly n: number;
  readonly p: number;
  private readonly rows: Float64Array;
  private readonly means: Float64Array;
  private readonly centred: Float64Array;
  private readonly solver: ResampleSolver;

  /** `columns`: the p predictor columns (length n each), column 0 the constant; `y`: the response. */
  constructor(columns: readonly Float64Array[], y: Float64Array) {
    const p = columns.length;
    const n = y.length;
    const w = p + 1;
    this.n = n;
    this.p = p;
    this.means = new Float64Array(p);
    for (let j = 1; j < p; j++) {
      let s = 0;
      const c = columns[j];
      for (let i = 0; i < n; i++) s += c[i];
      this.means[j] = s / n;
    }
    // Row-major [1, x1 − x̄1, …, y] so each resample is one sequential pass.
    this.rows = new Float64Array(n * w);
    for (let i = 0; i < n; i++) {
      this.rows[i * w] = 1;
      for (let j = 1; j < p; j++) this.rows[i * w + j] = columns[j][i] - this.means[j];
      this.rows[i * w + p] = y[i];
    }
    this.centred = new Float64Array(p);
    this.solver = p === 1 ? solveOne : p === 2 ? solveTwo : p === 3 ? solveThree : makeGenericSolver(p);
  }

  /** Coefficients of the problem with row weights `counts` into `out`; false when rank-deficient. */
  solve(counts: Int32Array, out: Float64Array): boolean {
    if (!this.solver(this.rows, counts, this.n, this.centred)) return false;
    let intercept = this.centred[0];
    for (let j = 1; j < this.p; j++) {
      intercept -= this.means[j] * this.centred[j];
      out[j] = this.centred[j];
    }
    out[0] = intercept;
    return true;
  }
}

/**
 * Multiplicities of resample b: n draws with replacement from n rows, from `new Rng(seed).fork(b)`,
 * so any resample can be reproduced on its own.
 */
export function resampleCounts(n: number, seed: number, b: number, counts: Int32Array = new Int32Array(n)): Int32Array {
  const rng = new Rng(seed).fork(b);
  counts.fill(0);
  if (n < 2097152) {
    const threshold = TWO_POW_32 % n;
    for (let i = 0; i < n; i++) counts[drawIndex(rng, n, threshold)]++;
  } else {
    for (let i = 0; i < n; i++) counts[rng.nextInt(n)]++;
  }
  return counts;
}

/**
 * Seeded percentile bootstrap by case resampling (Efron & Tibshirani, An Introduction to the
 * Bootstrap, 1993, ch. 9 and 13): `resamples` weighted problems (WeightedRowsProblem) with the
 * multiplicities of resampleCounts.
 */
export function bootstrapCoefficients(
  columns: readonly Float64Array[],
  y: Float64Array,
  options: { resamples: number; solverSeed: number },
): BootstrapReplicates {
  const problem = new WeightedRowsProblem(columns, y);
  const { n, p } = problem;
  const B = options.resamples;
  const counts = new Int32Array(n);
  const beta = new Float64Array(p);
  const out: Float64Array[] = [];
  for (let j = 0; j < p; j++) out.push(new Float64Array(B));
  let ok = 0;
  let failed = 0;
  for (let b = 0; b < B; b++) {
    resampleCounts(n, options.solverSeed, b, counts);
    if (!problem.solve(counts, beta)) {
      failed++;
      continue;
    }
    for (let j = 0; j < p; j++) out[j][ok] = beta[j];
    ok++;
  }
  const sorted = out.map((c) => c.slice(0, ok).sort());
  return { resamples: B, solverSeed: options.solverSeed, failed, sorted };
}

// One resample's weighted least squares, by Gentleman's square-root-free Givens updates: each row
// x (with weight k = its multiplicity) updates D, R̄ (unit upper triangular) and θ̄ as
//   d' = d + w·xⱼ², c̄ = d/d', s̄ = w·xⱼ/d', w ← c̄·w, then for the later columns c:
//   x_c ← x_c − xⱼ·r̄ⱼc, r̄ⱼc ← c̄·r̄ⱼc + s̄·x_c (old x_c).
// The solution is R̄β = θ̄. Rank test (as in the main fit, squared): Dⱼ must exceed 1e-24 times
// column j's weighted squared norm, else the resample cannot separate coefficient j.
// p = 1, 2, 3 (the fits' designs) are written out with the triangle in locals: about 2.5× faster
// than the loop form, which is kept for other p.
type ResampleSolver = (rows: Float64Array, counts: Int32Array, n: number, beta: Float64Array) => boolean;

const solveOne: ResampleSolver = (rows, counts, n, beta) => {
  // Column 0 is the constant: the solution is the weighted mean of y.
  let d0 = 0;
  let t0 = 0;
  for (let i = 0; i < n; i++) {
    const k = counts[i];
    if (k === 0) continue;
    const dp = d0 + k;
    t0 = (d0 * t0 + k * rows[2 * i + 1]) / dp;
    d0 = dp;
  }
  beta[0] = t0;
  return d0 > 0;
};

const solveTwo: ResampleSolver = (rows, counts, n, beta) => {
  let d0 = 0, d1 = 0, r01 = 0, t0 = 0, t1 = 0, size1 = 0;
  for (let i = 0; i < n; i++) {
    const k = counts[i];
    if (k === 0) continue;
    const base = 3 * i;
    let x1 = rows[base + 1];
    let y = rows[base + 2];
    size1 += k * x1 * x1;
    let wt = k;
    {
      const dp = d0 + wt;
      const inv = 1 / dp;
      const cb = d0 * inv;
      const sb = wt * inv;
      wt *= cb;
      d0 = dp;
      let xc = x1;
      x1 = xc - r01;
      r01 = cb * r01 + sb * xc;
      xc = y;
      y = xc - t0;
      t0 = cb * t0 + sb * xc;
    }
    if (wt !== 0 && x1 !== 0) {
      const dp = d1 + wt * x1 * x1;
      const inv = 1 / dp;
      t1 = d1 * inv * t1 + wt * x1 * inv * y;
      d1 = dp;
    }
  }
  if (!(d0 > 0 && d1 > 1e-24 * size1)) return false;
  beta[1] = t1;
  beta[0] = t0 - r01 * t1;
  return true;
};

const solveThree: ResampleSolver = (rows, counts, n, beta) => {
  let d0 = 0, d1 = 0, d2 = 0, r01 = 0, r02 = 0, r12 = 0, t0 = 0, t1 = 0, t2 = 0, size1 = 0, size2 = 0;
  for (let i = 0; i < n; i++) {
    const k = counts[i];
    if (k === 0) continue;
    const base = 4 * i;
    let x1 = rows[base + 1];
    let x2 = rows[base + 2];
    let y = rows[base + 3];
    size1 += k * x1 * x1;
    size2 += k * x2 * x2;
    let wt = k;
    {
      const dp = d0 + wt;
      const inv = 1 / dp;
      const cb = d0 * inv;
      const sb = wt * inv;
      wt *= cb;
      d0 = dp;
      let xc = x1;
      x1 = xc - r01;
      r01 = cb * r01 + sb * xc;
      xc = x2;
      x2 = xc - r02;
      r02 = cb * r02 + sb * xc;
      xc = y;
      y = xc - t0;
      t0 = cb * t0 + sb * xc;
    }
    if (wt !== 0 && x1 !== 0) {
      const dp = d1 + wt * x1 * x1;
      const inv = 1 / dp;
      const cb = d1 * inv;
      const sb = wt * x1 * inv;
      wt *= cb;
      d1 = dp;
      let xc = x2;
      x2 = xc - x1 * r12;
      r12 = cb * r12 + sb * xc;
      xc = y;
      y = xc - x1 * t1;
      t1 = cb * t1 + sb * xc;
    }
    if (wt !== 0 && x2 !== 0) {
      const dp = d2 + wt * x2 * x2;
      const inv = 1 / dp;
      t2 = d2 * inv * t2 + wt * x2 * inv * y;
      d2 = dp;
    }
  }
  if (!(d0 > 0 && d1 > 1e-24 * size1 && d2 > 1e-24 * size2)) return false;
  beta[2] = t2;
  beta[1] = t1 - r12 * t2;
  beta[0] = t0 - r01 * beta[1] - r02 * t2;
  return true;
};

function makeGenericSolver(p: number): ResampleSolver {
  const w = p + 1;
  const d = new Float64Array(p);
  const rbar = new Float64Array(p * w); // row j: r̄ⱼc for c > j, θ̄ⱼ in column p
  const x = new Float64Array(w);
  const size = new Float64Array(p);
  return (rows, counts, n, beta) => {
    d.fill(0);
    rbar.fill(0);
    size.fill(0);
    for (let i = 0; i < n; i++) {
      const k = counts[i];
      if (k === 0) continue;
      const base = i * w;
      for (let c = 0; c < w; c++) x[c] = rows[base + c];
      for (let c = 1; c < p; c++) size[c] += k * x[c] * x[c];
      let weight = k;
      for (let j = 0; j < p && weight !== 0; j++) {
        const xj = x[j];
        if (xj === 0) continue;
        const dp = d[j] + weight * xj * xj;
        const cb = d[j] / dp;
        const sb = (weight * xj) / dp;
        weight *= cb;
        d[j] = dp;
        const rj = j * w;
        for (let c = j + 1; c < w; c++) {
          const xc = x[c];
          x[c] = xc - xj * rbar[rj + c];
          rbar[rj + c] = cb * rbar[rj + c] + sb * xc;
        }
      }
    }
    if (!(d[0] > 0)) return false;
    for (let j = 1; j < p; j++) if (!(d[j] > 1e-24 * size[j])) return false;
    for (let j = p - 1; j >= 0; j--) {
      let s = rbar[j * w + p];
      for (let c = j + 1; c < p; c++) s -= rbar[j * w + c] * beta[c];
      beta[j] = s;
    }
    return true;
  };
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
