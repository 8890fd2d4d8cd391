// Hyperplane rounding (Goemans–Williamson) and sparse vector rounding ("the explicit vector
// method"): exact expectations against simulation and dense evaluation, the guarantee against
// direct formulas and against the exact expectation, and input errors.
import { describe, expect, it } from "vitest";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { Rng } from "../src/random/prng.js";
import { cutValue } from "../src/graph/cut-value.js";
import { hyperplaneExpectedCut, hyperplaneRound } from "../src/cut/heuristic/hyperplane-rounding.js";
import { vectorMethodCosine, vectorMethodExpectedCut, vectorMethodRound } from "../src/cut/heuristic/vector-rounding.js";
import { resolveVectorSets } from "../src/bounds/vector-sets.js";
import { vectorMethodGuarantee } from "../src/bounds/vector-guarantee.js";
import { InputError } from "../src/errors.js";
import { complete, cycle, hypercube, petersen, randomBipartite, randomEdges } from "./helpers/graphs.js";
import { directVectorGuarantee } from "./helpers/vector.js";

/** G(n, p), then edges deleted until no triangle remains (each deletion checked by brute force). */
function triangleFreeRandom(rng: Rng, n: number, p: number): Graph {
  const adj = Array.from({ length: n }, () => new Uint8Array(n));
  for (const [u, v] of randomEdges(n, p, rng)) adj[u][v] = adj[v][u] = 1;
  for (let u = 0; u < n; u++)
    for (let v = u + 1; v < n; v++)
      if (adj[u][v]) for (let w = 0; w < n; w++) if (adj[u][w] && adj[v][w]) { adj[u][v] = adj[v][u] = 0; break; }
  const e: [number, number][] = [];
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) if (adj[u][v]) e.push([u, v]);
  return graphFromEdges(n, e);
}
function hasTriangle(g: Graph): boolean {
  let found = false;
  g.forEachEdge((u, v) => {
    for (const w of g.neighborsOf(u)) if (w !== v && g.hasEdge(v, w)) found = true;
  });
  return found;
}

