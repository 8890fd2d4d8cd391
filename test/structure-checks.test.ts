// Structure checks against closed-form facts about named graphs and against brute-force
// oracles on small random graphs; every witness a check returns is verified edge by edge.
import { describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import {
  bipartition,
  connectedComponents,
  countFourCycles,
  countTriangles,
  degeneracy,
  degreeStats,
  describeGraph,
  findCompleteBipartite,
  findClique,
  findCycle,
  findSubgraph,
  girth,
  parsePatternName,
  patternGraph,
  symmetryConditions,
} from "../src/graph/structure/index.js";
import { Rng } from "../src/random/prng.js";
import { complete, cycle, petersen, randomGraph } from "./helpers/graphs.js";

// ---- helpers: graphs, witnesses, brute force -------------------------------------------

function completeBipartite(s: number, t: number): Graph {
  const e: [number, number][] = [];
  for (let u = 0; u < s; u++) for (let v = s; v < s + t; v++) e.push([u, v]);
  return graphFromEdges(s + t, e);
}

function expectCycle(g: Graph, c: readonly number[] | null, k?: number): void {
  expect(c).not.toBeNull();
  const cyc = c!;
  if (k !== undefined) expect(cyc.length).toBe(k);
  expect(cyc.length).toBeGreaterThanOrEqual(3);
  expect(new Set(cyc).size).toBe(cyc.length);
  for (let i = 0; i < cyc.length; i++) expect(g.hasEdge(cyc[i], cyc[(i + 1) % cyc.length])).toBe(true);
}

function expectClique(g: Graph, c: readonly number[] | null, r: number): void {
  expect(c).not.toBeNull();
  expect(c!.length).toBe(r);
  expect(new Set(c).size).toBe(r);
  for (let i = 0; i < r; i++) for (let j = i + 1; j < r; j++) expect(g.hasEdge(c![i], c![j])).toBe(true);
}

function expectEmbedding(g: Graph, p: Graph, emb: Int32Array): void {
  expect(emb.length).toBe(p.n);
  expect(new Set(emb).size).toBe(p.n);
  for (const x of emb) expect(x >= 0 && x < g.n).toBe(true);
  p.forEachEdge((a, b) => expect(g.hasEdge(emb[a], emb[b])).toBe(true));
}

/** All k-subsets of 0..n-1 (lexicographic). */
function* subsets(n: number, k: number): Generator<number[]> {
  const a = Array.from({ length: k }, (_, i) => i);
  if (k > n) return;
  for (;;) {
    yield a.slice();
    let i = k - 1;
    while (i >= 0 && a[i] === n - k + i) i--;
    if (i < 0) return;
    a[i]++;
    for (let j = i + 1; j < k; j++) a[j] = a[j - 1] + 1;
  }
}

function* permutations(xs: number[]): Generator<number[]> {
  if (xs.length <= 1) {
    yield xs.slice();
    return;
  }
  for (let i = 0; i < xs.length; i++) {
    const rest = [...xs.slice(0, i), ...xs.slice(i + 1)];
    for (const p of permutations(rest)) yield [xs[i], ...p];
  }
}

// Brute force oracles (common practice, no source): try every vertex subset / ordering.
function bruteClique(g: Graph, r: number): boolean {
  for (const s of subsets(g.n, r)) {
    let ok = true;
    for (let i = 0; i < r && ok; i++) for (let j = i + 1; j < r && ok; j++) ok = g.hasEdge(s[i], s[j]);
    if (ok) return true;
  }
  return false;
}

function bruteCycle(g: Graph, k: number): boolean {
  for (const s of subsets(g.n, k)) {
    // Fix the first vertex; try every ordering of the rest as a Hamiltonian cycle of the subset.
    for (const p of permutations(s.slice(1))) {
      const c = [s[0], ...p];
      let ok = true;
      for (let i = 0; i < k && ok; i++) ok = g.hasEdge(c[i], c[(i + 1) % k]);
      if (ok) return true;
    }
  }
  return false;
}

function bruteEmbeds(g: Graph, p: Graph): boolean {
  const pe: [number, number][] = [];
  p.forEachEdge((a, b) => pe.push([a, b]));
  for (const s of subsets(g.n, p.n)) {
    for (const img of permutations(s)) if (pe.every(([a, b]) => g.hasEdge(img[a], img[b]))) return true;
  }
  return false;
}

function bruteTriangles(g: Graph): number {
  let t = 0;
  for (const [a, b, c] of subsets(g.n, 3)) if (g.hasEdge(a, b) && g.hasEdge(b, c) && g.hasEdge(a, c)) t++;
  return t;
}

function bruteFourCycles(g: Graph): number {
  // A 4-set {a,b,c,d} carries up to three distinct 4-cycles: abcd, abdc, acbd.
  let t = 0;
  const e = (x: number, y: number) => g.hasEdge(x, y);
  for (const [a, b, c, d] of subsets(g.n, 4)) {
    if (e(a, b) && e(b, c) && e(c, d) && e(d, a)) t++;
    if (e(a, b) && e(b, d) && e(d, c) && e(c, a)) t++;
    if (e(a, c) && e(c, b) && e(b, d) && e(d, a)) t++;
  }
  return t;
}

// ---- named graphs ----------------------------------------------------------------------

describe("Petersen graph", () => {
  // Petersen graph: n 10, m 15, 3-regular, girth 5, triangle-free, no C4, degeneracy 3,
  // not bipartite (it has 5-cycles), connected (from memory; textbook facts).
  const g = petersen();
  it("has the textbook invariants", () => {
    expect([g.n, g.m]).toEqual([10, 15]);
    const d = degreeStats(g);
    expect([d.min, d.max, d.mean]).toEqual([3, 3, 3]);
    expect(d.weighted).toBeNull();
    expect(degeneracy(g).degeneracy).toBe(3);
    expect(countTriangles(g).total).toBe(0);
    expect(countFourCycles(g).total).toBe(0);
    const gi = girth(g);
    expect(gi.girth).toBe(5);
    expectCycle(g, gi.cycle, 5);
    const b = bipartition(g);
    expect(b.bipartite).toBe(false);
    if (!b.bipartite) {
      expectCycle(g, b.oddCycle);
      expect(b.oddCycle.length % 2).toBe(1);
    }
    expect(connectedComponents(g).count).toBe(1);
  });
  it("contains C5, C6, C8 but not C3, C4, C7 (from memory: Petersen has no 7-cycle)", () => {
    // Cycle lengths of the Petersen graph are 5, 6, 8, 9 (from memory; it is hypohamiltonian, so no 10).
    for (const k of [3, 4, 5, 6, 7, 8]) {
      const r = findCycle(g, k);
      expect(r.found, `C${k}`).toBe([5, 6, 8].includes(k));
      expect(r.exhaustive).toBe(true);
      if (r.found) expectCycle(g, r.witness, k);
      expect(r.found).toBe(bruteCycle(g, k));
    }
  });
  it("describeGraph reports it", () => {
    const s = describeGraph(g);
    expect(s).toMatchObject({
      n: 10, m: 15, totalWeight: 15, minDegree: 3, maxDegree: 3, avgDegree: 3, degeneracy: 3,
      triangles: 0, fourCycles: 0, girth: 5, bipartite: false, components: 1,
      free: { K3: true, K4: true, C4: true, C5: false },
      unknown: [],
    });
    expectCycle(g, s.witnesses.C5, 5);
    // Any K2,3 contains a 4-cycle, so a C4-free graph has none (common practice, no source).
    expect(findSubgraph(g, patternGraph("K2,3")).found).toBe(false);
  });
});

describe("complete, complete bipartite and cycle graphs", () => {
  // Closed forms (common knowledge, from memory): K_n has C(n,3) triangles and 3·C(n,4)
  // 4-cycles, degeneracy n−1; K_{s,t} has C(s,2)·C(t,2) 4-cycles, girth 4, degeneracy min(s,t);
  // C_n has girth n.
  const choose = (a: number, b: number): number => (b < 0 || b > a ? 0 : b === 0 ? 1 : (choose(a - 1, b - 1) * a) / b);
  it("K_n", () => {
    for (const n of [1, 2, 3, 4, 7, 12]) {
      const g = complete(n);
      expect(countTriangles(g).total).toBe(choose(n, 3));
      expect(countFourCycles(g).total).toBe(3 * choose(n, 4));
      expect(degeneracy(g).degeneracy).toBe(Math.max(0, n - 1));
      expect(girth(g).girth).toBe(n >= 3 ? 3 : null);
      const tri = countTriangles(g);
      for (let v = 0; v < n; v++) expect(tri.perVertex[v]).toBe(choose(n - 1, 2));
      for (let r = 1; r <= 6; r++) {
        const c = findClique(g, r);
        expect(c.found).toBe(r <= n);
        if (c.found) expectClique(g, c.witness, r);
      }
      for (let k = 3; k <= 8; k++) {
        const c = findCycle(g, k);
        expect(c.found).toBe(k <= n);
        if (c.found) expectCycle(g, c.witness, k);
      }
    }
  });
  it("K_{s,t}", () => {
    for (const [s, t] of [[1, 5], [2, 2], [2, 3], [3, 3], [4, 6]]) {
      const g = completeBipartite(s, t);
      expect(countFourCycles(g).total).toBe(choose(s, 2) * choose(t, 2));
      expect(countTriangles(g).total).toBe(0);
      expect(degeneracy(g).degeneracy).toBe(Math.min(s, t));
      expect(girth(g).girth).toBe(s >= 2 && t >= 2 ? 4 : null);
      const b = bipartition(g);
      expect(b.bipartite).toBe(true);
      if (b.bipartite) g.forEachEdge((u, v) => expect(b.sides[u]).not.toBe(b.sides[v]));
      // A bipartite graph has no odd cycles; K_{s,t} has an even cycle C_{2j} iff j ≤ min(s,t), j ≥ 2.
      for (let k = 3; k <= 8; k++) expect(findCycle(g, k).found).toBe(k % 2 === 0 && k / 2 <= Math.min(s, t));
    }
  });
  it("C_n and long paths (no recursion limits)", () => {
    for (const n of [3, 4, 5, 9, 1000]) {
      const g = cycle(n);
      const gi = girth(g);
      expect(gi.girth).toBe(n);
      expectCycle(g, gi.cycle, n);
      expect(bipartition(g).bipartite).toBe(n % 2 === 0);
      expect(degeneracy(g).degeneracy).toBe(2);
    }
    const n = 200_000;
    const path = graphFromEdges(n, Array.from({ length: n - 1 }, (_, i) => [i, i + 1] as [number, number]));
    expect(connectedComponents(path).count).toBe(1);
    expect(girth(path)).toEqual({ girth: null, cycle: null });
    expect(bipartition(path).bipartite).toBe(true);
    expect(degeneracy(path).degeneracy).toBe(1);
  });
  it("the 3-cube Q3 contains C4 and C6 but not K2,3 (from memory: two vertices of Q3 share at most 2 neighbours)", () => {
    const e: [number, number][] = [];
    for (let v = 0; v < 8; v++) for (let b = 0; b < 3; b++) if (v < (v ^ (1 << b))) e.push([v, v ^ (1 << b)]);
    const q3 = graphFromEdges(8, e);
    expect(countFourCycles(q3).total).toBe(6); // the six faces (from memory)
    expect(findSubgraph(q3, patternGraph("K2,3")).found).toBe(false);
    expect(findSubgraph(q3, patternGraph("C6")).found).toBe(true);
    expect(findSubgraph(q3, patternGraph("C8")).found).toBe(true); // Q3 is Hamiltonian (Gray code)
    // K_{3,3} minus an edge still contains K_{2,3} (common practice, no source).
    const k33 = completeBipartite(3, 3);
    const minus: [number, number][] = [];
    k33.forEachEdge((u, v) => { if (!(u === 2 && v === 5)) minus.push([u, v]); });
    const h = graphFromEdges(6, minus);
    const r = findSubgraph(h, patternGraph("K_{2,3}"));
    expect(r.found).toBe(true);
    if (r.found) expectEmbedding(h, patternGraph("K2,3"), r.embedding);
  });
});

// ---- random graphs vs brute force --------------------------------------------------------

describe("random small graphs vs brute force (common practice, no source)", () => {
  const rng = new Rng(20240611);
  const graphs: Graph[] = [];
  for (let t = 0; t < 120; t++) {
    const n = 3 + rng.nextInt(7); // 3..9 vertices
    graphs.push(randomGraph(n, 0.15 + 0.7 * rng.nextFloat(), rng));
  }

  it("triangle and 4-cycle counts, per-vertex triangles", () => {
    for (const g of graphs) {
      const tri = countTriangles(g);
      expect(tri.total).toBe(bruteTriangles(g));
      expect(tri.perVertex.reduce((a, b) => a + b, 0)).toBe(3 * tri.total);
      if (tri.total > 0) expectClique(g, tri.witness, 3);
      else expect(tri.witness).toBeNull();
      const c4 = countFourCycles(g);
      expect(c4.total).toBe(bruteFourCycles(g));
      if (c4.total > 0) expectCycle(g, c4.witness, 4);
      else expect(c4.witness).toBeNull();
    }
  });

  it("K_r for r ≤ 6 and C_k for k ≤ 8", () => {
    for (const g of graphs) {
      for (let r = 3; r <= 6; r++) {
        const c = findClique(g, r);
        expect(c.found).toBe(bruteClique(g, r));
        expect(c.exhaustive).toBe(true);
        if (c.found) expectClique(g, c.witness, r);
      }
      for (let k = 3; k <= Math.min(8, g.n); k++) {
        const c = findCycle(g, k);
        expect(c.found, `C${k} in n=${g.n} m=${g.m}`).toBe(bruteCycle(g, k));
        if (c.found) expectCycle(g, c.witness, k);
      }
    }
  });

  it("girth, bipartiteness, components and degeneracy", () => {
    for (const g of graphs) {
      let expected: number | null = null;
      for (let k = 3; k <= g.n && expected === null; k++) if (bruteCycle(g, k)) expected = k;
      const gi = girth(g);
      expect(gi.girth).toBe(expected);
      if (expected !== null) expectCycle(g, gi.cycle, expected);
      // Bipartite ⇔ some 2-colouring has no monochromatic edge: try all 2^n colourings.
      let brute = false;
      for (let mask = 0; mask < 1 << g.n && !brute; mask++) {
        let ok = true;
        g.forEachEdge((u, v) => { if (((mask >> u) & 1) === ((mask >> v) & 1)) ok = false; });
        brute = ok;
      }
      const b = bipartition(g);
      expect(b.bipartite).toBe(brute);
      if (b.bipartite) g.forEachEdge((u, v) => expect(b.sides[u]).not.toBe(b.sides[v]));
      else {
        expectCycle(g, b.oddCycle);
        expect(b.oddCycle.length % 2).toBe(1);
      }
      const cc = connectedComponents(g);
      for (let u = 0; u < g.n; u++) for (const v of g.neighborsOf(u)) expect(cc.label[u]).toBe(cc.label[v]);
      expect(cc.sizes.reduce((a, b) => a + b, 0)).toBe(g.n);
      // Degeneracy = max over subgraphs of the min degree; removal order has ≤ d later neighbours.
      const dg = degeneracy(g);
      let bestMin = 0;
      for (let mask = 1; mask < 1 << g.n; mask++) {
        let md = Infinity;
        for (let v = 0; v < g.n; v++) {
          if (!((mask >> v) & 1)) continue;
          let d = 0;
          for (const w of g.neighborsOf(v)) if ((mask >> w) & 1) d++;
          md = Math.min(md, d);
        }
        bestMin = Math.max(bestMin, md);
      }
      expect(dg.degeneracy).toBe(bestMin);
      expect([...dg.order].sort((a, b) => a - b)).toEqual(Array.from({ length: g.n }, (_, i) => i));
      for (let i = 0; i < g.n; i++) {
        const v = dg.order[i];
        expect(dg.position[v]).toBe(i);
        let later = 0;
        for (const w of g.neighborsOf(v)) if (dg.position[w] > i) later++;
        expect(later).toBeLessThanOrEqual(dg.degeneracy);
        expect(later).toBeLessThanOrEqual(dg.coreNumber[v]);
      }
    }
  });

  it("findSubgraph agrees with findClique, findCycle and brute force", () => {
    const patterns = ["K3", "K4", "C4", "C5", "K2,3", "P4", "K1,3", "C6"].map((p) => [p, patternGraph(p)] as const);
    // A pattern that is not connected: a triangle plus a disjoint edge.
    const mixed = graphFromEdges(5, [[0, 1], [1, 2], [0, 2], [3, 4]]);
    for (const g of graphs.slice(0, 60)) {
      for (const [name, p] of patterns) {
        // "auto" hands K_r, C_k and K_{s,t} to the dedicated searches; "backtracking" never does.
        const auto = findSubgraph(g, p);
        const plain = findSubgraph(g, p, { strategy: "backtracking" });
        expect(plain.method).toBe("backtracking");
        expect(auto.found).toBe(plain.found);
        for (const r of [auto, plain]) {
          if (r.found) expectEmbedding(g, p, r.embedding);
          else expect(r.exhaustive).toBe(true);
        }
        if (name[0] === "K" && !name.includes(",")) expect(plain.found).toBe(findClique(g, p.n).found);
        if (name[0] === "C") expect(plain.found).toBe(findCycle(g, p.n).found);
        if (g.n <= 7) expect(plain.found, `${name} in n=${g.n}`).toBe(bruteEmbeds(g, p));
      }
      const r = findSubgraph(g, mixed);
      expect(r.method).toBe("backtracking");
      if (r.found) expectEmbedding(g, mixed, r.embedding);
      if (g.n <= 7) expect(r.found).toBe(bruteEmbeds(g, mixed));
    }
  });

  it("random patterns on up to 6 vertices vs brute force", () => {
    const prng = new Rng(4242);
    for (const g of graphs.filter((h) => h.n <= 7).slice(0, 40)) {
      for (let t = 0; t < 6; t++) {
        const p = randomGraph(2 + prng.nextInt(5), 0.2 + 0.6 * prng.nextFloat(), prng);
        const r = findSubgraph(g, p);
        expect(r.found).toBe(bruteEmbeds(g, p));
        if (r.found) expectEmbedding(g, p, r.embedding);
      }
    }
  });

  it("findCompleteBipartite for 1 ≤ s, t ≤ 4 (either side order)", () => {
    for (const g of graphs.slice(0, 80)) {
      for (let s = 1; s <= 4; s++) {
        for (let t = 1; t <= 4; t++) {
          if (s + t > 7) continue;
          const r = findCompleteBipartite(g, s, t);
          const plain = findSubgraph(g, completeBipartite(s, t), { strategy: "backtracking" });
          expect(r.found, `K${s},${t}`).toBe(plain.found);
          if (g.n <= 7) expect(r.found).toBe(bruteEmbeds(g, completeBipartite(s, t)));
          if (r.witness !== null) {
            expect(r.witness.left.length).toBe(s);
            expect(r.witness.right.length).toBe(t);
            const all = [...r.witness.left, ...r.witness.right];
            expect(new Set(all).size).toBe(s + t);
            for (const a of r.witness.left) for (const b of r.witness.right) expect(g.hasEdge(a, b)).toBe(true);
          }
        }
      }
    }
  });
});

describe("larger random graphs: witnesses and consistency", () => {
  it("C_k witnesses on graphs of a few hundred vertices, and triangles vs K3 search", () => {
    const rng = new Rng(7);
    for (let t = 0; t < 6; t++) {
      const n = 200 + rng.nextInt(200);
      const g = randomGraph(n, (1.5 + rng.nextFloat() * 2) / n, rng);
      const tri = countTriangles(g);
      expect(findClique(g, 3).found).toBe(tri.total > 0);
      expect(findCycle(g, 4).found).toBe(countFourCycles(g).total > 0);
      const gi = girth(g);
      if (gi.girth !== null) {
        expectCycle(g, gi.cycle, gi.girth);
        for (let k = 3; k < Math.min(gi.girth, 9); k++) expect(findCycle(g, k).found).toBe(false);
      }
      for (let k = 3; k <= 8; k++) {
        const c = findCycle(g, k);
        if (c.found) expectCycle(g, c.witness, k);
        const s = findSubgraph(g, patternGraph(`C${k}`));
        expect(s.found).toBe(c.found);
      }
    }
  });
  it("budgets: an exhausted budget says exhaustive: false", () => {
    const g = petersen();
    const r = findSubgraph(g, patternGraph("C7"), { maxNodes: 5, strategy: "backtracking" });
    expect(r).toEqual({ found: false, exhaustive: false, nodesExplored: 5, method: "backtracking" });
    expect(findSubgraph(g, patternGraph("C7"), { maxNodes: 5 })).toMatchObject({ found: false, exhaustive: false, method: "cycle" });
    expect(findCompleteBipartite(complete(8), 3, 3, { maxNodes: 2 }).found).toBe(true); // two nodes: the 2nd and 3rd left vertex
    expect(findCompleteBipartite(complete(8), 3, 3, { maxNodes: 1 })).toMatchObject({ found: false, exhaustive: false });
    expect(findSubgraph(g, patternGraph("C7")).exhaustive).toBe(true);
    expect(findCycle(g, 7, { maxNodes: 3 }).exhaustive).toBe(false);
    const s = describeGraph(complete(6), { skip: ["triangles", "fourCycles", "girth"], maxSearchNodes: 1 });
    expect(s.triangles).toBeNull();
    expect(s.free.K4).toBeNull();
    expect(s.unknown).toEqual(expect.arrayContaining(["triangles", "fourCycles", "girth", "free.K4", "free.C5"]));
  });
});

describe("symmetry conditions used by findSubgraph", () => {
  // Orbit–stabiliser theorem (common knowledge): along a stabiliser chain the orbit sizes
  // multiply to |Aut(P)|. Each condition block [v, w1..wj] is an orbit of size j + 1.
  const orbitProduct = (p: Graph): number => {
    const sizes = new Map<number, number>();
    for (const [a] of symmetryConditions(p)) sizes.set(a, (sizes.get(a) ?? 1) + 1);
    return [...sizes.values()].reduce((x, y) => x * y, 1);
  };
  const bruteAut = (p: Graph): number => {
    let count = 0;
    const e: [number, number][] = [];
    p.forEachEdge((a, b) => e.push([a, b]));
    for (const s of permutations(Array.from({ length: p.n }, (_, i) => i))) if (e.every(([a, b]) => p.hasEdge(s[a], s[b]))) count++;
    return count;
  };
  it("orbit sizes multiply to |Aut| on named and random patterns", () => {
    // |Aut K_r| = r!, |Aut C_k| = 2k, |Aut K_{s,t}| = s!·t! (s ≠ t), |Aut P_k| = 2 (common knowledge).
    expect(orbitProduct(patternGraph("K5"))).toBe(120);
    expect(orbitProduct(patternGraph("C7"))).toBe(14);
    expect(orbitProduct(patternGraph("K2,3"))).toBe(12);
    expect(orbitProduct(patternGraph("K3,3"))).toBe(72);
    expect(orbitProduct(patternGraph("P5"))).toBe(2);
    // |Aut(Petersen)| = 120 (from memory: it is S5 acting on 2-subsets).
    expect(orbitProduct(petersen())).toBe(120);
    const rng = new Rng(99);
    for (let t = 0; t < 40; t++) {
      const p = randomGraph(2 + rng.nextInt(6), rng.nextFloat(), rng);
      expect(orbitProduct(p)).toBe(bruteAut(p));
    }
  });
  it("symmetric patterns embed where they should", () => {
    const pg = petersen();
    const r = findSubgraph(pg, pg);
    expect(r.found).toBe(true);
    if (r.found) expectEmbedding(pg, pg, r.embedding);
    expect(findSubgraph(complete(10), pg).found).toBe(true);
    const minus: [number, number][] = [];
    pg.forEachEdge((u, v) => { if (!(u === 0 && v === 1)) minus.push([u, v]); });
    expect(findSubgraph(graphFromEdges(10, minus), pg)).toMatchObject({ found: false, exhaustive: true });
  });
});

describe("weighted graphs, patterns and input errors", () => {
  it("weighted degree statistics", () => {
    const g = graphFromEdges(3, [[0, 1, 2.5], [1, 2, -1]]);
    const d = degreeStats(g);
    expect(d).toMatchObject({ min: 1, max: 2, minVertex: 0, maxVertex: 1 });
    expect(d.weighted).toEqual({ min: -1, max: 2.5, mean: 1.5 / 3 * 2, minVertex: 2, maxVertex: 0 });
    expect(describeGraph(g).totalWeight).toBe(1.5);
  });
  it("parses pattern names", () => {
    expect(parsePatternName("K_{2,3}")).toEqual({ kind: "complete-bipartite", name: "K2,3", sizes: [2, 3] });
    expect(parsePatternName("c5").name).toBe("C5");
    const p4 = patternGraph("P4");
    expect([p4.n, p4.m]).toEqual([4, 3]);
    const k23 = patternGraph("K2,3");
    expect([k23.n, k23.m]).toEqual([5, 6]);
    for (const bad of ["K", "C2", "X5", "K0", "K2,", "C3,4", "K{3", "K9,9", "P0"]) {
      expect(() => patternGraph(bad)).toThrow(InputError);
    }
  });
  it("rejects out-of-range parameters, naming them", () => {
    // Input validation, common practice, no source.
    const g = petersen();
    expect(() => findClique(g, 0)).toThrow(/`r`/);
    expect(() => findCycle(g, 2)).toThrow(/`k`/);
    expect(() => findCycle(g, 3.5)).toThrow(InputError);
    expect(() => findSubgraph(g, complete(17))).toThrow(/pattern/);
    expect(() => findSubgraph(g, complete(3), { maxNodes: -1 })).toThrow(/maxNodes/);
    expect(() => findSubgraph(g, complete(3), { strategy: "fast" as never })).toThrow(/strategy/);
    expect(() => findCompleteBipartite(g, 0, 3)).toThrow(/`s`/);
    expect(() => findCompleteBipartite(g, 17, 20)).toThrow(/smaller side/);
    expect(() => describeGraph(g, { skip: ["bogus" as never] })).toThrow(/skip/);
  });
  it("handles the empty graph", () => {
    const g = graphFromEdges(0, []);
    const s = describeGraph(g);
    expect(s).toMatchObject({ n: 0, m: 0, triangles: 0, fourCycles: 0, girth: null, bipartite: true, components: 0 });
    expect(findClique(g, 1).found).toBe(false);
    expect(findSubgraph(g, patternGraph("K1")).found).toBe(false);
  });
});
