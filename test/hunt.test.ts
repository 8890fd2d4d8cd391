// The extremal search (src/hunt): its rooted H test, the hunt's reported graphs and brackets, its
// determinism under a work budget, and the C4-free benchmark on 31 vertices. Outside sources:
// nauty's pickg filters (-T0: no triangle, -W0: no 4-cycle, -k:3: clique number ≤ 3), networkx's
// GraphMatcher.subgraph_is_monomorphic and nx.core_number; the polarity graph ER_5 (31 vertices,
// 90 edges, C4-free: Erdős–Rényi 1962, Brown 1966). Every check runs under a work budget.
import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { verifyBracket } from "../src/cut/bracket/verify.js";
import { hfreeProcess, type HFreePattern } from "../src/families/hfree-process.js";
import { family } from "../src/families/registry.js";
import { graphFromEdges } from "../src/graph/builder.js";
import { encodeGraph6, parseGraph6 } from "../src/graph/formats/graph6.js";
import type { Graph } from "../src/graph/graph.js";
import { findSubgraph, patternGraph } from "../src/graph/structure/index.js";
import { hunt, MutableGraph, objectiveValue, rootedPattern, RootedSearch, structuredSpecs, type HuntResult } from "../src/hunt/index.js";
import { describeNeeds, python, tool } from "./helpers/requirements.js";

/** Graph6 lines kept by nauty-pickg with the given filter (one process for the whole batch). */
function pickg(filter: string, lines: readonly string[]): string[] {
  const out = execFileSync("nauty-pickg", ["-q", filter], { input: lines.join("\n") + "\n" }).toString();
  return out.split("\n").filter((l) => l !== "");
}

// networkx: does G contain H as a (not necessarily induced) subgraph; G's degeneracy (max core number).
const NX = String.raw`
import json, sys
import networkx as nx
from networkx.algorithms.isomorphism import GraphMatcher
job = json.load(sys.stdin)
H = nx.from_graph6_bytes(job["pattern"].encode())
out = []
for line in job["graphs"]:
    G = nx.from_graph6_bytes(line.encode())
    core = nx.core_number(G)
    out.append({"contains": GraphMatcher(G, H).subgraph_is_monomorphic(), "degeneracy": max(core.values()) if core else 0})
print(json.dumps(out))
`;
function networkx(pattern: Graph, graphs: readonly string[]): { contains: boolean; degeneracy: number }[] {
  return JSON.parse(execFileSync("python3", ["-c", NX], { input: JSON.stringify({ pattern: encodeGraph6(pattern), graphs }) }).toString());
}

/** G plus the edge uv, as a new CSR graph. */
function withEdge(g: MutableGraph, u: number, v: number): Graph {
  const edges: [number, number][] = [[u, v]];
  for (let a = 0; a < g.n; a++) for (let b = a + 1; b < g.n; b++) if (g.has(a, b)) edges.push([a, b]);
  return graphFromEdges(g.n, edges);
}

