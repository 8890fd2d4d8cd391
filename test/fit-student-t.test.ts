// Student's t distribution (src/fit/student-t.ts) against published tables, closed forms and scipy.
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { logGamma, regularizedIncompleteBeta, studentTCdf, studentTQuantile, studentTTwoSided } from "../src/fit/student-t.js";
import { expectInputError } from "./helpers/errors.js";
import { itNeeds, python } from "./helpers/requirements.js";

describe("log-gamma and the incomplete beta", () => {
  it("log-gamma matches factorials and Γ(1/2) = √π", () => {
    // Γ(n) = (n − 1)! and Γ(1/2) = √π (Abramowitz & Stegun 6.1.6, 6.1.8).
    let f = 1;
    for (let n = 1; n <= 25; n++) {
      if (n > 1) f *= n - 1;
      expect(logGamma(n)).toBeCloseTo(Math.log(f), 11);
    }
    expect(logGamma(0.5)).toBeCloseTo(0.5 * Math.log(Math.PI), 14);
    expect(logGamma(1.5)).toBeCloseTo(Math.log(Math.sqrt(Math.PI) / 2), 14);
  });

  it("I_x(a, 1) = x^a, I_x(1, b) = 1 − (1 − x)^b and the symmetry I_x(a, b) = 1 − I_{1−x}(b, a)", () => {
    // Closed forms from the definition of B(x; a, b) (Abramowitz & Stegun 26.5.1, 26.5.2).
    for (const x of [0.01, 0.2, 0.5, 0.77, 0.999]) {
      for (const a of [0.5, 2, 7.5, 40]) {
        expect(regularizedIncompleteBeta(x, a, 1)).toBeCloseTo(x ** a, 13);
        expect(regularizedIncompleteBeta(x, 1, a)).toBeCloseTo(1 - (1 - x) ** a, 13);
        expect(regularizedIncompleteBeta(x, a, 3.2) + regularizedIncompleteBeta(1 - x, 3.2, a)).toBeCloseTo(1, 13);
      }
    }
  });
});

describe("Student's t", () => {
  it("has the closed-form CDFs for 1 and 2 degrees of freedom", () => {
    // df = 1 is the Cauchy distribution, F(t) = ½ + arctan(t)/π; df = 2: F(t) = ½ + t / (2√(t² + 2))
    // (Abramowitz & Stegun 26.7.3, 26.7.4).
    for (const t of [-50, -3, -1, -0.2, 0, 0.4, 1, 2.5, 9, 300]) {
      expect(studentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 14);
      expect(studentTCdf(t, 2)).toBeCloseTo(0.5 + t / (2 * Math.sqrt(t * t + 2)), 14);
    }
    // Upper tail of the Cauchy far out keeps its relative accuracy: P(T > t) = arctan(1/t)/π.
    expect(studentTTwoSided(1e6, 1) / 2 / (Math.atan(1e-6) / Math.PI)).toBeCloseTo(1, 10);
    // Quantiles invert the closed forms: Cauchy t_p = tan(π(p − ½)).
    for (const p of [0.001, 0.1, 0.6, 0.975, 0.9999]) expect(studentTQuantile(p, 1) / Math.tan(Math.PI * (p - 0.5))).toBeCloseTo(1, 11);
  });

  it("reproduces the published critical values t_{1−α, ν}", () => {
    // NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.2 "Critical values of the Student's t
    // distribution" (three decimals; typed from memory, and agreeing with scipy.stats.t.ppf). The
    // ν = 1, α = 0.001 entry is left out: the table prints 318.313, the true value is 318.309.
    const alphas = [0.1, 0.05, 0.025, 0.01, 0.005, 0.001];
    const table: [number, number[]][] = [
      [1, [3.078, 6.314, 12.706, 31.821, 63.657]],
      [2, [1.886, 2.92, 4.303, 6.965, 9.925, 22.327]],
      [3, [1.638, 2.353, 3.182, 4.541, 5.841, 10.215]],
      [4, [1.533, 2.132, 2.776, 3.747, 4.604, 7.173]],
      [5, [1.476, 2.015, 2.571, 3.365, 4.032, 5.893]],
      [10, [1.372, 1.812, 2.228, 2.764, 3.169, 4.144]],
      [30, [1.31, 1.697, 2.042, 2.457, 2.75, 3.385]],
      [100, [1.29, 1.66, 1.984, 2.364, 2.626, 3.174]],
    ];
    for (const [df, row] of table) {
      row.forEach((v, k) => {
        expect(Math.abs(studentTQuantile(1 - alphas[k], df) - v)).toBeLessThanOrEqual(5e-4 + 1e-12);
      });
    }
  });

  it("quantile and CDF are inverse to each other, including fractional and large df", () => {
    for (const df of [0.5, 1.7, 3, 12.25, 200, 1e5]) {
      for (const p of [1e-8, 0.003, 0.25, 0.5, 0.9, 0.999999]) {
        const t = studentTQuantile(p, df);
        const back = studentTCdf(t, df);
        expect(Math.abs(back - p) / Math.min(p, 1 - p)).toBeLessThan(1e-9);
      }
    }
  });

  it("refuses bad degrees of freedom and probabilities with one-line errors", () => {
    expectInputError(() => studentTCdf(1, 0), "`df`");
    expectInputError(() => studentTCdf(1, Infinity), "`df`");
    expectInputError(() => studentTQuantile(1, 5), "`p`");
    expectInputError(() => studentTQuantile(0, 5), "`p`");
  });

  itNeeds([python("scipy")], "agrees with scipy.stats.t (cdf, two-sided sf, ppf) on a grid", () => {
    // Outside reference: scipy.stats.t from Debian's python3-scipy.
    const dfs = [1, 2, 3.5, 7, 19, 60, 250, 5000, 1e5];
    const ts = [-40, -6, -2.1, -0.7, 0, 0.05, 1.3, 2.8, 5, 12, 80];
    const ps = [1e-10, 1e-4, 0.01, 0.1, 0.3, 0.5, 0.72, 0.95, 0.995, 0.99999];
    const script = [
      "import json, sys",
      "from scipy.stats import t",
      "q = json.load(sys.stdin)",
      "out = {'cdf': [[float(t.cdf(x, d)) for x in q['ts']] for d in q['dfs']],",
      "       'sf2': [[float(2 * t.sf(abs(x), d)) for x in q['ts']] for d in q['dfs']],",
      "       'ppf': [[float(t.ppf(p, d)) for p in q['ps']] for d in q['dfs']]}",
      "print(json.dumps(out))",
    ].join("\n");
    const r = spawnSync("python3", ["-c", script], { input: JSON.stringify({ dfs, ts, ps }), encoding: "utf8" });
    expect(r.status, r.stderr).toBe(0);
    const ref = JSON.parse(r.stdout) as { cdf: number[][]; sf2: number[][]; ppf: number[][] };
    const rel = (a: number, b: number): number => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(b), 1e-300));
    dfs.forEach((df, i) => {
      ts.forEach((t, j) => {
        // Both tails to 1e-11 relative: the smaller of F and 1 − F is the hard one.
        const F = studentTCdf(t, df);
        expect(rel(F, ref.cdf[i][j]), `cdf(${t}, ${df})`).toBeLessThan(1e-11);
        expect(rel(studentTTwoSided(t, df), Math.min(1, ref.sf2[i][j])), `two-sided(${t}, ${df})`).toBeLessThan(1e-10);
      });
      ps.forEach((p, j) => {
        expect(rel(studentTQuantile(p, df), ref.ppf[i][j]), `ppf(${p}, ${df})`).toBeLessThan(1e-10);
      });
    });
  });
});
