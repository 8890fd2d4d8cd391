// The bitmask exact search for tiny graphs (src/cut/exact/bitmask-max-cut.ts) against the
// suites' brute force, the existing exact search, and every graph nauty's geng makes on ≤ 7 vertices.
import { describe, expect, it } from "vitest";
import { bitmaskExactMaxCut, bitmaskMaxCut, adjacencyMasks, BITMASK_MAX_VERTICES, type BitmaskCutStats } from "../src/cut/exact/bitmask-max-cut.js";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { gnp } from "../src/families/gnp.js";
import { graphFromEdges } from "../src/graph/builder.js";
import { parseGraph6 } from "../src/graph/formats/graph6.js";
import { bruteForceMaxCut, cutOfPartition } from "./helpers/maxcut.js";
import { gengLines } from "./helpers/nauty.js";
import { itNeeds, tool } from "./helpers/requirements.js";

describe("bitmask exact max cut", () => {
  itNeeds([tool("nauty-geng")], "agrees with brute force on every graph with at most 7 vertices (nauty-geng)", () => {
    // Graph counts on n = 1..7 vertices: OEIS A000088 (1, 2, 4, 11, 34, 156, 1044).
    const counts = [1, 2, 4, 11, 34, 156, 1044];
    let checked = 0;
    for (let n = 1; n <= 7; n++) {
      const lines = gengLines([String(n)]);
      expect(lines.length).toBe(counts[n - 1]);
      for (const line of lines) {
        const g = parseGraph6(line);
        const r = bitmaskExactMaxCut(g);
        expect(r.value, line).toBe(bruteForceMaxCut(g));
        expect(cutOfPartition(g, r.partition), line).toBe(r.value);
        expect(r.upper).toBe(r.value);
        checked++;
      }
    }
    expect(checked).toBe(1252);
  });

  it("agrees with the existing exact search (exactMaxCut) on seeded random graphs up to 20 vertices", () => {
    let checked = 0;
    for (const n of [8, 11, 14, 17, 20]) {
      for (const p of [0.1, 0.2, 0.35, 0.6]) {
        for (let seed = 0; seed < 6; seed++) {
          const g = gnp(n, p, seed);
          const r = bitmaskExactMaxCut(g);
          const ref = exactMaxCut(g, { work: 1e9 });
          expect(ref.status).toBe("optimal");
          expect(r.value, `gnp n=${n} p=${p} seed=${seed}`).toBe(ref.value);
          expect(cutOfPartition(g, r.partition)).toBe(r.value);
          if (n <= 14) expect(r.value).toBe(bruteForceMaxCut(g));
          checked++;
        }
      }
    }
    expect(checked).toBe(120);
  });

  it("peels leaves and cuts bipartite cores without enumerating; stops an odd core at m − 1 when reached", () => {
    const stats: BitmaskCutStats = { core: -1, graySteps: -1, side: 0 };
    // A path on 6 vertices: all leaves peel away in turn (maxcut = m = 5: a path is bipartite).
    const path = graphFromEdges(6, [[0, 1], [1, 2], [2, 3], [3, 4], [4, 5]]);
    expect(bitmaskMaxCut(adjacencyMasks(path), 6, stats)).toBe(5);
    expect(stats.core).toBe(0);
    // An even cycle: bipartite core of 8 vertices, no Gray steps.
    const c8 = graphFromEdges(8, Array.from({ length: 8 }, (_, i) => [i, (i + 1) % 8] as [number, number]));
    expect(bitmaskMaxCut(adjacencyMasks(c8), 8, stats)).toBe(8);
    expect(stats).toMatchObject({ core: 8, graySteps: 0 });
    // C5 with a pendant path: the core is C5 (maxcut 4 = m − 1), the two pendant edges are cut.
    const c5tail = graphFromEdges(7, [[0, 1], [1, 2], [2, 3], [3, 4], [4, 0], [0, 5], [5, 6]]);
    expect(bitmaskMaxCut(adjacencyMasks(c5tail), 7, stats)).toBe(6);
    expect(stats.core).toBe(5);
    expect(stats.graySteps).toBeLessThan(16); // stopped at the bound before the 2^4 − 1 patterns ran out
    // K5 (common practice, no source: maxcut of K_n is ⌊n²/4⌋): never reaches m − 1, all 15 steps run.
    const k5 = graphFromEdges(5, [[0, 1], [0, 2], [0, 3], [0, 4], [1, 2], [1, 3], [1, 4], [2, 3], [2, 4], [3, 4]]);
    expect(bitmaskMaxCut(adjacencyMasks(k5), 5, stats)).toBe(6);
    expect(stats.graySteps).toBe(15);
  });

  it("refuses graphs beyond its size and weighted graphs", () => {
    const big = graphFromEdges(BITMASK_MAX_VERTICES + 1, [[0, 1]]);
    expect(() => bitmaskExactMaxCut(big)).toThrow(/at most 30/);
    const weighted = graphFromEdges(3, [[0, 1, 2], [1, 2, 1]]);
    expect(() => bitmaskExactMaxCut(weighted)).toThrow(/unweighted/);
  });
});
