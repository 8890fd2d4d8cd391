// The decomposition cut for H-free graphs: on K4-free process graphs, blow-ups of triangle-free and
// K4-free graphs and a K5-free Turán graph, the cut is re-evaluated by cutValue, its stage
// guarantees add up to at most its surplus, and every piece set aside is H′-free by the structure
// checks; on all small connected graphs it never beats brute force.
import { describe, expect, it } from "vitest";
import { decompositionBounds, decompositionCut, patternMinusVertex, type DecompositionCutRecord } from "../src/cut/decomposition/decomposition-cut.js";
import { InputError } from "../src/errors.js";
import { family } from "../src/families/registry.js";
import { graphFromEdges } from "../src/graph/builder.js";
import { cutValue, surplusOf } from "../src/graph/cut-value.js";
import { parseGraph6 } from "../src/graph/formats/graph6.js";
import type { Graph } from "../src/graph/graph.js";
import { inducedSubgraph } from "../src/graph/induced.js";
import { patternGraph } from "../src/graph/structure/patterns.js";
import { findSubgraph } from "../src/graph/structure/subgraph.js";
import { countTriangles } from "../src/graph/structure/triangles.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";
import { gengLines } from "./helpers/nauty.js";
import { itNeeds, tool } from "./helpers/requirements.js";

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

/** Everything a decomposition cut promises, re-derived from the graph and the record alone. */
function checkRecord(g: Graph, r: DecompositionCutRecord): void {
  // The one cut evaluator (src/graph/cut-value.ts) confirms the value.
  expect(r.partition.length).toBe(g.n);
  expect(cutValue(g, r.partition)).toBe(r.value);
  expect(r.surplus).toBe(surplusOf(g, r.value));
  expect(r.reached).toBe(true);
  // Stages split the edges; each reaches its guarantee; the guarantees add up to at most the surplus.
  expect(sum(r.stages.map((s) => s.m))).toBe(g.m);
  expect(sum(r.stages.map((s) => s.surplus))).toBeCloseTo(r.surplus, 9);
  expect(sum(r.stages.map((s) => s.guarantee))).toBeCloseTo(r.guarantee, 9);
  expect(r.guarantee).toBeLessThanOrEqual(r.surplus + 1e-9);
  for (const s of r.stages) {
    expect(s.surplus).toBeGreaterThanOrEqual(s.guarantee - 1e-9);
    // Method of conditional expectations: at least half of the edges between parts are cut.
    if (s.kind === "between") expect(s.guarantee).toBe(0);
  }
  // Top level: remainder and pieces partition the vertices; each piece lies in its centre's neighbourhood.
  const owner = new Int32Array(g.n).fill(-1);
  for (const v of r.remainder) owner[v] = -2;
  const placedBefore = new Uint8Array(g.n);
  for (const v of r.remainder) placedBefore[v] = 1;
  for (const p of r.pieces) {
    const sub = inducedSubgraph(g, p.vertices);
    expect(sub.n).toBe(p.n);
    expect(sub.m).toBe(p.m);
    expect(countTriangles(sub).total).toBe(p.triangles);
    for (const v of p.vertices) expect(g.hasEdge(p.centre, v)).toBe(true);
    const side = p.vertices.map((v) => r.partition[v]);
    expect(surplusOf(sub, cutValue(sub, side))).toBeCloseTo(p.surplus, 9);
    expect(p.surplus).toBeGreaterThanOrEqual(p.guarantee - 1e-9);
    if (p.method === "exact" && p.n <= 16) expect(p.surplus).toBe(bruteForceMaxCut(sub) - sub.m / 2);
    if (p.freeOf !== null) {
      // Structure checks (src/graph/structure/subgraph.ts): an exhaustive search finds no H′.
      const s = findSubgraph(sub, patternGraph(p.freeOf));
      expect(s.exhaustive).toBe(true);
      expect(s.found).toBe(false);
    }
    if (p.parent === null) {
      for (const v of p.vertices) {
        expect(owner[v]).toBe(-1);
        owner[v] = p.id;
      }
      // This piece's edges to everything placed before it are cut at least half the time.
      let edges = 0;
      let cut = 0;
      for (const v of p.vertices)
        for (const u of g.neighborsOf(v))
          if (placedBefore[u]) {
            edges++;
            if (r.partition[u] !== r.partition[v]) cut++;
          }
      expect(2 * cut).toBeGreaterThanOrEqual(edges);
      for (const v of p.vertices) placedBefore[v] = 1;
    } else {
      const parent = new Set(r.pieces[p.parent].vertices);
      for (const v of p.vertices) expect(parent.has(v)).toBe(true);
      expect(p.level).toBe(r.pieces[p.parent].level + 1);
    }
  }
  expect(Array.from(owner).every((o) => o !== -1)).toBe(true);
  // The peeling stopped because the remainder has few triangles: T ≤ c·m·√Δ.
  const rest = inducedSubgraph(g, r.remainder);
  let maxDegree = 0;
  for (let v = 0; v < rest.n; v++) maxDegree = Math.max(maxDegree, rest.degree(v));
  expect(countTriangles(rest).total).toBeLessThanOrEqual(r.thresholds.triangleFactor * rest.m * Math.sqrt(maxDegree) + 1e-9);
}

