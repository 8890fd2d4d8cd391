// Complement of a simple graph: the same vertices, an edge exactly where the input has none.
// Defined for unweighted graphs only (a weighted complement has no canonical weights).

import { InputError } from "../../errors.js";
import { EdgeBuffer } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { checkEdgeLimit } from "../limits.js";
import { defineFamily } from "../types.js";
import { unknownSize } from "./nested-size.js";

export function complement(g: Graph): Graph {
  if (g.weighted) throw new InputError("complement: the input graph is weighted; only unweighted graphs have a complement here");
  const n = g.n;
  const m = (n * (n - 1)) / 2 - g.m;
  checkEdgeLimit("complement", m);
  const buf = new EdgeBuffer({ capacity: m });
  const { offsets, neighbors } = g;
  for (let u = 0; u < n; u++) {
    // Merge-walk the sorted neighbour list against u+1..n−1.
    let i = offsets[u];
    const end = offsets[u + 1];
    while (i < end && neighbors[i] <= u) i++;
    for (let v = u + 1; v < n; v++) {
      if (i < end && neighbors[i] === v) i++;
      else buf.add(u, v);
    }
  }
  return buf.build(n).graph;
}

export const complementFamily = defineFamily({
  name: "complement",
  summary: "complement of a graph: edges exactly where the nested graph has none",
  params: [{ name: "of", type: "spec", description: "the graph to complement, e.g. [petersen]" }],
  random: false,
  freeOf: () => [],
  predictedSize: (params, ctx) => {
    const s = ctx?.predictedSizeOf(params.of);
    if (s === undefined) return unknownSize();
    const n = s.n;
    return {
      n,
      m: (n * (n - 1)) / 2 - s.m,
      mExact: s.mExact,
      ...(s.minDegree !== undefined && s.maxDegree !== undefined ? { minDegree: n - 1 - s.maxDegree, maxDegree: n - 1 - s.minDegree } : {}),
    };
  },
  build: (params, ctx) => complement(ctx.resolve(params.of)),
});
