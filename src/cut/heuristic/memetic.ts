// Memetic search for max cut on large sparse graphs: a breakout walker (or several) explores, and
// after every slice of its work a partition crossover folds whatever regions of its cuts beat the
// elite cut into it, so improvements found in different places and at different times add up.
// Deterministic under a work limit (count of moves); seconds only end a run early.

import { checkPartition, cutValue } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { Rng } from "../../random/prng.js";
import { checkSeed } from "../../random/seed.js";
import { checkInteger, checkSeconds } from "../../validate.js";
import { optimalityThreshold } from "./anytime.js";
import { BreakoutSearcher } from "./breakout.js";
import { FlipState } from "./flip-state.js";
import { PartitionCrossover } from "./partition-crossover.js";
import { cutRecordOf, type CutRecord, type SolverStatus } from "../types.js";

const OWNER = "memetic search";

/**
 * From this many vertices on, the bracket runs the memetic search instead of breakout alone.
 * bench/cut-large, G(n, m) at the sizes of G55, G60 and G70: +17 to +34 at 60 s (loaded machine)
 * and +17 to +25 at 3·10^6 moves; at G81's size (20,000 vertices) within seed noise at 60 s and
 * 3·10^6 moves, +12 at 8·10^6. On the 800–3000-vertex benchmark graphs it was mixed at 10 s
 * (better on G22, worse on G14), so breakout alone stays the default there.
 */
export const MEMETIC_MIN_VERTICES = 4000;

/** A live report of a running memetic search (about twice a second). */
export interface MemeticProgress {
  /** Best cut value so far. */
  value: number;
  /** Moves made so far (the unit of `work`). */
  work: number;
  seconds: number;
}

export interface MemeticOptions {
  /** Seed of the search's randomness (default 0); recorded in the result. */
  solverSeed?: number;
  /** Wall-clock limit in seconds (default 1 when `work` is not given either). */
  seconds?: number;
  /**
   * Deterministic limit: the number of one-vertex moves, checked after every slice of a walker's
   * work (so the run may pass it by up to one slice). With the same seed and `work` the result is
   * the same cut whatever the machine's load, provided `seconds` does not end the run first.
   */
  work?: number;
  /** Called about twice a second and at the end. */
  onProgress?: (p: MemeticProgress) => void;
  /** A partition to start from (e.g. the bracket's best cut): the result is never worse. */
  initial?: ArrayLike<number>;
  /** A proven upper bound on the max cut: reaching it ends the search with status "optimal". */
  upperBound?: number;
  /** Breakout walkers run in turn (default 1: on G(5000, 12498) at 6·10^6 moves one walker beat two on seeds 1 and 2). */
  walkers?: number;
  /**
   * Breakout rounds per slice, after which the walker's cuts are crossed into the elite (default
   * 300: a cross costs O(n + m), about what 100 rounds cost on G(5000, 12498)).
   */
  sliceRounds?: number;
  /** The walkers' shortest jump (breakout's `jumpMin`; default breakout's own). */
  jumpMin?: number;
}

/** A memetic search's cut record, with the work it used. */
export interface MemeticCutRecord extends CutRecord {
  /** Moves made (compare with the `work` limit). */
  work: number;
}

/** A seed per walker start, derived from the search's seed. */
function walkerSeed(seed: number, k: number): number {
  return (seed + Math.imul(k + 1, 0x9e3779b9)) >>> 0;
}

/**
 * Memetic max-cut search in the spirit of Wu & Hao (2012, "A memetic approach for the max-cut
 * problem", PPSN XII): a population of cuts improved by a local-search operator and recombined by
 * a crossover that keeps what the parents share. Here the operator is our breakout search (after
 * Benlic & Hao 2013) and the crossover is a partition crossover (Tinós, Whitley & Chicano 2015),
 * which on a sparse graph splits the parents' differences into many small independent regions and
 * keeps the better side of each. A breakout walker gains in one region while it loses in another;
 * crossing its cut into the elite after every slice keeps the gains and drops the losses.
 * Runs until `seconds` or `work` (moves) runs out, or the cut reaches `upperBound`.
 */
