// A sparse Cholesky proof that Diag(c) + W ⪰ 0 for a graph's weight matrix W: the vertices are
// put in reverse Cuthill–McKee order, which keeps each row's nonzeros close to the diagonal, and the
// factor is computed inside the envelope (profile) of that order, where all fill-in stays.
//
// Why the envelope: for the rows r of the permuted matrix, let first(r) be the column of its first
// nonzero; Cholesky creates no nonzero left of first(r) (George & Liu, Computer Solution of Large
// Sparse Positive Definite Systems, 1981, Thm 4.1.1), so storing columns first(r)..r of each row is
// enough. On planar and toroidal graphs the reverse Cuthill–McKee envelope is O(n^1.5) wide in total
// (a grid's rows are about one breadth-first level, O(√n), wide), on random graphs it is nearly dense:
// the work is predicted exactly from the envelope before anything is allocated, and a caller refuses
// the proof above its own work limit. The rigour (margins against rounding) is `certifyCholesky` in
// ./cholesky.ts, shared with the dense proof; here only the storage and the order differ.

import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { checkMemory } from "../limits/memory.js";
import { certifyCholesky, type PsdProof } from "./cholesky.js";

/** The order and envelope of a graph's matrix, computed from its pattern alone. */
export interface EnvelopePlan {
  n: number;
  /** order[r] = the vertex in row r of the permuted matrix. */
  order: Int32Array;
  /** position[v] = the row of vertex v. */
  position: Int32Array;
  /** first[r] = the first column stored in row r (≤ r). */
  first: Int32Array;
  /** Stored entries in all rows (Σ (r − first[r] + 1)). */
  entries: number;
  /** Widest row, diagonal included: the most nonzero terms of any inner product. */
  width: number;
  /** An upper bound on the factorisation's multiply-adds, Σ_r w_r(w_r + 1)/2: the deterministic work of the proof. */
  work: number;
}

/**
 * Reverse Cuthill–McKee order (Cuthill & McKee 1969; reversed as George 1971 proposed), one component
 * after another, each started at a pseudo-peripheral vertex found by repeated breadth-first search
 * (Gibbs, Poole & Stockmeyer 1976), neighbours taken by increasing degree; ties by vertex number,
 * so the order is a pure function of the graph.
 */
export function reverseCuthillMcKee(graph: Graph): Int32Array {
  const { n, offsets, neighbors } = graph;
  const degree = (v: number): number => offsets[v + 1] - offsets[v];
  const order = new Int32Array(n);
  const level = new Int32Array(n).fill(-1);
  const seen = new Uint8Array(n);
  const queue = new Int32Array(n);
  let placed = 0;
  // Breadth-first levels from `root` within its component; returns the last level's size and start in `queue`.
  const bfs = (root: number): { count: number; lastStart: number; depth: number } => {
    let head = 0, tail = 0;
    queue[tail++] = root;
    level[root] = 0;
    let lastStart = 0, depth = 0;
    while (head < tail) {
      const v = queue[head++];
      if (level[v] > depth) {
        depth = level[v];
        lastStart = head - 1;
      }
      for (let k = offsets[v]; k < offsets[v + 1]; k++) {
        const w = neighbors[k];
        if (level[w] < 0) {
          level[w] = level[v] + 1;
          queue[tail++] = w;
        }
      }
    }
    for (let i = 0; i < tail; i++) level[queue[i]] = -1;
    return { count: tail, lastStart, depth };
  };
  const scratch: number[] = [];
  for (let start = 0; start < n; start++) {
    if (seen[start]) continue;
    // Pseudo-peripheral root: move to a least-degree vertex of the last level while the depth grows.
    let root = start;
    let info = bfs(root);
    for (let round = 0; round < 8; round++) {
      let best = -1;
      for (let i = info.lastStart; i < info.count; i++) {
        const v = queue[i];
        if (best < 0 || degree(v) < degree(best) || (degree(v) === degree(best) && v < best)) best = v;
      }
      const next = bfs(best);
      if (next.depth <= info.depth) break;
      root = best;
      info = next;
    }
    // Cuthill–McKee from the root.
    const begin = placed;
    order[placed++] = root;
    seen[root] = 1;
    for (let head = begin; head < placed; head++) {
      const v = order[head];
      scratch.length = 0;
      for (let k = offsets[v]; k < offsets[v + 1]; k++) {
        const w = neighbors[k];
        if (!seen[w]) {
          seen[w] = 1;
          scratch.push(w);
        }
      }
      scratch.sort((a, b) => degree(a) - degree(b) || a - b);
      for (const w of scratch) order[placed++] = w;
    }
  }
  order.reverse();
  return order;
}

