// Partition crossover of two cuts: the vertices on which the parents disagree split into
// connected components whose contributions to the cut are independent, so the child takes, per
// component, whichever parent's sides cut more. The child is never worse than either parent.

import type { Graph } from "../../graph/graph.js";

/**
 * Partition crossover for max cut, after the partition crossover for pseudo-Boolean functions of
 * Tinós, Whitley & Chicano (2015, "Partition crossover for pseudo-Boolean optimization", FOGA XIII)
 * specialised to the cut function: with b aligned to a (complemented when that makes them agree on
 * more vertices), let D be the vertices where they differ. Switching a component C of G[D] from a's
 * sides to b's changes only the edges from C to vertices outside D (edges inside C keep their
 * status, and no edge joins two components), by Σ w·(+1 if the edge is uncut in a, −1 if cut).
 * Taking b's sides exactly on the components where that sum is positive gives a child whose cut
 * is at least max(cut(a), cut(b)), in O(n + m). Work arrays are allocated once per graph.
 */
export class PartitionCrossover {
  readonly graph: Graph;
  private readonly comp: Int32Array;
  private readonly queue: Int32Array;
  private readonly delta: Float64Array;
  /** Components of the last cross (how finely the parents' differences split). */
  components = 0;
  /** Components taken from b in the last cross. */
  taken = 0;

  constructor(graph: Graph) {
    this.graph = graph;
    this.comp = new Int32Array(graph.n);
    this.queue = new Int32Array(graph.n);
    this.delta = new Float64Array(graph.n);
  }

  /** Write the child of a and b into `child` (which may be a itself) and return cut(child) − cut(a) ≥ 0. */
  cross(a: Uint8Array, b: Uint8Array, child: Uint8Array): number {
    const { n, offsets, neighbors, weights } = this.graph;
    const { comp, queue, delta } = this;
    let differ = 0;
    for (let v = 0; v < n; v++) differ += a[v] ^ b[v];
    const flipB = 2 * differ > n ? 1 : 0;
    // comp[v]: −1 where the parents agree, else the component's number.
    for (let v = 0; v < n; v++) comp[v] = (a[v] ^ b[v] ^ flipB) === 1 ? -2 : -1;
    let count = 0;
    for (let s = 0; s < n; s++) {
      if (comp[s] !== -2) continue;
      const c = count++;
      let head = 0;
      let tail = 0;
      queue[tail++] = s;
      comp[s] = c;
      let d = 0;
      while (head < tail) {
        const u = queue[head++];
        const au = a[u];
        for (let i = offsets[u]; i < offsets[u + 1]; i++) {
          const x = neighbors[i];
          const cx = comp[x];
          if (cx === -1) {
            const w = weights === null ? 1 : weights[i];
            d += a[x] !== au ? -w : w;
          } else if (cx === -2) {
            comp[x] = c;
            queue[tail++] = x;
          }
        }
      }
      delta[c] = d;
    }
    let gain = 0;
    let taken = 0;
    if (child !== a) child.set(a);
    for (let c = 0; c < count; c++) {
      if (delta[c] > 0) {
        gain += delta[c];
        taken++;
      }
    }
    if (taken > 0) for (let v = 0; v < n; v++) if (comp[v] >= 0 && delta[comp[v]] > 0) child[v] = b[v] ^ flipB;
    this.components = count;
    this.taken = taken;
    return gain;
  }
}
