// Complete graph K_n: every pair adjacent. m = n(n−1)/2, (n−1)-regular.
// Max cut ⌊n²/4⌋ (balanced bipartition); for odd n it meets Edwards' bound with equality.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

/** Builds K_n; trusts its argument (callers validated it). */
export function buildComplete(n: number): Graph {
  const buf = new EdgeBuffer({ capacity: (n * (n - 1)) / 2 });
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) buf.add(u, v);
  return buf.build(n).graph;
}

export const completeFamily = defineFamily({
  name: "complete",
  summary: "complete graph K_n",
  params: [{ name: "n", type: "integer", description: "number of vertices", default: 5, min: 1, max: 30000 }],
  random: false,
  freeOf: (p) => (p.n < 3 ? [{ pattern: "K3", citation: "fewer than 3 vertices" }] : []),
  predictedSize: (p) => {
    const n = p.n;
    return { n, m: (n * (n - 1)) / 2, mExact: true, minDegree: n - 1, maxDegree: n - 1 };
  },
  build: (p) => buildComplete(p.n),
});

/** K_n, validated like the spec `complete:n=…`. */
export function complete(n: number): Graph {
  return buildComplete(resolveTyped(completeFamily, { n }).n);
}
