// What the exact max-cut searches share: their result record and options, progress reports,
// and the pruning margin that weights decide.

import type { Graph } from "../../graph/graph.js";
import { hasIntegerWeights } from "../../graph/weights.js";
import { roundUp } from "../../linalg/float-rounding.js";
import { invalidParameter } from "../../errors.js";
import { cutRecordOf, type CutRecord } from "../types.js";

/** Why an exact search stopped: proven optimal, or out of its time (`seconds`) or work (`work`) budget with a valid bracket. */
export type ExactStatus = "optimal" | "time-limit" | "work-limit";

/** What an exact search returns: a cut (value = cutValue(partition)) plus a proven upper bound. */
export interface ExactCutRecord extends CutRecord {
  status: ExactStatus;
  /** Proven upper bound on the max cut: equal to `value` when optimal, the best bracket so far when a budget ran out. */
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
  /**
   * Deterministic work budget (default: none): branch-and-bound nodes, each tabulated leaf counting
   * max(1, 2^b/64), or Gray-code steps. On expiry the record has status "work-limit" and a valid
   * bracket; the record's details say how much was used (`workUsed`).
   */
  work?: number;
}

/** The `work` option: a positive integer, or Infinity when not given. */
export function checkWork(owner: string, work: unknown): number {
  if (work === undefined) return Infinity;
  if (typeof work !== "number" || !(Number.isInteger(work) && work > 0)) throw invalidParameter(owner, "work", "should be a positive integer", work);
  return work;
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
 * The record of an exact search: the cut of `partition` (value from cutValue) and the proven bound
 * max(upper, value) plus the search's slack (src/cut/exact/exact-slack.ts; 0 for exact integer
 * weights), rounded up: `upper` null means the search finished, so the bound is the value itself.
 */
export function exactRecord(
  method: string,
  graph: Graph,
  partition: Uint8Array,
  search: { status: ExactStatus; upper: number | null; slack: number; graySteps: number; branchNodes: number; t0: number; solverSeed: number },
  details: CutRecord["details"],
): ExactCutRecord {
  const cut = cutRecordOf(method, graph, partition, search.status, nowSeconds() - search.t0, search.solverSeed, details);
  const { upper, slack } = search;
  const base = upper === null ? cut.value : Math.max(upper, cut.value);
  // Field by field rather than spread (the same fields in the same order): small graphs make many of these.
  return {
    method: cut.method,
    value: cut.value,
    partition: cut.partition,
    status: search.status,
    seconds: cut.seconds,
    solverSeed: cut.solverSeed,
    details: cut.details,
    upper: slack === 0 ? base : roundUp(base + slack, 2),
    graySteps: search.graySteps,
    branchNodes: search.branchNodes,
  };
}

/** Monotonic clock in seconds. */
export function nowSeconds(): number {
  return performance.now() / 1000;
}
