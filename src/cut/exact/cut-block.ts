// The "block" of the exact searches: the last b vertices, whose 2^b internal cut values are
// tabulated so that the best completion of any outer pattern costs two lookups per pattern.

import { float64Pool, int32Pool } from "../../graph/scratch.js";
import { popcount } from "../../graph/bits.js";

// Scratch for the constructor's temporaries (exact searches on tiny graphs run by the hundred thousand).
const densePool = float64Pool(), maskPool = int32Pool(), degPool = int32Pool();

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
    const w = densePool.take(size * size).fill(0); // scratch, zeroed: the diagonal is never written
    for (let i = 0; i < size; i++) for (let j = i + 1; j < size; j++) w[i * size + j] = w[j * size + i] = weightBetween(i, j);
    // table[c] = table[c without its lowest bit j] + (edges from j to the zeros of c) − (edges to its ones):
    // moving j to side 1 cuts its edges to side 0 and uncuts its edges to side 1.
    let best = 0;
    // Unweighted blocks (every weight 0 or 1): delta = deg(j) − 2·|N(j) ∩ rest|, one popcount per
    // pattern instead of a pass over the block. Small integers add exactly in any order, so the
    // table is the same as the general loop's below.
    let unit = true;
    for (let i = 0; i < w.length && unit; i++) unit = w[i] === 0 || w[i] === 1;
    if (unit) {
      const mask = maskPool.take(size).fill(0);
      const deg = degPool.take(size).fill(0);
      for (let i = 0; i < size; i++) {
        for (let k = 0; k < size; k++) {
          if (w[i * size + k] === 1) {
            mask[i] |= 1 << k;
            deg[i]++;
          }
        }
      }
      for (let c = 1; c < count; c++) {
        const j = 31 - Math.clz32(c & -c);
        const rest = c & (c - 1);
        const v = table[rest] + (deg[j] - 2 * popcount(rest & mask[j]));
        table[c] = v;
        if (v > best) best = v;
      }
    } else {
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

