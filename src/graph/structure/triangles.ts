// Triangle counting in O(m·√m): edges oriented by (degree, id), forward neighbours marked
// and scanned (Chiba & Nishizeki 1985; the "forward" algorithm of Schank & Wagner 2005).

import type { Graph } from "../graph.js";
import { perGraph } from "../per-graph.js";
import { float64Pool, int32Pool } from "../scratch.js";
import { firstAbove, scratchDegreeRanking } from "./orientation.js";

const fwdPool = int32Pool(), markPool = int32Pool(), perRankPool = float64Pool();

export interface TriangleCount {
  /** Number of triangles (exact below 2^53). */
  total: number;
  /** perVertex[v] = number of triangles through v; Σ perVertex = 3·total. */
  perVertex: Float64Array;
  /** One triangle [a, b, c] when total > 0, else null. */
  witness: number[] | null;
}

/** Orienting each edge towards the larger (degree, id) endpoint bounds out-degrees by √(2m). */
export function countTriangles(g: Graph): TriangleCount {
  const { n } = g;
  const ra = scratchDegreeRanking(g); // scratch: read only until this returns
  const { offsets: off, neighbors: nb, vertexOf } = ra;
  // fwd[u]: start of u's forward neighbours (those of larger rank) within its sorted list.
  const fwd = fwdPool.take(n); // scratch pools: each is fully initialised below
  for (let u = 0; u < n; u++) fwd[u] = firstAbove(nb, off[u], off[u + 1], u);
  const mark = markPool.take(n).fill(0); // mark[w] = u + 1 while scanning u: stamps avoid clearing
  const perRank = perRankPool.take(n).fill(0);
  let total = 0;
  let wa = -1, wb = -1, wc = -1;
  for (let u = 0; u < n; u++) {
    const uEnd = off[u + 1];
    if (uEnd - fwd[u] < 2) continue;
    const stamp = u + 1;
    for (let i = fwd[u]; i < uEnd; i++) mark[nb[i]] = stamp;
    for (let i = fwd[u]; i < uEnd; i++) {
      const v = nb[i];
      const vEnd = off[v + 1];
      let found = 0;
      for (let j = fwd[v]; j < vEnd; j++) {
        const w = nb[j];
        if (mark[w] === stamp) {
          found++;
          perRank[w]++;
          if (wa < 0) { wa = u; wb = v; wc = w; }
        }
      }
      if (found > 0) {
        perRank[u] += found;
        perRank[v] += found;
        total += found;
      }
    }
  }
  const perVertex = new Float64Array(n);
  for (let r = 0; r < n; r++) perVertex[vertexOf[r]] = perRank[r];
  const witness = wa < 0 ? null : [vertexOf[wa], vertexOf[wb], vertexOf[wc]];
  return { total, perVertex, witness };
}

/**
 * The triangle count of a graph, computed once per Graph object and shared: a sweep job asks for
 * it in the structure summary and in four lower-bound evaluators. Callers must treat the record
 * (its perVertex array above all) as read-only.
 */
export const sharedTriangleCount: (g: Graph) => TriangleCount = perGraph(countTriangles);
