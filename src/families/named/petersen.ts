// The Petersen graph GP(5,2) ≅ KG(5,2): 10 vertices, 3-regular, girth 5, srg(10,3,0,1).
// The dodecahedron GP(10,2) sits beside it: 20 vertices, 3-regular, girth 5.

import type { Graph } from "../../graph/graph.js";
import { girthFreeOf } from "../free-of.js";
import { buildGeneralizedPetersen } from "../generalized-petersen.js";
import { namedFamily } from "./define.js";

export function petersen(): Graph {
  return buildGeneralizedPetersen(5, 2);
}

export function dodecahedron(): Graph {
  return buildGeneralizedPetersen(10, 2);
}

export const petersenFamily = namedFamily({
  name: "petersen",
  summary: "Petersen graph: GP(5,2), also the Kneser graph KG(5,2)",
  n: 10,
  m: 15,
  minDegree: 3,
  maxDegree: 3,
  freeOf: girthFreeOf(5, "Petersen graph (Holton–Sheehan, The Petersen Graph, 1993)"),
  notes: ["Strongly regular srg(10,3,0,1); chromatic number 3."],
  build: petersen,
});

export const dodecahedronFamily = namedFamily({
  name: "dodecahedron",
  summary: "skeleton of the regular dodecahedron, GP(10,2)",
  n: 20,
  m: 30,
  minDegree: 3,
  maxDegree: 3,
  freeOf: girthFreeOf(5, "every face of the dodecahedron is a pentagon (common knowledge, no source; checked in the tests)"),
  build: dodecahedron,
});
