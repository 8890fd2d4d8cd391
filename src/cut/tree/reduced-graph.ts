// The max-cut problem left at a node of a branch-and-bound tree: some vertices fixed to a side, the
// rest free. Fixed vertices collapse into one vertex z standing for side 0, so a node is an ordinary
// weighted graph (signed weights) plus a constant, and every bound for graphs applies to it.
//
// Why it is exact: an edge uv with v fixed on side 0 is cut iff u is not with z (weight +w on uz);
// with v on side 1 it is cut iff u is with z, i.e. w − [u not with z]·w (constant w, weight −w on
// uz). Edges among fixed vertices give a constant. So for every assignment of the free vertices,
// cut(G) = offset + cut(reduced) with z on side 0 (common practice, no source).

import { InputError } from "../../errors.js";
import { buildGraph } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";

export interface ReducedProblem {
  /** z = vertex 0, then the free vertices in increasing order. */
  graph: Graph;
  /** Cut weight fixed by the node: edges among fixed vertices and the constant parts above. */
  offset: number;
  /** free[i] is the original vertex of reduced vertex i + 1. */
  free: Int32Array;
}

/**
 * The reduced problem of a node: `side[v]` is 0 or 1 for fixed vertices, 255 for free ones.
 * Integer weights stay integers, so every reduced sum is exact (the tree search requires that).
 */
export function reducedProblem(graph: Graph, side: Uint8Array): ReducedProblem {
  const n = graph.n;
  if (side.length !== n) throw new InputError(`reducedProblem: \`side\` has ${side.length} entries, the graph ${n} vertices`);
  const pos = new Int32Array(n).fill(-1);
  let count = 0;
  for (let v = 0; v < n; v++) if (side[v] === 255) pos[v] = ++count;
  const free = new Int32Array(count);
  for (let v = 0; v < n; v++) if (pos[v] > 0) free[pos[v] - 1] = v;
  const toZ = new Float64Array(count + 1);
  const us: number[] = [], vs: number[] = [], ws: number[] = [];
  let offset = 0;
  graph.forEachEdge((u, v, w) => {
    const fu = side[u] === 255, fv = side[v] === 255;
    if (fu && fv) {
      us.push(pos[u]);
      vs.push(pos[v]);
      ws.push(w);
    } else if (!fu && !fv) {
      if (side[u] !== side[v]) offset += w;
    } else {
      const f = fu ? u : v, fixed = fu ? v : u;
      if (side[fixed] === 0) toZ[pos[f]] += w;
      else {
        toZ[pos[f]] -= w;
        offset += w;
      }
    }
  });
  for (let i = 1; i <= count; i++) {
    if (toZ[i] !== 0) {
      us.push(0);
      vs.push(i);
      ws.push(toZ[i]);
    }
  }
  return { graph: buildGraph(count + 1, us, vs, ws).graph, offset, free };
}
