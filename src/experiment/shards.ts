// Slicing a plan into N shards of about equal predicted cost, so that one huge graph does not
// hold a task for hours while the others idle. The slicing is a pure function of the plan and N:
// every task of a job array computes it on its own and gets the same answer, so no coordinator
// hands out work. Costs are predicted from each job's n, m and bracket budget (family members:
// the family's predicted size; file graphs: read once, since a stream has no index), rounded to
// whole milliseconds, and shards are filled largest job first (LPT), ties by plan position, so
// the result never depends on floating-point details beyond IEEE multiplication and addition.

import { AUTO_EXACT_VERTICES } from "../cut/bracket/index.js";
import { readGraphs } from "../graph/formats/read.js";
import type { BracketSettings } from "./job.js";
import type { Plan } from "./plan.js";

/**
 * Work units of a deterministic `work` budget per second, to compare work with seconds: our own
 * estimate, about 10^8 units per CPU-second for whole brackets (bench/budgets.bench.mjs, noisy).
 */
export const WORK_UNITS_PER_SECOND = 1e8;
/** Costs are whole milliseconds, at least 1; capped so a cost packs exactly into a double with its position. */
const MAX_COST = 2 ** 26 - 1;
/** Positions pack into 26 bits beside the cost (MAX_PLAN_JOBS = 5·10^7 < 2^26). */
const POSITION_BITS = 2 ** 26;

/** The budget that stops a bracket first, in seconds: `seconds`, or `work` converted at WORK_UNITS_PER_SECOND. */
export function budgetSeconds(settings: BracketSettings): number {
  const byWork = settings.work === null ? Infinity : settings.work / WORK_UNITS_PER_SECOND;
  return Math.min(settings.seconds ?? Infinity, byWork);
}

/**
 * Predicted seconds of one job (bracket, structure, bounds, the row) on one core. A model of our
 * own, fitted by eye to measured brackets (bench/cluster.bench.mjs): exact search doubles with each
 * vertex (about 2 s at n = 30), heuristics and the SDP take about 8 ms per vertex-plus-edge until the
 * budget stops them, structure checks grow like m^1.5 (triangle and 4-cycle counts). Only the
 * ranking of jobs matters for balance, not the absolute figure.
 */
export function predictedJobSeconds(n: number, m: number, settings: BracketSettings): number {
  const budget = budgetSeconds(settings);
  const size = n + m;
  let solve: number;
  if (m === 0) solve = 0;
  else if (settings.effort === "exact" || (settings.effort === "auto" && n <= AUTO_EXACT_VERTICES)) solve = 2 * 2 ** Math.min(n - 30, 40);
  else solve = (settings.effort === "quick" ? 0.002 : 0.008) * size;
  const structure = 0.002 + 1e-6 * size + 1e-8 * m * Math.sqrt(m);
  return Math.min(solve, budget) + structure;
}

/** A job's cost in whole milliseconds (at least 1, at most MAX_COST): the unit the slicing compares. */
export function jobCost(n: number, m: number, settings: BracketSettings): number {
  return Math.min(MAX_COST, Math.max(1, Math.ceil(predictedJobSeconds(n, m, settings) * 1000)));
}

/** How a plan splits into `count` shards. */
export interface PlanSlices {
  count: number;
  /** The shard of each job, by position in the plan. */
  shardOf: Int32Array;
  /** Jobs per shard. */
  sizes: number[];
  /** Predicted cost per shard, in milliseconds on one core. */
  costs: number[];
  /** Predicted cost of each job (milliseconds), by position. */
  jobCosts: Float64Array;
}

/** Predicted cost of every job of the plan, by position (file graphs are read once for their size). */
export async function planJobCosts(plan: Plan): Promise<Float64Array> {
  const costs = new Float64Array(plan.total);
  let index = 0;
  for (const e of plan.entries) {
    if (e.kind === "specs") {
      for (const item of e.items) {
        const c = jobCost(item.n, item.m, e.settings);
        for (let k = 0; k < e.solverSeeds.length; k++) costs[index++] = c;
      }
    } else {
      let position = 0;
      for await (const loaded of readGraphs({ path: e.path }, { format: e.format })) {
        if (position >= e.count) break;
        position++;
        const c = jobCost(loaded.graph.n, loaded.graph.m, e.settings);
        for (let k = 0; k < e.solverSeeds.length; k++) costs[index++] = c;
      }
      // A file that shrank since the plan was loaded: planJobs names it; here the rest cost 1.
      for (; position < e.count; position++) for (let k = 0; k < e.solverSeeds.length; k++) costs[index++] = 1;
    }
  }
  return costs;
}

/**
 * Longest-processing-time-first slicing of jobs with these costs into `count` shards: jobs in order
 * of falling cost (ties: earlier position first), each to the shard with the least cost so far
 * (ties: the lower shard). Within 4/3 of the best possible largest shard (Graham, "Bounds on
 * multiprocessing timing anomalies", SIAM J. Appl. Math. 17 (1969) 416–429). Equal costs give
 * position modulo `count`.
 */
export function sliceByCost(jobCosts: Float64Array, count: number): PlanSlices {
  if (!Number.isInteger(count) || count < 1) throw new RangeError(`sliceByCost: count should be a positive integer (got ${count})`);
  const total = jobCosts.length;
  // Sort (cost descending, position ascending) as one packed number per job: exact below 2^52.
  const order = new Float64Array(total);
  for (let i = 0; i < total; i++) order[i] = (MAX_COST - jobCosts[i]) * POSITION_BITS + i;
  order.sort();
  const shardOf = new Int32Array(total);
  const sizes = new Array<number>(count).fill(0);
  const costs = new Array<number>(count).fill(0);
  // A binary heap of shards by (cost so far, shard).
  const heap = Array.from({ length: count }, (_, i) => i);
  const less = (a: number, b: number): boolean => costs[a] < costs[b] || (costs[a] === costs[b] && a < b);
  for (let k = 0; k < total; k++) {
    const position = order[k] % POSITION_BITS;
    const s = heap[0];
    shardOf[position] = s;
    sizes[s]++;
    costs[s] += jobCosts[position];
    // Sift the root down.
    let i = 0;
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let best = i;
      if (l < count && less(heap[l], heap[best])) best = l;
      if (r < count && less(heap[r], heap[best])) best = r;
      if (best === i) break;
      [heap[i], heap[best]] = [heap[best], heap[i]];
      i = best;
    }
  }
  return { count, shardOf, sizes, costs, jobCosts };
}

/** The plan's slicing into `count` shards of about equal predicted cost. */
export async function planSlices(plan: Plan, count: number): Promise<PlanSlices> {
  return sliceByCost(await planJobCosts(plan), count);
}
