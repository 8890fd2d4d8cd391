// Bipartiteness by BFS 2-colouring. Evidence either way: the two sides, or an odd cycle
// (distinct vertices, consecutive ones adjacent, closing edge from last to first).

import type { Graph } from "../graph.js";

export type BipartitionResult =
  | { bipartite: true; /** sides[v] ∈ {0, 1}; every edge joins the two sides. */ sides: Uint8Array }
  | { bipartite: false; /** An odd cycle [v0, …, v_{2k}]: v_i ~ v_{i+1} and v_{2k} ~ v0. */ oddCycle: number[] };

export function bipartition(g: Graph): BipartitionResult {
  const { n, offsets, neighbors } = g;
  const depth = new Int32Array(n).fill(-1);
  const parent = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  for (let s = 0; s < n; s++) {
    if (depth[s] >= 0) continue;
    let head = 0, tail = 0;
    queue[tail++] = s;
    depth[s] = 0;
    while (head < tail) {
      const u = queue[head++];
      for (let i = offsets[u]; i < offsets[u + 1]; i++) {
        const v = neighbors[i];
        if (depth[v] < 0) {
          depth[v] = depth[u] + 1;
          parent[v] = u;
          queue[tail++] = v;
        } else if (depth[v] === depth[u]) {
          // BFS edges join equal or adjacent levels, so a same-colour edge joins one level:
          // the tree paths from u and v meet at their lowest common ancestor, closing an odd cycle.
          return { bipartite: false, oddCycle: closeOddCycle(parent, u, v) };
        }
      }
    }
  }
  const sides = new Uint8Array(n);
  for (let v = 0; v < n; v++) sides[v] = depth[v] & 1;
  return { bipartite: true, sides };
}

/** u and v on the same BFS level and adjacent: climb in step to the common ancestor. */
function closeOddCycle(parent: Int32Array, u: number, v: number): number[] {
  const left: number[] = [];
  const right: number[] = [];
  let a = u, b = v;
  while (a !== b) {
    left.push(a);
    right.push(b);
    a = parent[a];
    b = parent[b];
  }
  // left: u … (child of lca), then lca, then right reversed: … v; the edge v–u closes it.
  return [...left, a, ...right.reverse()];
}
