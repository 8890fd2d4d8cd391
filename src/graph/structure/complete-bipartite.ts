// K_{s,t} containment (not necessarily induced) with a witness, by codegree counting: the
// smaller side grows one vertex at a time among vertices seeing ≥ t of the common neighbours.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../graph.js";
import { checkBudget, type SearchBudget } from "./cliques.js";
import { degeneracy } from "./degeneracy.js";

/** Largest size of the smaller side: that side is enumerated, so the search is exponential in it. */
export const MAX_ENUMERATED_SIDE = 16;

export interface CompleteBipartiteResult {
  s: number;
  t: number;
  found: boolean;
  /** `left` (s vertices) all adjacent to every vertex of `right` (t vertices); null when not found. */
  witness: { left: number[]; right: number[] } | null;
  /** True when `found` is a proof: a witness, or a completed search. */
  exhaustive: boolean;
  nodesExplored: number;
}

/**
 * Is there a K_{s,t} (s vertices all adjacent to t others)? The smaller side a1 < a2 < … is
 * grown one vertex at a time; candidates for the next are counted over the current common
 * neighbourhood C (paths c–x, x above the last chosen vertex) and need ≥ t hits. The first
 * level is the classic 2-path count, Σ_v deg(v)² work in all.
 */
export function findCompleteBipartite(g: Graph, s: number, t: number, options: SearchBudget = {}): CompleteBipartiteResult {
  for (const [name, v] of [["s", s], ["t", t]] as const) {
    if (!Number.isInteger(v) || v < 1) throw invalidParameter("findCompleteBipartite", name, "should be a positive integer", v);
  }
  if (Math.min(s, t) > MAX_ENUMERATED_SIDE) {
    throw invalidParameter("findCompleteBipartite", s <= t ? "s" : "t", `the smaller side should be at most ${MAX_ENUMERATED_SIDE}`, Math.min(s, t));
  }
  const maxNodes = checkBudget("findCompleteBipartite", options);
  // Enumerate the smaller side (size a); the larger one (size b) is read off as common neighbours.
  const swap = s > t;
  const a = swap ? t : s;
  const b = swap ? s : t;
  const result = (left: number[] | null, right: number[] | null, exhaustive: boolean, nodesExplored: number): CompleteBipartiteResult => ({
    s,
    t,
    found: left !== null,
    witness: left === null ? null : swap ? { left: right!, right: left } : { left, right: right! },
    exhaustive,
    nodesExplored,
  });
  const { n, offsets, neighbors } = g;
  if (a + b > n) return result(null, null, true, 0);
  if (a === 1) {
    for (let v = 0; v < n; v++) {
      if (offsets[v + 1] - offsets[v] >= b) return result([v], Array.from(neighbors.subarray(offsets[v], offsets[v] + b)), true, 1);
    }
    return result(null, null, true, 0);
  }
  // Every vertex of a K_{a,b} copy has degree ≥ a inside it, so the copy lies in the a-core;
  // the a-side vertices also need degree ≥ b.
  const core = degeneracy(g).coreNumber;
  let maxDeg = 0;
  for (let v = 0; v < n; v++) maxDeg = Math.max(maxDeg, offsets[v + 1] - offsets[v]);
  const seen = new Int32Array(n); // neighbours of C counted at the current level
  const touched = new Int32Array(n);
  // Per level: candidates for the next a-side vertex, and C = common neighbours of the chosen ones.
  const cands: Int32Array[] = [];
  const common: Int32Array[] = [];
  for (let l = 0; l < a; l++) {
    cands.push(new Int32Array(l === 0 ? 0 : n));
    common.push(new Int32Array(maxDeg));
  }
  const commonLen = new Int32Array(a);
  const chosen = new Int32Array(a);
  let nodes = 0;
  let outOfBudget = false;

  // chosen[0..level-1] fixed, common[level-1] (size ≥ b) their common neighbours: choose chosen[level].
  const extend = (level: number): boolean => {
    const c = common[level - 1];
    const cLen = commonLen[level - 1];
    const last = chosen[level - 1];
    let nt = 0;
    for (let i = 0; i < cLen; i++) {
      const y = c[i];
      for (let j = offsets[y + 1] - 1; j >= offsets[y]; j--) {
        const x = neighbors[j];
        if (x <= last) break; // sorted lists: the a-side is chosen in increasing order
        if (seen[x]++ === 0) touched[nt++] = x;
      }
    }
    const cand = cands[level];
    let nc = 0;
    for (let i = 0; i < nt; i++) {
      const x = touched[i];
      if (seen[x] >= b && core[x] >= a && offsets[x + 1] - offsets[x] >= b) cand[nc++] = x;
      seen[x] = 0;
    }
    if (nc < a - level) return false;
    cand.subarray(0, nc).sort();
    const out = common[level];
    for (let p = 0; p + (a - level) <= nc; p++) {
      if (++nodes > maxNodes) { outOfBudget = true; return false; }
      const x = cand[p];
      chosen[level] = x;
      // C ∩ N(x): C is short here, so binary searches in N(x) beat a merge.
      let k = 0;
      for (let i = 0; i < cLen; i++) if (g.hasEdge(x, c[i])) out[k++] = c[i];
      commonLen[level] = k;
      if (level === a - 1 || extend(level + 1)) return true;
      if (outOfBudget) return false;
    }
    return false;
  };

  for (let a1 = 0; a1 < n; a1++) {
    if (core[a1] < a || offsets[a1 + 1] - offsets[a1] < b) continue;
    const c0 = common[0];
    let k = 0;
    for (let i = offsets[a1]; i < offsets[a1 + 1]; i++) if (core[neighbors[i]] >= a) c0[k++] = neighbors[i];
    if (k < b) continue;
    commonLen[0] = k;
    chosen[0] = a1;
    if (extend(1)) return result(Array.from(chosen), Array.from(common[a - 1].subarray(0, b)), true, nodes);
    if (outOfBudget) return result(null, null, false, maxNodes);
  }
  return result(null, null, true, nodes);
}
