// What the exact max-cut searches share: their result record and options, progress reports,
// and the pruning margin that weights decide.

import type { Graph } from "../../graph/graph.js";
import { hasIntegerWeights } from "../../graph/weights.js";
import { cutRecordOf, type CutRecord } from "../types.js";

/** What an exact search returns: a cut (value = cutValue(partition)) plus a proven upper bound. */
export interface ExactCutRecord extends CutRecord {
  status: "optimal" | "time-limit";
  /** Proven upper bound on the max cut: equal to `value` when optimal, the best bracket so far when time ran out. */
  upper: number;
  /** Gray-code steps taken: one outer pattern each, whose 2^b block completions are tabulated. */
  graySteps: number;
  /** Branch-and-bound nodes visited. */
  branchNodes: number;
}

export interface ExactProgress {
  /** Best cut of the whole graph known so far (-Infinity before the first). */
  lower: number;
  graySteps: number;
  branchNodes: number;
  seconds: number;
}

export interface ExactOptions {
  /** Time budget in seconds (default 60). On expiry the record has status "time-limit" and a valid bracket. */
  seconds?: number;
  /** Seed for the randomised incumbent heuristic (default 0); recorded in the result. */
  solverSeed?: number;
  /** Called about every half second during a long search. */
  onProgress?: (p: ExactProgress) => void;
}

/** Seconds between `onProgress` calls. */
export const PROGRESS_INTERVAL = 0.5;

export const DEFAULT_EXACT_SECONDS = 60;

/**
 * The smallest improvement worth searching for. With integer weights a better cut is at least
 * 1 better; otherwise a relative tolerance absorbs the rounding of incremental sums, so
 * "optimal" then means optimal up to that tolerance (recorded in the result details).
 */
export function improvementMargin(graph: Graph): number {
  if (hasIntegerWeights(graph)) return 1;
  let abs = 0;
  const w = graph.weights!;
  for (let i = 0; i < w.length; i++) abs += Math.abs(w[i]);
  return Math.max(1e-12, 1e-11 * abs);
}

/**
 * The record of an exact search: the cut of `partition` (value from cutValue) and the proven bound,
 * never below value + slack, where slack is the pruning tolerance the search used (0 for integer
 * weights): `upper` null means the search finished, so the bound is the value itself plus slack.
 */
export function exactRecord(
  method: string,
  graph: Graph,
  partition: Uint8Array,
  search: { status: "optimal" | "time-limit"; upper: number | null; slack: number; graySteps: number; branchNodes: number; t0: number; solverSeed: number },
  details: CutRecord["details"],
): ExactCutRecord {
  const cut = cutRecordOf(method, graph, partition, search.status, nowSeconds() - search.t0, search.solverSeed, details);
  const { upper, slack } = search;
  return {
    ...cut,
    status: search.status,
    upper: upper === null ? cut.value + slack : Math.max(upper, cut.value + slack),
    graySteps: search.graySteps,
    branchNodes: search.branchNodes,
  };
}

/** Monotonic clock in seconds. */
export function nowSeconds(): number {
  return performance.now() / 1000;
}
