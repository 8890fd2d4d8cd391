// Induced subgraph on a list of vertices, relabelled 0..k−1 in the order given; edge
// weights are kept.

import { invalidParameter } from "../../errors.js";
import { inducedSubgraph } from "../../graph/induced.js";
import type { FamilyDefinition, Params } from "../types.js";
import { unknownShape, type ShapeContext } from "./nested-shape.js";

export const inducedFamily: FamilyDefinition = {
  name: "induced",
  summary: "induced subgraph on the listed vertices, relabelled 0..k−1 in the order given",
  params: [
    { name: "of", type: "spec", description: "the host graph, e.g. [petersen]" },
    { name: "vertices", type: "integer-list", description: "distinct vertex ids of the host, e.g. 0+1+2+5" },
  ],
  random: false,
  validate: (params: Params) => {
    // The host's size is known only once it is built (then `inducedSubgraph` checks the range).
    const seen = new Set<number>();
    for (const v of params.vertices as number[]) {
      if (v < 0) throw invalidParameter("induced", "vertices", "should be vertex ids of at least 0", v);
      if (seen.has(v)) throw invalidParameter("induced", "vertices", "should list each vertex once", v);
      seen.add(v);
    }
  },
  freeOf: () => [],
  expected: (params, ctx?: ShapeContext) => {
    const s = ctx?.expectedOf(params.of as string);
    if (s === undefined) return unknownShape();
    const k = (params.vertices as number[]).length;
    // Without the graph, only the edge density is known: its share of the k(k−1)/2 pairs.
    const density = s.n > 1 ? s.m / ((s.n * (s.n - 1)) / 2) : 0;
    return { n: k, m: (density * k * (k - 1)) / 2, mExact: false };
  },
  build: (params, ctx) => inducedSubgraph(ctx.resolve(params.of as string), params.vertices as number[], "induced"),
  notes: "Every induced subgraph of an H-free graph is H-free.",
};
