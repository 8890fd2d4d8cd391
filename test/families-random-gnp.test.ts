// G(n, p), G(n, m) and bipartite G(a, b, p): edge-count laws, exact distributions on tiny
// vertex sets (chi-square), determinism (same seed → same bytes, also in a worker thread) and
// parameter errors.
import { dirname, resolve } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import { describe, expect, it } from "vitest";
import type { Graph } from "../src/graph/graph.js";
import { bipartiteGnp } from "../src/families/bipartite-gnp.js";
import { gnm } from "../src/families/gnm.js";
import { gnp } from "../src/families/gnp.js";
import { buildFamily, family, familyWithInfo } from "../src/families/registry.js";
import { Rng } from "../src/random/prng.js";
import { expectInputError } from "./helpers/errors.js";
import { chiSquare } from "./helpers/stats.js";
import { file, itNeeds } from "./helpers/requirements.js";

// Upper 0.1% points of the chi-square distribution with k degrees of freedom: NIST/SEMATECH
// e-Handbook of Statistical Methods, §1.3.6.7.4 (table of upper critical values of the
// chi-square distribution); the values were recomputed with scipy.stats.chi2.ppf(0.999, k).
const CHI2_999: Record<number, number> = { 44: 78.75, 63: 103.442 };

/** Index of a graph on ≤ 6 vertices among all labelled graphs: bit k = pair k in (u, v) order. */
function labelledIndex(g: Graph): number {
  let code = 0, k = 0;
  for (let u = 0; u < g.n; u++) for (let v = u + 1; v < g.n; v++, k++) if (g.hasEdge(u, v)) code |= 1 << k;
  return code;
}

function popcount(x: number): number {
  let c = 0;
  for (; x !== 0; x &= x - 1) c++;
  return c;
}

function bytesOf(a: Int32Array): Buffer {
  return Buffer.from(a.buffer, a.byteOffset, a.byteLength);
}

function sameBytes(a: { n: number; offsets: Int32Array; neighbors: Int32Array }, b: { n: number; offsets: Int32Array; neighbors: Int32Array }): boolean {
  return a.n === b.n && bytesOf(a.offsets).equals(bytesOf(b.offsets)) && bytesOf(a.neighbors).equals(bytesOf(b.neighbors));
}

describe("G(n, p)", () => {
  it("has Binomial(C(n,2), p) edge counts over many seeds", () => {
    // Binomial mean Np and variance Np(1−p) (standard): every count within 5σ of the mean,
    // and the average of S counts within 5σ/√S.
    for (const [n, p] of [[200, 0.05], [60, 0.7], [2000, 0.0001]] as const) {
      const N = (n * (n - 1)) / 2;
      const mean = N * p, sd = Math.sqrt(N * p * (1 - p));
      const S = 150;
      let sum = 0;
      for (let seed = 0; seed < S; seed++) {
        const m = gnp(n, p, seed).m;
        expect(Math.abs(m - mean)).toBeLessThan(5 * sd);
        sum += m;
      }
      expect(Math.abs(sum / S - mean)).toBeLessThan((5 * sd) / Math.sqrt(S));
    }
  });

  it("gives each labelled graph on 4 vertices probability p^m (1−p)^(6−m)", () => {
    // Independent edges with probability p (the definition of G(n, p)); chi-square with 63
    // degrees of freedom over the 64 labelled graphs, critical value from CHI2_999.
    for (const [p, S, seed0] of [[0.5, 12800, 1], [0.3, 20000, 100000]] as const) {
      const counts = new Array<number>(64).fill(0);
      for (let s = 0; s < S; s++) counts[labelledIndex(gnp(4, p, seed0 + s))]++;
      const expected = counts.map((_, code) => S * p ** popcount(code) * (1 - p) ** (6 - popcount(code)));
      expect(chiSquare(counts, expected)).toBeLessThan(CHI2_999[63]);
    }
  });

  it("has Binomial(n−1, p) vertex degrees", () => {
    // Each degree is Binomial(n−1, p): mean (n−1)p, variance (n−1)p(1−p) (standard).
    // Pooled over 20 graphs of 1000 vertices the sample variance is within 10% (its standard
    // error is about 1.5% here).
    const n = 1000, p = 0.01;
    let s1 = 0, s2 = 0, count = 0;
    for (let seed = 0; seed < 20; seed++) {
      const g = gnp(n, p, seed);
      for (let v = 0; v < n; v++) {
        const d = g.degree(v);
        s1 += d;
        s2 += d * d;
        count++;
      }
    }
    const mean = s1 / count;
    const variance = s2 / count - mean * mean;
    const expectedVar = (n - 1) * p * (1 - p);
    expect(Math.abs(mean - (n - 1) * p)).toBeLessThan((5 * Math.sqrt(expectedVar)) / Math.sqrt(count));
    expect(Math.abs(variance / expectedVar - 1)).toBeLessThan(0.1);
  });

  it("gives the empty graph at p = 0 and K_n at p = 1", () => {
    // Definition of G(n, p) (common practice, no source).
    expect(gnp(50, 0, 7).m).toBe(0);
    expect(gnp(50, 1, 7).m).toBe(1225);
    expect(gnp(0, 0.5, 1).n).toBe(0);
    expect(gnp(1, 0.5, 1).m).toBe(0);
  });

  it("is reproducible: same seed same bytes, other seeds differ; typed call = spec string = caller's Rng", () => {
    // Determinism is a design requirement (integer PRNG): common practice, no source.
    const a = gnp(300, 0.1, 42);
    expect(sameBytes(a, gnp(300, 0.1, 42))).toBe(true);
    expect(sameBytes(a, family("gnp:n=300,p=0.1,seed=42"))).toBe(true);
    expect(sameBytes(a, gnp(300, 0.1, new Rng(42)))).toBe(true);
    expect(sameBytes(a, gnp(300, 0.1, 43))).toBe(false);
    const info = familyWithInfo("gnp:n=30,p=0.2");
    expect(info.graphSeed).toBe(0);
    expect(info.notes.join(" ")).toContain("seed 0");
    expect(info.spec).toBe("gnp:n=30,p=0.2,seed=0");
  });

  it("rejects bad parameters with an InputError naming the parameter", () => {
    // Input validation, common practice, no source.
    expectInputError(() => gnp(10, 1.5, 0), "`p`");
    expectInputError(() => gnp(10, -0.1, 0), "`p`");
    expectInputError(() => gnp(-1, 0.5, 0), "`n`");
    expectInputError(() => gnp(2.5, 0.5, 0), "`n`");
    expectInputError(() => gnp(10, 0.5, -3), "`seed`");
    expectInputError(() => family("gnp:n=10,p=abc"), "`p`");
    expectInputError(() => family("gnp:n=10"), "`p`");
    expectInputError(() => family("gnp:n=10,p=0.1,q=3"), "`q`");
    // 10^6 vertices at p = 0.9: about 4.5·10^11 edges, refused before any allocation.
    expectInputError(() => gnp(1_000_000, 0.9, 0), "would not fit in memory");
    expectInputError(() => family("gnp:n=1000000,p=0.9"), "would not fit in memory");
  });
});