describe("decomposition cut on K4-free graphs", () => {
  for (const spec of ["hfree-process:n=60,h=K4,seed=1", "hfree-process:n=60,h=K4,seed=2", "hfree-process:n=100,h=K4,seed=3", "hfree-process:n=140,h=K4,seed=4"]) {
    it(`${spec} (the K4-free process): a valid cut, guarantees adding up, every piece triangle-free`, () => {
      const g = family(spec);
      const r = decompositionCut(g, { pattern: "K4", solverSeed: 1 });
      expect(r.pattern).toBe("K4");
      expect(r.thresholds.maxDepth).toBe(0); // r − 4 for K_r
      expect(r.pieces.length).toBeGreaterThan(0);
      for (const p of r.pieces) expect(p.freeOf).toBe("K3");
      checkRecord(g, r);
      expect(r.surplus).toBeGreaterThan(0);
    });
  }

  it("blow-up of a K4-free process graph (K4-free: a clique meets each copy set once): pieces triangle-free", () => {
    const g = family("blow-up:of=[hfree-process:n=40,h=K4,seed=2],t=3");
    const r = decompositionCut(g, { solverSeed: 2 });
    expect(r.pattern).toBe("K4"); // clique number 3, found by the clique search
    expect(r.patternFrom).toBe("clique-number");
    expect(r.pieces.length).toBeGreaterThan(0);
    checkRecord(g, r);
  });
});

describe("decomposition cut on blow-ups of triangle-free graphs", () => {
  for (const spec of ["blow-up:of=[petersen],t=3", "blow-up:of=[mycielski-chain:steps=3],t=2", "blow-up:of=[hfree-process:n=25,h=K3,seed=2],t=3"]) {
    it(`${spec}: no triangles, so nothing is set aside and the guarantee is (1/2π)Σ√d_i (Shearer 1992's order)`, () => {
      const g = family(spec);
      const r = decompositionCut(g, { pattern: "K4", solverSeed: 3 });
      expect(r.pieces).toHaveLength(0);
      expect(r.remainder).toHaveLength(g.n);
      let s = 0;
      for (let v = 0; v < g.n; v++) s += Math.sqrt(g.degree(v));
      expect(r.guarantee).toBeCloseTo(s / (2 * Math.PI), 9);
      checkRecord(g, r);
    });
  }
});

describe("recursion", () => {
  it("the K5-free Turán graph T(40, 4): K4-free pieces decomposed again into triangle-free ones", () => {
    // Turán (1941): the complete 4-partite graph is K5-free; a neighbourhood is 3-partite (K4-free).
    const g = family("complete-multipartite:parts=10+10+10+10");
    const r = decompositionCut(g, { pattern: "K5", solverSeed: 4 });
    expect(r.thresholds.maxDepth).toBe(1);
    const levels = new Set(r.pieces.map((p) => p.level));
    expect(levels.has(2)).toBe(true);
    expect(r.pieces.filter((p) => p.level === 1).every((p) => p.freeOf === "K4")).toBe(true);
    expect(r.pieces.filter((p) => p.level === 2).every((p) => p.freeOf === "K3")).toBe(true);
    expect(r.pieces.some((p) => p.method === "decomposition")).toBe(true);
    checkRecord(g, r);
    // The max cut of T(40, 4) splits the parts 2 + 2: 400 of 600 edges (common practice, no source).
    expect(r.value).toBeLessThanOrEqual(400);
  });

  it("a dense random graph with H from its clique number decomposes to several levels", () => {
    const g = family("gnp:n=70,p=0.5,seed=1");
    const r = decompositionCut(g, { solverSeed: 5 });
    expect(r.patternFrom).toBe("clique-number");
    expect(Math.max(...r.pieces.map((p) => p.level))).toBeGreaterThanOrEqual(2);
    checkRecord(g, r);
  });
});

