// Path P_n on n vertices 0—1—…—(n−1): a tree, so free of every cycle.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { girthFreeOf } from "./free-of.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

function buildPath(n: number): Graph {
  const buf = new EdgeBuffer({ capacity: Math.max(16, n - 1) });
  for (let v = 0; v + 1 < n; v++) buf.add(v, v + 1);
  return buf.build(n).graph;
}

/** P_n, validated like the spec `path:n=…`. */
export function path(n: number): Graph {
  const p = resolveTyped(pathFamily, { n });
  return buildPath(p.n);
}

export const pathFamily = defineFamily({
  name: "path",
  summary: "path P_n on n vertices",
  params: [{ name: "n", type: "integer", description: "number of vertices", default: 5, min: 1, max: 100_000_000 }],
  random: false,
  freeOf: () => girthFreeOf(Infinity, "a path is a tree"),
  predictedSize: (p) => {
    const n = p.n;
    return { n, m: n - 1, mExact: true, minDegree: n === 1 ? 0 : 1, maxDegree: n <= 2 ? n - 1 : 2 };
  },
  build: (p) => buildPath(p.n),
});
