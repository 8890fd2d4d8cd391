// Graph operations: blow-up, disjoint union, complement, induced subgraph, random edge
// deletion — as typed functions and as families on nested specs; canonical forms compared with
// nauty (genspecialg, complg, labelg) where it has the same construction.
import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { gnp } from "../src/families/gnp.js";
import { blowUp, blowUpFamily } from "../src/families/operations/blow-up.js";
import { complement, complementFamily } from "../src/families/operations/complement.js";
import { deleteRandomEdgesFamily, deleteRandomEdges } from "../src/families/operations/delete-random-edges.js";
import { disjointUnion, disjointUnionFamily } from "../src/families/operations/disjoint-union.js";
import { inducedSubgraphFamily } from "../src/families/operations/induced-subgraph.js";
import { inducedSubgraph } from "../src/graph/induced.js";
import type { FamilyDefinition, Params, PredictedSize, SizeContext } from "../src/families/types.js";
import { family, familyWithInfo } from "../src/families/registry.js";
import { complete as completeGraph } from "../src/families/complete.js";
import { graphFromEdges } from "../src/graph/builder.js";
import { encodeGraph6 } from "../src/graph/formats/graph6.js";
import type { Graph } from "../src/graph/graph.js";
import { bipartition, connectedComponents, countTriangles } from "../src/graph/structure/index.js";
import { Rng } from "../src/random/prng.js";
import { expectInputError } from "./helpers/errors.js";
import { genspecialLines, labelgLines } from "./helpers/nauty.js";
import { itNeeds, tool } from "./helpers/requirements.js";

const NAUTY = [tool("nauty-labelg"), tool("nauty-genspecialg"), tool("nauty-complg")];

const canonical = (graph6: string): string => labelgLines([graph6.trim()]).join("\n");
const genspecial = (...args: string[]): string => genspecialLines(args).join("\n");

function sameGraph(a: Graph, b: Graph): boolean {
  return a.n === b.n && Array.from(a.offsets).join() === Array.from(b.offsets).join() && Array.from(a.neighbors).join() === Array.from(b.neighbors).join();
}

const cycle5 = graphFromEdges(5, [[0, 1], [1, 2], [2, 3], [3, 4], [4, 0]]);
const petersenEdges: [number, number][] = [
  [0, 1], [1, 2], [2, 3], [3, 4], [4, 0], [0, 5], [1, 6], [2, 7], [3, 8], [4, 9], [5, 7], [7, 9], [9, 6], [6, 8], [8, 5],
];
const petersen = graphFromEdges(10, petersenEdges);

describe("blow-up", () => {
  itNeeds(NAUTY, "of K2 by t is K_{t,t} (nauty genspecialg -b)", () => {
    // Outside source: nauty-genspecialg -bt,t builds K_{t,t}; compared by nauty-labelg canonical form.
    for (const t of [1, 2, 3, 5]) {
      const g = blowUp(completeGraph(2), t);
      expect(canonical(encodeGraph6(g))).toBe(canonical(genspecial(`-b${t},${t}`)));
    }
  });

  it("multiplies n by t, m by t², degrees by t, and keeps K3-free graphs K3-free", () => {
    // A clique meets each class of copies at most once, so blow-ups keep K_r-freeness; copies are
    // independent and joined exactly when the originals are adjacent (definition; common practice).
    for (const t of [1, 2, 4]) {
      const g = blowUp(petersen, t);
      expect(g.n).toBe(10 * t);
      expect(g.m).toBe(15 * t * t);
      for (let v = 0; v < g.n; v++) expect(g.degree(v)).toBe(3 * t);
      expect(countTriangles(g).total).toBe(0);
      for (let x = 0; x < g.n; x++) for (let y = x + 1; y < g.n; y++) expect(g.hasEdge(x, y)).toBe(petersen.hasEdge(Math.floor(x / t), Math.floor(y / t)));
    }
    const w = blowUp(graphFromEdges(3, [[0, 1, 2.5], [1, 2, -1]]), 2);
    expect(w.totalWeight).toBe(4 * 2.5 - 4);
    expect(w.edgeWeight(0, 2)).toBe(2.5);
  });

  it("works as a family on nested specs and rejects t < 1", () => {
    // Input validation, common practice, no source.
    // The examples of the family list: Petersen (10 vertices, 15 edges) blown up by 3.
    const b = family("blow-up:of=[petersen],t=3");
    expect([b.n, b.m]).toEqual([30, 135]);
    const u = family("disjoint-union:of=[cycle:n=5]+[petersen]");
    expect([u.n, u.m]).toEqual([15, 20]);
    expect(family("induced-subgraph:of=[petersen],vertices=0+1+2+5").n).toBe(4);
    expect(family("complement:of=[petersen]").m).toBe(30);
    const g = family("blow-up:of=[complete:n=3],t=2");
    expect(g.n).toBe(6);
    expect(g.m).toBe(12);
    expect(familyWithInfo("blow-up:of=[complete:n=3],t=2").spec).toBe("blow-up:of=[complete:n=3],t=2");
    expectInputError(() => family("blow-up:of=[complete:n=3],t=0"), "`t`");
    expectInputError(() => blowUp(petersen, 1.5), "`t`");
    expectInputError(() => blowUp(completeGraph(500), 100), "would not fit in memory");
  });
});

