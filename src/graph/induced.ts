// The subgraph induced by a list of vertices, relabelled 0..k−1 in the order given, edge weights
// kept. Used by exact search (one connected component at a time) and by the induced-subgraph family.
// Vertices outside the list must never be reached from it in componentSubgraph (a component is closed).

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "./builder.js";
import type { Graph } from "./graph.js";

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
  const k = vertices.length;
  const buf = new EdgeBuffer({ weighted: graph.weighted });
  const { offsets, neighbors, weights } = graph;
  for (let i = 0; i < k; i++) {
    const v = vertices[i];
    for (let a = offsets[v]; a < offsets[v + 1]; a++) {
      const j = position[neighbors[a]];
      if (j > i) buf.add(i, j, weights === null ? 1 : weights[a]);
    }
  }
  return buf.build(k).graph;
}
