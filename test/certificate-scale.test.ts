// Certificates at every scale: the sparse (envelope) Cholesky proof against the dense one and against
// matrices that are not PSD by less than the rounding level; the probable (Chebyshev) shift against
// λmax from numpy's LAPACK over 1000 trials; verify re-deriving both and refusing tampered ones.
import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { bracket } from "../src/cut/bracket/bracket.js";
import { verifyBracket } from "../src/cut/bracket/verify.js";
import type { BracketRecord } from "../src/cut/bracket/record.js";
import { certifyDual, probableShift, proveShift, proveShiftSparse, verifyCertificate } from "../src/cut/relaxation/certificate.js";
import { solveSdp } from "../src/cut/relaxation/sdp-mixing.js";
import type { DualCertificate, ProbableShift } from "../src/cut/types.js";
import { fitRowsFromStore } from "../src/experiment/fit-rows.js";
import type { ResultStore } from "../src/experiment/store.js";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { provePsdByCholesky } from "../src/linalg/cholesky.js";
import { envelopePlan, provePsdByEnvelopeCholesky } from "../src/linalg/envelope-cholesky.js";
import { symmetricEigen } from "../src/linalg/dense-eigen.js";
import { Rng } from "../src/random/prng.js";
import { exact, largestDoubleBelow } from "./helpers/exact.js";
import { randomGraph } from "./helpers/graphs.js";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { itNeeds, python } from "./helpers/requirements.js";

/** The a×b torus C_a □ C_b (vertex r·b + c), weights from `weight`. */
function torus(a: number, b: number, weight: (rng: Rng) => number = () => 1, seed = 1): Graph {
  const rng = new Rng(seed);
  const e: [number, number, number][] = [];
  for (let r = 0; r < a; r++) {
    for (let c = 0; c < b; c++) {
      e.push([r * b + c, r * b + ((c + 1) % b), weight(rng)]);
      e.push([r * b + c, ((r + 1) % a) * b + c, weight(rng)]);
    }
  }
  return graphFromEdges(a * b, e);
}

/** Dense L − Diag(y) (row-major), for the reference eigenvalues. */
function denseShiftedLaplacian(g: Graph, y: ArrayLike<number>): Float64Array {
  const n = g.n;
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let k = g.offsets[i]; k < g.offsets[i + 1]; k++) {
      const w = g.weights === null ? 1 : g.weights[k];
      a[i * n + g.neighbors[k]] -= w;
      a[i * n + i] += w;
    }
    a[i * n + i] -= y[i];
  }
  return a;
}

function lambdaMax(g: Graph, y: ArrayLike<number>): number {
  const e = symmetricEigen(denseShiftedLaplacian(g, y), g.n);
  return Math.max(...e.values);
}

/** A dual vector like an SDP's: weighted degrees plus noise. */
function dualLike(g: Graph, rng: Rng): Float64Array {
  const y = new Float64Array(g.n);
  for (let i = 0; i < g.n; i++) {
    let s = 0;
    for (let k = g.offsets[i]; k < g.offsets[i + 1]; k++) s += Math.abs(g.weights === null ? 1 : g.weights[k]);
    y[i] = s * (0.5 + rng.nextFloat()) + rng.nextNormal();
  }
  return y;
}

const pm1 = (rng: Rng): number => (rng.nextFloat() < 0.5 ? -1 : 1);

