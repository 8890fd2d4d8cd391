// Invariants of the structured families against published theorems and tables: sizes, degrees,
// spectra (ml-matrix dense eigensolver), strongly-regular parameters, girth, forbidden subgraphs,
// chromatic numbers; plus every family's predicted size and `freeOf` claims checked on built graphs.
import { EigenvalueDecomposition, Matrix } from "ml-matrix";
import { describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import type { Graph } from "../src/graph/graph.js";
import { bipartition } from "../src/graph/structure/bipartite.js";
import { findClique } from "../src/graph/structure/cliques.js";
import { countFourCycles } from "../src/graph/structure/four-cycles.js";
import { girth } from "../src/graph/structure/girth.js";
import { patternGraph } from "../src/graph/structure/patterns.js";
import { findSubgraph } from "../src/graph/structure/subgraph.js";
import { countTriangles } from "../src/graph/structure/triangles.js";
import { STRUCTURED_FAMILIES } from "../src/families/catalog-structured.js";
import { andrasfai as andrasfaiGraph } from "../src/families/circulant.js";
import { completeMultipartite as completeMultipartiteGraph } from "../src/families/complete-multipartite.js";
import { kneser as kneserGraph, kneserVertexSet } from "../src/families/kneser.js";
import { mycielskiChain } from "../src/families/mycielski.js";
import { chvatal as chvatalGraph } from "../src/families/named/chvatal.js";
import { clebsch as clebschGraph } from "../src/families/named/clebsch.js";
import { extendedGolayCodewords } from "../src/families/named/golay.js";
import { grotzsch as grotzschGraph } from "../src/families/named/grotzsch.js";
import { higmanSims as higmanSimsGraph, steinerHexads } from "../src/families/named/higman-sims.js";
import { hoffmanSingleton as hoffmanSingletonGraph } from "../src/families/named/hoffman-singleton.js";
import { heawood as heawoodGraph } from "../src/families/named/heawood.js";
import { dodecahedron as dodecahedronGraph, petersen as petersenGraph } from "../src/families/named/petersen.js";
import { normGraph } from "../src/families/norm-graph.js";
import { finiteField } from "../src/families/finite-field.js";
import { paley as paleyGraph } from "../src/families/paley.js";
import { pg2Coordinates } from "../src/families/pg2.js";
import { polarityWithAbsolutePoints } from "../src/families/polarity.js";
import { projectivePlane as projectivePlaneIncidenceGraph } from "../src/families/projective-plane.js";
import { buildFamily, family, familyWithInfo } from "../src/families/registry.js";
import { srgParameters } from "../src/graph/structure/strongly-regular.js";

function binom(a: number, b: number): number {
  if (b < 0 || b > a) return 0;
  let r = 1;
  for (let i = 1; i <= b; i++) r = (r * (a - b + i)) / i;
  return Math.round(r);
}

function degrees(g: Graph): number[] {
  return Array.from({ length: g.n }, (_, v) => g.degree(v));
}

/** Sorted eigenvalues of the adjacency matrix, with optional 1s on the diagonal at `loops`. */
function spectrum(g: Graph, loops: ArrayLike<number> = []): number[] {
  const A = Matrix.zeros(g.n, g.n);
  g.forEachEdge((u, v) => {
    A.set(u, v, 1);
    A.set(v, u, 1);
  });
  for (let i = 0; i < loops.length; i++) A.set(loops[i], loops[i], 1);
  return new EigenvalueDecomposition(A, { assumeSymmetric: true }).realEigenvalues.sort((a, b) => a - b);
}

/** Expected multiset [value, multiplicity][] as a sorted list. */
function multiset(parts: [number, number][]): number[] {
  return parts.flatMap(([x, m]) => Array<number>(m).fill(x)).sort((a, b) => a - b);
}

function expectClose(actual: number[], expected: number[], tol = 1e-6): void {
  expect(actual.length).toBe(expected.length);
  const worst = Math.max(0, ...actual.map((x, i) => Math.abs(x - expected[i])));
  expect(worst).toBeLessThan(tol);
}

/** Eigenvalues of srg(n,k,λ,μ): k once, r and s with the standard multiplicities (Brouwer–Haemers, Spectra of Graphs, §9.1). */
function srgSpectrum(n: number, k: number, l: number, mu: number): number[] {
  const D = Math.sqrt((l - mu) ** 2 + 4 * (k - mu));
  const r = (l - mu + D) / 2, s = (l - mu - D) / 2;
  const f = Math.round(((n - 1) * -s - k) / (r - s));
  return multiset([[k, 1], [r, f], [s, n - 1 - f]]);
}

/** Exact k-colourability by backtracking in a largest-degree-first order (common practice, no source). */
function colourable(g: Graph, k: number): boolean {
  const order = Array.from({ length: g.n }, (_, v) => v).sort((a, b) => g.degree(b) - g.degree(a));
  const colour = new Int32Array(g.n).fill(-1);
  const place = (i: number, used: number): boolean => {
    if (i === order.length) return true;
    const v = order[i];
    // Symmetry breaking: a new colour may only be the next unused one.
    for (let c = 0; c < Math.min(k, used + 1); c++) {
      let ok = true;
      for (const w of g.neighborsOf(v)) if (colour[w] === c) { ok = false; break; }
      if (!ok) continue;
      colour[v] = c;
      if (place(i + 1, Math.max(used, c + 1))) return true;
      colour[v] = -1;
    }
    return false;
  };
  return place(0, 0);
}

function chromaticNumber(g: Graph): number {
  let k = 1;
  while (!colourable(g, k)) k++;
  return k;
}

/** Largest number of common neighbours of any t distinct vertices (brute force over t-sets). */
function maxCommonNeighbours(g: Graph, t: number): number {
  const n = g.n;
  let best = 0;
  const rec = (start: number, depth: number, common: number[]): void => {
    if (depth === t) {
      best = Math.max(best, common.length);
      return;
    }
    for (let v = start; v < n; v++) {
      const next = depth === 0 ? [...g.neighborsOf(v)] : common.filter((w) => g.hasEdge(v, w));
      if (depth + 1 < t && next.length <= best) continue; // cannot beat the best
      rec(v + 1, depth + 1, next);
    }
  };
  rec(0, 0, []);
  return best;
}

describe("polarity graphs ER_q", () => {
  const qs = [2, 3, 4, 5, 7, 8, 9, 11, 13, 16, 25, 27];
  it("have q²+q+1 vertices, q+1 absolute points of degree q, the rest degree q+1, m = q(q+1)²/2, and no C4", () => {
    // Erdős–Rényi 1962; Brown 1966: ER_q is C4-free with these degrees.
    for (const q of qs) {
      const { graph: g, absolutePoints } = polarityWithAbsolutePoints(q);
      expect(g.n).toBe(q * q + q + 1);
      expect(g.m).toBe((q * (q + 1) * (q + 1)) / 2);
      expect(absolutePoints.length).toBe(q + 1);
      const abs = new Set(absolutePoints);
      expect(degrees(g).every((d, v) => d === (abs.has(v) ? q : q + 1))).toBe(true);
      expect(countFourCycles(g).total).toBe(0);
    }
  });

  it("with loops kept, have adjacency eigenvalues q+1 once and ±√q, (q²+q)/2 times each", () => {
    // A² = qI + J for the polarity matrix (Brown 1966), so the spectrum is q+1 and ±√q; trace A = q+1
    // (the absolute points) forces equal multiplicities.
    for (const q of [2, 3, 4, 5, 7, 8, 9]) {
      const { graph, absolutePoints } = polarityWithAbsolutePoints(q);
      const h = (q * q + q) / 2;
      expectClose(spectrum(graph, absolutePoints), multiset([[q + 1, 1], [Math.sqrt(q), h], [-Math.sqrt(q), h]]));
    }
  });

  it("have their absolute points exactly where x·x = 0", () => {
    // Definition of an absolute point of the orthogonal polarity (Brown 1966), evaluated coordinate-wise.
    for (const q of [3, 4, 7, 8, 9]) {
      const F = finiteField(q);
      const { absolutePoints } = polarityWithAbsolutePoints(q);
      const x = new Int32Array(3);
      const want: number[] = [];
      for (let i = 0; i < q * q + q + 1; i++) {
        pg2Coordinates(q, i, x);
        if (F.add(F.add(F.mul(x[0], x[0]), F.mul(x[1], x[1])), F.mul(x[2], x[2])) === 0) want.push(i);
      }
      expect([...absolutePoints]).toEqual(want);
    }
  });
});

describe("projective-plane incidence graphs", () => {
  it("are bipartite, (q+1)-regular on 2(q²+q+1) vertices, girth 6, two points share exactly one line", () => {
    // Axioms of a projective plane of order q; the incidence graph has girth 6 (e.g. Godsil–Royle, Algebraic Graph Theory, §5.6).
    for (const q of [2, 3, 4, 5, 7, 8, 9]) {
      const g = projectivePlaneIncidenceGraph(q);
      const N = q * q + q + 1;
      expect(g.n).toBe(2 * N);
      expect(degrees(g).every((d) => d === q + 1)).toBe(true);
      expect(bipartition(g).bipartite).toBe(true);
      expect(girth(g).girth).toBe(6);
      if (q <= 4) {
        for (let x = 0; x < N; x++) for (let y = x + 1; y < N; y++) {
          const common = [...g.neighborsOf(x)].filter((L) => g.hasEdge(y, L)).length;
          if (common !== 1) expect(`points ${x}, ${y} share ${common} lines`).toBe("");
        }
      }
    }
  });
});

describe("Kneser graphs", () => {
  const cases = [[5, 1], [5, 2], [6, 2], [6, 3], [7, 2], [7, 3], [8, 3], [9, 3], [9, 4], [10, 4]];
  it("have C(n,k) vertices, degree C(n−k,k), disjoint vertex sets on every edge", () => {
    for (const [n, k] of cases) {
      const g = kneserGraph(n, k);
      expect(g.n).toBe(binom(n, k));
      expect(degrees(g).every((d) => d === binom(n - k, k))).toBe(true);
      const sets = Array.from({ length: g.n }, (_, i) => kneserVertexSet(n, k, i));
      expect(new Set(sets.map((s) => s.join(","))).size).toBe(g.n);
      g.forEachEdge((u, v) => {
        if (sets[u].some((x) => sets[v].includes(x))) expect(`${sets[u]} meets ${sets[v]}`).toBe("");
      });
    }
  });

  it("have eigenvalues (−1)^j·C(n−k−j, k−j) with multiplicity C(n,j) − C(n,j−1)", () => {
    // Lovász 1979 (eigenvalues); multiplicities: Godsil–Royle, Algebraic Graph Theory, §9.4 (from memory).
    for (const [n, k] of cases) {
      const parts: [number, number][] = [];
      for (let j = 0; j <= k; j++) parts.push([(-1) ** j * binom(n - k - j, k - j), binom(n, j) - binom(n, j - 1)]);
      expectClose(spectrum(kneserGraph(n, k)), multiset(parts));
    }
  });

  it("are triangle-free exactly when n < 3k", () => {
    // Three pairwise disjoint k-sets exist iff n ≥ 3k (elementary).
    for (const [n, k] of [...cases, [11, 4], [12, 4], [13, 5]]) {
      expect(countTriangles(kneserGraph(n, k)).total === 0, `KG(${n},${k})`).toBe(n < 3 * k);
    }
  });

  it("have chromatic number n − 2k + 2 on small cases", () => {
    // Lovász 1978 (Kneser's conjecture).
    for (const [n, k] of [[5, 2], [6, 2], [7, 3], [6, 3], [4, 1], [5, 1]]) expect(chromaticNumber(kneserGraph(n, k)), `KG(${n},${k})`).toBe(n - 2 * k + 2);
  });
});

describe("strongly regular graphs", () => {
  it("srgParameters recognises small known cases and rejects non-srg graphs", () => {
    // C5 = srg(5,2,0,1), K3,3 = srg(6,3,0,3), C6 not srg (non-adjacent pairs have 1 or 0 common neighbours): common knowledge, no source.
    expect(srgParameters(family("cycle:n=5"))).toEqual({ n: 5, k: 2, lambda: 0, mu: 1 });
    expect(srgParameters(family("complete-bipartite:a=3,b=3"))).toEqual({ n: 6, k: 3, lambda: 0, mu: 3 });
    expect(srgParameters(family("cycle:n=6"))).toBeNull();
    expect(srgParameters(family("path:n=4"))).toBeNull();
    expect(srgParameters(family("complete:n=5"))).toBeNull();
  });

  it("Paley(q) is srg(q, (q−1)/2, (q−5)/4, (q−1)/4) with the srg spectrum", () => {
    // Paley 1933; parameters in Brouwer's srg tables; spectrum from the srg formula.
    for (const q of [5, 9, 13, 17, 25, 29, 37, 41, 49, 53, 61, 81, 101, 121, 125]) {
      const g = paleyGraph(q);
      const want = { n: q, k: (q - 1) / 2, lambda: (q - 5) / 4, mu: (q - 1) / 4 };
      expect(srgParameters(g)).toEqual(want);
      if (q <= 49) expectClose(spectrum(g), srgSpectrum(q, want.k, want.lambda, want.mu));
    }
  });

  it("Petersen srg(10,3,0,1), Clebsch srg(16,5,0,2), Hoffman–Singleton srg(50,7,0,1), Higman–Sims srg(100,22,0,6)", () => {
    // Brouwer's tables of strongly regular graphs; each is the unique graph with its parameters.
    const cases: [Graph, [number, number, number, number]][] = [
      [petersenGraph(), [10, 3, 0, 1]],
      [clebschGraph(), [16, 5, 0, 2]],
      [hoffmanSingletonGraph(), [50, 7, 0, 1]],
      [higmanSimsGraph(), [100, 22, 0, 6]],
    ];
    for (const [g, [n, k, l, mu]] of cases) {
      expect(srgParameters(g)).toEqual({ n, k, lambda: l, mu });
      expectClose(spectrum(g), srgSpectrum(n, k, l, mu));
    }
  });

  it("the Higman–Sims construction rests on the Golay code and S(3,6,22)", () => {
    // Extended Golay code weight enumerator 1, 759, 2576, 759, 1 (MacWilliams–Sloane, ch. 2 §6);
    // S(3,6,22) has 77 blocks and every 3 points lie in exactly one (Witt 1938).
    const words = extendedGolayCodewords();
    const byWeight = new Map<number, number>();
    for (const w of words) {
      let c = 0;
      for (let x = w; x; x &= x - 1) c++;
      byWeight.set(c, (byWeight.get(c) ?? 0) + 1);
    }
    expect([...byWeight].sort((a, b) => a[0] - b[0])).toEqual([[0, 1], [8, 759], [12, 2576], [16, 759], [24, 1]]);
    const hexads = steinerHexads();
    expect(hexads.length).toBe(77);
    let bad = 0;
    for (let a = 0; a < 22; a++) for (let b = a + 1; b < 22; b++) for (let c = b + 1; c < 22; c++) {
      const t = (1 << a) | (1 << b) | (1 << c);
      if (hexads.filter((h) => (h & t) === t).length !== 1) bad++;
    }
    expect(bad).toBe(0);
  });
});

describe("norm graphs", () => {
  it("t = 2: n = q(q−1), C4-free (any two vertices share at most one neighbour)", () => {
    // Alon–Rónyai–Szabó 1999 with t = 2: K_{2,2}-free.
    for (const q of [3, 4, 5, 7, 8, 9, 11, 13, 16]) {
      const g = normGraph(q, 2);
      expect(g.n).toBe(q * (q - 1));
      expect(countFourCycles(g).total).toBe(0);
    }
  });

  it("t = 3: any 3 vertices share at most 2 neighbours (K3,3-free); t = 4: any 4 share at most 6", () => {
    // Alon–Rónyai–Szabó 1999: H(q,t) is K_{t,(t−1)!+1}-free.
    for (const q of [3, 4, 5]) {
      const g = normGraph(q, 3);
      expect(g.n).toBe(q * q * (q - 1));
      expect(maxCommonNeighbours(g, 3)).toBeLessThanOrEqual(2);
    }
    const h = normGraph(3, 4);
    expect(h.n).toBe(54);
    expect(maxCommonNeighbours(h, 4)).toBeLessThanOrEqual(6);
  });
});

describe("triangle-free constructions", () => {
  it("Andrásfai graphs And(k) are k-regular on 3k−1 vertices and triangle-free", () => {
    // Andrásfai 1964.
    for (let k = 1; k <= 12; k++) {
      const g = andrasfaiGraph(k);
      expect(g.n).toBe(3 * k - 1);
      expect(degrees(g).every((d) => d === k)).toBe(true);
      expect(countTriangles(g).total).toBe(0);
    }
  });

  it("Mycielski steps from K2 (mycielski-chain) are triangle-free with chromatic number steps + 2", () => {
    // Mycielski 1955: μ keeps triangle-freeness and raises χ by one; sizes n' = 2n+1, m' = 3m+n.
    let n = 2, m = 1;
    for (let t = 0; t <= 5; t++) {
      const g = mycielskiChain(t);
      expect([g.n, g.m]).toEqual([n, m]);
      expect(countTriangles(g).total).toBe(0);
      if (t <= 3) expect(chromaticNumber(g), `μ^${t}(K2)`).toBe(t + 2);
      [n, m] = [2 * n + 1, 3 * m + n];
    }
  });

  it("Grötzsch (11 vertices, 20 edges) and Chvátal (12 vertices, 4-regular) are triangle-free and 4-chromatic", () => {
    // Grötzsch 1959 / Mycielski 1955; Chvátal 1970 (common knowledge: both have χ = 4).
    const gr = grotzschGraph();
    expect([gr.n, gr.m]).toEqual([11, 20]);
    const ch = chvatalGraph();
    expect([ch.n, ch.m]).toEqual([12, 24]);
    expect(degrees(ch).every((d) => d === 4)).toBe(true);
    for (const g of [gr, ch]) {
      expect(countTriangles(g).total).toBe(0);
      expect(chromaticNumber(g)).toBe(4);
    }
  });

  it("Heawood (girth 6, 14 vertices), Petersen and dodecahedron (girth 5), Hoffman–Singleton (girth 5)", () => {
    // Girths: Heawood 6 (the (3,6)-cage), Petersen 5 (the (3,5)-cage), dodecahedron 5, Hoffman–Singleton 5
    // (the (7,5)-cage) — Holton–Sheehan 1993; Hoffman–Singleton 1960.
    expect(girth(heawoodGraph()).girth).toBe(6);
    expect(girth(petersenGraph()).girth).toBe(5);
    expect(girth(dodecahedronGraph()).girth).toBe(5);
    expect(girth(hoffmanSingletonGraph()).girth).toBe(5);
  });

  it("complete multipartite K_{3,2,2} is the Turán graph T(7,3): 16 edges, K4-free, contains K3", () => {
    // Turán 1941: ex(7, K4) = ⌊(1 − 1/3)·49/2⌋ = 16, attained by T(7,3).
    const g = completeMultipartiteGraph([3, 2, 2]);
    expect(g.m).toBe(16);
    expect(findClique(g, 4).found).toBe(false);
    expect(findClique(g, 3).found).toBe(true);
  });
});

/** Specs covering every structured family, at defaults and at other parameter values. */
const SPECS = [
  ...STRUCTURED_FAMILIES.filter((d) => d.params.every((p) => p.default !== undefined)).map((d) => d.name),
  "complete:n=9", "complete-bipartite:a=1,b=5", "complete-bipartite:a=2,b=2", "complete-multipartite:parts=1+2+3+4",
  "complete-multipartite:parts=4+4", "cycle:n=3", "cycle:n=4", "cycle:n=11", "path:n=1", "path:n=2", "path:n=7",
  "hypercube:dim=1", "hypercube:dim=6", "circulant:n=10,s=5", "circulant:n=12,s=1+3+5", "circulant:n=9,s=1+3", "circulant:n=17,s=1+2+4+8",
  "cayley-zn:n=8,s=1+7", "cayley-gf2:dim=3,s=1+2+3", "cayley-gf2:dim=5,s=1+2+4+8+16+31", "cayley-gf2:dim=6,s=7+56",
  "generalized-petersen:n=9,k=3", "generalized-petersen:n=3,k=1", "generalized-petersen:n=12,k=5", "generalised-petersen:n=7,k=2",
  "polarity:q=2", "polarity:q=8", "projective-plane:q=2", "projective-plane:q=4", "norm-graph:q=4,t=2", "norm-graph:q=4,t=3",
  "norm-graph:q=2,t=3", "norm-graph:q=3,t=4", "norm-graph:q=9,t=2", "kneser:n=7,k=3", "kneser:n=9,k=3", "kneser:n=2,k=1",
  "paley:q=9", "paley:q=5", "andrasfai:k=1", "andrasfai:k=6", "mycielski-chain:steps=0", "mycielski-chain:steps=4",
];

describe("every structured family", () => {
  it("builds exactly the n, m and degree range its predicted size gives", () => {
    for (const spec of SPECS) {
      const { graph: g, family: name, params } = familyWithInfo(spec);
      const def = STRUCTURED_FAMILIES.find((d) => d.name === name)!;
      const e = def.predictedSize(params);
      const ds = degrees(g);
      expect({ spec, n: g.n, m: g.m, min: Math.min(...ds), max: Math.max(...ds) }).toEqual({
        spec,
        n: e.n,
        m: e.m,
        min: e.minDegree,
        max: e.maxDegree,
      });
      expect(e.mExact).toBe(true);
    }
  });

  it("is free of every pattern its freeOf lists (exhaustive subgraph search)", () => {
    // The claims are the cited theorems; this checks our graphs satisfy them.
    let claims = 0;
    for (const spec of SPECS) {
      const { graph: g, family: name, params } = familyWithInfo(spec);
      const def = STRUCTURED_FAMILIES.find((d) => d.name === name)!;
      for (const { pattern, citation } of def.freeOf(params)) {
        expect(citation.length).toBeGreaterThan(10);
        let found: boolean;
        if (pattern === "K3") found = countTriangles(g).total > 0;
        else if (pattern === "C4") found = countFourCycles(g).total > 0;
        else {
          const r = findSubgraph(g, patternGraph(pattern), { maxNodes: 50_000_000 });
          expect(r.found || r.exhaustive, `${spec} ${pattern}: search incomplete`).toBe(true);
          found = r.found;
        }
        expect(found, `${spec} claims ${pattern}-free`).toBe(false);
        claims++;
      }
    }
    // The loop must have checked claims, not passed over specs without any.
    expect(claims).toBeGreaterThan(SPECS.length);
  });

  it("names are unique, lower case, and every definition has a summary and valid defaults", () => {
    const names = STRUCTURED_FAMILIES.map((d) => d.name);
    expect(new Set(names).size).toBe(names.length);
    for (const d of STRUCTURED_FAMILIES) {
      expect(d.name).toMatch(/^[a-z][a-z0-9-]*$/);
      expect(d.summary.length).toBeGreaterThan(5);
      expect(d.random).toBe(false);
    }
    expect(names).toContain("complete");
  });

  it("typed builders and spec strings give identical graphs", () => {
    const same = (a: Graph, b: Graph) => a.n === b.n && a.offsets.every((x, i) => x === b.offsets[i]) && a.neighbors.every((x, i) => x === b.neighbors[i]);
    expect(same(kneserGraph(8, 3), family("kneser:n=8,k=3"))).toBe(true);
    expect(same(paleyGraph(29), family("paley:q=29"))).toBe(true);
    expect(same(normGraph(5, 3), buildFamily("norm-graph", { q: 5, t: 3 }).graph)).toBe(true);
    expect(same(andrasfaiGraph(4), family("andrasfai:k=4"))).toBe(true);
  });
});

describe("invalid parameters", () => {
  const cases: [string, RegExp][] = [
    ["polarity:q=6", /polarity: invalid `q`: should be a prime power/],
    ["polarity:q=1", /polarity: invalid `q`: should be an integer between 2 and 1000/],
    ["projective-plane:q=10", /projective-plane: invalid `q`: should be a prime power/],
    ["paley:q=7", /paley: invalid `q`: should be ≡ 1 \(mod 4\)/],
    ["paley:q=21", /paley: invalid `q`: should be a prime power/],
    ["norm-graph:q=6,t=2", /norm-graph: invalid `q`/],
    ["norm-graph:q=101,t=5", /norm-graph: invalid `t`: should keep q\^\(t−1\) at most/],
    ["kneser:n=7,k=4", /kneser: invalid `k`: should be at most n\/2 = 3.5/],
    ["kneser:n=31,k=2", /kneser: invalid `n`: should be an integer between 2 and 30/],
    ["generalized-petersen:n=8,k=4", /generalized-petersen: invalid `k`: should be less than n\/2 = 4/],
    ["circulant:n=10,s=0+3", /circulant: invalid `s`: should list integers between 1 and n−1 = 9/],
    ["circulant:n=10,s=3+3", /circulant: invalid `s`: should list each element once/],
    ["cayley-zn:n=5,s=5", /circulant: invalid `s`/], // an alias reports under the family's own name
    ["cayley-gf2:dim=3,s=1+8", /cayley-gf2: invalid `s`: should list bitmasks between 1 and 2\^dim − 1 = 7/],
    ["complete-multipartite:parts=2+0", /complete-multipartite: invalid `parts`/],
    ["hypercube:dim=0", /hypercube: invalid `dim`/],
    ["cycle:n=2", /cycle: invalid `n`: should be an integer between 3/],
    ["andrasfai:k=2.5", /andrasfai: invalid `k`: should be an integer/],
    ["mycielski-chain:steps=-1", /mycielski-chain: invalid `steps`/],
    ["regular:n=10,d=3", /unknown family "regular": it is now called random-regular/],
    ["petersen:n=3", /petersen: unknown parameter `n`/],
  ];
  it("throw one-line InputErrors naming the parameter and its valid range", () => {
    // Input validation, common practice, no source.
    for (const [spec, re] of cases) {
      let err: unknown;
      try {
        family(spec);
      } catch (e) {
        err = e;
      }
      expect(err, spec).toBeInstanceOf(InputError);
      expect((err as Error).message, spec).toMatch(re);
      expect((err as Error).message).not.toContain("\n");
    }
  });

  it("typed builders validate the same way", () => {
    // Input validation, common practice, no source.
    expect(() => kneserGraph(5, 3)).toThrow(/kneser: invalid `k`/);
    expect(() => paleyGraph(11)).toThrow(/paley: invalid `q`/);
    expect(() => normGraph(10, 2)).toThrow(/norm-graph: invalid `q`/);
    expect(() => polarityWithAbsolutePoints(15)).toThrow(/polarity: invalid `q`/);
    // KG(30,15) is a perfect matching on C(30,15) ≈ 1.55·10^8 vertices: refused before allocating, as spec strings are.
    expect(() => kneserGraph(30, 15)).toThrow(/kneser:n=30,k=15: about 1\.55e\+8 vertices would not fit in memory/);
    expect(() => family("kneser:n=30,k=14")).toThrow(/edges would not fit in memory/);
    expect(() => family("kneser:n=30,k=15")).toThrow(/would not fit in memory/);
  });
});
