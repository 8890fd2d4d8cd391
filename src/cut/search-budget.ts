// Budgets and stopping rules shared by the anytime cut heuristics (local search, breakout,
// rank-2): option validation, a cheap deadline check, and the proven-optimum stop.

import { invalidParameter } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { assertSeed } from "../random/prng.js";
import { cutValue, type Partition } from "./evaluate.js";
import { integerWeights } from "./exact-common.js";
import type { CutRecord, SolverStatus } from "./types.js";

/** How much more work a `run` call may do. Either or both; omitting both means one second. */
export interface HeuristicBudget {
  /** Wall-clock seconds for this call (> 0; Infinity allowed when `iterations` is set). */
  seconds?: number;
  /** Method-specific iteration count for this call (restarts, rounds, ...); a positive integer. */
  iterations?: number;
}

/** Options every anytime heuristic accepts. */
export interface AnytimeOptions extends HeuristicBudget {
  /** PRNG seed; recorded in the result. Default 0. */
  seed?: number;
  /** Called whenever the best cut improves, with its value and the seconds spent so far; call `best()` for the partition. */
  onImprove?: (value: number, seconds: number) => void;
  /** A proven upper bound on the max cut (e.g. from an SDP certificate): reaching it ends the search with status "optimal". */
  upperBound?: number;
}

/** A search that can be resumed and asked for its best cut at any time. */
export interface AnytimeSearch {
  /** Continue within the given additional budget; returns why it stopped. */
  run(budget?: HeuristicBudget): SolverStatus;
  /** The best cut so far as a record (value confirmed by `cutValue`). */
  best(): CutRecord;
  /** The best cut value so far (the running value, no re-evaluation). */
  readonly bestValue: number;
}

/** Moves between clock reads: performance.now() costs far more than a flip. */
export const CLOCK_STRIDE = 4096;

export function checkHeuristicBudget(owner: string, budget: HeuristicBudget): { seconds: number; iterations: number } {
  const { seconds, iterations } = budget;
  if (seconds !== undefined && !(typeof seconds === "number" && seconds > 0 && !Number.isNaN(seconds))) {
    throw invalidParameter(owner, "seconds", "should be a positive number of seconds", seconds);
  }
  if (iterations !== undefined && !(Number.isInteger(iterations) && iterations > 0)) {
    throw invalidParameter(owner, "iterations", "should be a positive integer", iterations);
  }
  if (seconds === undefined && iterations === undefined) return { seconds: 1, iterations: Infinity };
  return { seconds: seconds ?? Infinity, iterations: iterations ?? Infinity };
}

export function checkSeed(owner: string, seed: number | undefined): number {
  const s = seed ?? 0;
  try {
    assertSeed(s);
  } catch {
    throw invalidParameter(owner, "seed", "should be an integer between 0 and 4294967295", seed);
  }
  return s;
}

/** True when every weight is an integer small enough that gains and cut values are exact in doubles. */
export function hasIntegerWeights(graph: Graph): boolean {
  return integerWeights(graph);
}

/**
 * The cut value at which `upperBound` proves optimality: for integer weights every cut is an
 * integer, so ⌊ub⌋ suffices (with a hair of slack for an ub computed in floating point).
 */
export function optimalityThreshold(owner: string, graph: Graph, upperBound: number | undefined): number {
  if (upperBound === undefined) return Infinity;
  if (typeof upperBound !== "number" || !Number.isFinite(upperBound)) {
    throw invalidParameter(owner, "upperBound", "should be a finite number", upperBound);
  }
  return hasIntegerWeights(graph) ? Math.floor(upperBound + 1e-9) : upperBound;
}

/** Tolerance below which a gain counts as zero: exact for integer weights, else relative to the weights. */
export function gainTolerance(graph: Graph): number {
  const w = graph.weights;
  if (w === null || hasIntegerWeights(graph)) return 0;
  let mx = 0;
  for (let i = 0; i < w.length; i++) mx = Math.max(mx, Math.abs(w[i]));
  return 1e-10 * mx;
}

/** Deadline and iteration limit of one `run` call. */
export class RunLimit {
  private readonly deadline: number;
  private readonly maxIterations: number;
  private iterations = 0;
  private pendingMoves = 0;
  timedOut = false;

  constructor(limits: { seconds: number; iterations: number }, now: number) {
    this.deadline = now + limits.seconds * 1000;
    this.maxIterations = limits.iterations;
  }

  /** Count one iteration that did `moves` units of work; true when the run must stop. */
  tick(moves: number): boolean {
    this.iterations++;
    this.pendingMoves += moves + 1;
    if (this.iterations >= this.maxIterations) return true;
    if (this.pendingMoves >= CLOCK_STRIDE) {
      this.pendingMoves = 0;
      if (performance.now() >= this.deadline) {
        this.timedOut = true;
        return true;
      }
    }
    return false;
  }

  get status(): SolverStatus {
    return this.timedOut ? "timeout" : "budget";
  }
}

/** The record an anytime searcher reports: a copy of its best partition, value confirmed by `cutValue`. */
export function searcherRecord(
  method: string,
  graph: Graph,
  bestSide: Partition,
  status: SolverStatus,
  seconds: number,
  seed: number,
  details: CutRecord["details"],
): CutRecord {
  const partition = bestSide.slice();
  return { method, value: cutValue(graph, partition), partition, status, seconds, seed, details };
}
