// Size guard shared by the registry, the typed builders and the operations: refuse, before
// allocating, a graph that would not fit in memory.

import { InputError } from "../errors.js";
import { MAX_VERTICES } from "../graph/builder.js";
import { checkMemory, graphBuildBytes } from "../limits/memory.js";

/**
 * Above this many edges building would need more than about 14 GB (two Int32 endpoint arrays,
 * the CSR arrays and the builder's scratch). Set so that ER_q fits for every prime power
 * q ≤ 1000 (ER_997 has 4.97·10^8 edges).
 */
export const MAX_FAMILY_EDGES = 520_000_000;
/** Above this many vertices per-vertex arrays alone would take GBs (the builder's own limit). */
export const MAX_FAMILY_VERTICES = MAX_VERTICES;

/** Refuse a graph of about `m` edges (and `n` vertices, when known) that would not fit in memory. */
export function checkEdgeLimit(owner: string, m: number, n = 0): void {
  if (m > MAX_FAMILY_EDGES) {
    throw new InputError(`${owner}: about ${m.toExponential(2)} edges would not fit in memory (limit ${MAX_FAMILY_EDGES.toExponential(0)})`);
  }
  if (n > MAX_FAMILY_VERTICES) {
    throw new InputError(`${owner}: about ${n.toExponential(2)} vertices would not fit in memory (limit ${MAX_FAMILY_VERTICES.toExponential(0)})`);
  }
  // Generators gather edges in a growing buffer (up to twice the edges) before the builder runs.
  checkMemory(graphBuildBytes(n, m, false) + 16 * m, owner);
}
