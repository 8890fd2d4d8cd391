// The one work-unit scheme of the bracket's deterministic budget. A unit is about one adjacency
// entry read plus one number updated (an "arc visit"): each stage turns its own counter (restarts,
// moves, sweeps, Lanczos products, rounding trials, exact-search work, a dense proof) into units
// here, from the graph's size alone, so a budget in units means the same on any machine and load.
// The factors were set so that every stage runs at roughly the same units per second
// (bench/budgets.bench.mjs prints the rates; common practice, no source).

import type { Graph } from "../../graph/graph.js";

/** Units per counted step of each stage, for one graph. All are positive integers. */
export interface WorkCosts {
  /** CSR size n + 2m: one pass over every vertex and arc. */
  readonly pass: number;
  /** One multi-start local-search restart: random sides, gains recomputed, a climb (≈ 3·(n + 3m)). */
  readonly restart: number;
  /** One breakout move: a flip, its neighbours' gains and their buckets, the tabu scan (≈ 6·(1 + average degree)). */
  readonly move: number;
  /** One Lanczos product with its reorthogonalisation (≈ two passes). */
  readonly matvec: number;
  /** One sparse vector-rounding trial with its polish (two passes plus a restart). */
  readonly vectorTrial: number;
  /** One unit of an exact search's own `work` (a branch node, a Gray step; a tabulated leaf counts 2^b/64). */
  readonly exactStep: number;
  /** A dense Cholesky proof of a shift: n³/6 multiply-adds. */
  readonly denseProof: number;
  /** One mixing-method sweep at this rank: every arc touches `rank` numbers. */
  sweep(rank: number): number;
  /** One hyperplane-rounding trial at this rank with its polish (n·rank projections plus a restart). */
  hyperplaneTrial(rank: number): number;
}

/** The unit costs of every stage on `graph`. */
export function workCosts(graph: Graph): WorkCosts {
  const n = Math.max(1, graph.n);
  const m = graph.m;
  const pass = n + 2 * m;
  const degree = Math.ceil((2 * m) / n);
  const restart = 3 * (pass + m);
  return {
    pass,
    restart,
    move: 6 * (1 + degree),
    matvec: 2 * pass,
    vectorTrial: 2 * pass + restart,
    exactStep: 4 * (1 + degree),
    denseProof: Math.ceil((n * n * n) / 6),
    sweep: (rank) => pass * rank,
    hyperplaneTrial: (rank) => n * rank + restart,
  };
}

/** Units of a stage that performed `count` steps costing `cost` each (never fractional). */
export function unitsOf(count: number, cost: number): number {
  return Math.ceil(Math.max(0, count) * cost);
}
