// Rank-2 relaxation heuristic for max cut (Burer, Monteiro & Zhang 2002): angles θ_i minimising
// Σ_ij w_ij cos(θ_i − θ_j) by gradient descent, the best cut over all half-circle sweeps of the
// angles, a 1-flip polish, and restarts from the perturbed best cut.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { Rng } from "../../random/prng.js";
import { checkSeed } from "../../random/seed.js";
import { FlipState } from "./flip-state.js";
import { checkHeuristicBudget, CLOCK_STRIDE, optimalityThreshold, RunLimit, type AnytimeOptions, type AnytimeSearch, type HeuristicBudget } from "./anytime.js";
import { cutRecordOf, type CutRecord, type SolverStatus } from "../types.js";

const OWNER = "rank-2 heuristic";
const TWO_PI = 2 * Math.PI;

export interface Rank2Options extends AnytimeOptions {
  /** Gradient steps per minimisation (default 300). */
  maxSteps?: number;
  /** Restart noise: each angle of the best cut moves by up to this fraction of π (default 0.2). */
  perturbation?: number;
  /** Restarts without improvement before a fresh random start (default 10). */
  patience?: number;
}

/** `iterations` counts minimise–sweep–polish cycles. */
export type Rank2SearchOptions = Omit<Rank2Options, keyof HeuristicBudget>;

/** Objective f(θ) = Σ_edges w cos(θ_i − θ_j) with its gradient, through c = cos θ, s = sin θ. */
class AngleObjective {
  readonly c: Float64Array;
  readonly s: Float64Array;
  readonly gradient: Float64Array;
  value = 0;
  constructor(n: number) {
    this.c = new Float64Array(n);
    this.s = new Float64Array(n);
    this.gradient = new Float64Array(n);
  }

  /** cos(θi−θj) = c_i c_j + s_i s_j; ∂f/∂θ_i = c_i·Σ_j w s_j − s_i·Σ_j w c_j: n trig calls, then O(m). */
  evaluate(graph: Graph, theta: Float64Array): void {
    const { offsets, neighbors, weights, n } = graph;
    const { c, s, gradient } = this;
    for (let v = 0; v < n; v++) {
      c[v] = Math.cos(theta[v]);
      s[v] = Math.sin(theta[v]);
    }
    let f = 0;
    for (let v = 0; v < n; v++) {
      let a = 0;
      let b = 0;
      for (let i = offsets[v]; i < offsets[v + 1]; i++) {
        const u = neighbors[i];
        const w = weights === null ? 1 : weights[i];
        a += w * c[u];
        b += w * s[u];
      }
      f += c[v] * a + s[v] * b;
      gradient[v] = c[v] * b - s[v] * a;
    }
    this.value = f / 2; // each edge was counted from both ends
  }
}

export class Rank2Searcher implements AnytimeSearch {
  readonly graph: Graph;
  readonly solverSeed: number;
  private readonly rng: Rng;
  private readonly maxSteps: number;
  private readonly perturbation: number;
  private readonly patience: number;
  private readonly optimalAt: number;
  private readonly onImprove: AnytimeOptions["onImprove"];
  private theta: Float64Array;
  private trial: Float64Array;
  private here: AngleObjective;
  private there: AngleObjective;
  private readonly keys: Float64Array;
  private readonly order: Int32Array;
  private readonly sweepSide: Uint8Array;
  private readonly state: FlipState;
  private readonly bestSide: Uint8Array;
  private readonly step0: number;
  private best_ = -Infinity;
  private fails = 0;
  private cycles = 0;
  private gradientSteps = 0;
  private elapsed = 0;
  private lastStatus: SolverStatus = "iteration-limit";

  constructor(graph: Graph, options: Rank2SearchOptions = {}) {
    const n = graph.n;
    this.graph = graph;
    this.solverSeed = checkSeed(OWNER, "solverSeed", options.solverSeed);
    this.rng = new Rng(this.solverSeed);
    const ms = options.maxSteps ?? 300;
    if (!Number.isInteger(ms) || ms < 1) throw invalidParameter(OWNER, "maxSteps", "should be a positive integer", ms);
    this.maxSteps = ms;
    const pt = options.perturbation ?? 0.2;
    if (!(pt > 0 && pt <= 1)) throw invalidParameter(OWNER, "perturbation", "should be a number in (0, 1]", pt);
    this.perturbation = pt;
    const pa = options.patience ?? 10;
    if (!Number.isInteger(pa) || pa < 1) throw invalidParameter(OWNER, "patience", "should be a positive integer", pa);
    this.patience = pa;
    this.optimalAt = optimalityThreshold(OWNER, graph, options.upperBound);
    this.onImprove = options.onImprove;
    this.theta = new Float64Array(n);
    this.trial = new Float64Array(n);
    this.here = new AngleObjective(n);
    this.there = new AngleObjective(n);
    this.keys = new Float64Array(n);
    this.order = new Int32Array(n);
    this.sweepSide = new Uint8Array(n);
    this.state = new FlipState(graph);
    this.bestSide = new Uint8Array(n);
    // The Hessian of f is bounded by twice the largest Σ|w| at a vertex: a safe first step.
    let maxAbs = 1;
    const { offsets, weights } = graph;
    for (let v = 0; v < n; v++) {
      let t = 0;
      for (let i = offsets[v]; i < offsets[v + 1]; i++) t += weights === null ? 1 : Math.abs(weights[i]);
      if (t > maxAbs) maxAbs = t;
    }
    this.step0 = 1 / maxAbs;
  }

