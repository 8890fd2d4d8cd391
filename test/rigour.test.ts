// The rounding margins that make certified bounds rigorous, each under a test that fails when the
// margin is removed: the Cholesky proof's backward-error margin (src/linalg/cholesky.ts), the
// diagonal rounding allowance of the shift proof (src/cut/relaxation/certificate.ts proveShift), and the
// rounding term of the dual bound sum (src/cut/relaxation/dual-bound.ts dualBoundValue). Every matrix and vector here
// is not PSD (or not a bound) by less than the rounding level, which exact BigInt arithmetic on the
// doubles (test/helpers/exact.ts) establishes; a proof without its margin is fooled by them.
// Sources: the backward error bound of Cholesky (Higham, Accuracy and Stability of Numerical
// Algorithms, 2nd ed., Thm 10.3) and of summation (ibid. §3.1).

import { describe, expect, it } from "vitest";
import { buildGraph } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { provePsdByCholesky } from "../src/linalg/cholesky.js";
import { symmetricEigen } from "../src/linalg/dense-eigen.js";
import { proveShift, verifyCertificate } from "../src/cut/relaxation/certificate.js";
import { dualBoundValue } from "../src/cut/relaxation/dual-bound.js";
import { Rng } from "../src/random/prng.js";
import { exact, exactSum, largestDoubleBelow } from "./helpers/exact.js";

/** Plain floating-point Cholesky of the lower triangle, no margin: does it run to completion? */
function plainCholeskyCompletes(a: Float64Array, n: number): boolean {
  const l = Float64Array.from(a);
  for (let j = 0; j < n; j++) {
    let s = l[j * n + j];
    for (let k = 0; k < j; k++) s -= l[j * n + k] * l[j * n + k];
    if (!(s > 0)) return false;
    const d = Math.sqrt(s);
    l[j * n + j] = d;
    for (let i = j + 1; i < n; i++) {
      let t = l[i * n + j];
      for (let k = 0; k < j; k++) t -= l[i * n + k] * l[j * n + k];
      l[i * n + j] = t / d;
    }
  }
  return true;
}

describe("rigour: the Cholesky proof never accepts a matrix that is not PSD by less than its margins", () => {
  it("w·J + μI is proven PSD, but not when its diagonal is only known to within 2μ (then w·J − μI is possible)", () => {
    // w·J has eigenvalues n·w and 0 (common practice, no source), so w·J + μI has λmin = μ > 0 and
    // w·J + (μ − e)I has λmin = μ − e < 0: with diagonalError e = 2μ the proof must refuse.
    let refused = 0;
    for (const w of [1 / 3, 0.1, 0.7, 5]) {
      for (const n of [2, 7, 30, 64]) {
        const mu = 1e-9 * w;
        const a = new Float64Array(n * n).fill(w);
        for (let i = 0; i < n; i++) a[i * n + i] = w + mu;
        // Plain floating-point Cholesky completes: the refusal below is the margin's doing.
        expect(plainCholeskyCompletes(a, n), `w = ${w}, n = ${n}`).toBe(true);
        expect(provePsdByCholesky(Float64Array.from(a), n, 0).proven, `w = ${w}, n = ${n}, exact diagonal`).toBe(true);
        expect(provePsdByCholesky(Float64Array.from(a), n, 2 * mu).proven, `w = ${w}, n = ${n}, diagonal within 2μ`).toBe(false);
        refused++;
      }
    }
    expect(refused).toBe(16);
  });

  it("random rounded BBᵀ (B of size n×(n − 1)) certified indefinite by an exact zᵀAz < 0: plain Cholesky is sometimes fooled, the proof never", () => {
    // BBᵀ is singular; rounding its entries moves λmin to about ±n·u·‖A‖. Where zᵀAz, summed exactly
    // over the doubles, is negative, A is not PSD, and no proof may say otherwise.
    const rng = new Rng(11);
    let indefinite = 0, fooled = 0;
    for (let t = 0; t < 60; t++) {
      const n = 20 + rng.nextInt(60);
      const B = Array.from({ length: n }, () => Array.from({ length: n - 1 }, () => rng.nextNormal()));
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j <= i; j++) {
          let s = 0;
          for (let k = 0; k < n - 1; k++) s += B[i][k] * B[j][k];
          a[i * n + j] = a[j * n + i] = s;
        }
      }
      const z = symmetricEigen(Float64Array.from(a), n);
      let imin = 0;
      for (let i = 1; i < n; i++) if (z.values[i] < z.values[imin]) imin = i;
      const v = Array.from(z.vectors.slice(imin * n, (imin + 1) * n), exact);
      let q = 0n;
      for (let i = 0; i < n; i++) {
        let row = 0n;
        for (let j = 0; j < n; j++) row += exact(a[i * n + j]) * v[j];
        q += v[i] * row;
      }
      if (q >= 0n) continue;
      indefinite++;
      if (plainCholeskyCompletes(a, n)) fooled++;
      expect(provePsdByCholesky(Float64Array.from(a), n).proven, `trial ${t}, n = ${n}`).toBe(false);
    }
    expect(indefinite).toBeGreaterThan(10);
    expect(fooled).toBeGreaterThan(0);
  });

  it("a PSD matrix with room to spare is still proven (the margin is not so large that nothing passes)", () => {
    const n = 50;
    const a = new Float64Array(n * n).fill(0.25);
    for (let i = 0; i < n; i++) a[i * n + i] = 1.25; // 0.25·J + I: λmin = 1
    expect(provePsdByCholesky(a, n).proven).toBe(true);
  });
});

