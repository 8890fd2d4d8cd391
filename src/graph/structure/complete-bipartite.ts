// K_{s,t} containment (not necessarily induced) with a witness, by codegrees: for each
// vertex a1, count 2-paths a1–b–a2 to find the partners with ≥ t common neighbours, then grow
// the s-side among those partners by intersecting sorted neighbourhoods. The counting costs Σ_v deg(v)².

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

export function findCompleteBipartite(g: Graph, s: number, t: number, options: SearchBudget = {}): CompleteBipartiteResult {
  for (const [name, v] of [["s", s], ["t", t]] as const) {
    if (!Number.isInteger(v) || v < 1) throw invalidParameter("findCompleteBipartite", name, "should be a positive integer", v);
  }
  if (Math.min(s, t) > MAX_ENUMERATED_SIDE) {
    throw invalidParameter("findCompleteBipartite", s <= t ? "s" : "t", `the smaller side should be at most ${MAX_ENUMERATED_SIDE}`, Math.min(s, t));
  }
  const maxNodes = checkBudget("findCompleteBipartite", options);
  // Enumerate the smaller side; the larger one is read off as common neighbours.
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
  // the a-side vertices need degree ≥ b.
  const core = degeneracy(g).coreNumber;
  const okB = (v: number) => core[v] >= a;
  const okA = (v: number) => core[v] >= a && offsets[v + 1] - offsets[v] >= b;
  const paths = new Int32Array(n);
  const touched = new Int32Array(n);
  const partners = new Int32Array(n); // a2 > a1 with codegree ≥ b, ascending
  const chosen = new Int32Array(a);
  // common[l] = common neighbours of chosen[0..l] (filtered by okB), sorted.
  const common: Int32Array[] = [];
  const commonLen = new Int32Array(a);
  let maxDeg = 0;
  for (let v = 0; v < n; v++) maxDeg = Math.max(maxDeg, offsets[v + 1] - offsets[v]);
  for (let l = 0; l < a; l++) common.push(new Int32Array(maxDeg));
  let nodes = 0;
  let outOfBudget = false;

  // chosen[0..level-1] fixed with common[level-1] of size ≥ b; pick chosen[level] among partners[from..].
  const extend = (level: number, np: number, from: number): boolean => {
    const prev = common[level - 1];
    const prevLen = commonLen[level - 1];
    const out = common[level];
    for (let p = from; p + (a - level) <= np; p++) {
      if (++nodes > maxNodes) { outOfBudget = true; return false; }
      const x = partners[p];
      let k = 0, i = 0, j = offsets[x];
      const jEnd = offsets[x + 1];
      while (i < prevLen && j < jEnd) {
        const u = prev[i], w = neighbors[j];
        if (u === w) { out[k++] = u; i++; j++; }
        else if (u < w) i++;
        else j++;
      }
      if (k < b) continue;
      chosen[level] = x;
      commonLen[level] = k;
      if (level === a - 1 || extend(level + 1, np, p + 1)) return true;
      if (outOfBudget) return false;
    }
    return false;
  };

  for (let a1 = 0; a1 < n; a1++) {
    if (!okA(a1)) continue;
    let nt = 0;
    for (let i = offsets[a1]; i < offsets[a1 + 1]; i++) {
      const mid = neighbors[i];
      if (!okB(mid)) continue;
      for (let j = offsets[mid + 1] - 1; j >= offsets[mid]; j--) {
        const a2 = neighbors[j];
        if (a2 <= a1) break; // sorted lists: only partners above a1 (a1 is the smallest of the a-side)
        if (paths[a2]++ === 0) touched[nt++] = a2;
      }
    }
    let np = 0;
    for (let i = 0; i < nt; i++) {
      const x = touched[i];
      if (paths[x] >= b && okA(x)) partners[np++] = x;
      paths[x] = 0;
    }
    if (np < a - 1) continue;
    partners.subarray(0, np).sort();
    const c0 = common[0];
    let k = 0;
    for (let i = offsets[a1]; i < offsets[a1 + 1]; i++) if (okB(neighbors[i])) c0[k++] = neighbors[i];
    commonLen[0] = k;
    chosen[0] = a1;
    if (extend(1, np, 0)) {
      const right = Array.from(common[a - 1].subarray(0, b));
      return result(Array.from(chosen), right, true, nodes);
    }
    if (outOfBudget) return result(null, null, false, maxNodes);
  }
  return result(null, null, true, nodes);
}
