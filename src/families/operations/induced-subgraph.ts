// The induced subgraph of a nested spec as a family; the typed function is `inducedSubgraph`
// (src/graph/induced.ts): vertices relabelled 0..k−1 in the order given, edge weights kept.

import { invalidParameter } from "../../errors.js";
import { inducedSubgraph } from "../../graph/induced.js";
import { defineFamily } from "../types.js";
import { unknownSize } from "./nested-size.js";

export const inducedSubgraphFamily = defineFamily({
  name: "induced-subgraph",
  summary: "induced subgraph on the listed vertices, relabelled 0..k−1 in the order given",
  params: [
    { name: "of", type: "spec", description: "the host graph, e.g. [petersen]" },
    { name: "vertices", type: "integer-list", description: "distinct vertex ids of the host, e.g. 0+1+2+5" },
  ],
  random: false,
  validate: (params) => {
    // The host's size is known only once it is built (then `inducedSubgraph` checks the range).
    const seen = new Set<number>();
    for (const v of params.vertices) {
      if (v < 0) throw invalidParameter("induced-subgraph", "vertices", "should be vertex ids of at least 0", v);
      if (seen.has(v)) throw invalidParameter("induced-subgraph", "vertices", "should list each vertex once", v);
      seen.add(v);
    }
  },
  freeOf: () => [],
  predictedSize: (params, ctx) => {
    const s = ctx?.predictedSizeOf(params.of);
    if (s === undefined) return unknownSize();
    const k = params.vertices.length;
    // Without the graph, only the edge density is known: its share of the k(k−1)/2 pairs.
    const density = s.n > 1 ? s.m / ((s.n * (s.n - 1)) / 2) : 0;
    return { n: k, m: (density * k * (k - 1)) / 2, mExact: false };
  },
  build: (params, ctx) => inducedSubgraph(ctx.resolve(params.of), params.vertices, "induced-subgraph"),
  notes: ["Every induced subgraph of an H-free graph is H-free."],
});