describe("small graphs and options", () => {
  itNeeds([tool("nauty-geng")], "every connected graph with n ≤ 7 (nauty-geng -c): a valid cut never above brute force, guarantees below it", () => {
    // Connected graphs on 7 vertices: 853 (OEIS A001349).
    const graphs = gengLines(["-c", "7"]).map((l) => parseGraph6(l));
    expect(graphs.length).toBe(853);
    let k = 0;
    for (const g of graphs) {
      const r = decompositionCut(g, { solverSeed: k++, exactVertices: 0 });
      checkRecord(g, r);
      expect(r.value).toBeLessThanOrEqual(bruteForceMaxCut(g));
    }
  });

  it("is reproducible per seed", () => {
    const g = family("hfree-process:n=80,h=K4,seed=5");
    const a = decompositionCut(g, { solverSeed: 9 });
    const b = decompositionCut(g, { solverSeed: 9 });
    expect(Array.from(a.partition)).toEqual(Array.from(b.partition));
    expect(a.pieces).toEqual(b.pieces);
  });

  it("as two lower-bound records (for tables and stores): the cut's surplus and the guarantee, or does-not-apply when weighted", () => {
    const g = family("hfree-process:n=60,h=K4,seed=1");
    const d = decompositionCut(g, { solverSeed: 6 });
    const b = decompositionBounds(g, { solverSeed: 6 });
    expect(b.cut).toMatchObject({ name: "decomposition-cut", applies: true, surplus: d.surplus, value: d.value });
    expect(b.guarantee.surplus).toBeCloseTo(d.guarantee, 12);
    expect(b.guarantee.value).toBeCloseTo(g.m / 2 + d.guarantee, 12);
    const w = decompositionBounds(graphFromEdges(2, [[0, 1, 2]]));
    expect(w.cut.applies || w.guarantee.applies).toBe(false);
  });

  it("H from the clique number: K_(ω+1) on small graphs (bitmask search up to 16 vertices) and above", () => {
    // ω of named graphs: the Petersen graph is triangle-free (Holton & Sheehan 1993, "The Petersen
    // Graph"): ω = 2; K_n has ω = n; the Turán graph T(n, r) has ω = r (Turán 1941).
    const complete = (n: number) => {
      const e: [number, number][] = [];
      for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) e.push([u, v]);
      return graphFromEdges(n, e);
    };
    expect(decompositionCut(family("petersen")).pattern).toBe("K3");
    expect(decompositionCut(family("complete-multipartite:parts=3+3+3+3")).pattern).toBe("K5");
    for (let n = 1; n <= 15; n++) expect(decompositionCut(complete(n)).pattern).toBe(`K${n + 1}`);
    // ω = 16 is past MAX_CLIQUE_ORDER's search range: no H, as the node-budgeted search says too.
    expect(decompositionCut(complete(16)).patternFrom).toBe("unknown");
    // Random graphs on 8–17 vertices (17: the node-budgeted search) against ω by brute force over
    // all vertex subsets (common practice, no source).
    let x = 12345;
    const next = () => (x = (Math.imul(x, 1103515245) + 12345) >>> 0) / 2 ** 32;
    for (let k = 0; k < 40; k++) {
      const n = 8 + (k % 10);
      const p = 0.3 + 0.5 * next();
      const e: [number, number][] = [];
      for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) if (next() < p) e.push([u, v]);
      const g = graphFromEdges(n, e);
      let omega = 0;
      for (let s = 1; s < 1 << n; s++) {
        const vs: number[] = [];
        for (let v = 0; v < n; v++) if ((s >> v) & 1) vs.push(v);
        if (vs.length <= omega) continue;
        if (vs.every((u, i) => vs.slice(i + 1).every((v) => g.hasEdge(u, v)))) omega = vs.length;
      }
      expect(decompositionCut(g, { solverSeed: k }).pattern).toBe(`K${omega + 1}`);
    }
  });

  it("H′ = H minus a vertex of largest degree, by name", () => {
    expect(patternMinusVertex("K4")).toBe("K3");
    expect(patternMinusVertex("C5")).toBe("P4");
    expect(patternMinusVertex("K2,3")).toBe("K1,3");
    expect(patternMinusVertex("K3,2")).toBe("K1,3");
    expect(patternMinusVertex("P4")).toBe("P3");
    expect(patternMinusVertex("K1")).toBeNull();
    expect(patternMinusVertex("K1,3")).toBeNull();
  });

  it("refuses weighted graphs and bad options with one line naming the parameter", () => {
    const g = family("petersen");
    expect(() => decompositionCut(graphFromEdges(2, [[0, 1, 2]]))).toThrow(/decomposition cut: the graph is weighted/);
    expect(() => decompositionCut(g, { pattern: "Q3" })).toThrow(InputError);
    expect(() => decompositionCut(g, { triangleFactor: -1 })).toThrow(/invalid `triangleFactor`/);
    expect(() => decompositionCut(g, { maxDepth: -1 })).toThrow(/invalid `maxDepth`/);
    expect(() => decompositionCut(g, { exactVertices: 99 })).toThrow(/invalid `exactVertices`/);
    expect(() => decompositionCut(g, { trials: 10, maxTrials: 5 })).toThrow(/invalid `maxTrials`/);
    expect(() => decompositionCut(g, { solverSeed: -1 })).toThrow(/invalid `solverSeed`/);
    for (const f of [() => decompositionCut(g, { maxDepth: 1.5 }), () => decompositionCut(g, { trials: 0 })]) {
      expect(f).toThrow(InputError);
      try {
        f();
      } catch (e) {
        expect((e as Error).message.includes("\n")).toBe(false);
      }
    }
  });
});