/** K_n with every weight w. Its Laplacian is w(nI − J), so λmax(L − y0·I) = n·w − y0 exactly. */
function weightedComplete(n: number, w: number): Graph {
  const us: number[] = [], vs: number[] = [], ws: number[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) us.push(i), vs.push(j), ws.push(w);
  return buildGraph(n, us, vs, ws).graph;
}

describe("rigour: the shift proof accounts for the rounding of its diagonal", () => {
  it("a shift just below λmax(L − Diag(y)) is refused even when y and the shift cancel in floating point", () => {
    // λmax(L − y0·I) = n·w − y0 (exact, from the spectrum of K_n: Brouwer & Haemers, Spectra of
    // Graphs, §1.4.1). shift = the largest double below it, so Diag(y + shift) − L has λmin < 0.
    // With y0 ≈ K and shift ≈ −K the diagonal y0 + shift − d rounds by about ulp(K), far above the
    // other error terms: only the diagonal allowance covers it.
    let refused = 0;
    for (const [n, w, c, K] of [
      [4, 0.3, 1 / 3, 2 ** 20],
      [4, 0.7, 0.1, 2 ** 24],
      [9, 0.1, 0.37, 2 ** 22],
      [16, 1 / 3, -0.2, 2 ** 26],
      [25, 0.7, 1.9, 2 ** 18],
    ] as const) {
      const g = weightedComplete(n, w);
      const y0 = c + K;
      const target = BigInt(n) * exact(w) - exact(y0);
      const shift = largestDoubleBelow(target, n * w - y0);
      expect(exact(shift) < target).toBe(true);
      const y = new Float64Array(n).fill(y0);
      expect(proveShift(g, y, shift).proven, `K_${n}, w = ${w}, y0 = ${y0}`).toBe(false);
      // verify takes the same path for a record claiming a Cholesky proof at that shift.
      const v = verifyCertificate(g, { kind: "psd-dual", y, shift, shiftProof: "cholesky" });
      expect(v.ok, `verify on K_${n}`).toBe(false);
      refused++;
    }
    expect(refused).toBe(5);
  });

  it("the true λmax plus a little is proven (the allowance does not refuse honest shifts)", () => {
    const g = weightedComplete(9, 0.1);
    const y = new Float64Array(9).fill(0.37);
    expect(proveShift(g, y, 9 * 0.1 - 0.37 + 1e-9).proven).toBe(true);
  });
});

/** γ_k = k·u/(1 − k·u), typed here from Higham (2nd ed., Lemma 3.1) rather than imported. */
const U = 2 ** -53;
const gammaOf = (k: number): number => (k * U) / (1 - k * U);