  get bestValue(): number {
    return this.best_;
  }

  /** Gradient descent with Armijo backtracking and an adaptive step. */
  private minimise(): void {
    const { graph } = this;
    const n = graph.n;
    this.here.evaluate(graph, this.theta);
    let tau = this.step0;
    for (let k = 0; k < this.maxSteps; k++) {
      const g = this.here.gradient;
      let g2 = 0;
      for (let v = 0; v < n; v++) g2 += g[v] * g[v];
      if (g2 <= 1e-18 * n) return;
      let accepted = false;
      for (let tries = 0; tries < 40; tries++) {
        for (let v = 0; v < n; v++) this.trial[v] = this.theta[v] - tau * g[v];
        this.there.evaluate(graph, this.trial);
        this.gradientSteps++;
        if (this.there.value <= this.here.value - 1e-4 * tau * g2) {
          accepted = true;
          break;
        }
        tau *= 0.5;
      }
      if (!accepted) return;
      const decrease = this.here.value - this.there.value;
      const t = this.theta;
      this.theta = this.trial;
      this.trial = t;
      const o = this.here;
      this.here = this.there;
      this.there = o;
      // A loose tolerance: the sweep only needs the angles roughly settled, and restarts pay more than precision.
      if (decrease <= 1e-5 * (Math.abs(this.here.value) + 1)) return;
      tau *= 2;
    }
  }

  /**
   * Best cut {i : θ_i ∈ [α, α+π)} over α ∈ [0, π): each vertex switches side once, at
   * α = θ_i (leaving) or θ_i − π (entering), so sort those keys and flip in order.
   */
  private sweep(): void {
    const { graph, state, keys, order, theta, sweepSide } = this;
    const n = graph.n;
    for (let v = 0; v < n; v++) {
      let t = theta[v] % TWO_PI;
      if (t < 0) t += TWO_PI;
      const inside = t < Math.PI;
      sweepSide[v] = inside ? 1 : 0;
      keys[v] = inside ? t : t - Math.PI;
      order[v] = v;
    }
    order.sort((a, b) => keys[a] - keys[b]);
    state.load(sweepSide);
    let bestValue = state.value;
    let bestCount = 0;
    for (let k = 0; k < n; k++) {
      state.flip(order[k]);
      if (state.value > bestValue) {
        bestValue = state.value;
        bestCount = k + 1;
      }
    }
    for (let k = 0; k < bestCount; k++) sweepSide[order[k]] ^= 1;
    state.load(sweepSide);
    state.climb();
  }

  private restart(): void {
    const { theta, rng, graph } = this;
    if (this.cycles === 0 || this.fails >= this.patience) {
      for (let v = 0; v < graph.n; v++) theta[v] = TWO_PI * rng.nextFloat();
      this.fails = 0;
    } else {
      const amp = this.perturbation * Math.PI;
      for (let v = 0; v < graph.n; v++) theta[v] = Math.PI * this.bestSide[v] + amp * (2 * rng.nextFloat() - 1);
    }
  }

  run(budget: HeuristicBudget = {}): SolverStatus {
    const t0 = performance.now();
    const limit = new RunLimit(checkHeuristicBudget(OWNER, budget), t0);
    if (this.lastStatus === "optimal") return "optimal";
    const { graph, state } = this;
    for (;;) {
      this.restart();
      this.minimise();
      this.sweep();
      this.cycles++;
      if (state.value > this.best_ + state.tolerance || this.best_ === -Infinity) {
        this.best_ = state.value;
        this.bestSide.set(state.side);
        this.fails = 0;
        this.onImprove?.(this.best_, this.elapsed + (performance.now() - t0) / 1000);
      } else this.fails++;
      if (this.best_ >= this.optimalAt || graph.m === 0) {
        this.lastStatus = "optimal";
        break;
      }
      // A cycle is thousands of flips' worth of work: read the clock after each.
      if (limit.tick(CLOCK_STRIDE)) {
        this.lastStatus = limit.status;
        break;
      }
    }
    this.elapsed += (performance.now() - t0) / 1000;
    return this.lastStatus;
  }

  best(): CutRecord {
    return cutRecordOf("rank2", this.graph, this.bestSide, this.lastStatus, this.elapsed, this.solverSeed, { cycles: this.cycles, gradientSteps: this.gradientSteps });
  }
}

/** Rank-2 heuristic within `seconds` and/or `iterations` cycles (default 1 s). */
export function rank2Search(graph: Graph, options: Rank2Options = {}): CutRecord {
  const s = new Rank2Searcher(graph, options);
  s.run({ seconds: options.seconds, iterations: options.iterations });
  return s.best();
}
