// The (5-regular) Clebsch graph, the folded 5-cube: Cayley graph of GF(2)^4 with the four unit vectors
// and the all-ones vector. srg(16,5,0,2), so triangle-free.

import type { Graph } from "../../graph/graph.js";
import { buildCayleyGf2 } from "../cayley-gf2.js";
import { namedFamily } from "./define.js";

export function clebsch(): Graph {
  return buildCayleyGf2(4, [1, 2, 4, 8, 15]);
}

export const clebschFamily = namedFamily({
  name: "clebsch",
  summary: "Clebsch graph (5-regular, 16 vertices): the folded 5-cube",
  n: 16,
  m: 40,
  minDegree: 5,
  maxDegree: 5,
  freeOf: [{ pattern: "K3", citation: "srg(16,5,0,2): λ = 0 (Brouwer's table of strongly regular graphs)" }],
  notes: ["Neighbourhood of a vertex is independent; non-neighbourhood is the Petersen graph."],
  build: clebsch,
});
