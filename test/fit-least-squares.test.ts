// QR least squares (src/fit/least-squares.ts) against NIST's Statistical Reference Datasets and
// hand-computable regressions.
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { leastSquares } from "../src/fit/least-squares.js";
import { expectInputError } from "./helpers/errors.js";
import { file, itNeeds, REFERENCE } from "./helpers/requirements.js";

const NIST = resolve(REFERENCE, "nist-strd");

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

/** A CSV with a header line, as numbers. */
function readCsv(path: string): number[][] {
  return readFileSync(path, "utf8")
    .trim()
    .split("\n")
    .slice(1)
    .map((l) => l.split(",").map(Number));
}

// NIST StRD "Norris" (linear regression, lower difficulty), 36 observations as (y, x). The data were
// copied from ../shared/reference/nist-strd/norris.csv (NIST's data file) so that this check runs
// without the shared folder; a test below confirms the copy still equals the file when it is there.
const NORRIS: [number, number][] = [
  [0.1, 0.2], [338.8, 337.4], [118.1, 118.2], [888.0, 884.6], [9.2, 10.1], [228.1, 226.5], [668.5, 666.3], [998.5, 996.3],
  [449.1, 448.6], [778.9, 777.0], [559.2, 558.2], [0.3, 0.4], [0.1, 0.6], [778.1, 775.5], [668.8, 666.9], [339.3, 338.0],
  [448.9, 447.5], [10.8, 11.6], [557.7, 556.0], [228.3, 228.1], [998.0, 995.8], [888.8, 887.6], [119.6, 120.2], [0.3, 0.3],
  [0.6, 0.3], [557.6, 556.8], [339.3, 339.1], [888.0, 887.2], [998.5, 999.0], [778.9, 779.0], [10.2, 11.1], [117.6, 118.3],
  [228.9, 229.2], [668.4, 669.1], [449.2, 448.9], [0.2, 0.5],
];

// NIST StRD Norris certified values (NIST Statistical Reference Datasets, Linear Regression, "Norris",
// certified values page). Typed from memory of that page; they agree digit for digit with
// ../shared/reference/nist-strd/certified.json (checked below when the folder is present).
const NORRIS_CERTIFIED = {
  coefficients: [-0.262323073774029, 1.00211681802045],
  standardErrors: [0.232818234301152, 0.429796848199937e-3],
  residualStandardDeviation: 0.884796396144373,
  rSquared: 0.999993745883712,
  residualSumOfSquares: 26.6173985294224,
};