describe("sparse Cholesky proof", () => {
  it("agrees with the dense proof on random, toroidal and ±1-weighted graphs at shifts on both sides of λmax", () => {
    // The dense proof (src/linalg/cholesky.ts, Higham Thm 10.3) is the reference; shifts 10⁻⁶·scale
    // away from λmax are far outside both proofs' margins (≤ 10⁻¹⁰ here), so they must agree.
    const rng = new Rng(5);
    const graphs: Graph[] = [torus(6, 8), torus(10, 12, pm1, 3), torus(4, 30, pm1, 4)];
    for (let t = 0; t < 9; t++) graphs.push(randomGraph(20 + rng.nextInt(100), 0.03 + 0.2 * rng.nextFloat(), rng, t % 2 === 0 ? {} : { weight: pm1 }));
    let compared = 0;
    for (const g of graphs) {
      const y = dualLike(g, rng);
      const lmax = lambdaMax(g, y);
      const scale = Math.max(1, Math.abs(lmax));
      for (const off of [-1e-2, -1e-6, 1e-6, 1e-2]) {
        const shift = lmax + off * scale;
        const dense = proveShift(g, y, shift).proven;
        const sparse = proveShiftSparse(g, y, shift).proven;
        expect(sparse, `n = ${g.n}, offset ${off}`).toBe(dense);
        expect(sparse).toBe(off > 0);
        compared++;
      }
    }
    expect(compared).toBe(48);
  });

  it("refuses Diag(c) + W on an even cycle and an even torus when λmin = −2⁻⁵⁰ (below the rounding level), proves it at +10⁻⁶", () => {
    // Spectra (Brouwer & Haemers, Spectra of Graphs, 2012, §1.4.3 and §1.4.6): the adjacency matrix of
    // C_n has eigenvalues 2cos(2πk/n), so λmin = −2 for even n; the torus C_a □ C_b has the sums, λmin = −4.
    // Diag(2 − 2⁻⁵⁰) + W (resp. 4 − 2⁻⁴⁸) is therefore not PSD, by less than either proof's margin.
    const cycle = graphFromEdges(64, Array.from({ length: 64 }, (_, i) => [i, (i + 1) % 64] as [number, number]));
    const cases: [Graph, number][] = [
      [cycle, 2],
      [torus(20, 30), 4],
      [torus(12, 40), 4],
    ];
    for (const [g, top] of cases) {
      for (const [c, psd] of [[top - 2 ** -48, false], [top - 2 ** -50, false], [top + 1e-6, true]] as const) {
        const diagonal = new Float64Array(g.n).fill(c);
        const sparse = provePsdByEnvelopeCholesky(g, envelopePlan(g), diagonal, 0);
        expect(sparse.proven, `n = ${g.n}, c = ${c}`).toBe(psd);
        if (g.n <= 800) {
          const a = new Float64Array(g.n * g.n);
          for (let i = 0; i < g.n; i++) {
            a[i * g.n + i] = c;
            for (let k = g.offsets[i]; k < g.offsets[i + 1]; k++) a[i * g.n + g.neighbors[k]] = 1;
          }
          expect(provePsdByCholesky(a, g.n).proven).toBe(psd);
        }
      }
    }
  });

  it("refuses a rounded signless Laplacian of a bipartite torus certified indefinite by exact arithmetic", () => {
    // Diag(Σ_j w_ij) + W has zᵀ(·)z = 0 for z = ±1 by colour class (bipartite: every edge joins the
    // classes). With each diagonal entry the largest double below its exact row sum, zᵀAz, summed
    // exactly over the doubles (test/helpers/exact.ts), is negative: A is not PSD, by about an ulp.
    let checked = 0;
    for (let t = 0; t < 20; t++) {
      const [a, b] = [4 + 2 * (t % 4), 6 + 2 * (t % 3)];
      const g = torus(a, b, (rng) => 0.5 + rng.nextFloat(), 100 + t);
      const diagonal = new Float64Array(g.n);
      let quad = 0n;
      for (let i = 0; i < g.n; i++) {
        let row = 0n, guess = 0;
        for (let k = g.offsets[i]; k < g.offsets[i + 1]; k++) {
          row += exact(g.weights![k]);
          guess += g.weights![k];
        }
        diagonal[i] = largestDoubleBelow(row, guess);
        quad += exact(diagonal[i]) - row; // Σ_i c_i − Σ_i Σ_j w_ij = zᵀAz
      }
      expect(quad < 0n).toBe(true);
      expect(provePsdByEnvelopeCholesky(g, envelopePlan(g), diagonal, 0).proven, `trial ${t}`).toBe(false);
      checked++;
    }
    expect(checked).toBe(20);
  });

  it("keeps the envelope narrow on a torus (width about twice the short side) and wide on a random graph", () => {
    // Reverse Cuthill–McKee on a grid numbers about one breadth-first level per step (George & Liu 1981, ch. 4).
    const t = envelopePlan(torus(30, 100));
    expect(t.width).toBeLessThanOrEqual(2 * 30 + 4);
    const r = envelopePlan(randomGraph(600, 0.02, 9));
    expect(r.width).toBeGreaterThan(200);
  });
});