describe("hyperplane rounding (Goemans–Williamson)", () => {
  it("rounds the optimal SDP vectors of C5 to expected cut ≥ 0.87856·SDP", () => {
    // C5's optimal SDP solution puts vertex i at angle 4πi/5, so each edge spans 4π/5 and the SDP
    // value is 5(1 − cos 4π/5)/2 = (25 + 5√5)/8 (Goemans & Williamson 1995, who note the 5-cycle's
    // ratio 32/(25 + 5√5) ≈ 0.884; their guarantee α ≈ 0.87856).
    const g = cycle(5);
    const vectors = new Float64Array(10);
    for (let i = 0; i < 5; i++) {
      vectors[2 * i] = Math.cos((4 * Math.PI * i) / 5);
      vectors[2 * i + 1] = Math.sin((4 * Math.PI * i) / 5);
    }
    const sdp = (5 * (1 - Math.cos((4 * Math.PI) / 5))) / 2;
    expect(sdp).toBeCloseTo((25 + 5 * Math.sqrt(5)) / 8, 12);
    const r = hyperplaneRound(g, vectors, 2, { trials: 400, solverSeed: 7, polish: false });
    expect(r.value).toBe(cutValue(g, r.partition));
    expect(r.details?.expectedCut).toBeCloseTo(4, 12); // 5 edges × (4π/5)/π
    expect(r.details?.meanCut as number).toBeGreaterThanOrEqual(0.87856 * sdp);
    expect(r.value).toBe(4); // max cut of C5 (from memory)
  });

  it("mean of many trials matches the exact expectation Σ w·arccos(cos θ_ij)/π (weighted, r = 3)", () => {
    // GW 1995 Lemma 3.2: a random hyperplane separates unit vectors at angle θ with probability θ/π.
    // Tolerance: 4 standard errors of the sample mean (estimated in the test).
    const rng = new Rng(5);
    const e = randomEdges(25, 0.3, rng).map(([u, v]) => [u, v, 1 + rng.nextInt(4)] as [number, number, number]);
    const g = graphFromEdges(25, e);
    const vectors = new Float64Array(25 * 3);
    for (let i = 0; i < vectors.length; i++) vectors[i] = rng.nextNormal();
    const expected = hyperplaneExpectedCut(g, vectors, 3);
    const trials = 3000;
    const rec = hyperplaneRound(g, vectors, 3, { trials, solverSeed: 3, polish: false });
    // Re-simulate to get the sample standard deviation.
    const sim = new Rng(99);
    let s = 0, s2 = 0;
    const side = new Uint8Array(25);
    for (let t = 0; t < trials; t++) {
      const h = [sim.nextNormal(), sim.nextNormal(), sim.nextNormal()];
      for (let v = 0; v < 25; v++) side[v] = vectors[3 * v] * h[0] + vectors[3 * v + 1] * h[1] + vectors[3 * v + 2] * h[2] > 0 ? 1 : 0;
      const c = cutValue(g, side);
      s += c;
      s2 += c * c;
    }
    const sd = Math.sqrt((s2 - (s * s) / trials) / (trials - 1));
    const se = sd / Math.sqrt(trials);
    expect(Math.abs((rec.details?.meanCut as number) - expected)).toBeLessThan(4 * se);
    expect(Math.abs(s / trials - expected)).toBeLessThan(4 * se);
  });

  it("polishing never lowers the best cut, and the same seed gives the same partition", () => {
    // Determinism, common practice, no source.
    const rng = new Rng(8);
    const g = graphFromEdges(40, randomEdges(40, 0.2, rng));
    const vectors = new Float64Array(40 * 4);
    for (let i = 0; i < vectors.length; i++) vectors[i] = rng.nextNormal();
    const raw = hyperplaneRound(g, vectors, 4, { trials: 30, solverSeed: 1, polish: false });
    const pol = hyperplaneRound(g, vectors, 4, { trials: 30, solverSeed: 1, polish: true });
    expect(pol.value).toBeGreaterThanOrEqual(raw.value);
    expect(pol.value).toBe(cutValue(g, pol.partition));
    expect(raw.details?.bestRoundedCut).toBe(raw.value);
    const again = hyperplaneRound(g, vectors, 4, { trials: 30, solverSeed: 1, polish: true });
    expect(Array.from(again.partition)).toEqual(Array.from(pol.partition));
  });

  it("rejects malformed vectors and options", () => {
    // Input validation, common practice, no source.
    const g = cycle(5);
    expect(() => hyperplaneRound(g, new Float64Array(9), 2)).toThrow(InputError);
    expect(() => hyperplaneRound(g, new Float64Array(9), 2)).toThrow(/`vectors`: should be a Float64Array of n·r = 10/);
    expect(() => hyperplaneRound(g, new Float64Array(10), 0)).toThrow(/`r`/);
    expect(() => hyperplaneRound(g, new Float64Array(10).fill(NaN), 2)).toThrow(/finite/);
    expect(() => hyperplaneRound(g, new Float64Array(10), 2, { trials: 0 })).toThrow(/`trials`/);
  });
});

/** (1/2π)·Σ_i √d_i, the triangle-free form of the guarantee (the vector method with V_i = N(i)). */
function sqrtDegreeSum(g: Graph): number {
  let s = 0;
  for (let v = 0; v < g.n; v++) s += Math.sqrt(g.degree(v));
  return s / (2 * Math.PI);
}

/** The normalised vectors x_i/‖x_i‖, x_i = e_i − ε_i·Σ_{k∈V_i} e_k, written out densely in R^n. */
function denseVectors(g: Graph, sets: number[][], eps: number[]): Float64Array[] {
  return sets.map((s, i) => {
    const v = new Float64Array(g.n);
    v[i] = 1;
    for (const k of s) v[k] -= eps[i];
    const norm = Math.hypot(...v);
    return v.map((t) => t / norm);
  });
}

/** Dense evaluation of the rounding's expectation: explicit vectors and arccos/π per edge. */
function denseExpectedCut(g: Graph, sets: number[][], eps: number[]): number {
  const n = g.n;
  const x = denseVectors(g, sets, eps);
  let e = 0;
  g.forEachEdge((u, v, w) => {
    let d = 0;
    for (let k = 0; k < n; k++) d += x[u][k] * x[v][k];
    e += (w * Math.acos(Math.max(-1, Math.min(1, d)))) / Math.PI;
  });
  return e;
}

