// Connected components by iterative breadth-first search (no recursion, so deep paths
// cannot overflow the stack): a label per vertex, numbered in order of smallest vertex.

import type { Graph } from "../graph.js";

export interface ComponentsResult {
  count: number;
  /** label[v] ∈ 0..count-1; components are numbered by their smallest vertex. */
  label: Int32Array;
  /** sizes[c] = number of vertices with label c. */
  sizes: Int32Array;
}

export function connectedComponents(g: Graph): ComponentsResult {
  const { n, offsets, neighbors } = g;
  const label = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  const sizesTmp = new Int32Array(n);
  let count = 0;
  for (let s = 0; s < n; s++) {
    if (label[s] >= 0) continue;
    let head = 0, tail = 0;
    queue[tail++] = s;
    label[s] = count;
    while (head < tail) {
      const u = queue[head++];
      for (let i = offsets[u]; i < offsets[u + 1]; i++) {
        const v = neighbors[i];
        if (label[v] < 0) {
          label[v] = count;
          queue[tail++] = v;
        }
      }
    }
    sizesTmp[count++] = tail;
  }
  return { count, label, sizes: sizesTmp.slice(0, count) };
}
