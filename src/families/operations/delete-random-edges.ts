// Random edge deletion: each edge is kept independently with probability 1 − p (weights
// kept). Deleted edges are found by geometric skipping over the edges in (u, v) order.

import type { Graph } from "../../graph/graph.js";
import { buildGraph } from "../../graph/builder.js";
import { Rng } from "../../random/prng.js";
import { geometricSkip } from "../gnp.js";
import { checkSeed } from "../../random/seed.js";
import { checkTypedParam } from "../typed-build.js";
import { defineFamily } from "../types.js";
import { unknownSize } from "./nested-size.js";

/**
 * Each edge deleted with probability p, like the spec `delete-random-edges:of=[…],p=…,seed=…`.
 * `graphSeed` may be a caller's Rng; the draws follow the edges in (u, v) order, so the result is reproducible.
 */
export function deleteRandomEdges(g: Graph, p: number, graphSeed: Rng | number): Graph {
  checkTypedParam(deleteRandomEdgesFamily, "p", p);
  const r = typeof graphSeed === "number" ? new Rng(checkSeed(deleteRandomEdgesFamily.name, "seed", graphSeed)) : graphSeed;
  const { us, vs, ws } = g.edgeArrays();
  const m = us.length;
  const keep = new Uint8Array(m).fill(1);
  if (p === 1) keep.fill(0);
  else if (p > 0) {
    const logQ = Math.log1p(-p);
    for (let e = -1; ; ) {
      e += 1 + geometricSkip(r, logQ);
      if (e >= m) break;
      keep[e] = 0;
    }
  }
  let kept = 0;
  for (let e = 0; e < m; e++) kept += keep[e];
  const ku = new Int32Array(kept);
  const kv = new Int32Array(kept);
  const kw = ws === null ? null : new Float64Array(kept);
  for (let e = 0, k = 0; e < m; e++) {
    if (keep[e] === 0) continue;
    ku[k] = us[e];
    kv[k] = vs[e];
    if (kw !== null) kw[k] = ws![e];
    k++;
  }
  return buildGraph(g.n, ku, kv, kw).graph;
}

export const deleteRandomEdgesFamily = defineFamily({
  name: "delete-random-edges",
  summary: "random edge deletion: each edge of the nested graph kept with probability 1 − p",
  params: [
    { name: "of", type: "spec", description: "the graph to thin out, e.g. [petersen]" },
    { name: "p", type: "number", description: "probability that an edge is deleted", min: 0, max: 1 },
  ],
  random: true,
  freeOf: () => [],
  predictedSize: (params, ctx) => {
    const s = ctx?.predictedSizeOf(params.of);
    if (s === undefined) return unknownSize();
    const p = params.p;
    return { n: s.n, m: s.m * (1 - p), mExact: p === 1 || (p === 0 && s.mExact) };
  },
  build: (params, ctx) => deleteRandomEdges(ctx.resolve(params.of), params.p, ctx.rng),
  notes: ["Deleting edges keeps every H-free property of the nested graph."],
});
