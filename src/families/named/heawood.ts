// The Heawood graph: incidence graph of the Fano plane PG(2,2); 14 vertices, 3-regular, girth 6.

import type { Graph } from "../../graph/graph.js";
import { bipartiteFreeOf } from "../free-of.js";
import { projectivePlane } from "../projective-plane.js";
import { namedFamily } from "./define.js";

export function heawood(): Graph {
  return projectivePlane(2);
}

export const heawoodFamily = namedFamily({
  name: "heawood",
  summary: "Heawood graph: points versus lines of the Fano plane",
  n: 14,
  m: 21,
  minDegree: 3,
  maxDegree: 3,
  freeOf: [
    ...bipartiteFreeOf("points versus lines"),
    { pattern: "C4", citation: "girth 6: two points of the Fano plane lie on one line (Heawood 1890; the (3,6)-cage)" },
  ],
  build: heawood,
});
