// The choices behind the explicit vector method: for each vertex i a set V_i ⊆ N(i) and a
// weight 0 ≤ ε_i ≤ 1/√|V_i|, validated once and stored as sorted CSR lists. ε_i = 0 is allowed:
// x_i is then e_i itself, and the guarantee's proof goes through unchanged (the best choices
// found by the optimiser switch some vertices off this way).

import { invalidParameter } from "../errors.js";
import type { Graph } from "../graph/graph.js";

const OWNER = "vector method";

export interface VectorSetOptions {
  /** V_i per vertex: neighbours of i, each at most once (any order). Default V_i = N(i). */
  sets?: ReadonlyArray<ArrayLike<number>>;
  /** ε_i per vertex, 0 ≤ ε_i ≤ 1/√|V_i| (ignored where V_i is empty). Default epsScale/√|V_i|. */
  eps?: ArrayLike<number>;
  /** Default ε_i = epsScale/√|V_i| when `eps` is not given; 0 < epsScale ≤ 1 (default 1). */
  epsScale?: number;
}

/** V_i is members[offsets[i]..offsets[i+1]), sorted ascending. */
export interface VectorSets {
  offsets: Int32Array;
  members: Int32Array;
  eps: Float64Array;
  /** True when V_i = N(i) for every i (the CSR lists of the graph itself). */
  neighbourhoods: boolean;
}

// 1/√k computed in floating point may sit a hair below the ε a caller wrote as 1/√k.
const EPS_SLACK = 1 + 1e-12;

export function resolveVectorSets(graph: Graph, options: VectorSetOptions = {}): VectorSets {
  const n = graph.n;
  let offsets = graph.offsets;
  let members = graph.neighbors;
  const neighbourhoods = options.sets === undefined;
  if (options.sets !== undefined) {
    const sets = options.sets;
    if (sets.length !== n) throw invalidParameter(OWNER, "sets", `should list one set per vertex (${n})`, sets.length);
    offsets = new Int32Array(n + 1);
    for (let i = 0; i < n; i++) offsets[i + 1] = offsets[i] + sets[i].length;
    members = new Int32Array(offsets[n]);
    // mark[x] = i for x ∈ N(i): a set already listed in ascending order is checked in one pass
    // (the common case: choices made by the optimiser); any other goes the general way below.
    const mark = new Int32Array(n).fill(-1);
    const { offsets: go, neighbors: nb } = graph;
    for (let i = 0; i < n; i++) {
      const raw = sets[i];
      for (let a = go[i]; a < go[i + 1]; a++) mark[nb[a]] = i;
      let fast = true;
      for (let k = 0; k < raw.length && fast; k++) {
        const x = raw[k];
        fast = Number.isInteger(x) && x >= 0 && x < n && mark[x] === i && (k === 0 || raw[k - 1] < x);
      }
      if (fast) {
        for (let k = 0; k < raw.length; k++) members[offsets[i] + k] = raw[k];
        continue;
      }
      const s = Array.from(raw).sort((a, b) => a - b);
      for (let k = 0; k < s.length; k++) {
        const x = s[k];
        if (!graph.hasEdge(i, x)) throw invalidParameter(OWNER, `sets[${i}]`, `should contain only neighbours of vertex ${i}; ${x} is not one`, Array.from(sets[i]));
        if (k > 0 && s[k - 1] === x) throw invalidParameter(OWNER, `sets[${i}]`, `should not repeat vertex ${x}`, Array.from(sets[i]));
        members[offsets[i] + k] = x;
      }
    }
  }
  const eps = new Float64Array(n);
  if (options.eps !== undefined) {
    if (options.epsScale !== undefined) throw invalidParameter(OWNER, "epsScale", "cannot be combined with `eps`", options.epsScale);
    if (options.eps.length !== n) throw invalidParameter(OWNER, "eps", `should give one ε per vertex (${n})`, options.eps.length);
    for (let i = 0; i < n; i++) {
      const k = offsets[i + 1] - offsets[i];
      const e = options.eps[i];
      if (k === 0) continue;
      if (!(e >= 0 && e <= EPS_SLACK / Math.sqrt(k))) {
        throw invalidParameter(OWNER, `eps[${i}]`, `should lie in [0, 1/√|V_i|] = [0, ${1 / Math.sqrt(k)}]`, e);
      }
      eps[i] = e;
    }
  } else {
    const scale = options.epsScale ?? 1;
    if (!(scale > 0 && scale <= 1)) throw invalidParameter(OWNER, "epsScale", "should be a number in (0, 1]", scale);
    for (let i = 0; i < n; i++) {
      const k = offsets[i + 1] - offsets[i];
      eps[i] = k === 0 ? 0 : scale / Math.sqrt(k);
    }
  }
  return { offsets, members, eps, neighbourhoods };
}

/**
 * Per-edge quantities of the explicit vector method, stored by arc: for the arc a = (i→j) with
 * i < j, `overlap[a]` = |V_i ∩ V_j|; for every arc a = (i→j), `member[a]` = [j ∈ V_i] (null when
 * V = N, where it is always 1). Overlaps are counted from the endpoint with the larger set: mark
 * V_i, walk the smaller V_j. That costs Σ_i |V_i| + Σ_edges min(|V_i|, |V_j|), which is
 * O(m^{3/2}) for V = N (Chiba & Nishizeki 1985: Σ_edges min(d_i, d_j) ≤ 2·arboricity·m).
 */
export interface VectorEdgeTerms {
  overlap: Int32Array;
  member: Uint8Array | null;
}

export function vectorEdgeTerms(graph: Graph, sets: VectorSets): VectorEdgeTerms {
  const { n, offsets: go, neighbors } = graph;
  const { offsets, members } = sets;
  const overlap = new Int32Array(neighbors.length);
  const member = sets.neighbourhoods ? null : new Uint8Array(neighbors.length);
  const stamp = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    const si = offsets[i + 1] - offsets[i];
    for (let k = offsets[i]; k < offsets[i + 1]; k++) stamp[members[k]] = i;
    for (let a = go[i]; a < go[i + 1]; a++) {
      const j = neighbors[a];
      if (member !== null) member[a] = stamp[j] === i ? 1 : 0;
      const sj = offsets[j + 1] - offsets[j];
      // Each edge is counted once, by the endpoint whose set is larger (ties: the larger id).
      if (sj > si || (sj === si && j > i)) continue;
      let c = 0;
      for (let k = offsets[j]; k < offsets[j + 1]; k++) if (stamp[members[k]] === i) c++;
      overlap[i < j ? a : graph.arcIndex(j, i)] = c;
    }
  }
  return { overlap, member };
}

/** Is x in the sorted run a[lo..hi)? Binary search. */
export function sortedContains(a: Int32Array, lo: number, hi: number, x: number): boolean {
  hi--;
  while (lo <= hi) {
    const mid = (lo + hi) >>> 1;
    const y = a[mid];
    if (y === x) return true;
    if (y < x) lo = mid + 1;
    else hi = mid - 1;
  }
  return false;
}

/** |V_i ∩ V_j| for one pair: walk the shorter run, binary-search the longer. */
export function intersectionSize(sets: VectorSets, i: number, j: number): number {
  const { offsets, members } = sets;
  const short = offsets[i + 1] - offsets[i] <= offsets[j + 1] - offsets[j] ? i : j;
  const long = short === i ? j : i;
  const b0 = offsets[long], b1 = offsets[long + 1];
  let count = 0;
  for (let k = offsets[short]; k < offsets[short + 1]; k++) if (sortedContains(members, b0, b1, members[k])) count++;
  return count;
}