describe("complement", () => {
  it("is an involution and has C(n,2) − m edges", () => {
    // complement(complement(G)) = G (definition; common practice, no source).
    for (let seed = 0; seed < 20; seed++) {
      const g = gnp(30, 0.3, seed);
      const c = complement(g);
      expect(c.m).toBe(435 - g.m);
      for (let u = 0; u < 30; u++) for (let v = u + 1; v < 30; v++) expect(c.hasEdge(u, v)).toBe(!g.hasEdge(u, v));
      expect(sameGraph(complement(c), g)).toBe(true);
    }
    expect(complement(completeGraph(6)).m).toBe(0);
    expect(complement(graphFromEdges(0, [])).n).toBe(0);
  });

  itNeeds(NAUTY, "matches nauty-complg, and C5 is self-complementary", () => {
    // Outside source: nauty-complg; C5 ≅ its complement (a standard fact, from memory).
    for (let seed = 0; seed < 10; seed++) {
      const g = gnp(12, 0.4, seed);
      const theirs = execFileSync("nauty-complg", ["-q"], { input: encodeGraph6(g) + "\n", encoding: "utf8" }).trim();
      expect(canonical(encodeGraph6(complement(g)))).toBe(canonical(theirs));
    }
    expect(canonical(encodeGraph6(complement(cycle5)))).toBe(canonical(encodeGraph6(cycle5)));
    expect(family("complement:of=[complete:n=4]").m).toBe(0);
  });

  it("refuses weighted graphs", () => {
    expectInputError(() => complement(graphFromEdges(3, [[0, 1, 2]])), "weighted");
  });
});

describe("disjoint union", () => {
  it("adds up vertices, edges and components, relabelling in order", () => {
    // Definition (common practice, no source); components from connectedComponents.
    const u = disjointUnion(cycle5, petersen, completeGraph(4));
    expect(u.n).toBe(19);
    expect(u.m).toBe(5 + 15 + 6);
    expect(connectedComponents(u).count).toBe(3);
    expect(u.hasEdge(5, 6)).toBe(true); // Petersen's 0–1 after the 5 vertices of C5
    expect(u.hasEdge(4, 5)).toBe(false);
    expect(u.hasEdge(15, 18)).toBe(true);
    expect(disjointUnion().n).toBe(0);
    const w = disjointUnion(graphFromEdges(2, [[0, 1, 3]]), cycle5);
    expect(w.totalWeight).toBe(3 + 5);
    const spec = family("disjoint-union:of=[complete:n=3]+[complete:n=4]");
    expect(spec.n).toBe(7);
    expect(spec.m).toBe(9);
  });
});

describe("induced subgraph", () => {
  it("keeps exactly the edges among the chosen vertices, in the given order", () => {
    // Definition of an induced subgraph (common practice, no source).
    const r = new Rng(5);
    for (let t = 0; t < 20; t++) {
      const g = gnp(25, 0.3, t);
      const vertices = r.shuffle(Array.from({ length: 25 }, (_, i) => i)).slice(0, 1 + r.nextInt(24));
      const h = inducedSubgraph(g, vertices);
      expect(h.n).toBe(vertices.length);
      for (let i = 0; i < h.n; i++) for (let j = i + 1; j < h.n; j++) expect(h.hasEdge(i, j)).toBe(g.hasEdge(vertices[i], vertices[j]));
    }
    // Petersen's outer 5-cycle 0..4 is induced; 0,1,2,5 induces the path 5–0–1–2.
    expect(inducedSubgraph(petersen, [0, 1, 2, 3, 4]).m).toBe(5);
    const p = inducedSubgraph(petersen, [0, 1, 2, 5]);
    expect(p.m).toBe(3);
    expect(bipartition(p).bipartite).toBe(true);
    const w = inducedSubgraph(graphFromEdges(3, [[0, 1, 2], [1, 2, 7]]), [2, 1]);
    expect(w.edgeWeight(0, 1)).toBe(7);
    expect(family("induced-subgraph:of=[complete:n=6],vertices=0+2+4").m).toBe(3);
  });

  it("rejects repeated or out-of-range vertices naming `vertices`", () => {
    // Input validation, common practice, no source.
    expectInputError(() => inducedSubgraph(petersen, [0, 1, 1]), "`vertices`");
    expectInputError(() => inducedSubgraph(petersen, [0, 10]), "`vertices`");
    expectInputError(() => family("induced-subgraph:of=[complete:n=4],vertices=0+7"), "`vertices`");
    expectInputError(() => family("induced-subgraph:of=[complete:n=4],vertices=0+0"), "`vertices`");
    expectInputError(() => family("induced-subgraph:of=[complete:n=4],vertices=-1"), "`vertices`");
  });
});

