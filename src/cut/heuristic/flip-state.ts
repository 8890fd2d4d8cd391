// One-flip machinery shared by every cut heuristic: a partition with the gain of switching
// each vertex (O(degree) update per flip, no allocation), and the climb to a 1-flip local optimum.

import type { Graph } from "../../graph/graph.js";
import type { GainBuckets } from "./gain-buckets.js";
import { checkPartition, cutValue, type Partition } from "../../graph/cut-value.js";
import { gainTolerance } from "./anytime.js";

/**
 * A partition under local search. `gain[v]` is the change in cut weight if v switches side:
 * Σ_{u~v} w_uv·(+1 if u is on v's side, −1 otherwise). `value` is the running cut weight,
 * seeded by `cutValue` and advanced by gains; records re-confirm it with `cutValue`.
 */
export class FlipState {
  readonly graph: Graph;
  readonly side: Partition;
  readonly gain: Float64Array;
  value = 0;
  /** Gains at or below this count as non-improving (0 for integer weights). */
  readonly tolerance: number;
  // Work space of `climb`, allocated once.
  private readonly stack: Int32Array;
  private readonly queued: Uint8Array;
  /** When set, every gain change is filed here too (breakout search picks moves from it). */
  index: GainBuckets | null = null;

  constructor(graph: Graph, initial?: ArrayLike<number>) {
    this.graph = graph;
    this.side = new Uint8Array(graph.n);
    this.gain = new Float64Array(graph.n);
    this.stack = new Int32Array(graph.n);
    this.queued = new Uint8Array(graph.n);
    this.tolerance = gainTolerance(graph);
    if (initial !== undefined) this.load(initial);
    else this.resync();
  }

  /** Replace the partition (validated) and recompute gains and value: O(n + m). */
  load(partition: ArrayLike<number>): void {
    checkPartition(this.graph, partition);
    this.side.set(partition);
    this.resync();
  }

  /** Recompute gains and value from the sides, discarding floating-point drift. */
  resync(): void {
    const { offsets, neighbors, weights, n } = this.graph;
    const side = this.side;
    const gain = this.gain;
    for (let v = 0; v < n; v++) {
      const sv = side[v];
      let g = 0;
      for (let i = offsets[v]; i < offsets[v + 1]; i++) {
        const w = weights === null ? 1 : weights[i];
        g += side[neighbors[i]] === sv ? w : -w;
      }
      gain[v] = g;
    }
    this.value = cutValue(this.graph, side);
  }

  /** Switch v's side: value += gain[v], gain[v] negates, each neighbour's gain moves by ±2w. */
  flip(v: number): void {
    const { offsets, neighbors, weights } = this.graph;
    const { side, gain, index } = this;
    this.value += gain[v];
    gain[v] = -gain[v];
    const sv = (side[v] ^= 1);
    if (index !== null) index.update(v, gain[v]);
    for (let i = offsets[v]; i < offsets[v + 1]; i++) {
      const u = neighbors[i];
      const w2 = weights === null ? 2 : 2 * weights[i];
      // Now on the same side: the edge is no longer cut, so switching u would cut it again
      // (+2w); otherwise −2w. Arithmetic, not a branch: the side pattern is unpredictable.
      const g = gain[u] + w2 * (1 - 2 * (side[u] ^ sv));
      gain[u] = g;
      if (index !== null) index.update(u, g);
    }
  }

  /** Climb from `side` and write the local optimum back into it; returns its cut value. */
  polishInPlace(side: Uint8Array): number {
    this.load(side);
    this.climb();
    side.set(this.side);
    return this.value;
  }

  /**
   * Climb to a 1-flip local optimum (no gain above `tolerance`), first-improvement from a
   * work list of candidates; only neighbours of a flipped vertex can become improving.
   * Returns the number of flips.
   */
  climb(): number {
    const { offsets, neighbors, n } = this.graph;
    const gain = this.gain;
    const stack = this.stack;
    const queued = this.queued;
    const tol = this.tolerance;
    let top = 0;
    for (let v = n - 1; v >= 0; v--) {
      if (gain[v] > tol) {
        stack[top++] = v;
        queued[v] = 1;
      } else queued[v] = 0;
    }
    let flips = 0;
    while (top > 0) {
      const v = stack[--top];
      queued[v] = 0;
      if (gain[v] <= tol) continue;
      this.flip(v);
      flips++;
      for (let i = offsets[v]; i < offsets[v + 1]; i++) {
        const u = neighbors[i];
        if (queued[u] === 0 && gain[u] > tol) {
          queued[u] = 1;
          stack[top++] = u;
        }
      }
    }
    return flips;
  }

  /** Largest gain (≤ tolerance means a local optimum); O(n). */
  maxGain(): number {
    let g = -Infinity;
    for (let v = 0; v < this.gain.length; v++) if (this.gain[v] > g) g = this.gain[v];
    return g;
  }
}

export interface PolishResult {
  /** Cut value after the climb, by `cutValue`. */
  value: number;
  flips: number;
}

/**
 * Climb `partition` (modified in place) to a 1-flip local optimum. Pass `state` to reuse its
 * buffers across many calls on the same graph.
 */
export function polishCut(graph: Graph, partition: Partition, state?: FlipState): PolishResult {
  const s = state ?? new FlipState(graph);
  if (s.graph !== graph) throw new Error("polishCut: the FlipState belongs to another graph");
  s.load(partition);
  const flips = s.climb();
  partition.set(s.side);
  return { value: cutValue(graph, partition), flips };
}
