// Generalized Petersen graph GP(n, k): outer cycle u_0…u_{n−1} (ids 0..n−1), spokes u_i v_i, and
// inner edges v_i v_{i+k} (ids n..2n−1). GP(5,2) is the Petersen graph, GP(10,2) the dodecahedron.

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

function gcd(a: number, b: number): number {
  while (b !== 0) [a, b] = [b, a % b];
  return a;
}

/** Builds GP(n, k) for 1 ≤ k < n/2; trusts its arguments. */
export function buildGeneralizedPetersen(n: number, k: number): Graph {
  const buf = new EdgeBuffer({ capacity: 3 * n });
  for (let i = 0; i < n; i++) {
    buf.add(i, (i + 1) % n);
    buf.add(i, n + i);
    buf.add(n + i, n + ((i + k) % n));
  }
  return buf.build(2 * n).graph;
}

/** GP(n, k), validated like the spec `generalized-petersen:n=…,k=…`. */
export function generalizedPetersen(n: number, k: number): Graph {
  const p = resolveTyped(generalizedPetersenFamily, { n, k });
  return buildGeneralizedPetersen(p.n, p.k);
}

export const generalizedPetersenFamily = defineFamily({
  name: "generalized-petersen",
  aliases: ["generalised-petersen"],
  summary: "generalized Petersen graph GP(n,k): an n-cycle, spokes, and inner edges v_i v_(i+k)",
  params: [
    { name: "n", type: "integer", description: "outer cycle length", default: 5, min: 3, max: 50_000_000 },
    { name: "k", type: "integer", description: "inner step, 1 ≤ k < n/2", default: 2, min: 1, max: 25_000_000 },
  ],
  random: false,
  validate: (p) => {
    const n = p.n, k = p.k;
    if (2 * k >= n) throw invalidParameter("generalized-petersen", "k", `should be less than n/2 = ${n / 2}`, k);
  },
  freeOf: (p) => {
    const n = p.n, k = p.k;
    // The spokes form a perfect matching and no vertex has two spokes, so a triangle lies in the
    // outer n-cycle or in one inner cycle of length n/gcd(n,k).
    const inner = n / gcd(n, k);
    return n !== 3 && inner !== 3 ? [{ pattern: "K3", citation: `outer cycle length ${n}, inner cycles of length ${inner}; spokes are a matching (elementary)` }] : [];
  },
  predictedSize: (p) => ({ n: 2 * p.n, m: 3 * p.n, mExact: true, minDegree: 3, maxDegree: 3 }),
  build: (p) => buildGeneralizedPetersen(p.n, p.k),
});
