// The eigenvalue bound max cut ≤ n·λmax(L)/4: the dual certificate with y = 0, its shift an
// upper estimate of λmax(L) established like every other shift (src/cut/certificate.ts).

import type { Graph } from "../../graph/graph.js";
import { certifyDual, type CertifyOptions } from "./certificate.js";
import type { UpperBoundRecord } from "../types.js";

/** n·λ̄/4 with λ̄ ≥ λmax(L) (proved by Cholesky for n ≤ denseLimit, else a Lanczos estimate; see shiftProof). */
export function eigenvalueUpperBound(graph: Graph, options: Omit<CertifyOptions, "name"> = {}): UpperBoundRecord {
  return certifyDual(graph, new Float64Array(graph.n), { ...options, name: "eigenvalue" });
}
