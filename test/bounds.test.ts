// Closed-form max-cut lower bounds (Edwards, triangle-free, the vector-method guarantee) against
// brute-force max cuts of every small graph nauty-geng generates, plus the report's gaps.
import { describe, expect, it } from "vitest";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { parseGraph6 } from "../src/graph/formats/graph6.js";
import { edwardsEdgeBound, edwardsVertexBound } from "../src/bounds/edwards.js";
import { triangleFreeBound } from "../src/bounds/triangle-free.js";
import { vectorMethodGuarantee } from "../src/bounds/vector-guarantee.js";
import { lowerBoundReport, lowerBounds } from "../src/bounds/report.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";
import { gengLines } from "./helpers/nauty.js";
import { itNeeds, tool } from "./helpers/requirements.js";


const geng = (args: string[]): Graph[] => gengLines(args).map((l) => parseGraph6(l));

/** Components by union–find, independent of src/graph/structure. */
function componentCount(g: Graph): number {
  const parent = Array.from({ length: g.n }, (_, i) => i);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x])));
  g.forEachEdge((u, v) => {
    parent[find(u)] = find(v);
  });
  let c = 0;
  for (let i = 0; i < g.n; i++) if (find(i) === i) c++;
  return c;
}

const isComplete = (g: Graph) => g.m === (g.n * (g.n - 1)) / 2;

describe("Edwards bounds on every connected graph with n ≤ 7 (nauty-geng -c)", () => {
  itNeeds([tool("nauty-geng")], "brute-force max cut ≥ both bounds; the √(8m+1) form is tight exactly for complete graphs of odd order", () => {
    // Edwards (1973): maxcut ≥ m/2 + (√(8m+1) − 1)/8, with equality iff G is a complete graph of odd order;
    // Edwards (1975): maxcut ≥ m/2 + (n−1)/4 for connected G.
    // Count check: connected graphs on 1..7 vertices number 1, 1, 2, 6, 21, 112, 853 (OEIS A001349).
    const counts = [1, 1, 2, 6, 21, 112, 853];
    let tightSeen = 0;
    for (let n = 1; n <= 7; n++) {
      const graphs = geng(["-c", String(n)]);
      expect(graphs.length).toBe(counts[n - 1]);
      for (const g of graphs) {
        const opt = bruteForceMaxCut(g);
        const e1 = edwardsEdgeBound(g);
        const e2 = edwardsVertexBound(g);
        expect(e1.applies && e2.applies).toBe(true);
        expect(opt).toBeGreaterThanOrEqual((e1.value as number) - 1e-9);
        expect(opt).toBeGreaterThanOrEqual((e2.value as number) - 1e-9);
        expect(e2.surplus).toBe((n - 1) / 4);
        const tight = Math.abs(opt - (e1.value as number)) < 1e-9;
        expect(tight).toBe(isComplete(g) && n % 2 === 1);
        if (tight) tightSeen++;
      }
    }
    expect(tightSeen).toBe(4); // K1, K3, K5, K7
  });
});

describe("Edwards per-component form on all graphs with n ≤ 6 (nauty-geng, disconnected included)", () => {
  itNeeds([tool("nauty-geng")], "maxcut ≥ m/2 + (n − c)/4 with c components", () => {
    // Graphs on 1..6 vertices: 1, 2, 4, 11, 34, 156 (OEIS A000088).
    const counts = [1, 2, 4, 11, 34, 156];
    for (let n = 1; n <= 6; n++) {
      const graphs = geng([String(n)]);
      expect(graphs.length).toBe(counts[n - 1]);
      for (const g of graphs) {
        const b = edwardsVertexBound(g);
        expect(b.surplus).toBe((n - componentCount(g)) / 4);
        expect(bruteForceMaxCut(g)).toBeGreaterThanOrEqual((b.value as number) - 1e-9);
      }
    }
  });

  it("two disjoint triangles meet the per-component form with equality", () => {
    // Each triangle: max cut 2 = 3/2 + (3−1)/4 (arithmetic, common practice, no source).
    const g = graphFromEdges(6, [[0, 1], [1, 2], [0, 2], [3, 4], [4, 5], [3, 5]]);
    const b = edwardsVertexBound(g);
    expect(b.surplus).toBe(1);
    expect(b.value).toBe(bruteForceMaxCut(g));
    expect(b.reason).toMatch(/2 components/);
  });
});