describe("rigour: the margins equal the published error bounds they rest on", () => {
  // Why these tests read the margin itself: near-singular matrices that are not PSD, built at random
  // (rounded BBᵀ with n = 60…300, 48 cases, measured while writing this test), never fooled a plain
  // floating-point Cholesky shifted by only 2u·max|a_ii|, so no counterexample can show that a
  // dropped term matters. The proof's theorem needs the terms anyway; each test below computes the
  // term from its published bound and requires the proof's shift to cover it, so that removing the
  // term from the code fails here.

  it("the Cholesky proof's shift covers the backward error γ_{n+1}/(1 − γ_{n+1})·tr A of Higham's Theorem 10.3", () => {
    const rng = new Rng(5);
    let checked = 0;
    for (const n of [3, 10, 40, 120]) {
      // A random well-conditioned PSD matrix: BBᵀ + I (common practice, no source).
      const B = Array.from({ length: n }, () => Array.from({ length: n }, () => rng.nextNormal()));
      const a = new Float64Array(n * n);
      let trace = 0;
      for (let i = 0; i < n; i++) {
        for (let j = 0; j <= i; j++) {
          let s = i === j ? 1 : 0;
          for (let k = 0; k < n; k++) s += B[i][k] * B[j][k];
          a[i * n + j] = a[j * n + i] = s;
        }
        trace += a[i * n + i];
      }
      const g = gammaOf(n + 1);
      const backward = (g / (1 - g)) * trace;
      const proof = provePsdByCholesky(Float64Array.from(a), n, 0);
      expect(proof.proven, `n = ${n}`).toBe(true);
      expect(proof.shift, `n = ${n}: shift against γ'·tr A = ${backward}`).toBeGreaterThanOrEqual(backward);
      // What it claims about λmin(A) leaves that error out: claim ≤ shift − γ'·tr A.
      expect(proof.lambdaMinLowerBound, `n = ${n}`).toBeLessThanOrEqual(proof.shift - backward);
      checked++;
    }
    expect(checked).toBe(4);
  });

  it("the shift proof's diagonal allowance covers γ_{deg+3}·(|y_i| + |shift| + Σ_j|w_ij|) when y and the shift nearly cancel", () => {
    // Diag(y + shift) − L with y ≈ 2^26 and shift ≈ −2^26: the entries y_i + shift − d_i are small, so
    // the Cholesky terms (relative to the entries) are small, and the rounding of the diagonal's
    // evaluation (Higham §3.1: a (deg + 3)-term sum) is the term that must be paid for.
    let checked = 0;
    for (const [n, w, c, K] of [
      [9, 0.1, 0.37, 2 ** 22],
      [16, 1 / 3, -0.2, 2 ** 26],
      [25, 0.7, 1.9, 2 ** 18],
    ] as const) {
      const g = weightedComplete(n, w);
      const y0 = c + K;
      const shift = n * w - y0 + 1e-3; // λmax(L − y0·I) = n·w − y0 (K_n's spectrum, as above), plus room
      const y = new Float64Array(n).fill(y0);
      const proof = proveShift(g, y, shift);
      expect(proof.proven, `K_${n}`).toBe(true);
      const allowance = gammaOf(n - 1 + 3) * (Math.abs(y0) + Math.abs(shift) + (n - 1) * w);
      expect(proof.shift, `K_${n}: shift against the diagonal allowance ${allowance}`).toBeGreaterThanOrEqual(allowance);
      expect(proof.lambdaMinLowerBound, `K_${n}`).toBeLessThanOrEqual(proof.shift - allowance);
      checked++;
    }
    expect(checked).toBe(3);
  });
});

describe("rigour: the dual bound sum is rounded up past its own rounding", () => {
  it("¼(Σy + n·shift) is never below its exact value, even when the floating-point sum loses terms", () => {
    // Σy summed left to right: 2^53 + 1 rounds back to 2^53 (ties to even), so every 1 is lost and
    // fl(Σy) = 0 while the exact sum is k. The exact bound k/4 must not be undercut.
    for (const k of [1, 3, 7, 40]) {
      const y = [2 ** 53, ...new Array<number>(k).fill(1), -(2 ** 53)];
      for (const shift of [0, 1e-300, 0.5]) {
        const exactBound = exactSum(y) + BigInt(y.length) * exact(shift); // four times the bound
        const got = dualBoundValue(y, shift);
        expect(4n * exact(got) >= exactBound, `k = ${k}, shift = ${shift}: ${got}`).toBe(true);
      }
    }
  });

  it("random duals of mixed sign and magnitude: the rounded-up value is never below the exact one", () => {
    const rng = new Rng(99);
    for (let t = 0; t < 300; t++) {
      const n = 1 + rng.nextInt(200);
      const y = Array.from({ length: n }, () => (rng.nextFloat() - 0.5) * 10 ** (rng.nextInt(20) - 5));
      const shift = (rng.nextFloat() - 0.3) * 10 ** (rng.nextInt(8) - 2);
      const got = dualBoundValue(y, shift);
      // 4·got ≥ Σy + n·shift, exactly (n·shift is exact on this scale: n is an integer).
      expect(4n * exact(got) >= exactSum(y) + BigInt(n) * exact(shift), `trial ${t}`).toBe(true);
    }
  });
});