describe("G(n, m)", () => {
  it("has exactly m edges, sparse and dense", () => {
    // Definition of G(n, m) (Erdős–Rényi 1959).
    for (const [n, m] of [[10, 0], [10, 45], [10, 22], [10, 23], [100, 1], [100, 2475], [100, 2476], [1000, 30000], [60, 1700]] as const) {
      const g = gnm(n, m, n + m);
      expect(g.n).toBe(n);
      expect(g.m).toBe(m);
    }
  });

  it("is uniform over the labelled graphs with m edges (sparse and dense method)", () => {
    // G(n, m) is uniform over the C(C(n,2), m) labelled graphs (Erdős–Rényi 1959). n = 5 has 10
    // pairs: m = 2 uses rejection of repeated pairs, m = 8 samples the 2 missing pairs. Both have
    // C(10, 2) = 45 graphs: chi-square with 44 degrees of freedom, critical value from CHI2_999.
    for (const [m, seed0] of [[2, 0], [8, 50000]] as const) {
      const S = 4500;
      const counts = new Map<number, number>();
      for (let s = 0; s < S; s++) {
        const code = labelledIndex(gnm(5, m, seed0 + s));
        counts.set(code, (counts.get(code) ?? 0) + 1);
      }
      expect(counts.size).toBe(45);
      for (const code of counts.keys()) expect(popcount(code)).toBe(m);
      const observed = [...counts.values()];
      expect(chiSquare(observed, observed.map(() => S / 45))).toBeLessThan(CHI2_999[44]);
    }
  });

  it("uses every pair equally often", () => {
    // Pair frequencies over S samples on n = 8 (N = 28 pairs). For a uniform m-subset the pair
    // indicators have variance q(1−q), q = m/N, and covariance −q(1−q)/(N−1) (sampling without
    // replacement, standard), so (N−1)/(N−m) · Σ (O−E)²/E is asymptotically chi-square with
    // N − 1 = 27 df; upper 0.1% point 55.476 (NIST/SEMATECH e-Handbook §1.3.6.7.4;
    // scipy.stats.chi2.ppf(0.999, 27)). m = 5 is the sparse method, m = 20 the dense one.
    const n = 8, N = 28, S = 3000;
    for (const [m, seed0] of [[5, 7], [20, 70007]] as const) {
      const freq = new Array<number>(N).fill(0);
      for (let s = 0; s < S; s++) {
        const g = gnm(n, m, seed0 + s);
        for (let u = 0, k = 0; u < n; u++) for (let v = u + 1; v < n; v++, k++) if (g.hasEdge(u, v)) freq[k]++;
      }
      const stat = (chiSquare(freq, freq.map(() => (S * m) / N)) * (N - 1)) / (N - m);
      expect(stat).toBeLessThan(55.476);
    }
  });

  it("rejects m above n(n−1)/2 naming `m`", () => {
    // Input validation, common practice, no source.
    expectInputError(() => gnm(10, 46, 0), "`m`");
    expectInputError(() => family("gnm:n=10,m=-1"), "`m`");
    expectInputError(() => gnm(50_000_000, 600_000_000, 0), "would not fit in memory");
  });
});

