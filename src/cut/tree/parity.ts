// The parity of a cut, for the exact tree search.
//
// With integer weights, a cut with side S has value w(S, V∖S) = Σ_{v∈S} d_w(v) − 2·w(E(S)), where
// d_w is the weighted degree and E(S) the edges inside S (each edge inside S is counted twice in the
// degree sum, each crossing edge once). So the value's parity is that of the number of vertices of
// odd weighted degree in S (the handshake argument; common practice, no source). Once a node has
// fixed every odd-degree vertex, all its cuts share one parity p, and a proven upper bound B on the
// node sharpens to the largest integer ≤ B of parity p. On the polarity graph ER_q with q odd only
// the q + 1 absolute points have odd degree (q, against q + 1 for the other points), so fixing them
// decides the parity; for q even the odd-degree vertices are the q² non-absolute points, too many.
//
// Both the search and `verifyTreeCertificate` apply `parityFloor` to a region's re-derived bound,
// from the graph and the region's fixings alone, so the certificate needs no new field.

import type { Graph } from "../../graph/graph.js";

/** The vertices of odd weighted degree (weights must be integers), in increasing order. */
export function oddDegreeVertices(graph: Graph): Int32Array {
  const out: number[] = [];
  for (let v = 0; v < graph.n; v++) {
    const d = graph.weightedDegree(v);
    if (Math.abs(d % 2) === 1) out.push(v);
  }
  return Int32Array.from(out);
}

/**
 * The parity (0 or 1) every cut of a node shares, or −1 when some odd-degree vertex is free.
 * `side` holds 0 or 1 for fixed vertices and 255 for free ones.
 */
export function nodeParity(odd: Int32Array, side: ArrayLike<number>): number {
  let p = 0;
  for (const v of odd) {
    const s = side[v];
    if (s === 255) return -1;
    p ^= s;
  }
  return p;
}

/** The largest integer ≤ `bound` (an integer) of parity `parity`; `bound` unchanged when the parity is unknown (−1). */
export function parityFloor(bound: number, parity: number): number {
  if (parity < 0 || !Number.isFinite(bound)) return bound;
  return Math.abs(bound % 2) === parity ? bound : bound - 1;
}
