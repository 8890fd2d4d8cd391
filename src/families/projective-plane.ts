// Incidence graph of the Desarguesian projective plane PG(2, q): points 0..N−1 and lines N..2N−1
// (N = q²+q+1), point x on line L iff x·L = 0. Bipartite, (q+1)-regular, girth 6.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { checkPrimePower, finiteField } from "./finite-field.js";
import { bipartiteFreeOf } from "./free-of.js";
import { pg2Coordinates, pg2PointCount, pg2PolarLine } from "./pg2.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

function buildIncidence(q: number): Graph {
  const F = finiteField(q, "projective-plane");
  const N = pg2PointCount(q);
  const buf = new EdgeBuffer({ capacity: N * (q + 1) });
  const x = new Int32Array(3);
  const onLine = new Int32Array(q + 1);
  // Lines carry the same normalised coordinates as points; the points on line L are its polar line.
  for (let L = 0; L < N; L++) {
    pg2Coordinates(q, L, x);
    const len = pg2PolarLine(F, x[0], x[1], x[2], onLine);
    for (let j = 0; j < len; j++) buf.add(onLine[j], N + L);
  }
  return buf.build(2 * N).graph;
}

/** Points-versus-lines incidence graph of PG(2, q); PG(2,2) gives the Heawood graph. */
export function projectivePlane(q: number): Graph {
  const p = resolveTyped(projectivePlaneFamily, { q });
  return buildIncidence(p.q);
}

export const projectivePlaneFamily = defineFamily({
  name: "projective-plane",
  summary: "incidence graph of PG(2,q): points versus lines, bipartite and (q+1)-regular",
  params: [{ name: "q", type: "integer", description: "field order, a prime power", default: 3, min: 2, max: 1000 }],
  random: false,
  validate: (p) => {
    checkPrimePower("projective-plane", "q", p.q);
  },
  freeOf: () => [
    ...bipartiteFreeOf("points versus lines"),
    { pattern: "C4", citation: "girth 6: two points lie on exactly one line (axiom of projective planes)" },
  ],
  predictedSize: (p) => {
    const q = p.q;
    const N = q * q + q + 1;
    return { n: 2 * N, m: N * (q + 1), mExact: true, minDegree: q + 1, maxDegree: q + 1 };
  },
  build: (p) => buildIncidence(p.q),
});
