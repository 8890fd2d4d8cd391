// Mycielski's construction μ(G) (Mycielski 1955) and its iterates from K2: μ(K2) = C5,
// μ²(K2) = Grötzsch graph. Each step keeps triangle-freeness and raises the chromatic number by one.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { resolveTyped } from "./typed-build.js";
import type { ExpectedShape, FamilyDefinition } from "./types.js";

/**
 * μ(G) on 2n + 1 vertices: the originals 0..n−1 keep their edges, shadow n + i is joined to the
 * neighbours of i, and the apex 2n is joined to every shadow. Edge weights are not carried over.
 */
export function mycielskian(g: Graph): Graph {
  const n = g.n;
  const buf = new EdgeBuffer({ capacity: Math.max(16, 3 * g.m + n) });
  const { offsets, neighbors } = g;
  for (let u = 0; u < n; u++) {
    for (let i = offsets[u]; i < offsets[u + 1]; i++) {
      const v = neighbors[i];
      if (v > u) buf.add(u, v);
      buf.add(n + u, v); // every arc u→v gives shadow(u)–v, so both shadows of an edge appear once
    }
    buf.add(n + u, 2 * n);
  }
  return buf.build(2 * n + 1).graph;
}

const K2_SPEC = "complete:n=2";

function iterate(start: Graph, iterations: number): Graph {
  let g = start;
  for (let i = 0; i < iterations; i++) g = mycielskian(g);
  return g;
}

function k2(): Graph {
  const b = new EdgeBuffer({ capacity: 1 });
  b.add(0, 1);
  return b.build(2).graph;
}

/** μ^t(K2): t = 1 gives C5, t = 2 the Grötzsch graph; chromatic number t + 2. */
export function mycielskiGraph(iterations: number): Graph {
  const p = resolveTyped(mycielski, { iterations, of: K2_SPEC });
  return iterate(k2(), p.iterations as number);
}

/** n' = 2n + 1, m' = 3m + n, δ' = δ + 1 (a shadow of a minimum-degree vertex), Δ' = max(2Δ, n) (the apex). */
function mycielskiShape(start: ExpectedShape, iterations: number): ExpectedShape {
  let { n, m } = start;
  let lo = start.minDegree ?? 0, hi = start.maxDegree ?? n - 1;
  for (let i = 0; i < iterations; i++) {
    [n, m, lo, hi] = [2 * n + 1, 3 * m + n, Math.min(lo + 1, n), Math.max(2 * hi, n)];
  }
  return { n, m, mExact: start.mExact, minDegree: lo, maxDegree: hi };
}

export const mycielski: FamilyDefinition = {
  name: "mycielski",
  summary: "Mycielski iterates (of K2 by default: 1 step gives C5, 2 steps the Grötzsch graph)",
  params: [
    { name: "iterations", type: "integer", description: "number of Mycielski steps", default: 2, min: 0, max: 20 },
    { name: "of", type: "spec", description: "the graph the steps start from", default: K2_SPEC },
  ],
  random: false,
  // Only the start K2 is known to be triangle-free here; other starts make no claim.
  freeOf: (p) =>
    p.of === K2_SPEC ? [{ pattern: "K3", source: "Mycielski 1955: the construction keeps triangle-freeness, starting from K2" }] : [],
  expected: (p, ctx) => {
    const start: ExpectedShape =
      p.of === K2_SPEC ? { n: 2, m: 1, mExact: true, minDegree: 1, maxDegree: 1 } : (ctx?.expectedOf(p.of as string) ?? { n: NaN, m: NaN, mExact: false });
    return mycielskiShape(start, p.iterations as number);
  },
  build: (p, ctx) => iterate(ctx.resolve(p.of as string), p.iterations as number),
  notes: "Chromatic number iterations + 2 (Mycielski 1955).",
};
