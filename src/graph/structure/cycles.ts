// C_k containment (a cycle of length exactly k, not necessarily induced) with a witness:
// O(m·√m) scans for k = 3, 4; a distance-pruned, depth-bounded DFS for k ≥ 5.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../graph.js";
import { checkBudget, findClique, type SearchBudget } from "./cliques.js";
import { scanFourCycles } from "./four-cycles.js";
import { int32Pool } from "../scratch.js";
import { firstAbove, scratchDegreeRanking } from "./orientation.js";

const stampPool = int32Pool(), distPool = int32Pool(), onPathPool = int32Pool(), queuePool = int32Pool(), pathPool = int32Pool(), iterPool = int32Pool();

/** Largest k accepted; the DFS is exponential in k (intended use is k ≤ 8). */
export const MAX_CYCLE_LENGTH = 16;

export interface CycleSearchResult {
  k: number;
  found: boolean;
  /** k distinct vertices [v0, …, v_{k-1}] with v_i ~ v_{i+1} and v_{k-1} ~ v0, or null. */
  witness: number[] | null;
  /** True when `found` is a proof: a witness, or a completed search. */
  exhaustive: boolean;
  nodesExplored: number;
}

/**
 * Is there a cycle of length exactly k? k = 3 and 4 reuse the O(m·√m) triangle/4-cycle scans.
 * k ≥ 5: from each vertex s as the cycle's lowest (degree, id) vertex, a DFS over simple paths
 * above s, pruned by BFS distance back to s.
 */
export function findCycle(g: Graph, k: number, options: SearchBudget = {}): CycleSearchResult {
  if (!Number.isInteger(k) || k < 3 || k > MAX_CYCLE_LENGTH) {
    throw invalidParameter("findCycle", "k", `should be an integer between 3 and ${MAX_CYCLE_LENGTH}`, k);
  }
  const maxNodes = checkBudget("findCycle", options);
  if (k === 3) {
    const c = findClique(g, 3, options);
    return { k, found: c.found, witness: c.witness, exhaustive: c.exhaustive, nodesExplored: c.nodesExplored };
  }
  if (k === 4) {
    // The scan is polynomial (O(m·√m)), so it runs without a budget.
    const c = scanFourCycles(g, true);
    return { k, found: c.witness !== null, witness: c.witness, exhaustive: true, nodesExplored: 0 };
  }
  return searchLongCycle(g, k, maxNodes);
}

function searchLongCycle(g: Graph, k: number, maxNodes: number): CycleSearchResult {
  const { n, offsets: off, neighbors: nb, vertexOf } = scratchDegreeRanking(g); // scratch: read only until this returns
  const half = k >>> 1; // every vertex of a k-cycle through s is within ⌊k/2⌋ of s along it
  const stampOf = stampPool.take(n).fill(0); // = s + 1 when dist[v] is valid for root s
  const dist = distPool.take(n); // read only where stampOf marks it written
  const onPath = onPathPool.take(n).fill(0); // = s + 1 while v is on the current path
  const queue = queuePool.take(n); // queue, path and iter: written before read
  const path = pathPool.take(k);
  const iter = iterPool.take(k);
  let nodes = 0;
  for (let s = 0; s < n; s++) {
    const sStart = firstAbove(nb, off[s], off[s + 1], s);
    if (off[s + 1] - sStart < 2) continue; // s needs two neighbours above it on the cycle
    const stamp = s + 1;
    // BFS from s within the vertices of rank > s, up to depth ⌊k/2⌋.
    let head = 0, tail = 0;
    queue[tail++] = s;
    stampOf[s] = stamp;
    dist[s] = 0;
    while (head < tail) {
      const u = queue[head++];
      const du = dist[u];
      if (du === half) continue;
      for (let i = firstAbove(nb, off[u], off[u + 1], s); i < off[u + 1]; i++) {
        const w = nb[i];
        if (stampOf[w] !== stamp) {
          stampOf[w] = stamp;
          dist[w] = du + 1;
          queue[tail++] = w;
        }
      }
    }
    // DFS over simple paths s = path[0], path[1], …; the path back from a vertex needs at
    // least dist[v] more edges, which prunes the deep levels where the work is.
    let depth = 0;
    path[0] = s;
    onPath[s] = stamp;
    iter[0] = sStart;
    while (depth >= 0) {
      const x = path[depth];
      if (iter[depth] >= off[x + 1]) {
        onPath[x] = 0;
        depth--;
        continue;
      }
      const y = nb[iter[depth]++];
      if (stampOf[y] !== stamp || onPath[y] === stamp) continue;
      const remaining = k - depth - 1; // edges still needed after stepping to y
      if (dist[y] > remaining) continue;
      if (++nodes > maxNodes) return { k, found: false, witness: null, exhaustive: false, nodesExplored: maxNodes };
      if (remaining === 1) {
        // dist[y] ≤ 1 and y ≠ s: y is a neighbour of s, closing the cycle.
        const witness = new Array<number>(k);
        for (let i = 0; i <= depth; i++) witness[i] = vertexOf[path[i]];
        witness[k - 1] = vertexOf[y];
        return { k, found: true, witness, exhaustive: true, nodesExplored: nodes };
      }
      depth++;
      path[depth] = y;
      onPath[y] = stamp;
      iter[depth] = firstAbove(nb, off[y], off[y + 1], s);
    }
  }
  return { k, found: false, witness: null, exhaustive: true, nodesExplored: nodes };
}