export function memeticSearch(graph: Graph, options: MemeticOptions = {}): MemeticCutRecord {
  const n = graph.n;
  const solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const seconds = options.seconds === undefined ? (options.work === undefined ? 1 : Infinity) : checkSeconds(OWNER, options.seconds, 1);
  const work = options.work === undefined ? Infinity : checkInteger(OWNER, "work", options.work, 1, 1, Number.MAX_SAFE_INTEGER);
  const walkerCount = checkInteger(OWNER, "walkers", options.walkers, 1, 1, 64);
  const sliceRounds = checkInteger(OWNER, "sliceRounds", options.sliceRounds, 300, 1, 2 ** 30);
  if (options.initial !== undefined) checkPartition(graph, options.initial, `${OWNER}: initial`);
  const optimalAt = optimalityThreshold(OWNER, graph, options.upperBound);
  const onProgress = options.onProgress;

  const t0 = performance.now();
  const deadline = t0 + seconds * 1000;
  const rng = new Rng(solverSeed);
  const px = new PartitionCrossover(graph);
  const polisher = new FlipState(graph);
  const elite = new Uint8Array(n);
  let eliteValue: number;
  let moves = 0;
  if (options.initial !== undefined) elite.set(options.initial);
  else for (let v = 0; v < n; v++) elite[v] = rng.nextU32() & 1;
  eliteValue = cutValue(graph, elite);
  const floor = eliteValue;
  let crossGain = 0;
  let secondsToBest = 0;
  let lastReport = t0;
  const report = (force: boolean): void => {
    if (onProgress === undefined) return;
    const now = performance.now();
    if (!force && now - lastReport < 500) return;
    lastReport = now;
    onProgress({ value: eliteValue, work: moves, seconds: (now - t0) / 1000 });
  };
  const better = (value: number): void => {
    if (value > eliteValue) {
      eliteValue = value;
      secondsToBest = (performance.now() - t0) / 1000;
    }
  };
  // The first walker starts from the caller's cut (when given), any others from random cuts.
  // Walkers are never reset to the elite: measured on G(5000, 12498) at equal work, restarting
  // them from it every 10n–40n moves gave worse cuts than leaving them independent.
  const walkers = Array.from(
    { length: walkerCount },
    (_, k) => new BreakoutSearcher(graph, { solverSeed: walkerSeed(solverSeed, k), initial: k === 0 && options.initial !== undefined ? elite : undefined, upperBound: options.upperBound, jumpMin: options.jumpMin }),
  );
  const seen = new Float64Array(walkerCount);

  let status: SolverStatus | null = graph.m === 0 || eliteValue >= optimalAt ? "optimal" : null;
  while (status === null) {
    for (let k = 0; k < walkerCount && status === null; k++) {
      const w = walkers[k];
      const left = (deadline - performance.now()) / 1000;
      if (left <= 0) {
        status = "time-limit";
        break;
      }
      const r = w.run({ iterations: sliceRounds, seconds: seconds === Infinity ? Infinity : left });
      const rec = w.best();
      const walked = Number(rec.details?.moves ?? 0);
      moves += walked - seen[k];
      seen[k] = walked;
      // Fold the walker's best and present cuts into the elite, region by region, then polish.
      crossGain += px.cross(elite, rec.partition, elite);
      crossGain += px.cross(elite, w.currentSide, elite);
      polisher.load(elite);
      moves += polisher.climb();
      elite.set(polisher.side);
      better(cutValue(graph, elite));
      report(false);
      if (eliteValue >= optimalAt || r === "optimal") status = "optimal";
      else if (r === "time-limit") status = "time-limit";
      else if (moves >= work) status = "work-limit";
    }
  }

  report(true);
  const elapsed = (performance.now() - t0) / 1000;
  const rec = cutRecordOf("memetic", graph, elite, status, elapsed, solverSeed, {
    workUsed: moves,
    walkers: walkerCount,
    crossGain,
    startValue: floor,
    secondsToBest,
  });
  return { ...rec, work: moves };
}
