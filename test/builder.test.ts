import { describe, expect, it } from "vitest";
import { buildGraph, EdgeBuffer, graphFromEdges } from "../src/graph/builder.js";
import { fromGraphology, toGraphology } from "../src/graph/graphology.js";
import { graphFromParts, graphToParts } from "../src/graph/graph.js";
import { Rng } from "../src/random/prng.js";

describe("CSR builder", () => {
  it("sorts neighbour lists and stores each edge twice", () => {
    const g = graphFromEdges(5, [[3, 1], [0, 4], [1, 0], [4, 3], [2, 1]]);
    expect(g.n).toBe(5);
    expect(g.m).toBe(5);
    expect([...g.neighborsOf(1)]).toEqual([0, 2, 3]);
    expect([...g.neighborsOf(4)]).toEqual([0, 3]);
    expect(g.hasEdge(3, 4)).toBe(true);
    expect(g.hasEdge(2, 4)).toBe(false);
    expect(g.totalWeight).toBe(5);
  });

  it("agrees with a naive adjacency-set build on random edge lists", () => {
    // Oracle: a plain Set-based adjacency (common practice, no source).
    const r = new Rng(1);
    for (let t = 0; t < 50; t++) {
      const n = 1 + r.nextInt(40);
      const seen = new Set<string>();
      const edges: [number, number][] = [];
      for (let k = 0; k < 3 * n; k++) {
        const u = r.nextInt(n), v = r.nextInt(n);
        if (u === v) continue;
        const key = `${Math.min(u, v)},${Math.max(u, v)}`;
        if (seen.has(key)) continue;
        seen.add(key);
        edges.push([u, v]);
      }
      const g = graphFromEdges(n, edges);
      expect(g.m).toBe(edges.length);
      for (let v = 0; v < n; v++) {
        const expected = edges.flatMap(([a, b]) => (a === v ? [b] : b === v ? [a] : [])).sort((x, y) => x - y);
        expect([...g.neighborsOf(v)]).toEqual(expected);
      }
    }
  });

  it("gives the same graph whether edges arrive sorted (direct placement) or shuffled", () => {
    // Oracle: the general two-pass path on a shuffled copy (common practice, no source).
    const r = new Rng(3);
    const n = 60;
    const pairs: [number, number][] = [];
    for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) if (r.nextFloat() < 0.2) pairs.push([u, v]);
    const byMax = [...pairs].sort((a, b) => a[1] - b[1] || a[0] - b[0]);
    const shuffled = r.shuffle([...pairs]);
    const g1 = graphFromEdges(n, pairs), g2 = graphFromEdges(n, byMax), g3 = graphFromEdges(n, shuffled);
    expect([...g1.neighbors]).toEqual([...g3.neighbors]);
    expect([...g2.neighbors]).toEqual([...g3.neighbors]);
    expect([...g1.offsets]).toEqual([...g3.offsets]);
    // A repeat at the end of an otherwise sorted list is still caught.
    expect(() => graphFromEdges(n, [...pairs, pairs[pairs.length - 1]])).toThrow(/duplicate edge/);
  });

  it("rejects loops, duplicates, bad ids and weights by default, naming the edge", () => {
    expect(() => graphFromEdges(3, [[0, 0]])).toThrow(/edge #0: self-loop at vertex 0/);
    expect(() => graphFromEdges(3, [[0, 1], [1, 0]])).toThrow(/edge #1: duplicate edge \{0, 1\}/);
    expect(() => graphFromEdges(3, [[0, 3]])).toThrow(/out of range/);
    expect(() => graphFromEdges(3, [[0, 1.5]])).toThrow(/integers/);
    expect(() => buildGraph(3, [0], [1], [NaN])).toThrow(/finite/);
    // Refused before allocating (2·10^9 vertices would need tens of GB): common practice, no source.
    expect(() => buildGraph(2_000_000_000, [0], [1])).toThrow(/at most 1e\+8 vertices/);
  });

  it("merges duplicates and drops loops only when asked, and reports how many", () => {
    const { graph, report } = buildGraph(3, [0, 1, 2, 0], [1, 0, 2, 2], [1, 2, 5, 4], { duplicates: "merge", loops: "drop" });
    expect(report).toEqual({ mergedDuplicates: 1, droppedLoops: 1 });
    expect(graph.m).toBe(2);
    expect(graph.edgeWeight(0, 1)).toBe(3);
    expect(graph.totalWeight).toBe(7);
  });

  it("names the line recorded as a tag in error messages", () => {
    const b = new EdgeBuffer({ tagged: true });
    b.add(0, 1, 1, 10);
    b.add(1, 0, 1, 11);
    expect(() => b.build(2, { describeEdge: (i) => `line ${b.tagOf(i)}` })).toThrow(/^line 11: duplicate/);
  });

  it("round-trips through worker-transferable parts and graphology", () => {
    const g = graphFromEdges(4, [[0, 1, 2], [1, 2, -1], [2, 3, 0.5]]);
    const h = graphFromParts(structuredClone(graphToParts(g)));
    expect([...h.neighbors]).toEqual([...g.neighbors]);
    expect(h.totalWeight).toBe(1.5);
    const back = fromGraphology(toGraphology(g), { weightAttribute: "weight" }).graph;
    expect(back.edgeArrays()).toEqual(g.edgeArrays());
  });
});
