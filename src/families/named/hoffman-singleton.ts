// The Hoffman–Singleton graph by Robertson's pentagons and pentagrams: P_h,j ~ P_h,j±1,
// Q_i,j ~ Q_i,j±2, P_h,j ~ Q_i,hi+j (indices mod 5). srg(50,7,0,1), the Moore graph of degree 7.

import { EdgeBuffer } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { girthFreeOf } from "../free-of.js";
import { namedFamily } from "./define.js";

export function hoffmanSingleton(): Graph {
  const P = (h: number, j: number) => 5 * h + (j % 5);
  const Q = (i: number, j: number) => 25 + 5 * i + (j % 5);
  const buf = new EdgeBuffer({ capacity: 175 });
  for (let a = 0; a < 5; a++) {
    for (let j = 0; j < 5; j++) {
      buf.add(P(a, j), P(a, j + 1));
      buf.add(Q(a, j), Q(a, j + 2));
      for (let i = 0; i < 5; i++) buf.add(P(a, j), Q(i, a * i + j));
    }
  }
  return buf.build(50).graph;
}

export const hoffmanSingletonFamily = namedFamily({
  name: "hoffman-singleton",
  summary: "Hoffman–Singleton graph: the Moore graph of degree 7 and girth 5",
  n: 50,
  m: 175,
  minDegree: 7,
  maxDegree: 7,
  freeOf: girthFreeOf(5, "srg(50,7,0,1), a Moore graph (Hoffman–Singleton 1960)"),
  build: hoffmanSingleton,
});