describe("the explicit vector method", () => {
  const rng = new Rng(12345);
  const triangleFree: [string, Graph][] = [
    ["C5", cycle(5)],
    ["Petersen", petersen()],
    ["Q3", hypercube(3)],
    ["random bipartite 12+14", randomBipartite(12, 14, 0.3, rng)],
    ["G(30, 0.3) minus triangle edges", triangleFreeRandom(rng, 30, 0.3)],
  ];

  for (const [name, g] of triangleFree) {
    it(`${name}: guarantee = (1/2π)Σ√d_i ≤ exact expectation, and the trial mean agrees`, () => {
      expect(hasTriangle(g)).toBe(false);
      const gu = vectorMethodGuarantee(g);
      // Triangle-free: no edge has common neighbours, so the overlap term vanishes (formula check).
      expect(gu.surplus).toBeCloseTo(sqrtDegreeSum(g), 12);
      expect(gu.overlapTerm).toBe(0);
      const trials = 4000;
      const rec = vectorMethodRound(g, { trials, solverSeed: 17 });
      const d = rec.details!;
      const expected = d.expectedSurplus as number;
      expect(expected).toBeGreaterThanOrEqual((gu.surplus as number) - 1e-12);
      // Statistical tolerance: mean over 4000 trials within 4 standard errors (≈ 6e-5 two-sided miss rate).
      expect(d.meanSurplus as number).toBeGreaterThanOrEqual((gu.surplus as number) - 4 * (d.stdErr as number));
      expect(Math.abs((d.meanSurplus as number) - expected)).toBeLessThan(4 * (d.stdErr as number));
      expect(rec.value).toBe(cutValue(g, rec.partition));
      expect(d.bestSurplus).toBe(rec.value - g.m / 2);
    });
  }

  it("C5 by hand: ⟨x̂_i, x̂_{i+1}⟩ = −1/√2, so each edge is cut with probability 3/4", () => {
    // ε = 1/√2, ‖x_i‖² = 2, ⟨x_i, x_j⟩ = −2ε for an edge (arithmetic from the definition).
    expect(vectorMethodExpectedCut(cycle(5))).toBeCloseTo(5 * 0.75, 12);
  });

  const dense: [string, Graph][] = [
    ["K4", complete(4)],
    ["K7", complete(7)],
    ["G(24, 0.5)", graphFromEdges(24, randomEdges(24, 0.5, rng))],
    ["G(30, 0.25)", graphFromEdges(30, randomEdges(30, 0.25, rng))],
  ];
  for (const [name, g] of dense) {
    it(`${name} (with triangles): guarantee matches a direct O(n³) evaluation, expectation matches dense vectors and exceeds the guarantee`, () => {
      const sets = Array.from({ length: g.n }, (_, i) => Array.from(g.neighborsOf(i)));
      const eps = sets.map((s) => (s.length ? 1 / Math.sqrt(s.length) : 0));
      const gu = vectorMethodGuarantee(g);
      expect(gu.surplus).toBeCloseTo(directVectorGuarantee(g, sets, eps), 10);
      expect(gu.overlapEdges).toBeGreaterThan(0);
      const exp = vectorMethodExpectedCut(g);
      expect(exp).toBeCloseTo(denseExpectedCut(g, sets, eps), 10);
      expect(exp - g.m / 2).toBeGreaterThanOrEqual((gu.surplus as number) - 1e-12);

      // Custom sets (a random half of each neighbourhood) and ε_i = c_i/√|V_i| with c_i ∈ (0, 1].
      const r = new Rng(g.n);
      const sub = sets.map((s) => s.filter(() => r.nextFloat() < 0.5).reverse());
      const e2 = sub.map((s) => (s.length ? (0.1 + 0.9 * r.nextFloat()) / Math.sqrt(s.length) : 0));
      const gu2 = vectorMethodGuarantee(g, { sets: sub, eps: e2 });
      expect(gu2.surplus).toBeCloseTo(directVectorGuarantee(g, sub, e2), 10);
      const exp2 = vectorMethodExpectedCut(g, { sets: sub, eps: e2 });
      expect(exp2).toBeCloseTo(denseExpectedCut(g, sub, e2), 10);
      expect(exp2 - g.m / 2).toBeGreaterThanOrEqual((gu2.surplus as number) - 1e-12);
      // The single-pair cosine, for pairs that need not be edges, against the dense vectors.
      const resolved = resolveVectorSets(g, { sets: sub, eps: e2 });
      const dense = denseVectors(g, sub, e2);
      for (let t = 0; t < 20; t++) {
        const i = r.nextInt(g.n);
        const j = (i + 1 + r.nextInt(g.n - 1)) % g.n;
        let d = 0;
        for (let k = 0; k < g.n; k++) d += dense[i][k] * dense[j][k];
        expect(vectorMethodCosine(resolved, i, j)).toBeCloseTo(d, 12);
      }
      const rec = vectorMethodRound(g, { sets: sub, eps: e2, trials: 3000, solverSeed: 4 });
      expect(Math.abs((rec.details!.meanSurplus as number) - (exp2 - g.m / 2))).toBeLessThan(4 * (rec.details!.stdErr as number));
    });
  }

  it("weighted graphs: rounding and expectation work, the guarantee does not apply", () => {
    const r = new Rng(77);
    const e = randomEdges(20, 0.3, r).map(([u, v]) => [u, v, r.nextInt(7) - 3 || 1] as [number, number, number]);
    const g = graphFromEdges(20, e);
    const gu = vectorMethodGuarantee(g);
    expect(gu.applies).toBe(false);
    expect(gu.surplus).toBeNull();
    const rec = vectorMethodRound(g, { trials: 3000, solverSeed: 2, polish: true });
    expect(rec.details!.guarantee).toBeNull();
    expect(rec.value).toBe(cutValue(g, rec.partition));
    const sets = Array.from({ length: 20 }, (_, i) => Array.from(g.neighborsOf(i)));
    const eps = sets.map((s) => (s.length ? 1 / Math.sqrt(s.length) : 0));
    expect((rec.details!.expectedSurplus as number) + g.totalWeight / 2).toBeCloseTo(denseExpectedCut(g, sets, eps), 10);
    expect(Math.abs((rec.details!.meanSurplus as number) - (rec.details!.expectedSurplus as number))).toBeLessThan(4 * (rec.details!.stdErr as number));
  });

  it("is deterministic per seed, and polishing only raises the best cut", () => {
    // Determinism, common practice, no source.
    const g = petersen();
    const a = vectorMethodRound(g, { trials: 50, solverSeed: 9 });
    const b = vectorMethodRound(g, { trials: 50, solverSeed: 9 });
    expect(Array.from(a.partition)).toEqual(Array.from(b.partition));
    const c = vectorMethodRound(g, { trials: 50, solverSeed: 9, polish: true });
    expect(c.value).toBeGreaterThanOrEqual(a.value);
    expect(c.details!.meanSurplus).toBe(a.details!.meanSurplus);
  });

  it("rejects sets that are not neighbourhood subsets and ε out of range, naming the parameter", () => {
    // Input validation, common practice, no source.
    const g = cycle(5);
    const ok = [[1, 4], [0, 2], [1, 3], [2, 4], [3, 0]];
    expect(() => vectorMethodGuarantee(g, { sets: ok })).not.toThrow();
    expect(() => vectorMethodGuarantee(g, { sets: [[2], [], [], [], []] })).toThrow(/`sets\[0\]`: should contain only neighbours of vertex 0; 2 is not one/);
    expect(() => vectorMethodGuarantee(g, { sets: [[1, 1], [], [], [], []] })).toThrow(/should not repeat vertex 1/);
    expect(() => vectorMethodGuarantee(g, { sets: [[1]] })).toThrow(/one set per vertex/);
    expect(() => vectorMethodGuarantee(g, { eps: [0.8, 0.5, 0.5, 0.5, 0.5] })).toThrow(/`eps\[0\]`: should lie in \[0, 1\/√\|V_i\|\]/);
    expect(() => vectorMethodGuarantee(g, { eps: [-0.1, 0.5, 0.5, 0.5, 0.5] })).toThrow(InputError);
    expect(() => vectorMethodGuarantee(g, { eps: [NaN, 0.5, 0.5, 0.5, 0.5] })).toThrow(InputError);
    // ε_i = 0 switches vertex i off (x_i = e_i); the guarantee then simply drops its terms.
    expect(vectorMethodGuarantee(g, { eps: [0, 0.5, 0.5, 0.5, 0.5] }).surplus).toBeCloseTo((4 * 0.5 * 2) / (2 * Math.PI), 12);
    expect(() => vectorMethodGuarantee(g, { epsScale: 1.5 })).toThrow(/`epsScale`/);
    expect(() => vectorMethodRound(g, { trials: -1 })).toThrow(/`trials`/);
  });
});
