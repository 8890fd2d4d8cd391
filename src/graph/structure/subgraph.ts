// General subgraph containment (not necessarily induced): an injective map of the pattern's
// vertices into the host that carries every pattern edge to a host edge, or proof there is none.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../graph.js";
import { checkBudget, findClique, type SearchBudget } from "./cliques.js";
import { findCompleteBipartite } from "./complete-bipartite.js";
import { findCycle } from "./cycles.js";
import { degeneracy } from "./degeneracy.js";
import { patternShape } from "./pattern-shape.js";
import { firstAbove } from "./orientation.js";
import { symmetryConditions } from "./symmetry.js";

/** Largest pattern accepted; the search is exponential in the pattern size (intended use ≤ 8). */
export const MAX_PATTERN_VERTICES = 16;

/** Which search answered: a dedicated one for a recognised pattern shape, or general backtracking. */
export type SubgraphMethod = "clique" | "cycle" | "complete-bipartite" | "backtracking";

export interface SubgraphSearchOptions extends SearchBudget {
  /** "auto" (default) uses the dedicated search for complete, cycle and complete bipartite patterns. */
  strategy?: "auto" | "backtracking";
}

export type SubgraphSearchResult =
  | {
      found: true;
      exhaustive: true;
      /** embedding[p] = host vertex of pattern vertex p; injective, pattern edges go to host edges. */
      embedding: Int32Array;
      nodesExplored: number;
      method: SubgraphMethod;
    }
  | {
      found: false;
      /** true: the search space was exhausted, a proof of absence; false: the node budget ran out. */
      exhaustive: boolean;
      nodesExplored: number;
      method: SubgraphMethod;
    };

/** A pattern vertex order in which each vertex has as many earlier neighbours as possible. */
function searchOrder(p: Graph): Int32Array {
  const k = p.n;
  const order = new Int32Array(k);
  const placed = new Uint8Array(k);
  const links = new Int32Array(k); // edges to already placed vertices
  for (let i = 0; i < k; i++) {
    let best = -1;
    for (let v = 0; v < k; v++) {
      if (placed[v]) continue;
      if (best < 0 || links[v] > links[best] || (links[v] === links[best] && p.degree(v) > p.degree(best))) best = v;
    }
    order[i] = best;
    placed[best] = 1;
    for (const w of p.neighborsOf(best)) links[w]++;
  }
  return order;
}

/** Minimum degree within each vertex's connected component of the pattern. */
function componentMinDegree(p: Graph): Int32Array {
  const k = p.n;
  const comp = new Int32Array(k).fill(-1);
  const minDeg: number[] = [];
  for (let s = 0; s < k; s++) {
    if (comp[s] >= 0) continue;
    const c = minDeg.length;
    let md = Infinity;
    const stack = [s];
    comp[s] = c;
    while (stack.length > 0) {
      const u = stack.pop()!;
      md = Math.min(md, p.degree(u));
      for (const w of p.neighborsOf(u)) if (comp[w] < 0) { comp[w] = c; stack.push(w); }
    }
    minDeg.push(md);
  }
  return Int32Array.from(comp, (c) => minDeg[c]);
}

/**
 * Complete, cycle and complete bipartite patterns go to their dedicated searches (unless
 * `strategy: "backtracking"`); any other pattern is found by backtracking over a
 * connectivity-first pattern order, with degree and core-number pruning and symmetry-breaking
 * order conditions, so automorphic copies of one occurrence are not all tried.
 */
export function findSubgraph(g: Graph, pattern: Graph, options: SubgraphSearchOptions = {}): SubgraphSearchResult {
  const k = pattern.n;
  if (k > MAX_PATTERN_VERTICES) {
    throw invalidParameter("findSubgraph", "pattern", `should have at most ${MAX_PATTERN_VERTICES} vertices`, `${k} vertices`);
  }
  const strategy = options.strategy ?? "auto";
  if (strategy !== "auto" && strategy !== "backtracking") throw invalidParameter("findSubgraph", "strategy", "should be auto or backtracking", strategy);
  const maxNodes = checkBudget("findSubgraph", options);
  if (strategy === "auto") {
    const budget = { maxNodes };
    const shape = patternShape(pattern);
    if (shape.kind === "complete") {
      const r = findClique(g, shape.r, budget);
      return finish("clique", r.witness === null ? null : Int32Array.from(r.witness), r.exhaustive, r.nodesExplored);
    }
    if (shape.kind === "cycle") {
      const r = findCycle(g, k, budget);
      const emb = new Int32Array(k);
      if (r.witness !== null) shape.order.forEach((pv, i) => (emb[pv] = r.witness![i]));
      return finish("cycle", r.witness === null ? null : emb, r.exhaustive, r.nodesExplored);
    }
    if (shape.kind === "complete-bipartite") {
      const r = findCompleteBipartite(g, shape.left.length, shape.right.length, budget);
      const emb = new Int32Array(k);
      if (r.witness !== null) {
        shape.left.forEach((pv, i) => (emb[pv] = r.witness!.left[i]));
        shape.right.forEach((pv, i) => (emb[pv] = r.witness!.right[i]));
      }
      return finish("complete-bipartite", r.witness === null ? null : emb, r.exhaustive, r.nodesExplored);
    }
  }
  return backtrack(g, pattern, maxNodes);
}