describe("triangle-free bound (1/2π)Σ√d_i", () => {
  itNeeds([tool("nauty-geng")], "holds on every connected triangle-free graph with n ≤ 9 (nauty-geng -ct)", () => {
    // Connected triangle-free graphs on 1..9 vertices: 1, 1, 1, 3, 6, 19, 59, 267, 1380 (OEIS A024607).
    const counts = [1, 1, 1, 3, 6, 19, 59, 267, 1380];
    for (let n = 1; n <= 9; n++) {
      const graphs = geng(["-ct", String(n)]);
      expect(graphs.length).toBe(counts[n - 1]);
      for (const g of graphs) {
        const b = triangleFreeBound(g);
        expect(b.applies).toBe(true);
        let s = 0;
        for (let v = 0; v < n; v++) s += Math.sqrt(g.degree(v));
        expect(b.surplus).toBeCloseTo(s / (2 * Math.PI), 12);
        expect(bruteForceMaxCut(g)).toBeGreaterThanOrEqual((b.value as number) - 1e-9);
      }
    }
  });

  itNeeds([tool("nauty-geng")], "does not apply to graphs with a triangle; the general guarantee still holds (n ≤ 7)", () => {
    let withTriangles = 0;
    for (const g of geng(["-c", "7"])) {
      const b = triangleFreeBound(g);
      const gu = vectorMethodGuarantee(g);
      if (gu.overlapEdges > 0) {
        withTriangles++;
        expect(b.applies).toBe(false);
        expect(b.value).toBeNull();
        expect(b.reason).toMatch(/triangles/);
      } else expect(b.applies).toBe(true);
      // The guarantee is an expectation of a random cut, so it never exceeds the max cut.
      expect(bruteForceMaxCut(g)).toBeGreaterThanOrEqual((gu.value as number) - 1e-9);
    }
    // Connected triangle-free graphs on 7 vertices: 59 (OEIS A024607), so 853 − 59 have a triangle.
    expect(withTriangles).toBe(853 - 59);
  });
});

describe("unweighted only, and the report", () => {
  it("weighted graphs: every closed-form bound says it does not apply", () => {
    const g = graphFromEdges(3, [[0, 1, 2], [1, 2, 1]]);
    for (const b of lowerBounds(g)) {
      expect(b.applies).toBe(false);
      expect(b.value).toBeNull();
      expect(b.reason).toMatch(/unweighted/);
    }
  });

  it("Petersen: bounds, gaps and relative gaps against the optimum 12", () => {
    const e: [number, number][] = [];
    for (let i = 0; i < 5; i++) e.push([i, (i + 1) % 5], [i, i + 5], [5 + i, 5 + ((i + 2) % 5)]);
    const g = graphFromEdges(10, e);
    const rep = lowerBoundReport(g, 12); // max cut 12 (from memory)
    expect(rep.bestSurplus).toBe(4.5);
    const by = new Map(rep.rows.map((r) => [r.name, r]));
    // m = 15: √121 = 11, so (11 − 1)/8 = 1.25; (n − 1)/4 = 2.25; 10·√3/(2π) (arithmetic).
    expect(by.get("edwards-edges")!.surplus).toBe(1.25);
    expect(by.get("edwards-edges")!.gap).toBe(3.25);
    expect(by.get("edwards-edges")!.relativeGap).toBeCloseTo(3.25 / 4.5, 12);
    expect(by.get("edwards-vertices")!.value).toBe(7.5 + 2.25);
    expect(by.get("triangle-free")!.surplus).toBeCloseTo((10 * Math.sqrt(3)) / (2 * Math.PI), 12);
    expect(by.get("vector-method")!.surplus).toBeCloseTo(by.get("triangle-free")!.surplus as number, 12);
    for (const r of rep.rows) expect(r.gap).toBeGreaterThan(0);
  });

  it("K5 (odd complete): the Edwards edge bound has zero gap; triangle-free row does not apply", () => {
    const e: [number, number][] = [];
    for (let i = 0; i < 5; i++) for (let j = i + 1; j < 5; j++) e.push([i, j]);
    const g = graphFromEdges(5, e);
    const rep = lowerBoundReport(g, 6); // ⌊25/4⌋ = 6 (from memory)
    const by = new Map(rep.rows.map((r) => [r.name, r]));
    expect(by.get("edwards-edges")!.gap).toBeCloseTo(0, 12);
    expect(by.get("triangle-free")!.applies).toBe(false);
    expect(by.get("triangle-free")!.gap).toBeNull();
  });
});
