// Mycielski's construction μ(G) (Mycielski 1955) and its iterates from K2: μ(K2) = C5,
// μ²(K2) = Grötzsch graph. Each step keeps triangle-freeness and raises the chromatic number by one.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { resolveParams } from "./spec.js";
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

function iterateFromK2(iterations: number): Graph {
  const k2 = new EdgeBuffer({ capacity: 1 });
  k2.add(0, 1);
  let g = k2.build(2).graph;
  for (let i = 0; i < iterations; i++) g = mycielskian(g);
  return g;
}

/** μ^t(K2): t = 1 gives C5, t = 2 the Grötzsch graph; chromatic number t + 2. */
export function mycielskiGraph(iterations: number): Graph {
  const p = resolveParams(mycielski, { iterations }).params;
  return iterateFromK2(p.iterations as number);
}

/** n' = 2n + 1, m' = 3m + n, δ' = δ + 1 (a shadow of a minimum-degree vertex), Δ' = max(2Δ, n) (the apex). */
function mycielskiShape(iterations: number): ExpectedShape {
  let n = 2, m = 1, lo = 1, hi = 1;
  for (let i = 0; i < iterations; i++) {
    [n, m, lo, hi] = [2 * n + 1, 3 * m + n, Math.min(lo + 1, n), Math.max(2 * hi, n)];
  }
  return { n, m, mExact: true, minDegree: lo, maxDegree: hi };
}

export const mycielski: FamilyDefinition = {
  name: "mycielski",
  summary: "Mycielski iterates of K2: 1 step gives C5, 2 steps the Grötzsch graph",
  params: [{ name: "iterations", type: "integer", description: "number of Mycielski steps applied to K2", default: 2, min: 0, max: 20 }],
  random: false,
  freeOf: () => [{ pattern: "K3", source: "Mycielski 1955: the construction keeps triangle-freeness (K2 is triangle-free)" }],
  expected: (p) => mycielskiShape(p.iterations as number),
  build: (p) => iterateFromK2(p.iterations as number),
  notes: "Chromatic number iterations + 2 (Mycielski 1955).",
};