itNeeds([python("numpy")], "probable shift: never below λmax (numpy's eigvalsh) over 1000 trials, whatever the filter's interval and degree", () => {
  // Reference: numpy.linalg.eigvalsh (LAPACK dsyevd, Debian python3-numpy), backward stable to about
  // n·u·‖A‖, far below the 10⁻⁹·scale allowed. The filter's top end is put below λmax in a third of
  // the trials and its degree is small: the bound must hold for any interval and degree.
  const rng = new Rng(2026);
  const trials: { g: Graph; y: Float64Array; p: ProbableShift }[] = [];
  const graphs: { g: Graph; y: Float64Array }[] = [];
  for (let k = 0; k < 100; k++) {
    const n = 6 + rng.nextInt(35);
    const g = randomGraph(n, 0.1 + 0.5 * rng.nextFloat(), rng, k % 3 === 0 ? { weight: pm1 } : {});
    graphs.push({ g, y: dualLike(g, rng) });
  }
  const spectra = graphs.map(({ g, y }) => symmetricEigen(denseShiftedLaplacian(g, y), g.n).values);
  for (let t = 0; t < 1000; t++) {
    const { g, y } = graphs[t % 100];
    const values = Array.from(spectra[t % 100]);
    const hi = Math.max(...values), lo = Math.min(...values);
    const spread = Math.max(1, hi - lo);
    const top = hi + (t % 3 === 0 ? -0.05 : 0.02) * rng.nextFloat() * spread;
    const bottom = Math.min(top - 0.01, lo - 0.5 * rng.nextFloat() * spread);
    trials.push({ g, y, p: { failureProbability: 10 ** -(3 + rng.nextInt(10)), solverSeed: rng.nextU32(), degree: 4 + rng.nextInt(150), top, bottom } });
  }
  const script = "import json,sys\nimport numpy as np\nprint(json.dumps([float(np.linalg.eigvalsh(np.array(m['a']).reshape(m['n'], m['n']))[-1]) for m in json.load(sys.stdin)]))";
  const input = JSON.stringify(graphs.map(({ g, y }) => ({ n: g.n, a: Array.from(denseShiftedLaplacian(g, y)) })));
  const reference = JSON.parse(execFileSync("python3", ["-c", script], { input, encoding: "utf8", maxBuffer: 1 << 26 })) as number[];
  expect(reference).toHaveLength(100);
  let found = 0, tight = 0;
  trials.forEach(({ g, y, p }, t) => {
    const lmax = reference[t % 100];
    const r = probableShift(g, y, p);
    if (!r.found) return;
    found++;
    const scale = Math.max(1, p.top - p.bottom);
    expect(r.bound, `trial ${t}: n = ${g.n}, degree ${p.degree}, top ${p.top}`).toBeGreaterThanOrEqual(lmax - 1e-9 * scale);
    if (r.bound - lmax <= 0.05 * scale) tight++;
  });
  expect(found).toBeGreaterThan(950);
  // The check has teeth: most bounds sit within 5% of the filter's interval above λmax.
  expect(tight).toBeGreaterThan(500);
});

