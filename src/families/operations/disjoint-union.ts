// Disjoint union: the graphs side by side, the i-th relabelled by the total order of those
// before it. Weighted when any part is (unweighted parts' edges weigh 1).

import { InputError } from "../../errors.js";
import { EdgeBuffer } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { checkEdgeLimit } from "../limits.js";
import { defineFamily, type PredictedSize } from "../types.js";
import { unknownSize } from "./nested-size.js";

export function disjointUnion(...gs: Graph[]): Graph {
  let n = 0;
  let m = 0;
  for (const g of gs) {
    n += g.n;
    m += g.m;
  }
  if (n > 0x7fffffff) throw new InputError(`disjoint-union: ${n} vertices in total; at most 2^31 − 1 fit`);
  checkEdgeLimit("disjoint-union", m);
  const weighted = gs.some((g) => g.weighted);
  const buf = new EdgeBuffer({ weighted, capacity: m });
  let base = 0;
  for (const g of gs) {
    const { us, vs, ws } = g.edgeArrays();
    for (let e = 0; e < us.length; e++) buf.add(base + us[e], base + vs[e], ws === null ? 1 : ws[e]);
    base += g.n;
  }
  return buf.build(n).graph;
}

export const disjointUnionFamily = defineFamily({
  name: "disjoint-union",
  summary: "disjoint union of graphs, relabelled one after another",
  params: [{ name: "of", type: "spec-list", description: "the graphs, e.g. [cycle:n=5]+[petersen]" }],
  random: false,
  freeOf: () => [],
  predictedSize: (params, ctx) => {
    if (ctx === undefined) return unknownSize();
    const shapes: PredictedSize[] = params.of.map((s) => ctx.predictedSizeOf(s));
    const known = shapes.every((s) => s.minDegree !== undefined && s.maxDegree !== undefined);
    return {
      n: shapes.reduce((a, s) => a + s.n, 0),
      m: shapes.reduce((a, s) => a + s.m, 0),
      mExact: shapes.every((s) => s.mExact),
      ...(known ? { minDegree: Math.min(...shapes.map((s) => s.minDegree!)), maxDegree: Math.max(...shapes.map((s) => s.maxDegree!)) } : {}),
    };
  },
  build: (params, ctx) => disjointUnion(...(params.of).map((s) => ctx.resolve(s))),
});
