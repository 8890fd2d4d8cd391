// The Grötzsch graph μ(C5) = mycielski-chain:steps=2: 11 vertices, 20 edges, triangle-free, chromatic number 4.

import type { Graph } from "../../graph/graph.js";
import { mycielskiChain } from "../mycielski.js";
import { namedFamily } from "./define.js";

export function grotzsch(): Graph {
  return mycielskiChain(2);
}

export const grotzschFamily = namedFamily({
  name: "grotzsch",
  summary: "Grötzsch graph: the Mycielskian of C5, smallest triangle-free 4-chromatic graph",
  n: 11,
  m: 20,
  minDegree: 3,
  maxDegree: 5,
  freeOf: [{ pattern: "K3", citation: "Mycielski 1955; smallest triangle-free 4-chromatic graph (Chvátal 1974)" }],
  build: grotzsch,
});
