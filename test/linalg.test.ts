// Lanczos against dense decompositions (ml-matrix here, numpy's LAPACK-backed eigvalsh when
// python3 is installed), the Cholesky PSD proof on matrices with known spectra, and rounding helpers.
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { provePsdByCholesky } from "../src/linalg/cholesky.js";
import { symmetricEigen } from "../src/linalg/dense-eigen.js";
import { lanczosExtreme } from "../src/linalg/lanczos.js";
import {
  adjacencyOperator,
  denseOperator,
  laplacianOperator,
  operatorToDense,
  shiftedLaplacianOperator,
  type SymmetricOperator,
} from "../src/linalg/operator.js";
import { roundoffGamma, nextUp, UNIT_ROUNDOFF } from "../src/linalg/float-rounding.js";
import { Rng } from "../src/random/prng.js";
import { randomGraph as gnp } from "./helpers/graphs.js";
import { itNeeds, python } from "./helpers/requirements.js";


function randomSymmetric(n: number, rng: Rng): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const x = rng.nextNormal();
      a[i * n + j] = x;
      a[j * n + i] = x;
    }
  }
  return a;
}

const WEIGHTS = {
  none: undefined,
  signed: (rng: Rng) => (rng.nextFloat() < 0.5 ? -1 : 1),
  real: (rng: Rng) => 3 * rng.nextFloat() - 1,
};
const randomGraph = (n: number, p: number, rng: Rng, weights: keyof typeof WEIGHTS): Graph => gnp(n, p, rng, { weight: WEIGHTS[weights] });

/** ‖Au − θu‖ computed here, independently of the solver. */
function residual(op: SymmetricOperator, u: Float64Array, theta: number): number {
  const au = new Float64Array(op.n);
  op.apply(u, au);
  let s = 0;
  for (let i = 0; i < op.n; i++) s += (au[i] - theta * u[i]) ** 2;
  return Math.sqrt(s);
}

describe("operators", () => {
  it("CSR products match the dense matrices read off them", () => {
    // L = D − W entrywise, the definition of the weighted Laplacian (common practice, no source).
    const g = graphFromEdges(4, [[0, 1, 2], [1, 2, -1], [2, 3, 0.5], [0, 3, 1]]);
    const L = operatorToDense(laplacianOperator(g));
    expect(Array.from(L, (x) => x + 0)).toEqual([3, -2, 0, -1, -2, 1, 1, 0, 0, 1, -0.5, -0.5, -1, 0, -0.5, 1.5]);
    const W = operatorToDense(adjacencyOperator(g));
    expect(W[1 * 4 + 2]).toBe(-1);
    const y = Float64Array.from([1, 2, 3, 4]);
    const S = operatorToDense(shiftedLaplacianOperator(g, y));
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) expect(S[i * 4 + j] + 0).toBe(L[i * 4 + j] - (i === j ? y[i] : 0) + 0);
    expect(() => shiftedLaplacianOperator(g, [1, 2])).toThrow(/`y` has 2 entries but the graph has 4 vertices/);
  });
});

describe("Lanczos", () => {
  it("agrees with the dense ml-matrix decomposition on random symmetric matrices, both ends, k = 3", () => {
    const rng = new Rng(11);
    for (const n of [60, 150]) {
      const a = randomSymmetric(n, rng);
      const dense = symmetricEigen(a, n);
      const op = denseOperator(a, n);
      for (const which of ["largest", "smallest"] as const) {
        const l = lanczosExtreme(op, { k: 3, which, solverSeed: 5, denseBelow: 0, maxBasis: 30 });
        expect(l.method).toBe("lanczos");
        expect(l.converged).toBe(true);
        for (let t = 0; t < 3; t++) {
          const ref = which === "largest" ? dense.values[n - 1 - t] : dense.values[t];
          expect(Math.abs(l.values[t] - ref)).toBeLessThan(1e-8);
          expect(l.residuals[t]).toBeLessThan(1e-8);
          expect(Math.abs(residual(op, l.vectors[t], l.values[t]) - l.residuals[t])).toBeLessThan(1e-10);
        }
      }
    }
  });

  it("agrees with dense results on weighted (signed) graph Laplacians, restarting a small basis", () => {
    const rng = new Rng(12);
    for (const weights of ["none", "signed", "real"] as const) {
      const g = randomGraph(120, 0.08, rng, weights);
      const op = laplacianOperator(g);
      const dense = symmetricEigen(operatorToDense(op), g.n);
      const l = lanczosExtreme(op, { k: 2, which: "largest", denseBelow: 0, maxBasis: 16, solverSeed: 3 });
      expect(l.restarts).toBeGreaterThan(0);
      expect(l.values[0]).toBeCloseTo(dense.values[g.n - 1], 8);
      expect(l.values[1]).toBeCloseTo(dense.values[g.n - 2], 8);
      expect(Math.max(...l.residuals)).toBeLessThan(1e-7);
    }
  });

  it("finds a repeated eigenvalue: L(K_n) has eigenvalue n with multiplicity n − 1", () => {
    // Laplacian spectrum of K_n is {0, n^(n−1)} (Brouwer & Haemers, Spectra of Graphs, §1.4.1).
    const n = 90;
    const edges: [number, number][] = [];
    for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) edges.push([u, v]);
    const l = lanczosExtreme(laplacianOperator(graphFromEdges(n, edges)), { k: 3, denseBelow: 0, maxBasis: 20 });
    for (let t = 0; t < 3; t++) expect(l.values[t]).toBeCloseTo(n, 9);
    const s = lanczosExtreme(laplacianOperator(graphFromEdges(n, edges)), { k: 1, which: "smallest", denseBelow: 0, maxBasis: 20 });
    expect(Math.abs(s.values[0])).toBeLessThan(1e-9);
  });

  it("is reproducible from its seed and validates its options", () => {
    // Input validation, common practice, no source.
    const g = randomGraph(100, 0.1, new Rng(4), "none");
    const a = lanczosExtreme(laplacianOperator(g), { solverSeed: 9, denseBelow: 0 });
    const b = lanczosExtreme(laplacianOperator(g), { solverSeed: 9, denseBelow: 0 });
    expect(Array.from(a.vectors[0])).toEqual(Array.from(b.vectors[0]));
    expect(a.solverSeed).toBe(9);
    expect(() => lanczosExtreme(laplacianOperator(g), { k: 0 })).toThrow(/invalid `k`/);
    expect(() => lanczosExtreme(laplacianOperator(g), { tolerance: 2 })).toThrow(/invalid `tolerance`/);
    expect(() => lanczosExtreme(laplacianOperator(g), { start: new Float64Array(3) })).toThrow(/`start` has 3 entries/);
    expect(() => lanczosExtreme(laplacianOperator(g), { maxMemoryBytes: 1000 })).toThrow(/maxMemoryBytes/);
  });

  itNeeds([python("numpy")], "matches numpy.linalg.eigvalsh (LAPACK) on a random weighted Laplacian", () => {
    const g = randomGraph(200, 0.05, new Rng(21), "real");
    const a = operatorToDense(laplacianOperator(g));
    const script = "import sys, json, numpy as np\nd = json.load(sys.stdin)\nA = np.array(d['a']).reshape(d['n'], d['n'])\nw = np.linalg.eigvalsh(A)\nprint(json.dumps([w[0], w[1], w[-2], w[-1]]))";
    const r = spawnSync("python3", ["-c", script], { input: JSON.stringify({ n: g.n, a: Array.from(a) }) });
    expect(r.status).toBe(0);
    const [lo0, lo1, hi1, hi0] = JSON.parse(r.stdout.toString()) as number[];
    const top = lanczosExtreme(laplacianOperator(g), { k: 2, denseBelow: 0 });
    const bottom = lanczosExtreme(laplacianOperator(g), { k: 2, which: "smallest", denseBelow: 0 });
    expect(top.values[0]).toBeCloseTo(hi0, 9);
    expect(top.values[1]).toBeCloseTo(hi1, 9);
    expect(bottom.values[0]).toBeCloseTo(lo0, 9);
    expect(bottom.values[1]).toBeCloseTo(lo1, 9);
  });
});

