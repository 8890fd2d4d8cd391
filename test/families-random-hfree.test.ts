// The random H-free process: its graphs are H-free and maximal (every non-edge would create H),
// checked with the structure routines, with networkx's VF2 monomorphism test, and for larger n
// against the definition of closing K3 / C4; the `edges` limit gives a prefix of the process.
import { execFileSync, spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { HFREE_PATTERNS, hfreeProcess, type HFreePattern } from "../src/families/hfree-process.js";
import { buildFamily, family } from "../src/families/registry.js";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { countFourCycles, countTriangles, findClique, findCycle, findSubgraph, patternGraph } from "../src/graph/structure/index.js";
import { expectInputError } from "./helpers/errors.js";

/** Does g contain H? The structure module's dedicated search for each pattern. */
function contains(g: Graph, h: HFreePattern): boolean {
  switch (h) {
    case "K3":
      return countTriangles(g).total > 0;
    case "C4":
      return findCycle(g, 4).found;
    case "C5":
      return findCycle(g, 5).found;
    case "K4":
      return findClique(g, 4).found;
    case "K2,3":
      return findSubgraph(g, patternGraph("K2,3")).found;
  }
}

function edgesOf(g: Graph): [number, number][] {
  const out: [number, number][] = [];
  g.forEachEdge((u, v) => out.push([u, v]));
  return out;
}

function nonEdges(g: Graph): [number, number][] {
  const out: [number, number][] = [];
  for (let u = 0; u < g.n; u++) for (let v = u + 1; v < g.n; v++) if (!g.hasEdge(u, v)) out.push([u, v]);
  return out;
}

function findPython(): string | null {
  for (const py of ["/usr/bin/python3", "python3"]) {
    if (spawnSync("which", [py]).status !== 0 && !py.startsWith("/")) continue;
    if (spawnSync(py, ["-c", "import networkx"]).status === 0) return py;
  }
  return null;
}
const python = findPython();

// networkx (Debian python3-networkx): GraphMatcher(G, H).subgraph_is_monomorphic() decides
// whether G has a (not necessarily induced) subgraph isomorphic to H.
const NX_SCRIPT = String.raw`
import json, sys
import networkx as nx
from networkx.algorithms.isomorphism import GraphMatcher
PATTERNS = {"K3": nx.complete_graph(3), "K4": nx.complete_graph(4), "C4": nx.cycle_graph(4),
            "C5": nx.cycle_graph(5), "K2,3": nx.complete_bipartite_graph(2, 3)}
out = []
for case in json.load(sys.stdin):
    G = nx.Graph(); G.add_nodes_from(range(case["n"])); G.add_edges_from(case["edges"])
    H = PATTERNS[case["h"]]
    free = not GraphMatcher(G, H).subgraph_is_monomorphic()
    maximal = True
    for u, v in nx.non_edges(G):
        G.add_edge(u, v)
        if not GraphMatcher(G, H).subgraph_is_monomorphic(): maximal = False
        G.remove_edge(u, v)
        if not maximal: break
    out.append({"free": free, "maximal": maximal})
print(json.dumps(out))
`;
import { check, itNeeds } from "./helpers/requirements.js";

describe("random H-free process", () => {
  it("gives H-free graphs to which no non-edge can be added (structure checks)", () => {
    // Maximal H-free: H-free, and adding any non-edge creates a copy of H (definition of the
    // H-free process's final graph; Bohman & Keevash 2010). Checked by rebuilding g + uv.
    for (const h of HFREE_PATTERNS) {
      for (const n of [9, 14]) {
        for (let seed = 0; seed < 3; seed++) {
          const g = hfreeProcess(n, h, seed);
          expect(contains(g, h)).toBe(false);
          const edges = edgesOf(g);
          let extendable = 0;
          for (const e of nonEdges(g)) if (!contains(graphFromEdges(n, [...edges, e]), h)) extendable++;
          expect(extendable).toBe(0);
        }
      }
    }
  });

  itNeeds([check("python3 with networkx (Debian python3-networkx)", () => python !== null)], "agrees with networkx: H-free and maximal", () => {
    // Outside check: networkx's VF2 monomorphism (see NX_SCRIPT).
    const cases: { n: number; edges: [number, number][]; h: HFreePattern }[] = [];
    for (const h of HFREE_PATTERNS) for (let seed = 10; seed < 13; seed++) cases.push({ n: 11, edges: edgesOf(hfreeProcess(11, h, seed)), h });
    const out = JSON.parse(execFileSync(python!, ["-c", NX_SCRIPT], { input: JSON.stringify(cases), encoding: "utf8" })) as { free: boolean; maximal: boolean }[];
    expect(out).toEqual(cases.map(() => ({ free: true, maximal: true })));
  });

  it("is maximal triangle-free at n = 300 and maximal C4-free at n = 150", () => {
    // Triangle-free: no triangles (countTriangles); maximal: every non-edge has a common
    // neighbour. C4-free: no 4-cycles (countFourCycles); maximal: every non-edge uv is joined by a
    // path u–x–y–v. Both are the definitions (common practice, no source).
    const t = hfreeProcess(300, "K3", 5);
    expect(countTriangles(t).total).toBe(0);
    let open = 0;
    for (const [u, v] of nonEdges(t)) if (!t.neighborsOf(u).some((x) => t.hasEdge(x, v))) open++;
    expect(open).toBe(0);
    const c = hfreeProcess(150, "C4", 5);
    expect(countFourCycles(c).total).toBe(0);
    open = 0;
    for (const [u, v] of nonEdges(c)) {
      if (!c.neighborsOf(u).some((x) => c.neighborsOf(v).some((y) => c.hasEdge(x, y)))) open++;
    }
    expect(open).toBe(0);
    for (const h of ["C5", "K4", "K2,3"] as HFreePattern[]) expect(contains(hfreeProcess(60, h, 5), h)).toBe(false);
  });

  it("stops after `edges` edges with a prefix of the full process", () => {
    // The limit truncates the same random order (design; common practice, no source).
    const full = hfreeProcess(80, "K3", 3);
    for (const k of [1, 50, 200]) {
      const part = hfreeProcess(80, "K3", 3, k);
      expect(part.m).toBe(k);
      let outside = 0;
      part.forEachEdge((u, v) => {
        if (!full.hasEdge(u, v)) outside++;
      });
      expect(outside).toBe(0);
    }
    expect(hfreeProcess(20, "C4", 3, 100000).m).toBe(hfreeProcess(20, "C4", 3).m);
    const viaSpec = family("hfree-process:n=80,h=K3,edges=50,seed=3");
    expect(Array.from(viaSpec.neighbors)).toEqual(Array.from(hfreeProcess(80, "K3", 3, 50).neighbors));
  });

  it("declares H in freeOf and rejects unknown patterns, naming the parameter", () => {
    // Input validation, common practice, no source.
    const info = buildFamily("hfree-process", { n: 10, h: "K2,3", seed: 1 });
    expect(info.graph.n).toBe(10);
    expectInputError(() => family("hfree-process:n=10,h=C6"), "`h`");
    expectInputError(() => hfreeProcess(10, "K5" as HFreePattern, 0), "`h`");
    expectInputError(() => family("hfree-process:n=20000,h=K3"), "`n`");
    expectInputError(() => family("hfree-process:n=20,h=K3,edges=-1"), "`edges`");
  });
});