describe("the rooted test: does adding uv create a copy of H", () => {
  // Oracle: findSubgraph's exhaustive search on G + uv, for G H-free (then any copy uses uv).
  // The H-free graphs come from the families' own process (its own rules, not the rooted test),
  // stopped early so that many pairs are still free.
  const cases: [HFreePattern, number, number][] = [["K3", 14, 14], ["C4", 14, 14], ["C5", 12, 14], ["K4", 12, 20], ["K2,3", 12, 20]];
  for (const [h, n, edges] of cases) {
    it(`${h}: agrees with an exhaustive search on every non-edge of partial ${h}-free process graphs`, () => {
      const pattern = patternGraph(h);
      let pairs = 0, closing = 0;
      for (let seed = 0; seed < 3; seed++) {
        const base = hfreeProcess(n, h, seed, edges);
        expect(findSubgraph(base, pattern).found).toBe(false);
        const g = MutableGraph.of(base);
        const search = new RootedSearch(g, rootedPattern(pattern));
        for (let u = 0; u < n; u++) {
          for (let v = u + 1; v < n; v++) {
            if (g.has(u, v)) continue;
            const expected = findSubgraph(withEdge(g, u, v), pattern).found;
            expect(search.createsPattern(u, v), `${h} seed ${seed} pair ${u}-${v}`).toBe(expected);
            pairs++;
            if (expected) closing++;
          }
        }
        expect(g.m).toBe(base.m); // the test leaves the graph as it was
      }
      // Both answers occur, so the comparison cannot pass by answering one way.
      expect(pairs).toBeGreaterThan(100);
      expect(closing).toBeGreaterThan(0);
      expect(closing).toBeLessThan(pairs);
    });
  }

  it("a pattern that is none of the presets (a 4-cycle with a pendant edge) agrees too", () => {
    const pattern = graphFromEdges(5, [[0, 1], [1, 2], [2, 3], [3, 0], [3, 4]]);
    let pairs = 0, closing = 0;
    // C4-free graphs are free of it (it contains a C4); common practice, no source.
    const g = MutableGraph.of(hfreeProcess(13, "C4", 5, 16));
    const search = new RootedSearch(g, rootedPattern(pattern));
    for (let u = 0; u < g.n; u++) for (let v = u + 1; v < g.n; v++) {
      if (g.has(u, v)) continue;
      const expected = findSubgraph(withEdge(g, u, v), pattern).found;
      expect(search.createsPattern(u, v)).toBe(expected);
      pairs++;
      if (expected) closing++;
    }
    expect(closing).toBeGreaterThan(0);
    expect(closing).toBeLessThan(pairs);
  });
});

describe("reference constructions", () => {
  it("offers ER_5 on 31 vertices and Kneser KG(7,3) on 35 (Erdős–Rényi 1962; Kneser graphs: Lovász 1978)", () => {
    expect(structuredSpecs(31)).toContain("polarity:q=5");
    expect(structuredSpecs(35)).toContain("kneser:n=7,k=3");
    const er5 = family("polarity:q=5");
    expect([er5.n, er5.m]).toEqual([31, 90]); // q² + q + 1 vertices, q(q + 1)²/2 edges
  });
});

/** Every reported graph: H-free by the outside tools, its bracket verified, its value re-derived. */
function checkReported(result: HuntResult, pattern: Graph, nautyFilter: string | null): void {
  const lines = result.frontier.map((e) => e.graph6);
  expect(lines.length).toBeGreaterThan(0);
  if (nautyFilter !== null) expect(pickg(nautyFilter, lines)).toEqual(lines); // nauty keeps every one: none contains H
  const nx = networkx(pattern, lines);
  expect(nx.length).toBe(lines.length);
  result.frontier.forEach((e, i) => {
    expect(nx[i].contains, `frontier graph at m = ${e.m}`).toBe(false);
    expect(e.degeneracy).toBe(nx[i].degeneracy);
    const g = parseGraph6(e.graph6);
    expect(g.m).toBe(e.m);
    const verdict = verifyBracket(g, e.record);
    expect(verdict.verdict, JSON.stringify(verdict.checks.filter((c) => !c.ok))).toBe("verified");
    expect(e.value).toBe(objectiveValue(result.objective, e.record.surplusUpper, e.m, nx[i].degeneracy));
  });
}