itNeeds([python("numpy")], "bisected sparse shift on the SDP dual of ±1 tori: never below λmax (numpy's eigvalsh), within 10⁻⁷·‖A‖ above it, re-proved by verify", () => {
  // Reference: numpy.linalg.eigvalsh (LAPACK dsyevd, Debian python3-numpy), accurate to about n·u·‖A‖.
  // Near an SDP optimum the top of L − Diag(y) is a cluster (the case the bisection exists for): the
  // rough Lanczos estimate does not converge and the shift comes from bisection on the envelope proof.
  const cases = [torus(8, 100, pm1, 11), torus(12, 40, pm1, 12)].map((g) => ({ g, y: solveSdp(g).y }));
  const script = "import json,sys\nimport numpy as np\nprint(json.dumps([[float(e[-1]), float(max(abs(e[0]), abs(e[-1])))] for e in (np.linalg.eigvalsh(np.array(m['a']).reshape(m['n'], m['n']))[[0, -1]] for m in json.load(sys.stdin))]))";
  const input = JSON.stringify(cases.map(({ g, y }) => ({ n: g.n, a: Array.from(denseShiftedLaplacian(g, y)) })));
  const reference = JSON.parse(execFileSync("python3", ["-c", script], { input, encoding: "utf8", maxBuffer: 1 << 28 })) as [number, number][];
  cases.forEach(({ g, y }, t) => {
    const b = certifyDual(g, y);
    expect(b.certificate?.shiftProof).toBe("sparse-cholesky");
    expect(b.details?.bisection).toBe(true);
    const shift = b.certificate!.shift;
    const [lmax, scale] = reference[t]; // scale = ‖L − Diag(y)‖₂
    expect(shift).toBeGreaterThanOrEqual(lmax);
    expect(shift - lmax).toBeLessThan(1e-7 * scale);
    // The dense route (a tight Lanczos estimate, then Cholesky) is no tighter.
    const dense = certifyDual(g, y, { shiftProof: "cholesky" });
    expect(b.value).toBeLessThanOrEqual(dense.value + 1e-9 * Math.abs(dense.value));
    const v = verifyCertificate(g, b.certificate!);
    expect(v.ok && v.proven, v.message).toBe(true);
  });
});

