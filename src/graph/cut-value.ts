// The one place a cut's value and its surplus are computed. Every solver's claim, `verify`, the
// closed-form bounds and the tests go through here, so nothing can report a value its partition
// does not have.

import { InputError } from "../errors.js";
import type { Graph } from "./graph.js";

/** A side (0 or 1) for each vertex. */
export type Partition = Uint8Array;

export function checkPartition(graph: Graph, partition: ArrayLike<number>, owner = "partition"): void {
  if (partition.length !== graph.n) {
    throw new InputError(`${owner}: has ${partition.length} entries but the graph has ${graph.n} vertices`);
  }
  for (let i = 0; i < partition.length; i++) {
    const s = partition[i];
    if (s !== 0 && s !== 1) throw new InputError(`${owner}: entry ${i} is ${s}, expected 0 or 1`);
  }
}

/** Total weight of edges whose endpoints lie on different sides. */
export function cutValue(graph: Graph, partition: ArrayLike<number>): number {
  checkPartition(graph, partition);
  const { offsets, neighbors, weights } = graph;
  let cut = 0;
  for (let u = 0; u < graph.n; u++) {
    const su = partition[u];
    for (let i = offsets[u]; i < offsets[u + 1]; i++) {
      const v = neighbors[i];
      if (v > u && partition[v] !== su) cut += weights === null ? 1 : weights[i];
    }
  }
  return cut;
}

/** surplus = cut − W/2, the excess over a uniformly random cut (W = total weight). */
export function surplusOf(graph: Graph, cut: number): number {
  return cut - graph.totalWeight / 2;
}

/**
 * An upper bound on the max cut of a graph with exact integer weights, rounded down to the integer
 * below: every cut value is then an integer. The bound must be proven as computed (every bound in
 * halfplus is rounded up past its own rounding), so the plain floor is sound; a tolerance here
 * would let a bound a hair below an integer round up past a cut it does not prove. Callers decide
 * integrality (`hasIntegerWeights`).
 */
export function floorCutBound(bound: number): number {
  return Math.floor(bound);
}
