// The Chvátal graph (Chvátal 1970): 12 vertices, 4-regular, triangle-free, chromatic number 4.
// Given as an edge list; the tests verify it against networkx's copy (canonical form) and its invariants.

import { graphFromEdges } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { namedFamily } from "./define.js";

const EDGES: ReadonlyArray<readonly [number, number]> = [
  [0, 1], [0, 4], [0, 6], [0, 9], [1, 2], [1, 5], [1, 7], [2, 3], [2, 6], [2, 8], [3, 4], [3, 7],
  [3, 9], [4, 5], [4, 8], [5, 10], [5, 11], [6, 10], [6, 11], [7, 8], [7, 11], [8, 10], [9, 10], [9, 11],
];

export function chvatal(): Graph {
  return graphFromEdges(12, EDGES);
}

export const chvatalFamily = namedFamily({
  name: "chvatal",
  summary: "Chvátal graph: smallest triangle-free 4-regular 4-chromatic graph",
  n: 12,
  m: 24,
  minDegree: 4,
  maxDegree: 4,
  freeOf: [{ pattern: "K3", citation: "Chvátal 1970 (a 4-regular triangle-free 4-chromatic graph)" }],
  build: chvatal,
});