describe("bipartite G(a, b, p)", () => {
  it("only joins the two parts, with Binomial(a·b, p) edges", () => {
    // Definition of the random bipartite graph; binomial mean and variance (standard).
    const a = 40, b = 70, p = 0.2, N = a * b;
    const mean = N * p, sd = Math.sqrt(N * p * (1 - p));
    for (let seed = 0; seed < 100; seed++) {
      const g = bipartiteGnp(a, b, p, seed);
      expect(g.n).toBe(a + b);
      expect(Math.abs(g.m - mean)).toBeLessThan(5 * sd);
      let inside = 0;
      g.forEachEdge((u, v) => {
        if (!(u < a && v >= a)) inside++;
      });
      expect(inside).toBe(0);
    }
    expect(bipartiteGnp(3, 4, 1, 0).m).toBe(12);
    expect(bipartiteGnp(0, 4, 0.5, 0).m).toBe(0);
    expect(sameBytes(bipartiteGnp(30, 20, 0.3, 5), family("bipartite-gnp:a=30,b=20,p=0.3,seed=5"))).toBe(true);
    expectInputError(() => bipartiteGnp(3, 4, 2, 0), "`p`");
  });

  it("gives each labelled bipartite graph on parts 2 + 2 probability p^m (1−p)^(4−m)", () => {
    // Independent cross pairs (definition); 16 graphs, chi-square 15 df, upper 0.1% point 37.697
    // (NIST/SEMATECH e-Handbook §1.3.6.7.4; scipy.stats.chi2.ppf(0.999, 15)).
    const p = 0.35, S = 8000;
    const counts = new Array<number>(16).fill(0);
    const pairs = [[0, 2], [0, 3], [1, 2], [1, 3]];
    for (let s = 0; s < S; s++) {
      const g = bipartiteGnp(2, 2, p, s);
      let code = 0;
      pairs.forEach(([u, v], k) => {
        if (g.hasEdge(u, v)) code |= 1 << k;
      });
      counts[code]++;
    }
    const expected = counts.map((_, code) => S * p ** popcount(code) * (1 - p) ** (4 - popcount(code)));
    expect(chiSquare(counts, expected)).toBeLessThan(37.697);
  });
});

// The worker imports the compiled package (dist/), built by `npm test` before the suites run.
const root = resolve(dirname(fileURLToPath(import.meta.url)), "..");
const distRegistry = resolve(root, "dist/families/registry.js");

describe("determinism across threads", () => {
  itNeeds([file(distRegistry, "the build in dist/ (npm run build)")], "builds byte-identical graphs in a worker thread and here", async () => {
    // A spec + seed must give the same bytes in every isolate (integer PRNG, no dependence on
    // hash iteration order): common practice, no source.
    const specs = ["gnp:n=500,p=0.02,seed=9", "gnm:n=400,m=3000,seed=4", "gnm:n=40,m=700,seed=4", "bipartite-gnp:a=50,b=60,p=0.1,seed=2"];
    const code = `
      const { parentPort, workerData } = require("node:worker_threads");
      import(workerData.url).then((mod) => {
        const out = workerData.specs.map((s) => { const g = mod.family(s); return { n: g.n, offsets: g.offsets, neighbors: g.neighbors }; });
        parentPort.postMessage(out);
      });`;
    const fromWorker = await new Promise<{ n: number; offsets: Int32Array; neighbors: Int32Array }[]>((ok, fail) => {
      const w = new Worker(code, { eval: true, workerData: { url: pathToFileURL(distRegistry).href, specs } });
      w.once("message", (m) => {
        ok(m);
        void w.terminate();
      });
      w.once("error", fail);
    });
    const dist = (await import(pathToFileURL(distRegistry).href)) as { family: (s: string) => Graph };
    specs.forEach((s, i) => {
      const here = family(s);
      expect(here.m).toBeGreaterThan(0);
      expect(sameBytes(fromWorker[i], here)).toBe(true);
      // Same compiled code in this thread: the worker is not merely matching a stale build.
      expect(sameBytes(dist.family(s), here)).toBe(true);
    });
  });

  it("buildFamily with typed parameters matches the spec string", () => {
    // The typed path and the spec path share resolveParams (common practice, no source).
    expect(sameBytes(buildFamily("gnm", { n: 50, m: 100, seed: 3 }).graph, family("gnm:n=50,m=100,seed=3"))).toBe(true);
    expect(sameBytes(gnm(50, 100, 3), family("gnm:n=50,m=100,seed=3"))).toBe(true);
  });
});
