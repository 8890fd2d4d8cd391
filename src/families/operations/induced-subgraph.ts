// Induced subgraph on a list of vertices, relabelled 0..k−1 in the order given; edge
// weights are kept.

import { invalidParameter } from "../../errors.js";
import { EdgeBuffer } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { checkTypedParam } from "../typed-build.js";
import type { FamilyDefinition, Params } from "../types.js";
import { unknownShape, type ShapeContext } from "./nested-shape.js";

/** Vertex ids must be distinct integers in [0, n); `n` undefined checks only distinctness and sign. */
function checkVertexList(vertices: readonly number[], n: number | undefined): void {
  const seen = new Set<number>();
  for (const v of vertices) {
    if (v < 0 || (n !== undefined && v >= n)) {
      throw invalidParameter("induced", "vertices", `should be vertex ids between 0 and ${n === undefined ? "n − 1" : n - 1}`, v);
    }
    if (seen.has(v)) throw invalidParameter("induced", "vertices", "should list each vertex once", v);
    seen.add(v);
  }
}

export function inducedSubgraph(g: Graph, vertices: ArrayLike<number>): Graph {
  const list = Array.from(vertices);
  checkTypedParam(inducedFamily, "vertices", list);
  checkVertexList(list, g.n);
  const k = list.length;
  const position = new Int32Array(g.n).fill(-1);
  for (let i = 0; i < k; i++) position[list[i]] = i;
  const buf = new EdgeBuffer({ weighted: g.weighted });
  const { offsets, neighbors, weights } = g;
  for (let i = 0; i < k; i++) {
    const v = list[i];
    for (let a = offsets[v]; a < offsets[v + 1]; a++) {
      const j = position[neighbors[a]];
      if (j > i) buf.add(i, j, weights === null ? 1 : weights[a]);
    }
  }
  return buf.build(k).graph;
}

export const inducedFamily: FamilyDefinition = {
  name: "induced",
  summary: "induced subgraph on the listed vertices, relabelled 0..k−1 in the order given",
  params: [
    { name: "of", type: "spec", description: "the host graph, e.g. [petersen]" },
    { name: "vertices", type: "integer-list", description: "distinct vertex ids of the host, e.g. 0+1+2+5" },
  ],
  random: false,
  validate: (params: Params) => checkVertexList(params.vertices as number[], undefined),
  freeOf: () => [],
  expected: (params, ctx?: ShapeContext) => {
    const s = ctx?.expectedOf(params.of as string);
    if (s === undefined) return unknownShape();
    const k = (params.vertices as number[]).length;
    // Without the graph, only the edge density is known: its share of the k(k−1)/2 pairs.
    const density = s.n > 1 ? s.m / ((s.n * (s.n - 1)) / 2) : 0;
    return { n: k, m: (density * k * (k - 1)) / 2, mExact: false };
  },
  build: (params, ctx) => inducedSubgraph(ctx.resolve(params.of as string), params.vertices as number[]),
  notes: "Every induced subgraph of an H-free graph is H-free.",
};
