// Pieces shared by the exact max-cut searches: the result record, the "block" (the last b
// vertices, whose 2^b internal cut values are tabulated so each completion costs O(1)),
// weight statistics that decide the pruning margin, and trivial upper bounds.

import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { gamma, roundUp } from "../linalg/rounding.js";
import type { CutRecord } from "./types.js";

/** What an exact search returns: a cut (value = cutValue(partition)) plus a proven upper bound. */
export interface ExactCutRecord extends CutRecord {
  /** optimal: proven; timeout / budget: stopped by `seconds` / by `work`, with a valid bracket. */
  status: "optimal" | "timeout" | "budget";
  /** Proven upper bound on the max cut: equal to `value` when optimal, the best bracket so far on timeout. */
  upper: number;
  /** Search nodes visited (outer Gray steps, or branch-and-bound nodes), for the record. */
  nodes: number;
}

export interface ExactProgress {
  /** Best cut of the whole graph known so far (-Infinity before the first). */
  lower: number;
  nodes: number;
  seconds: number;
}

export interface ExactOptions {
  /** Time budget in seconds (default 60). On expiry the record has status "timeout" and a valid bracket. */
  seconds?: number;
  /** Seed for the randomised incumbent heuristic (default 0); recorded in the result. */
  seed?: number;
  /** Called about every half second during a long search. */
  onProgress?: (p: ExactProgress) => void;
  /**
   * Deterministic work budget (default: none): branch-and-bound nodes, each tabulated leaf counting
   * max(1, 2^b/64), or Gray-code steps. On expiry the record has status "budget" and a valid bracket;
   * the record's details say how much was used (`workUsed`).
   */
  work?: number;
}

export function checkWork(owner: string, work: number | undefined): number {
  if (work === undefined) return Infinity;
  if (typeof work !== "number" || !(Number.isInteger(work) && work > 0)) {
    throw new InputError(`${owner}: invalid \`work\`: should be a positive integer (got ${JSON.stringify(work)})`);
  }
  return work;
}

/** Seconds between `onProgress` calls. */
export const PROGRESS_INTERVAL = 0.5;

export const DEFAULT_EXACT_SECONDS = 60;

export function checkSeconds(owner: string, seconds: number | undefined, fallback: number): number {
  const s = seconds ?? fallback;
  if (typeof s !== "number" || !(s > 0) || !Number.isFinite(s)) {
    throw new InputError(`${owner}: invalid \`seconds\`: should be a positive finite number (got ${JSON.stringify(seconds)})`);
  }
  return s;
}

export function checkSeedOption(owner: string, seed: number | undefined): number {
  const s = seed ?? 0;
  if (!Number.isInteger(s) || s < 0 || s > 0xffffffff) {
    throw new InputError(`${owner}: invalid \`seed\`: should be an integer between 0 and 4294967295 (got ${JSON.stringify(seed)})`);
  }
  return s;
}

/** Sum of the positive edge weights: every cut is at most this (as computed; see positiveWeightBound). */
export function positiveWeightSum(graph: Graph): number {
  if (graph.weights === null) return graph.m;
  let s = 0;
  const w = graph.weights;
  for (let i = 0; i < w.length; i++) if (w[i] > 0) s += w[i];
  return s / 2;
}

/**
 * The positive-weight bound as a proven number: the sum itself for exact integer weights, else
 * rounded up past the rounding of a sum of 2m terms (γ_{2m}, Higham §3.1). The bracket publishes
 * it and `verify` re-derives it, both through this function.
 */
export function positiveWeightBound(graph: Graph): number {
  const s = positiveWeightSum(graph);
  if (integerWeights(graph)) return s;
  return roundUp(s + gamma(2 * graph.m + 2) * s, 2);
}

/**
 * Largest Σ|w| (over both arcs of every edge) for which integer weights make every partial sum of
 * the searches exact in doubles: sums of at most twice the total weight stay below 2^53.
 */
export const EXACT_INTEGER_TOTAL = 2 ** 52;

/**
 * True when every weight is an integer and the weights are small enough that every cut value and
 * partial sum is an exact integer in floating point (then bounds may be rounded down and pruning
 * needs no tolerance). Huge integer weights count as non-integer: their sums round.
 */
export function integerWeights(graph: Graph): boolean {
  if (graph.weights === null) return 2 * graph.m <= EXACT_INTEGER_TOTAL;
  const w = graph.weights;
  let abs = 0;
  for (let i = 0; i < w.length; i++) {
    if (!Number.isInteger(w[i])) return false;
    abs += Math.abs(w[i]);
  }
  return abs <= EXACT_INTEGER_TOTAL;
}

/**
 * The smallest improvement worth searching for. With integer weights a better cut is at least
 * 1 better; otherwise a relative tolerance absorbs the rounding of incremental sums, so
 * "optimal" then means optimal up to that tolerance (recorded in the result details).
 */
export function improvementMargin(graph: Graph): number {
  if (integerWeights(graph)) return 1;
  let abs = 0;
  const w = graph.weights!;
  for (let i = 0; i < w.length; i++) abs += Math.abs(w[i]);
  return Math.max(1e-12, 1e-11 * abs);
}