describe("random edge deletion", () => {
  it("keeps each edge with probability 1 − p, reproducibly", () => {
    // Determinism, common practice, no source.
    // Kept edges ~ Binomial(m, 1 − p): within 5σ (binomial mean and variance, standard).
    const g = completeGraph(80);
    const p = 0.3;
    const sd = Math.sqrt(g.m * p * (1 - p));
    for (let seed = 0; seed < 50; seed++) {
      const h = deleteRandomEdges(g, p, seed);
      expect(Math.abs(h.m - g.m * (1 - p))).toBeLessThan(5 * sd);
      let extra = 0;
      h.forEachEdge((u, v) => {
        if (!g.hasEdge(u, v)) extra++;
      });
      expect(extra).toBe(0);
    }
    expect(sameGraph(deleteRandomEdges(g, p, 7), deleteRandomEdges(g, p, new Rng(7)))).toBe(true);
    expect(sameGraph(deleteRandomEdges(g, p, 7), family("delete-random-edges:of=[complete:n=80],p=0.3,seed=7"))).toBe(true);
    expect(sameGraph(deleteRandomEdges(g, 0, 7), g)).toBe(true);
    expect(deleteRandomEdges(g, 1, 7).m).toBe(0);
    const w = deleteRandomEdges(graphFromEdges(3, [[0, 1, 2], [1, 2, 7]]), 0, 1);
    expect(w.totalWeight).toBe(9);
  });

  it("deletes each edge with equal probability", () => {
    // Each of the 6 edges of K4 is deleted with probability p independently (definition):
    // per-edge deletion counts over S trials ~ Binomial(S, p), each within 5σ.
    const g = completeGraph(4);
    const S = 4000, p = 0.25;
    const deleted = new Array<number>(6).fill(0);
    for (let s = 0; s < S; s++) {
      const h = deleteRandomEdges(g, p, s);
      let k = 0;
      for (let u = 0; u < 4; u++) for (let v = u + 1; v < 4; v++, k++) if (!h.hasEdge(u, v)) deleted[k]++;
    }
    for (const d of deleted) expect(Math.abs(d - S * p)).toBeLessThan(5 * Math.sqrt(S * p * (1 - p)));
  });

  it("rejects p outside [0, 1] naming `p`", () => {
    expectInputError(() => deleteRandomEdges(petersen, 1.2, 0), "`p`");
    expectInputError(() => family("delete-random-edges:of=[complete:n=4],p=-0.5"), "`p`");
    expectInputError(() => deleteRandomEdges(petersen, 0.5, -1), "`seed`");
  });
});

describe("predicted sizes of operations", () => {
  // Sizes follow from the definitions (common practice, no source): blow-up n·t, m·t², degrees ·t;
  // union sums; complement C(n,2) − m with degrees n − 1 − d; deletion m(1 − p).
  const sizes: Record<string, PredictedSize> = {
    petersen: { n: 10, m: 15, mExact: true, minDegree: 3, maxDegree: 3 },
    "gnp:n=100,p=0.1": { n: 100, m: 495, mExact: false },
  };
  const ctx: SizeContext = { predictedSizeOf: (spec) => sizes[spec] };
  // Operations take the context as an optional second argument of `predictedSize`.
  const shapeOf = (def: FamilyDefinition, params: Params): PredictedSize => def.predictedSize(params, ctx);

  it("follow the nested size when a SizeContext is given", () => {
    expect(shapeOf(blowUpFamily, { of: "petersen", t: 3 })).toEqual({ n: 30, m: 135, mExact: true, minDegree: 9, maxDegree: 9 });
    expect(shapeOf(disjointUnionFamily, { of: ["petersen", "gnp:n=100,p=0.1"] })).toEqual({ n: 110, m: 510, mExact: false });
    expect(shapeOf(complementFamily, { of: "petersen" })).toEqual({ n: 10, m: 30, mExact: true, minDegree: 6, maxDegree: 6 });
    expect(shapeOf(deleteRandomEdgesFamily, { of: "petersen", p: 0.2, seed: 0 })).toEqual({ n: 10, m: 12, mExact: false });
    expect(shapeOf(inducedSubgraphFamily, { of: "petersen", vertices: [0, 1, 2] }).n).toBe(3);
  });

  it("are unknown (NaN) without one, and the exact size is checked when building", () => {
    expect(Number.isNaN(blowUpFamily.predictedSize({ of: "petersen", t: 3 }).m)).toBe(true);
  });
});
