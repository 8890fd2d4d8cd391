// Random bipartite graph G(a, b, p): parts 0..a−1 and a..a+b−1, each of the a·b cross pairs
// an edge independently with probability p; geometric skipping keeps it O(a + b + m).

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import type { Rng } from "../random/prng.js";
import { bipartiteFreeOf } from "./free-of.js";
import { binomialCapacity, geometricSkip, MAX_RANDOM_VERTICES } from "./gnp.js";
import { buildRandomTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

function sampleBipartite(a: number, b: number, p: number, rng: Rng): Graph {
  const pairs = a * b;
  const buf = new EdgeBuffer({ capacity: binomialCapacity(pairs, p) });
  if (p === 1) {
    for (let i = 0; i < a; i++) for (let j = 0; j < b; j++) buf.add(i, a + j);
  } else if (p > 0) {
    const logQ = Math.log1p(-p);
    // Cross pairs indexed k = i·b + j; exact in doubles since a·b < 2^53.
    for (let k = -1; ; ) {
      k += 1 + geometricSkip(rng, logQ);
      if (k >= pairs) break;
      const i = Math.floor(k / b);
      buf.add(i, a + (k - i * b));
    }
  }
  return buf.build(a + b).graph;
}

export const bipartiteGnpFamily = defineFamily({
  name: "bipartite-gnp",
  summary: "random bipartite graph: parts of sizes a and b, each cross pair an edge with probability p",
  params: [
    { name: "a", type: "integer", description: "size of the first part (vertices 0..a−1)", min: 0, max: MAX_RANDOM_VERTICES },
    { name: "b", type: "integer", description: "size of the second part (vertices a..a+b−1)", min: 0, max: MAX_RANDOM_VERTICES },
    { name: "p", type: "number", description: "edge probability for each cross pair", min: 0, max: 1 },
  ],
  random: true,
  validate: (params) => {
    const a = params.a;
    const b = params.b;
    if (a + b > MAX_RANDOM_VERTICES) {
      throw invalidParameter("bipartite-gnp", "b", `a + b should be at most ${MAX_RANDOM_VERTICES} (a = ${a})`, b);
    }
  },
  freeOf: () => bipartiteFreeOf("no odd cycles (König 1936)"),
  predictedSize: (params) => {
    const a = params.a;
    const b = params.b;
    const p = params.p;
    const exact = p === 0 || p === 1;
    if (!exact || a + b === 0) return { n: a + b, m: p * a * b, mExact: exact };
    const both = a > 0 && b > 0;
    return { n: a + b, m: p * a * b, mExact: true, minDegree: both ? p * Math.min(a, b) : 0, maxDegree: both ? p * Math.max(a, b) : 0 };
  },
  build: (params, ctx) => sampleBipartite(params.a, params.b, params.p, ctx.rng),
  notes: ["Geometric skipping over the a·b cross pairs (Batagelj & Brandes 2005)."],
});

/** Random bipartite graph from a graph seed (spec `bipartite-gnp:a=…,b=…,p=…,seed=…`) or a caller's Rng. */
export function bipartiteGnp(a: number, b: number, p: number, graphSeed: number | Rng = 0): Graph {
  return buildRandomTyped(bipartiteGnpFamily, { a, b, p }, graphSeed);
}