describe("verify re-derives sparse and probable certificates and refuses tampered ones", () => {
  const g = torus(12, 14, pm1, 8);
  const y = dualLike(g, new Rng(3));
  const lmax = lambdaMax(g, y);
  const sparse = certifyDual(g, y, { shiftProof: "sparse-cholesky" }).certificate!;
  const probable = certifyDual(g, y, { shiftProof: "chebyshev-probable" }).certificate!;

  it("a sparse certificate is re-proved; one whose shift is below λmax is refused", () => {
    expect(sparse.shiftProof).toBe("sparse-cholesky");
    expect(sparse.shift).toBeGreaterThanOrEqual(lmax);
    const ok = verifyCertificate(g, sparse);
    expect(ok.ok && ok.proven && ok.kind === "proven").toBe(true);
    const low = verifyCertificate(g, { ...sparse, shift: lmax - 1e-7 });
    expect(low.ok).toBe(false);
  });

  it("a probable certificate records δ and its seed; verify re-runs it to the same δ", () => {
    expect(probable.shiftProof).toBe("chebyshev-probable");
    expect(probable.probable?.failureProbability).toBe(1e-9);
    expect(Number.isInteger(probable.probable?.solverSeed)).toBe(true);
    expect(probable.shift).toBeGreaterThanOrEqual(lmax);
    const v = verifyCertificate(g, probable);
    expect(v).toMatchObject({ ok: true, proven: false, kind: "probable", failureProbability: 1e-9 });
  });

  it("tampered probable certificates are rejected", () => {
    const p = probable.probable!;
    const tampered: [string, DualCertificate][] = [
      ["shift lowered", { ...probable, shift: probable.shift - 1e-6 * Math.abs(probable.shift) - 1e-9 }],
      ["smaller δ claimed", { ...probable, probable: { ...p, failureProbability: 1e-15 } }],
      ["lower degree", { ...probable, probable: { ...p, degree: 3 } }],
      ["parameters removed", { kind: "psd-dual", y: probable.y, shift: probable.shift, shiftProof: "chebyshev-probable" }],
      ["δ of 1", { ...probable, probable: { ...p, failureProbability: 1 } }],
    ];
    for (const [what, c] of tampered) expect(verifyCertificate(g, c).ok, what).toBe(false);
  });

  it("a bracket record resting on a probable shift verifies as probable, never as proven or exact", () => {
    const rec = bracket(g, { seconds: 0.5, effort: "quick", solverSeed: 1 });
    const cert = certifyDual(g, y, { shiftProof: "chebyshev-probable" });
    const upper = Math.floor(cert.value);
    expect(upper).toBeGreaterThanOrEqual(rec.lower);
    const forged: BracketRecord = {
      ...rec,
      upper,
      surplusUpper: upper - g.totalWeight / 2,
      exact: false,
      upperKind: "probable",
      certificate: { kind: "psd-dual", y: Array.from(y), shift: cert.certificate!.shift, shiftProof: "chebyshev-probable", roundedDown: true, tolerance: 0, probable: cert.certificate!.probable },
    };
    const v = verifyBracket(g, forged);
    expect(v).toMatchObject({ ok: true, verdict: "probable", upperKind: "probable", failureProbability: 1e-9 });
    // The command line: `verify` says probable and exits 3 (0 with --accept-estimates), like an estimate.
    ensureBuilt();
    const dir = mkdtempSync(join(tmpdir(), "halfplus-probable-"));
    try {
      const path = join(dir, "probable.json");
      writeFileSync(path, JSON.stringify(forged) + "\n");
      const r = halfplus(["verify", path]);
      expect(r.code, r.stderr).toBe(3);
      expect(r.stdout).toMatch(/probable: max cut in \[/);
      expect(halfplus(["verify", path, "--accept-estimates"]).code).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
    expect(verifyBracket(g, { ...forged, upperKind: "proven" }).verdict).toBe("rejected");
    expect(verifyBracket(g, { ...forged, upper: upper - 1, surplusUpper: upper - 1 - g.totalWeight / 2 }).verdict).toBe("rejected");
  });
});

describe("cut --risk", () => {
  it("is refused outside [0, 0.5] with one line naming it, and accepted inside", () => {
    ensureBuilt();
    const bad = halfplus(["cut", "petersen", "--risk", "2"]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/--risk/);
    expect(bad.stderr.trim().split("\n")).toHaveLength(1);
    const ok = halfplus(["cut", "petersen", "--risk", "1e-6", "--json", "--seconds", "1"]);
    expect(ok.code, ok.stderr).toBe(0);
    expect(JSON.parse(ok.stdout)).toMatchObject({ version: 3, upperKind: "proven" });
  });
});

describe("fit rows by upper-end certainty", () => {
  it("upperAtLeast keeps rows at least as certain as asked and refuses an unknown word", () => {
    const rows = ["proven", "probable", "estimate", "proven"].map((upperKind, i) => ({ key: `k${i}`, family: "f", n: 10, m: 20 + i, surplusLower: 1, surplusUpper: 2, exact: 0, upperKind }));
    const store = { rows: () => rows[Symbol.iterator]() } as unknown as ResultStore;
    expect(fitRowsFromStore(store).length).toBe(4);
    expect(fitRowsFromStore(store, { upperAtLeast: "probable" }).map((r) => r.key)).toEqual(["k0", "k1", "k3"]);
    expect(fitRowsFromStore(store, { upperAtLeast: "proven" }).map((r) => r.key)).toEqual(["k0", "k3"]);
    expect(() => fitRowsFromStore(store, { upperAtLeast: "sure" as never })).toThrow(/upperAtLeast/);
  });
});
