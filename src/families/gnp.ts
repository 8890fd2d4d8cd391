// Erdős–Rényi G(n, p): each of the n(n−1)/2 pairs is an edge independently with probability p.
// Geometric skipping over the pairs (Batagelj & Brandes 2005) gives O(n + m) expected time.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import type { Rng } from "../random/prng.js";
import { buildComplete } from "./complete.js";
import { buildRandomTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

/**
 * Largest vertex count of the random families: typed arrays of a few n entries must fit, and
 * pair keys u·n + v (gnm) stay exact integers below 2^53.
 */
export const MAX_RANDOM_VERTICES = 50_000_000;

/**
 * Number of failures before the next success in Bernoulli trials with log(1 − p) = `logQ`
 * (p in (0, 1)): ⌊log U / log(1 − p)⌋ with U uniform in (0, 1]. May be huge when p is tiny.
 */
export function geometricSkip(rng: Rng, logQ: number): number {
  return Math.floor(Math.log(rng.nextFloatOpenZero()) / logQ);
}

/** A capacity hint for about `mean` Binomial successes: the mean plus 5 standard deviations. */
export function binomialCapacity(trials: number, p: number): number {
  const mean = trials * p;
  return Math.min(trials, Math.ceil(mean + 5 * Math.sqrt(mean * (1 - p)) + 16));
}

function sampleGnp(n: number, p: number, rng: Rng): Graph {
  if (p === 1) return buildComplete(n);
  const buf = new EdgeBuffer({ capacity: binomialCapacity((n * (n - 1)) / 2, p) });
  if (p > 0 && n > 1) {
    const logQ = Math.log1p(-p);
    // Pairs (w, v) with w < v in the order v = 1, 2, ...; w runs past v − 1 into the next rows.
    let v = 1;
    let w = -1;
    while (v < n) {
      w += 1 + geometricSkip(rng, logQ);
      while (w >= v && v < n) {
        w -= v;
        v++;
      }
      if (v < n) buf.add(w, v);
    }
  }
  return buf.build(n).graph;
}

export const gnpFamily = defineFamily({
  name: "gnp",
  summary: "Erdős–Rényi random graph G(n, p): each pair an edge independently with probability p",
  params: [
    { name: "n", type: "integer", description: "number of vertices", min: 0, max: MAX_RANDOM_VERTICES },
    { name: "p", type: "number", description: "edge probability", min: 0, max: 1 },
  ],
  random: true,
  freeOf: () => [],
  predictedSize: (params) => {
    const n = params.n;
    const p = params.p;
    const exact = p === 0 || p === 1;
    return {
      n,
      m: (p * n * (n - 1)) / 2,
      mExact: exact,
      ...(exact && n > 0 ? { minDegree: p * (n - 1), maxDegree: p * (n - 1) } : {}),
    };
  },
  build: (params, ctx) => sampleGnp(params.n, params.p, ctx.rng),
  notes: ["Batagelj & Brandes, Efficient generation of large random networks, Phys. Rev. E 71 (2005): geometric skipping, O(n + m) expected time."],
});

/** G(n, p) from a graph seed (the graph of spec `gnp:n=…,p=…,seed=…`) or from a caller's Rng. */
export function gnp(n: number, p: number, graphSeed: number | Rng = 0): Graph {
  return buildRandomTyped(gnpFamily, { n, p }, graphSeed);
}