describeNeeds([tool("nauty-pickg"), python("networkx")], "hunt: reported graphs against nauty and networkx", () => {
  it("C4, n = 31, from the C4-free process only: C4-free graphs, verified brackets, and a ratio at least as small as ER_5's", () => {
    const pattern = patternGraph("C4");
    const result = hunt({ pattern, patternName: "C4", n: 31, objective: { kind: "ratio" }, iterations: 3000, starts: "process", solverSeed: 3 });
    checkReported(result, pattern, "-W0");
    // No chain started from a construction: every frontier graph descends from a process output.
    for (const e of result.frontier) expect(e.start).toMatch(/^hfree-process:n=31,h=C4,seed=\d+$|^frontier graph/);
    const er5 = result.references.find((r) => r.label === "polarity:q=5");
    expect(er5).toBeDefined();
    // ER_5 has degrees q and q + 1 = 6 (q + 1 absolute points lose their loop), degeneracy 5 by networkx below.
    expect(er5!.degeneracy).toBe(networkx(pattern, [encodeGraph6(family("polarity:q=5"))])[0].degeneracy);
    expect(er5!.degeneracy).toBe(5);
    expect(verifyBracket(family("polarity:q=5"), er5!.record).verdict).toBe("verified");
    expect(er5!.value).toBeCloseTo((er5!.record.upper - 45) / (90 / Math.sqrt(5)), 12);
    expect(result.best!.value).toBeLessThanOrEqual(er5!.value);
  }, 120_000);

  it("K3, n = 16, from the empty graph, objective surplus/m^0.75: triangle-free graphs, verified brackets", () => {
    const pattern = patternGraph("K3");
    const result = hunt({ pattern, patternName: "K3", n: 16, objective: { kind: "power", alpha: 0.75 }, iterations: 600, starts: "empty", solverSeed: 1, chainLength: 300 });
    checkReported(result, pattern, "-T0");
  }, 60_000);

  it("K4 at fixed m = 30 on 12 vertices: every reported graph has 30 edges and no K4", () => {
    const pattern = patternGraph("K4");
    const result = hunt({ pattern, patternName: "K4", n: 12, objective: { kind: "surplus", m: 30 }, iterations: 300, solverSeed: 2 });
    expect(result.frontier.map((e) => e.m)).toEqual([30]);
    checkReported(result, pattern, "-k:3");
  }, 60_000);

  it("a pattern given as a graph (C4 with a pendant edge) uses the search's own process: graphs free of it", () => {
    const pattern = graphFromEdges(5, [[0, 1], [1, 2], [2, 3], [3, 0], [3, 4]]);
    const result = hunt({ pattern, n: 14, objective: { kind: "ratio" }, iterations: 300, starts: "process", processRuns: 2, solverSeed: 4 });
    expect(result.frontier[0].start).toMatch(/rooted test|frontier/);
    checkReported(result, pattern, null);
  }, 60_000);
});

describe("hunt: budgets and determinism", () => {
  it("the same seed and work budget give the same frontier", () => {
    const run = () => hunt({ pattern: patternGraph("K3"), patternName: "K3", n: 12, objective: { kind: "ratio" }, iterations: 250, solverSeed: 9, chainLength: 100 });
    const a = run(), b = run();
    expect(a.iterations).toBe(250);
    expect(a.status).toBe("iteration-limit");
    expect(a.frontier.map((e) => [e.m, e.graph6, e.value])).toEqual(b.frontier.map((e) => [e.m, e.graph6, e.value]));
  });

  it("a time budget that is over at the first clock check stops at once", () => {
    const r = hunt({ pattern: patternGraph("K3"), n: 10, objective: { kind: "ratio" }, seconds: 1e-9 });
    expect(r.status).toBe("time-limit");
    expect(r.iterations).toBe(0);
  });

  it("refuses bad options with one line naming the parameter", () => {
    const base = { pattern: patternGraph("C4"), n: 10, objective: { kind: "ratio" } as const, iterations: 1 };
    expect(() => hunt({ ...base, n: 3 })).toThrow(/hunt: .*n/);
    expect(() => hunt({ ...base, objective: { kind: "power", alpha: 0 } })).toThrow(/alpha/);
    expect(() => hunt({ ...base, objective: { kind: "surplus", m: 46 } })).toThrow(/\bm\b/);
    expect(() => hunt({ ...base, iterations: undefined })).toThrow(/budget/);
  });
});

describe("hunt: a fixed m that no start reaches", () => {
  it("ends with the work budget and an empty frontier (ex(8, K3) = 16 < 17: Mantel 1907)", () => {
    const r = hunt({ pattern: patternGraph("K3"), patternName: "K3", n: 8, objective: { kind: "surplus", m: 17 }, iterations: 20, solverSeed: 0 });
    expect(r.iterations).toBe(20);
    expect(r.frontier).toEqual([]);
  });
});
