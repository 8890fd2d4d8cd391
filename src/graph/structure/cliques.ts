// K_r containment with a witness clique: cliques grown by intersecting sorted forward
// neighbourhoods along a degeneracy ordering, each of size ≤ d (Chiba & Nishizeki 1985).

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../graph.js";
import { sharedDegeneracy, type DegeneracyResult } from "./degeneracy.js";
import { firstAbove, rankedAdjacency, type RankedAdjacency } from "./orientation.js";
import { perGraph } from "../per-graph.js";
import { int32Pool, type ScratchPool } from "../scratch.js";

/** The degeneracy-ordered adjacency, kept per Graph object (small graphs): a clique number is several searches. */
const sharedRanking: (g: Graph) => RankedAdjacency = perGraph((g) => rankedAdjacency(g, sharedDegeneracy(g).order));

/** Largest r accepted; the search is exponential in r (intended use is r ≤ 6). */
export const MAX_CLIQUE_ORDER = 16;

// Scratch for the search (each level its own pool); every entry is written before it is read.
const candPools: ScratchPool<Int32Array>[] = Array.from({ length: MAX_CLIQUE_ORDER }, () => int32Pool());
const candLenPool = int32Pool(), chosenPool = int32Pool();

export interface SearchBudget {
  /** Stop after examining this many search nodes (a node is one vertex tried in a partial solution). */
  maxNodes?: number;
}

export interface CliqueSearchResult {
  r: number;
  found: boolean;
  /** r pairwise adjacent vertices, or null. */
  witness: number[] | null;
  /** True when `found` is a proof: either a witness, or the search ran to completion. */
  exhaustive: boolean;
  nodesExplored: number;
}

export function checkBudget(owner: string, options: SearchBudget): number {
  const b = options.maxNodes;
  if (b === undefined) return Infinity;
  if (!(b === Infinity || (Number.isInteger(b) && b >= 1))) throw invalidParameter(owner, "maxNodes", "should be a positive integer", b);
  return b;
}

export function findClique(g: Graph, r: number, options: SearchBudget = {}): CliqueSearchResult {
  if (!Number.isInteger(r) || r < 1 || r > MAX_CLIQUE_ORDER) {
    throw invalidParameter("findClique", "r", `should be an integer between 1 and ${MAX_CLIQUE_ORDER}`, r);
  }
  const maxNodes = checkBudget("findClique", options);
  const none = (exhaustive: boolean, nodesExplored: number): CliqueSearchResult => ({ r, found: false, witness: null, exhaustive, nodesExplored });
  if (r === 1) return g.n > 0 ? { r, found: true, witness: [0], exhaustive: true, nodesExplored: 1 } : none(true, 0);
  if (r === 2) {
    for (let u = 0; u < g.n; u++) if (g.degree(u) > 0) return { r, found: true, witness: [u, g.neighbors[g.offsets[u]]], exhaustive: true, nodesExplored: 1 };
    return none(true, 0);
  }
  const dg = sharedDegeneracy(g);
  // A K_r has a vertex with r-1 later neighbours in any ordering, so d < r-1 rules it out.
  if (dg.degeneracy < r - 1) return none(true, 0);
  const { n, offsets: off, neighbors: nb, vertexOf } = sharedRanking(g);
  const core = dg.coreNumber;
  const d = dg.degeneracy;
  // cand[level] holds the common forward neighbours of the chosen vertices, sorted by rank.
  const cand: Int32Array[] = [];
  for (let l = 0; l < r; l++) cand.push(candPools[l].take(d + 1));
  const candLen = candLenPool.take(r);
  const chosen = chosenPool.take(r);
  let nodes = 0;
  let outOfBudget = false;

  // chosen[0..level-1] fixed; cand[level-1] lists vertices adjacent to all of them; need r - level more.
  const extend = (level: number): boolean => {
    const c = cand[level - 1];
    const len = candLen[level - 1];
    const need = r - level;
    for (let i = 0; i + need <= len; i++) {
      if (++nodes > maxNodes) { outOfBudget = true; return false; }
      const w = c[i];
      chosen[level] = w;
      if (need === 1) return true;
      // cand[level] = c[i+1..] ∩ forward(w); both sorted, and forward(w) only holds ranks > w.
      const out = cand[level];
      let k = 0, a = i + 1, b = firstAbove(nb, off[w], off[w + 1], w);
      const bEnd = off[w + 1];
      while (a < len && b < bEnd) {
        const x = c[a], y = nb[b];
        if (x === y) { out[k++] = x; a++; b++; }
        else if (x < y) a++;
        else b++;
      }
      candLen[level] = k;
      if (k >= need - 1 && extend(level + 1)) return true;
      if (outOfBudget) return false;
    }
    return false;
  };

  for (let u = 0; u < n; u++) {
    if (core[vertexOf[u]] < r - 1) continue;
    const first = cand[0];
    let k = 0;
    for (let i = firstAbove(nb, off[u], off[u + 1], u); i < off[u + 1]; i++) {
      const w = nb[i];
      if (core[vertexOf[w]] >= r - 1) first[k++] = w;
    }
    if (k < r - 1) continue;
    if (++nodes > maxNodes) return none(false, maxNodes);
    chosen[0] = u;
    candLen[0] = k;
    if (extend(1)) return { r, found: true, witness: Array.from(chosen, (x) => vertexOf[x]), exhaustive: true, nodesExplored: nodes };
    if (outOfBudget) return none(false, maxNodes);
  }
  return none(true, nodes);
}
