// Degeneracy, core numbers and a smallest-last vertex ordering in O(n + m) by the bucket
// algorithm of Matula & Beck (1983) as arranged by Batagelj & Zaversnik (2003).

import type { Graph } from "../graph.js";
import { perGraph } from "../per-graph.js";

export interface DegeneracyResult {
  /** max_v coreNumber[v]: the least d such that every subgraph has a vertex of degree ≤ d (0 when n = 0). */
  degeneracy: number;
  /**
   * Removal order: order[i] is the i-th vertex peeled off (read backwards, it is Matula and
   * Beck's smallest-last ordering). Every vertex has at most `degeneracy` neighbours later in
   * the order (the evidence for the upper bound).
   */
  order: Int32Array;
  /** position[v] = index of v in `order`. */
  position: Int32Array;
  /** coreNumber[v] = largest k such that v lies in the k-core (the evidence for the lower bound). */
  coreNumber: Int32Array;
}

export function degeneracy(g: Graph): DegeneracyResult {
  const { n, offsets, neighbors } = g;
  const deg = new Int32Array(n);
  let maxDeg = 0;
  for (let v = 0; v < n; v++) {
    deg[v] = offsets[v + 1] - offsets[v];
    if (deg[v] > maxDeg) maxDeg = deg[v];
  }
  // bin[d] = first position of degree-d vertices in `vert` (counting sort by degree).
  const bin = new Int32Array(maxDeg + 1);
  for (let v = 0; v < n; v++) bin[deg[v]]++;
  let start = 0;
  for (let d = 0; d <= maxDeg; d++) {
    const c = bin[d];
    bin[d] = start;
    start += c;
  }
  const vert = new Int32Array(n);
  const pos = new Int32Array(n);
  for (let v = 0; v < n; v++) {
    pos[v] = bin[deg[v]]++;
    vert[pos[v]] = v;
  }
  for (let d = maxDeg; d > 0; d--) bin[d] = bin[d - 1];
  bin[0] = 0;

  let best = 0;
  for (let i = 0; i < n; i++) {
    const v = vert[i];
    const dv = deg[v];
    if (dv > best) best = dv;
    for (let k = offsets[v]; k < offsets[v + 1]; k++) {
      const u = neighbors[k];
      const du = deg[u];
      if (du > dv) {
        // Move u to the front of its bucket, then shrink that bucket by one: u's degree drops.
        const pu = pos[u];
        const pw = bin[du];
        const w = vert[pw];
        if (u !== w) {
          pos[u] = pw;
          vert[pu] = w;
          pos[w] = pu;
          vert[pw] = u;
        }
        bin[du]++;
        deg[u] = du - 1;
      }
    }
  }
  // After the sweep deg[v] is v's core number and `vert` the removal order.
  return { degeneracy: best, order: vert, position: pos, coreNumber: deg };
}

/**
 * degeneracy(g) computed once per Graph object (../per-graph.ts): the structure summary and every
 * clique search of a sweep job read it. The result is read-only.
 */
export const sharedDegeneracy: (g: Graph) => DegeneracyResult = perGraph(degeneracy);