describe("leastSquares", () => {
  it("reproduces NIST StRD Norris: coefficients, standard errors, residual SD and R² to 1e-9 relative", () => {
    // Outside source: NIST StRD Norris certified values (typed above).
    const X = NORRIS.map(([, x]) => [1, x]);
    const y = NORRIS.map(([v]) => v);
    const r = leastSquares(X, y);
    for (let j = 0; j < 2; j++) {
      expect(rel(r.coefficients[j], NORRIS_CERTIFIED.coefficients[j])).toBeLessThan(1e-9);
      expect(rel(r.standardErrors[j], NORRIS_CERTIFIED.standardErrors[j])).toBeLessThan(1e-9);
    }
    expect(rel(r.residualStandardDeviation, NORRIS_CERTIFIED.residualStandardDeviation)).toBeLessThan(1e-9);
    expect(rel(r.residualSumOfSquares, NORRIS_CERTIFIED.residualSumOfSquares)).toBeLessThan(1e-9);
    expect(rel(r.rSquared, NORRIS_CERTIFIED.rSquared)).toBeLessThan(1e-9);
    expect(r.df).toBe(34);
  });

  it("matches the closed-form simple regression on four points (estimates, standard errors, leverage)", () => {
    // Simple linear regression by hand (common practice, no source): x = 0..3, y = 1, 3, 2, 5 gives
    // x̄ = 1.5, Sxx = 5, Sxy = 5.5, slope 1.1, intercept 1.1, RSS 2.7, s² = 1.35,
    // se(slope) = √(s²/Sxx), se(intercept) = √(s²(1/n + x̄²/Sxx)), hᵢ = 1/n + (xᵢ − x̄)²/Sxx.
    const r = leastSquares([[1, 0], [1, 1], [1, 2], [1, 3]], [1, 3, 2, 5]);
    expect(r.coefficients[0]).toBeCloseTo(1.1, 13);
    expect(r.coefficients[1]).toBeCloseTo(1.1, 13);
    expect(r.residualSumOfSquares).toBeCloseTo(2.7, 13);
    expect(r.standardErrors[1]).toBeCloseTo(Math.sqrt(1.35 / 5), 13);
    expect(r.standardErrors[0]).toBeCloseTo(Math.sqrt(1.35 * (0.25 + 2.25 / 5)), 13);
    expect(Array.from(r.leverage)).toEqual([0.7, 0.3, 0.3, 0.7].map((h) => expect.closeTo(h, 13)));
    expect(Array.from(r.residuals)).toEqual([-0.1, 0.8, -1.3, 0.6].map((e) => expect.closeTo(e, 13)));
    expect(r.rSquared).toBeCloseTo(1 - 2.7 / 8.75, 13);
  });

  it("recovers an exact quadratic with badly scaled columns", () => {
    // y = 3 − 2x + 0.5x² exactly, x = 1000..1019: the columns 1, x, x² span 6 orders of magnitude
    // (common practice, no source).
    const xs = Array.from({ length: 20 }, (_, i) => 1000 + i);
    const r = leastSquares(
      xs.map((x) => [1, x, x * x]),
      xs.map((x) => 3 - 2 * x + 0.5 * x * x),
    );
    expect(r.coefficients[2]).toBeCloseTo(0.5, 9);
    expect(r.coefficients[1]).toBeCloseTo(-2, 6);
    expect(r.coefficients[0]).toBeCloseTo(3, 3);
  });

  it("refuses rank-deficient designs, mismatched sizes and non-finite entries in one line", () => {
    expectInputError(() => leastSquares([[1, 2, 4], [1, 3, 6], [1, 5, 10], [1, 1, 2]], [1, 2, 3, 4], { names: ["c", "x", "twice x"] }), "twice x is a linear combination");
    expectInputError(() => leastSquares([[1, 2], [1, 3]], [1, 2, 3]), "`y`");
    expectInputError(() => leastSquares([[1, 2], [1, NaN], [1, 4]], [1, 2, 3]), "row 2, column 2");
    expectInputError(() => leastSquares([[1, 2], [1, 3, 4]], [1, 2]), "row 2 has 3 entries");
    expectInputError(() => leastSquares([[1, 2, 3]], [1]), "at least 3 rows");
  });

  itNeeds([file(NIST, "NIST StRD data in ../shared/reference/nist-strd")], "the Norris data and certified values above equal the shared NIST files", () => {
    // Outside source: ../shared/reference/nist-strd (NIST StRD data and certified values).
    expect(readCsv(resolve(NIST, "norris.csv"))).toEqual(NORRIS.map(([y, x]) => [y, x]));
    const cert = JSON.parse(readFileSync(resolve(NIST, "certified.json"), "utf8"));
    expect(cert.norris.coefficients).toEqual(NORRIS_CERTIFIED.coefficients);
    expect(cert.norris.standardErrors).toEqual(NORRIS_CERTIFIED.standardErrors);
    expect(cert.norris.residualSumOfSquares).toEqual(NORRIS_CERTIFIED.residualSumOfSquares);
  });

  itNeeds([file(NIST, "NIST StRD data in ../shared/reference/nist-strd")], "reproduces NIST StRD Longley: all seven coefficients to 1e-8 relative", () => {
    // Outside source: NIST StRD Longley (higher difficulty; badly conditioned), data and certified
    // coefficients read from ../shared/reference/nist-strd.
    const rows = readCsv(resolve(NIST, "longley.csv"));
    const cert = JSON.parse(readFileSync(resolve(NIST, "certified.json"), "utf8")).longley.coefficients as number[];
    const r = leastSquares(
      rows.map((row) => [1, ...row.slice(1)]),
      rows.map((row) => row[0]),
    );
    expect(cert).toHaveLength(7);
    for (let j = 0; j < 7; j++) expect(rel(r.coefficients[j], cert[j]), `coefficient ${j}`).toBeLessThan(1e-8);
    // Certified standard errors and residual SD of Longley, typed from memory of NIST's Longley page
    // (not in certified.json): a looser 1e-8 relative as well.
    const se = [890420.383607373, 84.9149257747669, 0.334910077722432e-1, 0.488399681651699, 0.214274163161675, 0.22607320006937, 455.478499142212];
    for (let j = 0; j < 7; j++) expect(rel(r.standardErrors[j], se[j]), `standard error ${j}`).toBeLessThan(1e-8);
    expect(rel(r.residualStandardDeviation, 304.854073561965)).toBeLessThan(1e-8);
    expect(rel(r.rSquared, 0.995479004577296)).toBeLessThan(1e-8);
  });
});
