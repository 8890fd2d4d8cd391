// Multi-start one-flip local search: random partitions, each climbed to a 1-flip local
// optimum; keeps the best. An anytime searcher with time and restart budgets.

import type { Graph } from "../../graph/graph.js";
import { Rng } from "../../random/prng.js";
import { checkSeed } from "../../random/seed.js";
import { FlipState } from "./flip-state.js";
import { checkHeuristicBudget, optimalityThreshold, RunLimit, type AnytimeOptions, type AnytimeSearch, type HeuristicBudget } from "./anytime.js";
import { cutRecordOf, type CutRecord, type SolverStatus } from "../types.js";

const OWNER = "local search";

/** Anytime multi-start search; `iterations` counts restarts. */
export class MultiStartSearcher implements AnytimeSearch {
  readonly graph: Graph;
  readonly solverSeed: number;
  private readonly rng: Rng;
  private readonly state: FlipState;
  private readonly bestSide: Uint8Array;
  private readonly onImprove: AnytimeOptions["onImprove"];
  private readonly optimalAt: number;
  private best_ = -Infinity;
  private starts = 0;
  private elapsed = 0;
  private lastStatus: SolverStatus = "iteration-limit";

  constructor(graph: Graph, options: Omit<AnytimeOptions, keyof HeuristicBudget> = {}) {
    this.graph = graph;
    this.solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
    this.rng = new Rng(this.solverSeed);
    this.state = new FlipState(graph);
    this.bestSide = new Uint8Array(graph.n);
    this.onImprove = options.onImprove;
    this.optimalAt = optimalityThreshold(OWNER, graph, options.upperBound);
  }

  get bestValue(): number {
    return this.best_;
  }

  run(budget: HeuristicBudget = {}): SolverStatus {
    const t0 = performance.now();
    const limit = new RunLimit(checkHeuristicBudget(OWNER, budget), t0);
    const { state, rng, graph } = this;
    const side = state.side;
    if (this.starts > 0 && this.lastStatus === "optimal") return "optimal";
    for (;;) {
      for (let v = 0; v < graph.n; v++) side[v] = rng.nextU32() & 1;
      state.resync();
      const flips = state.climb();
      this.starts++;
      if (state.value > this.best_) {
        this.best_ = state.value;
        this.bestSide.set(side);
        this.onImprove?.(this.best_, this.elapsed + (performance.now() - t0) / 1000);
      }
      if (this.best_ >= this.optimalAt || graph.m === 0) {
        this.lastStatus = "optimal";
        break;
      }
      if (limit.tick(flips + graph.n)) {
        this.lastStatus = limit.status;
        break;
      }
    }
    this.elapsed += (performance.now() - t0) / 1000;
    return this.lastStatus;
  }

  best(): CutRecord {
    return cutRecordOf("local-search", this.graph, this.bestSide, this.lastStatus, this.elapsed, this.solverSeed, { starts: this.starts });
  }
}

/** Multi-start local search within `seconds` and/or `iterations` restarts (default 1 s). */
export function localSearch(graph: Graph, options: AnytimeOptions = {}): CutRecord {
  const s = new MultiStartSearcher(graph, options);
  s.run({ seconds: options.seconds, iterations: options.iterations });
  return s.best();
}
