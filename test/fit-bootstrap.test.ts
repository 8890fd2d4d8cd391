// The case-resampling bootstrap (src/fit/bootstrap.ts): each resample's weighted QR solve against the
// dense QR least squares on the resample written out row by row, the draws, and the percentile rule.
import { describe, expect, it } from "vitest";
import { bootstrapCoefficients, percentileInterval, resampleCounts, WeightedRowsProblem } from "../src/fit/bootstrap.js";
import { leastSquares } from "../src/fit/least-squares.js";
import { fitPowerLaw } from "../src/fit/power-law.js";
import { Rng } from "../src/random/prng.js";
import { chiSquare } from "./helpers/stats.js";

function randomDesign(rng: Rng, n: number, p: number): { columns: Float64Array[]; y: Float64Array } {
  const columns = [new Float64Array(n).fill(1)];
  // Off-centre, differently scaled predictors, like ln m (≈ 5..12) and ln d (≈ 1..4).
  for (let j = 1; j < p; j++) columns.push(Float64Array.from({ length: n }, () => 3 * j + j * rng.nextNormal()));
  const y = Float64Array.from({ length: n }, (_, i) => 0.5 + columns.slice(1).reduce((s, c, j) => s + (j + 1) * 0.3 * c[i], 0) + 0.2 * rng.nextNormal());
  return { columns, y };
}

describe("bootstrap", () => {
  it("solves each weighted resample like QR least squares on the resample's rows written out (p = 1..4)", () => {
    // A resample with multiplicities k is the same least-squares problem as its rows repeated k times
    // (definition of case resampling, Efron & Tibshirani 1993, ch. 6); p = 4 runs the loop form.
    const rng = new Rng(1);
    for (const p of [1, 2, 3, 4]) {
      const n = 40;
      const { columns, y } = randomDesign(rng, n, p);
      const problem = new WeightedRowsProblem(columns, y);
      for (let b = 0; b < 5; b++) {
        const counts = resampleCounts(n, 7, b);
        const X: number[][] = [];
        const ys: number[] = [];
        for (let i = 0; i < n; i++) {
          for (let k = 0; k < counts[i]; k++) {
            X.push(columns.map((c) => c[i]));
            ys.push(y[i]);
          }
        }
        const ref = leastSquares(X, ys, { leverage: false }).coefficients;
        const got = new Float64Array(p);
        expect(problem.solve(counts, got)).toBe(true);
        for (let j = 0; j < p; j++) expect(got[j]).toBeCloseTo(ref[j], 11);
      }
    }
  });

  it("replicate b of the bootstrap is resample b solved on its own", () => {
    const { columns, y } = randomDesign(new Rng(2), 30, 3);
    const boot = bootstrapCoefficients(columns, y, { resamples: 1000, solverSeed: 5 });
    expect(boot.failed).toBe(0);
    const problem = new WeightedRowsProblem(columns, y);
    const beta = new Float64Array(3);
    const slopes: number[] = [];
    for (let b = 0; b < 1000; b++) {
      problem.solve(resampleCounts(30, 5, b), beta);
      slopes.push(beta[1]);
    }
    expect(Array.from(boot.sorted[1])).toEqual(slopes.sort((a, b) => a - b));
  });

  it("draws every row with equal probability and n draws per resample", () => {
    // Multinomial(n; 1/n, …): total n, each count's mean 1; pooled over resamples the draws are uniform
    // (chi-square with 6 degrees of freedom; 22.46 is its 0.999 quantile, NIST/SEMATECH e-Handbook
    // §1.3.6.7.4, from memory).
    const n = 7;
    const totals = new Array(n).fill(0);
    for (let b = 0; b < 2000; b++) {
      const c = resampleCounts(n, 3, b);
      expect(c.reduce((s, v) => s + v, 0)).toBe(n);
      c.forEach((v, i) => (totals[i] += v));
    }
    expect(chiSquare(totals, new Array(n).fill(2000))).toBeLessThan(22.46);
    // Large n: the share of rows never drawn tends to (1 − 1/n)^n ≈ e^{-1} (common practice, no source).
    const big = resampleCounts(100_000, 1, 0);
    const zeros = big.reduce((s, v) => s + (v === 0 ? 1 : 0), 0) / 100_000;
    expect(Math.abs(zeros - Math.exp(-1))).toBeLessThan(0.005);
    expect(Array.from(resampleCounts(50, 9, 3))).toEqual(Array.from(resampleCounts(50, 9, 3)));
  });

  it("takes percentiles by linear interpolation between order statistics (Hyndman & Fan definition 7)", () => {
    // Definition 7: h = (N − 1)p, x_(⌊h⌋) + (h − ⌊h⌋)(x_(⌊h⌋+1) − x_(⌊h⌋)); on 1..10 at p = 0.025
    // h = 0.225 → 1.225, at p = 0.975 h = 8.775 → 9.775 (Hyndman & Fan, Am. Stat. 50, 1996).
    const sorted = Float64Array.from({ length: 10 }, (_, i) => i + 1);
    const iv = percentileInterval(sorted, 0.95);
    expect(iv.lower).toBeCloseTo(1.225, 14);
    expect(iv.upper).toBeCloseTo(9.775, 14);
  });

  it("skips resamples that cannot separate the coefficients and says how many", () => {
    // Four rows share m = 100, one has m = 1000: a resample misses the odd row with probability
    // (4/5)^5 = 0.328, so about 328 of 1000 are rank-deficient (Binomial(1000, 0.328): s.d. 14.8).
    const rows = [100, 100, 100, 100, 1000].map((m, i) => ({ m, surplusLower: 3 + i, surplusUpper: 4 + i, exact: false }));
    const f = fitPowerLaw(rows, { law: "m", bootstrap: { solverSeed: 2 } });
    expect(f.bootstrap!.failed).toBeGreaterThan(280);
    expect(f.bootstrap!.failed).toBeLessThan(380);
    expect(f.notes.join("\n")).toContain(`${f.bootstrap!.failed} of 1000 bootstrap resamples could not separate the coefficients`);
  });
});