describe("Cholesky PSD proof", () => {
  it("proves Laplacian + δI positive definite and rejects L − δI (λmin(L) = 0)", () => {
    // A Laplacian is PSD with λmin = 0 (constant vector), a standard fact (Mohar 1991, "The Laplacian spectrum of graphs").
    const g = randomGraph(150, 0.1, new Rng(7), "none");
    const L = operatorToDense(laplacianOperator(g));
    const plus = L.slice();
    for (let i = 0; i < g.n; i++) plus[i * g.n + i] += 1e-6;
    const ok = provePsdByCholesky(plus, g.n);
    expect(ok.proven).toBe(true);
    expect(ok.lambdaMinLowerBound).toBeGreaterThanOrEqual(0);
    const minus = L.slice();
    for (let i = 0; i < g.n; i++) minus[i * g.n + i] -= 1e-6;
    expect(provePsdByCholesky(minus, g.n).proven).toBe(false);
  });

  it("decides definiteness like the dense spectrum on shifted random matrices", () => {
    const rng = new Rng(8);
    const n = 80;
    const a = randomSymmetric(n, rng);
    const lmin = symmetricEigen(a, n).values[0];
    for (const delta of [1e-3, -1e-3]) {
      const b = a.slice();
      for (let i = 0; i < n; i++) b[i * n + i] += -lmin + delta;
      expect(provePsdByCholesky(b, n).proven).toBe(delta > 0);
    }
  });

  it("counts the stated diagonal error against the margin", () => {
    // diag(1e-12, 1): PD, but not provably so if the diagonal may be off by 1e-9.
    const a = Float64Array.from([1e-12, 0, 0, 1]);
    expect(provePsdByCholesky(a.slice(), 2, 0).proven).toBe(true);
    expect(provePsdByCholesky(a.slice(), 2, 1e-9).proven).toBe(false);
    expect(() => provePsdByCholesky(a.slice(), 2, -1)).toThrow(/diagonalError/);
    expect(provePsdByCholesky(Float64Array.from([NaN]), 1).proven).toBe(false);
  });
});

describe("rounding helpers", () => {
  it("nextUp moves strictly up by at most two ulps; roundoffGamma matches k·u/(1 − k·u)", () => {
    for (const x of [0, 1, -1, 1e-310, -1e-310, 3.5e300, 1 / 3, -0.1]) {
      const y = nextUp(x);
      expect(y).toBeGreaterThan(x);
      const ulp = Math.max(Math.abs(x) * 2 ** -52, Number.MIN_VALUE);
      expect(y - x).toBeLessThanOrEqual(2 * ulp + Number.MIN_VALUE);
    }
    // γ_k definition (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., §3.1).
    expect(roundoffGamma(10)).toBeGreaterThanOrEqual((10 * UNIT_ROUNDOFF) / (1 - 10 * UNIT_ROUNDOFF));
    expect(roundoffGamma(10)).toBeLessThan(1.0001 * ((10 * UNIT_ROUNDOFF) / (1 - 10 * UNIT_ROUNDOFF)));
  });
});
