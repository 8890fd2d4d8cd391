// Blow-up G(t): each vertex v becomes t independent copies v·t .. v·t+t−1, and copies of
// adjacent vertices are all joined (each copy edge keeps the original edge's weight).

import { invalidParameter } from "../../errors.js";
import { EdgeBuffer } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { checkEdgeLimit } from "../limits.js";
import { checkTypedParam } from "../typed-build.js";
import { defineFamily } from "../types.js";
import { unknownSize } from "./nested-size.js";

const MAX_VERTICES = 0x7fffffff;

/** G(t), validated like the spec `blow-up:of=[…],t=…`. */
export function blowUp(g: Graph, t: number): Graph {
  checkTypedParam(blowUpFamily, "t", t);
  if (g.n * t > MAX_VERTICES) throw invalidParameter("blow-up", "t", `n·t should be below 2^31 (n = ${g.n})`, t);
  checkEdgeLimit("blow-up", g.m * t * t);
  const buf = new EdgeBuffer({ weighted: g.weighted, capacity: g.m * t * t });
  const { us, vs, ws } = g.edgeArrays();
  for (let e = 0; e < us.length; e++) {
    const a = us[e] * t;
    const b = vs[e] * t;
    const w = ws === null ? 1 : ws[e];
    for (let i = 0; i < t; i++) for (let j = 0; j < t; j++) buf.add(a + i, b + j, w);
  }
  return buf.build(g.n * t).graph;
}

export const blowUpFamily = defineFamily({
  name: "blow-up",
  summary: "blow-up: every vertex replaced by t independent copies, copies of adjacent vertices joined",
  params: [
    { name: "of", type: "spec", description: "the graph to blow up, e.g. [petersen]" },
    { name: "t", type: "integer", description: "copies per vertex", min: 1, max: 100000 },
  ],
  random: false,
  freeOf: () => [],
  predictedSize: (params, ctx) => {
    const s = ctx?.predictedSizeOf(params.of);
    if (s === undefined) return unknownSize();
    const t = params.t;
    return {
      n: s.n * t,
      m: s.m * t * t,
      mExact: s.mExact,
      ...(s.minDegree !== undefined && s.maxDegree !== undefined ? { minDegree: s.minDegree * t, maxDegree: s.maxDegree * t } : {}),
    };
  },
  build: (params, ctx) => blowUp(ctx.resolve(params.of), params.t),
  notes: ["A clique meets each set of copies at most once, so the blow-up of a K_r-free graph is K_r-free; for t ≥ 2 any edge gives a C4."],
});
