// The max-cut SDP relaxation written in SDPA sparse format (".dat-s"), for outside solvers.
// SDPA's primal is  min cᵀx  s.t.  Σ_i F_i x_i − F_0 ⪰ 0,  its dual  max ⟨F_0, Y⟩ s.t. ⟨F_i, Y⟩ = c_i, Y ⪰ 0.
// With F_0 = L/4, F_i = e_i e_iᵀ and c = 1 the dual is the Goemans–Williamson relaxation
// max ¼⟨L, Y⟩, diag Y = 1, and the primal is min Σx_i s.t. Diag(x) − L/4 ⪰ 0 (x = y/4 of our dual):
// both optimal values equal the SDP bound.

import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { weightedDegrees } from "../../linalg/operator.js";

export interface SdpaOptions {
  /** Text for the leading comment line (no newlines). */
  comment?: string;
}

/** Shortest decimal that reads back as the same double, so solvers see exactly our numbers. */
function num(x: number): string {
  return Object.is(x, -0) ? "0" : String(x);
}

/**
 * The relaxation of `graph` as an SDPA sparse file: n constraints, one n×n block. Entries are
 * `matrix block i j value` with 1-based i ≤ j; zero entries (isolated vertices, cancelled weights) are left out.
 */
export function toSdpa(graph: Graph, options: SdpaOptions = {}): string {
  const n = graph.n;
  if (n === 0) throw new InputError("toSdpa: the graph has no vertices; SDPA needs at least one constraint");
  const comment = options.comment ?? `max-cut SDP relaxation: n = ${n}, m = ${graph.m}; optimal value = Goemans-Williamson bound`;
  if (/[\r\n]/.test(comment)) throw new InputError("toSdpa: invalid `comment`: should be a single line");
  const d = weightedDegrees(graph);
  const out: string[] = [];
  // Lines starting with " or * are comments in SDPA files.
  out.push(`"${comment}`);
  out.push(`${n} = mDIM`);
  out.push("1 = nBLOCK");
  out.push(`${n} = bLOCKsTRUCT`);
  // The cost vector on one line: all ones (Σ x_i).
  out.push(new Array<string>(n).fill("1").join(" "));
  const { offsets, neighbors, weights } = graph;
  for (let i = 0; i < n; i++) {
    if (d[i] !== 0) out.push(`0 1 ${i + 1} ${i + 1} ${num(d[i] / 4)}`);
    for (let a = offsets[i]; a < offsets[i + 1]; a++) {
      const j = neighbors[a];
      if (j <= i) continue;
      const w = weights === null ? 1 : weights[a];
      if (w !== 0) out.push(`0 1 ${i + 1} ${j + 1} ${num(-w / 4)}`);
    }
  }
  for (let i = 0; i < n; i++) out.push(`${i + 1} 1 ${i + 1} ${i + 1} 1`);
  out.push("");
  return out.join("\n");
}