/**
 * Vertices in bit positions 0..b-1 with the internal cut of every side pattern c ∈ [0, 2^b)
 * tabulated. `maximise` then finds max_c table[c] + Σ_i c_i·t_i for given linear terms t in
 * two table lookups and one add per pattern (t is split into low/high halves whose partial
 * sums are themselves tabulated per call).
 */
export class CutBlock {
  readonly size: number;
  readonly lowBits: number;
  readonly highBits: number;
  /** Internal cut of the block for each side pattern. */
  readonly table: Float64Array;
  /** max over c of table[c]: the max cut of the block's induced subgraph. */
  readonly tableMax: number;
  private readonly lowSums: Float64Array;
  private readonly highSums: Float64Array;

  /** `inBlock(i, j)` gives the weight between block bits i and j (0 when not adjacent). */
  constructor(size: number, weightBetween: (i: number, j: number) => number) {
    if (size < 0 || size > 24) throw new RangeError(`CutBlock: size ${size} outside 0..24`);
    this.size = size;
    this.lowBits = size >> 1;
    this.highBits = size - this.lowBits;
    const count = 1 << size;
    const table = new Float64Array(count);
    // Dense adjacency of the block, for the table recurrence below.
    const w = new Float64Array(size * size);
    for (let i = 0; i < size; i++) for (let j = i + 1; j < size; j++) w[i * size + j] = w[j * size + i] = weightBetween(i, j);
    // table[c] = table[c without its lowest bit j] + (edges from j to the zeros of c) − (edges to its ones):
    // moving j to side 1 cuts its edges to side 0 and uncuts its edges to side 1.
    let best = 0;
    for (let c = 1; c < count; c++) {
      const j = 31 - Math.clz32(c & -c);
      const rest = c & (c - 1);
      let delta = 0;
      const row = j * size;
      for (let k = 0; k < size; k++) {
        if (k === j) continue;
        const wk = w[row + k];
        if (wk !== 0) delta += (rest >>> k) & 1 ? -wk : wk;
      }
      const v = table[rest] + delta;
      table[c] = v;
      if (v > best) best = v;
    }
    this.table = table;
    this.tableMax = best;
    this.lowSums = new Float64Array(1 << this.lowBits);
    this.highSums = new Float64Array(1 << this.highBits);
  }

  /** Σ_i max(0, t_i) + tableMax: an upper bound on `maximise` without enumerating. */
  quickBound(t: Float64Array): number {
    let s = this.tableMax;
    for (let i = 0; i < this.size; i++) if (t[i] > 0) s += t[i];
    return s;
  }

  /**
   * The pattern c maximising table[c] + Σ c_i t_i, if its value exceeds `threshold`; else -1.
   * The value is written to out[0] when a pattern is returned.
   */
  maximise(t: Float64Array, threshold: number, out: Float64Array): number {
    const lb = this.lowBits, hb = this.highBits;
    const lowSums = this.lowSums, highSums = this.highSums, table = this.table;
    const lowCount = 1 << lb, highCount = 1 << hb;
    for (let c = 1; c < lowCount; c++) lowSums[c] = lowSums[c & (c - 1)] + t[31 - Math.clz32(c & -c)];
    for (let c = 1; c < highCount; c++) highSums[c] = highSums[c & (c - 1)] + t[lb + 31 - Math.clz32(c & -c)];
    let bestC = -1;
    let thr = threshold;
    for (let hi = 0; hi < highCount; hi++) {
      const base = hi << lb;
      const hs = highSums[hi];
      // Four independent running maxima let the CPU overlap the loads (about 2× faster than a
      // single compare-and-branch); the rare winner is located by a second scan.
      let m0 = -Infinity, m1 = -Infinity, m2 = -Infinity, m3 = -Infinity;
      let lo = 0;
      for (; lo + 3 < lowCount; lo += 4) {
        const p = base + lo;
        const a0 = table[p] + lowSums[lo];
        const a1 = table[p + 1] + lowSums[lo + 1];
        const a2 = table[p + 2] + lowSums[lo + 2];
        const a3 = table[p + 3] + lowSums[lo + 3];
        m0 = a0 > m0 ? a0 : m0;
        m1 = a1 > m1 ? a1 : m1;
        m2 = a2 > m2 ? a2 : m2;
        m3 = a3 > m3 ? a3 : m3;
      }
      for (; lo < lowCount; lo++) {
        const a0 = table[base + lo] + lowSums[lo];
        m0 = a0 > m0 ? a0 : m0;
      }
      m0 = m0 > m1 ? m0 : m1;
      m2 = m2 > m3 ? m2 : m3;
      const m = m0 > m2 ? m0 : m2;
      if (m + hs > thr) {
        thr = m + hs;
        for (let k = 0; k < lowCount; k++) {
          if (table[base + k] + lowSums[k] === m) {
            bestC = base + k;
            break;
          }
        }
      }
    }
    if (bestC >= 0) out[0] = thr;
    return bestC;
  }
}

/** Monotonic clock in seconds. */
export function nowSeconds(): number {
  return performance.now() / 1000;
}
