// The subgraph induced by a list of vertices, relabelled 0..k−1 in the order given, edge weights
// kept. Used by exact search (one connected component at a time) and by the induced-subgraph family.
// Vertices outside the list must never be reached from it in componentSubgraph (a component is closed).

import { invalidParameter } from "../errors.js";
import { Graph } from "./graph.js";

/** Vertices must be distinct ids in [0, n); a bad list is an InputError naming `owner`'s `vertices`. */
export function inducedSubgraph(graph: Graph, vertices: ArrayLike<number>, owner = "inducedSubgraph"): Graph {
  const k = vertices.length;
  const position = new Int32Array(graph.n).fill(-1);
  for (let i = 0; i < k; i++) {
    const v = vertices[i];
    if (!Number.isInteger(v) || v < 0 || v >= graph.n) {
      throw invalidParameter(owner, "vertices", `should be vertex ids between 0 and ${graph.n - 1}`, v);
    }
    if (position[v] >= 0) throw invalidParameter(owner, "vertices", "should list each vertex once", v);
    position[v] = i;
  }
  return induced(graph, vertices, position);
}

/**
 * The subgraph on a connected component (or any vertex set closed under neighbours), given each
 * member's place in the list (`position[v]` for v in `vertices`; other entries are never read).
 * The exact search calls it once per component with one shared `position` array, so a graph of
 * 10^8 mostly isolated vertices costs no per-component O(n) fill.
 */
export function componentSubgraph(graph: Graph, vertices: ArrayLike<number>, position: ArrayLike<number>): Graph {
  return induced(graph, vertices, position);
}

function induced(graph: Graph, vertices: ArrayLike<number>, position: ArrayLike<number>): Graph {
  // CSR written directly (what buildGraph would make of the edge list, without its general
  // machinery: a subgraph of a simple graph has no loops or repeats). A member's neighbours map to
  // ascending new ids when the list is ascending; otherwise each list is sorted by insertion.
  const k = vertices.length;
  const { offsets, neighbors, weights } = graph;
  const off = new Int32Array(k + 1);
  for (let i = 0; i < k; i++) {
    const v = vertices[i];
    let d = 0;
    for (let a = offsets[v]; a < offsets[v + 1]; a++) if (position[neighbors[a]] >= 0) d++;
    off[i + 1] = off[i] + d;
  }
  const nb = new Int32Array(off[k]);
  const w = weights === null ? null : new Float64Array(off[k]);
  for (let i = 0; i < k; i++) {
    const v = vertices[i];
    const start = off[i];
    let p = start;
    for (let a = offsets[v]; a < offsets[v + 1]; a++) {
      const j = position[neighbors[a]];
      if (j < 0) continue;
      // Insertion into the sorted run nb[start..p) (no moves when the ids arrive ascending).
      const wj = w === null ? 0 : weights![a];
      let q = p;
      while (q > start && nb[q - 1] > j) {
        nb[q] = nb[q - 1];
        if (w !== null) w[q] = w[q - 1];
        q--;
      }
      nb[q] = j;
      if (w !== null) w[q] = wj;
      p++;
    }
  }
  return new Graph(k, off, nb, w);
}
