// Every graph on n ≤ 8 vertices, classified against nauty's geng filters: the lines of
// `geng -t/-f/-tf/-k/-b/-c/-d2 n` must be exactly the lines of `geng n` that we accept.
import { expect, it } from "vitest";
import type { Graph } from "../src/graph/graph.js";
import { parseGraph6 } from "../src/graph/formats/graph6.js";
import {
  bipartition,
  connectedComponents,
  countFourCycles,
  countTriangles,
  degreeStats,
  describeGraph,
  findClique,
  findCycle,
  findSubgraph,
  patternGraph,
} from "../src/graph/structure/index.js";
import { gengLines } from "./helpers/nauty.js";
import { describeNeeds, tool } from "./helpers/requirements.js";

const GENG = "nauty-geng";

const geng = (flags: string[], n: number): string[] => gengLines([...flags, String(n)]);

interface Classified {
  line: string;
  K3free: boolean;
  C4free: boolean;
  K4free: boolean;
  bipartite: boolean;
  connected: boolean;
  minDegree: number;
}

describeNeeds([tool(GENG)], "all graphs on n ≤ 8 vertices vs nauty-geng filters", () => {
  // Source: nauty-geng (Debian nauty) options -t, -f, -k, -b, -c, -d# as documented by `geng -help`.
  // geng's filtered output uses the same labelling as its unfiltered output, so the sets compare line by line.
  const K3 = patternGraph("K3"), C4 = patternGraph("C4"), K4 = patternGraph("K4");
  const byN = new Map<number, Classified[]>();
  const classify = (n: number): Classified[] => {
    let c = byN.get(n);
    if (c !== undefined) return c;
    c = geng([], n).map((line) => {
      const g: Graph = parseGraph6(line);
      const tri = countTriangles(g).total;
      const c4 = countFourCycles(g).total;
      const k4 = findClique(g, 4).found;
      // Independent routes to the same answers must agree with each other too.
      expect(findClique(g, 3).found).toBe(tri > 0);
      expect(findCycle(g, 4).found).toBe(c4 > 0);
      expect(findSubgraph(g, K3).found).toBe(tri > 0);
      expect(findSubgraph(g, C4).found).toBe(c4 > 0);
      expect(findSubgraph(g, K4).found).toBe(k4);
      return {
        line,
        K3free: tri === 0,
        C4free: c4 === 0,
        K4free: !k4,
        bipartite: bipartition(g).bipartite,
        connected: connectedComponents(g).count === 1,
        minDegree: degreeStats(g).min,
      };
    });
    byN.set(n, c);
    return c;
  };
  const sorted = (xs: string[]) => [...xs].sort();

  for (let n = 1; n <= 8; n++) {
    it(`n = ${n}`, () => {
      const all = classify(n);
      // Sizes of the unfiltered stream: OEIS A000088 (1, 2, 4, 11, 34, 156, 1044, 12346).
      expect(all.length).toBe([1, 2, 4, 11, 34, 156, 1044, 12346][n - 1]);
      const ours = (p: (c: Classified) => boolean) => sorted(all.filter(p).map((c) => c.line));
      expect(ours((c) => c.K3free)).toEqual(sorted(geng(["-t"], n)));
      expect(ours((c) => c.C4free)).toEqual(sorted(geng(["-f"], n)));
      expect(ours((c) => c.K3free && c.C4free)).toEqual(sorted(geng(["-tf"], n)));
      expect(ours((c) => c.K4free)).toEqual(sorted(geng(["-k"], n)));
      expect(ours((c) => c.bipartite)).toEqual(sorted(geng(["-b"], n)));
      expect(ours((c) => c.connected)).toEqual(sorted(geng(["-c"], n)));
      // geng refuses -d2 below 3 vertices, where no graph has minimum degree 2.
      expect(ours((c) => c.minDegree >= 2)).toEqual(n >= 3 ? sorted(geng(["-d2"], n)) : []);
    });
  }

  it("describeGraph's free flags agree with the same filters on n = 7", () => {
    const all = classify(7);
    const free = all.map((c) => describeGraph(parseGraph6(c.line)).free);
    const pick = (f: (x: (typeof free)[number]) => boolean | null) => sorted(all.filter((_, i) => f(free[i]) === true).map((c) => c.line));
    expect(pick((x) => x.K3)).toEqual(sorted(geng(["-t"], 7)));
    expect(pick((x) => x.C4)).toEqual(sorted(geng(["-f"], 7)));
    expect(pick((x) => x.K4)).toEqual(sorted(geng(["-k"], 7)));
  });
});