function finish(method: SubgraphMethod, embedding: Int32Array | null, exhaustive: boolean, nodesExplored: number): SubgraphSearchResult {
  return embedding !== null ? { found: true, exhaustive: true, embedding, nodesExplored, method } : { found: false, exhaustive, nodesExplored, method };
}

function backtrack(g: Graph, pattern: Graph, maxNodes: number): SubgraphSearchResult {
  const k = pattern.n;
  const absent = (exhaustive: boolean, nodesExplored: number): SubgraphSearchResult => finish("backtracking", null, exhaustive, nodesExplored);
  if (k === 0) return finish("backtracking", new Int32Array(0), true, 0);
  if (k > g.n || pattern.m > g.m) return absent(true, 0);

  const order = searchOrder(pattern);
  const posOf = new Int32Array(k);
  for (let i = 0; i < k; i++) posOf[order[i]] = i;
  // back[i] = search positions j < i adjacent (in the pattern) to the vertex at position i.
  const back: Int32Array[] = [];
  const needDeg = new Int32Array(k);
  const needCore = new Int32Array(k);
  const compMin = componentMinDegree(pattern);
  for (let i = 0; i < k; i++) {
    const pv = order[i];
    back.push(Int32Array.from([...pattern.neighborsOf(pv)].map((w) => posOf[w]).filter((j) => j < i)));
    needDeg[i] = pattern.degree(pv);
    // The image of a pattern component of minimum degree δ is a host subgraph of minimum degree ≥ δ,
    // so it lies in the host's δ-core.
    needCore[i] = compMin[pv];
  }
  // Order conditions from the pattern's automorphisms: above[i] / below[i] list earlier positions
  // whose images must be smaller / larger than the image at position i.
  const above: number[][] = Array.from({ length: k }, () => []);
  const below: number[][] = Array.from({ length: k }, () => []);
  for (const [a, b] of symmetryConditions(pattern, order)) {
    const pa = posOf[a], pb = posOf[b];
    if (pa < pb) above[pb].push(pa);
    else below[pa].push(pb);
  }
  const core = degeneracy(g).coreNumber;
  const { offsets, neighbors, n } = g;

  const map = new Int32Array(k).fill(-1); // host vertex at each search position
  const used = new Uint8Array(n);
  const cur = new Int32Array(k); // next candidate index at each level
  const end = new Int32Array(k);
  const anchor = new Int32Array(k); // back position whose host neighbours are scanned, or -1 (all vertices)
  let nodes = 0;

  const enter = (i: number): void => {
    const b = back[i];
    let best = -1;
    for (let t = 0; t < b.length; t++) {
      const j = b[t];
      if (best < 0 || g.degree(map[j]) < g.degree(map[best])) best = j;
    }
    anchor[i] = best;
    // Candidates must lie strictly between lo and hi (symmetry conditions).
    let lo = -1, hi = n;
    const ab = above[i], be = below[i];
    for (let t = 0; t < ab.length; t++) lo = Math.max(lo, map[ab[t]]);
    for (let t = 0; t < be.length; t++) hi = Math.min(hi, map[be[t]]);
    if (best < 0) {
      cur[i] = lo + 1;
      end[i] = hi;
    } else {
      const h = map[best];
      cur[i] = firstAbove(neighbors, offsets[h], offsets[h + 1], lo);
      end[i] = firstAbove(neighbors, cur[i], offsets[h + 1], hi - 1);
    }
    map[i] = -1;
  };

  let i = 0;
  enter(0);
  while (i >= 0) {
    if (map[i] >= 0) {
      used[map[i]] = 0;
      map[i] = -1;
    }
    let placed = false;
    while (cur[i] < end[i]) {
      const x = anchor[i] < 0 ? cur[i]++ : neighbors[cur[i]++];
      if (used[x] || offsets[x + 1] - offsets[x] < needDeg[i] || core[x] < needCore[i]) continue;
      if (++nodes > maxNodes) return absent(false, maxNodes);
      const b = back[i];
      let ok = true;
      for (let t = 0; t < b.length; t++) {
        const j = b[t];
        if (j !== anchor[i] && !g.hasEdge(map[j], x)) { ok = false; break; }
      }
      if (!ok) continue;
      map[i] = x;
      used[x] = 1;
      placed = true;
      break;
    }
    if (!placed) {
      i--;
      continue;
    }
    if (i === k - 1) {
      const embedding = new Int32Array(k);
      for (let t = 0; t < k; t++) embedding[order[t]] = map[t];
      return finish("backtracking", embedding, true, nodes);
    }
    i++;
    enter(i);
  }
  return absent(true, nodes);
}