/** The reverse Cuthill–McKee order of a graph and the envelope of its matrix in that order: O(n + m). */
export function envelopePlan(graph: Graph): EnvelopePlan {
  const { n, offsets, neighbors } = graph;
  const order = reverseCuthillMcKee(graph);
  const position = new Int32Array(n);
  for (let r = 0; r < n; r++) position[order[r]] = r;
  const first = new Int32Array(n);
  let entries = 0, width = n === 0 ? 0 : 1, work = 0;
  for (let r = 0; r < n; r++) {
    const v = order[r];
    let f = r;
    for (let k = offsets[v]; k < offsets[v + 1]; k++) f = Math.min(f, position[neighbors[k]]);
    first[r] = f;
    const w = r - f + 1;
    entries += w;
    if (w > width) width = w;
    work += (w * (w + 1)) / 2;
  }
  return { n, order, position, first, entries, width, work };
}

/**
 * Proves Diag(c) + W ⪰ 0, W the graph's (exact) weight matrix and c the floating-point `diagonal`
 * within `diagonalError` of the exact diagonal, by Cholesky in the envelope of `plan`. The margins
 * are `certifyCholesky`'s with the envelope's width as the term count.
 */
export function provePsdByEnvelopeCholesky(graph: Graph, plan: EnvelopePlan, diagonal: ArrayLike<number>, diagonalError: number): PsdProof {
  const { n, offsets, neighbors, weights } = graph;
  const { order, position, first } = plan;
  if (plan.entries > 2 ** 31 - 1) throw new InputError(`a sparse Cholesky proof with ${plan.entries} stored entries exceeds 2^31 entries`);
  checkMemory(8 * plan.entries, `a sparse Cholesky proof with ${plan.entries} stored entries`);
  // Row r holds columns first[r]..r at start[r]..start[r] + r − first[r]; base[r] = start[r] − first[r]
  // (an Int32Array: integer indices keep typed-array access on V8's fast path).
  const base = new Int32Array(n);
  let at = 0;
  for (let r = 0; r < n; r++) {
    base[r] = at - first[r];
    at += r - first[r] + 1;
  }
  const a = new Float64Array(at);
  const permuted = new Float64Array(n);
  for (let r = 0; r < n; r++) {
    const v = order[r];
    permuted[r] = diagonal[v];
    a[base[r] + r] = diagonal[v];
    for (let k = offsets[v]; k < offsets[v + 1]; k++) {
      const c = position[neighbors[k]];
      if (c < r) a[base[r] + c] = weights === null ? 1 : weights[k];
    }
  }
  for (let i = 0; i < at; i++) if (!Number.isFinite(a[i])) return { proven: false, shift: 0, lambdaMinLowerBound: NaN, failedAt: 0, message: `a matrix entry is ${a[i]}` };
  return certifyCholesky({ n, termCount: Math.max(1, plan.width), diagonal: permuted, diagonalError }, (shift, minPivot) => {
    for (let r = 0; r < n; r++) a[base[r] + r] -= shift;
    return factorEnvelope(a, base, first, n, minPivot);
  });
}

/** Row-by-row (Cholesky–Banachiewicz) factorisation inside the envelope; the first row whose pivot is ≤ minPivot, or −1. */
function factorEnvelope(a: Float64Array, base: Int32Array, first: Int32Array, n: number, minPivot: number): number {
  for (let r = 0; r < n; r++) {
    const fr = first[r];
    const br = base[r];
    for (let c = fr; c < r; c++) {
      const bc = base[c];
      const k0 = Math.max(fr, first[c]);
      let s0 = 0, s1 = 0;
      let k = k0;
      for (; k + 1 < c; k += 2) {
        s0 += a[br + k] * a[bc + k];
        s1 += a[br + k + 1] * a[bc + k + 1];
      }
      if (k < c) s0 += a[br + k] * a[bc + k];
      a[br + c] = (a[br + c] - (s0 + s1)) / a[bc + c];
    }
    let s = 0;
    for (let k = fr; k < r; k++) s += a[br + k] * a[br + k];
    const pivot = a[br + r] - s;
    if (!(pivot > minPivot)) return r;
    a[br + r] = Math.sqrt(pivot);
  }
  return -1;
}
