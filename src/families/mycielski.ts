// Mycielski's construction μ(G) (Mycielski 1955): each step keeps triangle-freeness and raises the
// chromatic number by one. Two families: `mycielski-chain`, the steps applied to K2 (1 step gives
// C5, 2 steps the 11-vertex Grötzsch graph, 3 steps 23 vertices), and `mycielski-of`, the steps
// applied to any graph given as a nested spec.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { checkTypedParam, resolveTyped } from "./typed-build.js";
import { defineFamily, type PredictedSize } from "./types.js";
import { unknownSize } from "./operations/nested-size.js";

/**
 * One step μ(G) on 2n + 1 vertices: the originals 0..n−1 keep their edges, shadow n + i is joined
 * to the neighbours of i, and the apex 2n is joined to every shadow. Edge weights are not carried over.
 */
function mycielskiStep(g: Graph): Graph {
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

function applySteps(start: Graph, steps: number): Graph {
  let g = start;
  for (let i = 0; i < steps; i++) g = mycielskiStep(g);
  return g;
}

function k2(): Graph {
  const b = new EdgeBuffer({ capacity: 1 });
  b.add(0, 1);
  return b.build(2).graph;
}

/** Each step: n' = 2n + 1, m' = 3m + n, δ' = δ + 1 (a shadow of a minimum-degree vertex), Δ' = max(2Δ, n) (the apex). */
function sizeAfterSteps(start: PredictedSize, steps: number): PredictedSize {
  let { n, m } = start;
  let lo = start.minDegree ?? 0, hi = start.maxDegree ?? n - 1;
  for (let i = 0; i < steps; i++) {
    [n, m, lo, hi] = [2 * n + 1, 3 * m + n, Math.min(lo + 1, n), Math.max(2 * hi, n)];
  }
  return { n, m, mExact: start.mExact, minDegree: lo, maxDegree: hi };
}

const K2_SIZE: PredictedSize = { n: 2, m: 1, mExact: true, minDegree: 1, maxDegree: 1 };

export const mycielskiChainFamily = defineFamily({
  name: "mycielski-chain",
  summary: "Mycielski steps applied to K2: steps=1 gives C5, steps=2 the Grötzsch graph (11 vertices), steps=3 has 23 vertices",
  params: [{ name: "steps", type: "integer", description: "Mycielski steps applied to K2 (0 gives K2 itself)", default: 2, min: 0, max: 20 }],
  random: false,
  freeOf: () => [{ pattern: "K3", citation: "Mycielski 1955: each step keeps triangle-freeness, starting from K2" }],
  predictedSize: (p) => sizeAfterSteps(K2_SIZE, p.steps),
  build: (p) => applySteps(k2(), p.steps),
  notes: ["Chromatic number steps + 2 (Mycielski 1955).", "Numbering: steps counts the constructions applied to K2, so steps=2 is the 11-vertex Grötzsch graph."],
});

/** K2 after `steps` Mycielski steps (1: C5, 2: the Grötzsch graph), validated like `mycielski-chain:steps=…`. */
export function mycielskiChain(steps: number): Graph {
  return applySteps(k2(), resolveTyped(mycielskiChainFamily, { steps }).steps);
}

export const mycielskiOfFamily = defineFamily({
  name: "mycielski-of",
  summary: "Mycielski's construction applied to a given graph: 2n+1 vertices (shadows and an apex), repeated `steps` times",
  params: [
    { name: "of", type: "spec", description: "the graph to start from, e.g. [cycle:n=7]" },
    { name: "steps", type: "integer", description: "how many times the construction is applied", default: 1, min: 0, max: 20 },
  ],
  random: false,
  // Triangle-freeness is kept but not known of an arbitrary start: no claim.
  freeOf: () => [],
  predictedSize: (p, ctx) => {
    const start = ctx?.predictedSizeOf(p.of);
    return start === undefined ? unknownSize() : sizeAfterSteps(start, p.steps);
  },
  build: (p, ctx) => applySteps(ctx.resolve(p.of), p.steps),
  notes: ["Each step keeps triangle-freeness and raises the chromatic number by one (Mycielski 1955). Edge weights are dropped."],
});

/** Mycielski's construction applied `steps` times to `g` (default once), like `mycielski-of:of=[…],steps=…`. */
export function mycielskiOf(g: Graph, steps = 1): Graph {
  checkTypedParam(mycielskiOfFamily, "steps", steps);
  return applySteps(g, steps);
}
