// The Higman–Sims graph from the Steiner system S(3,6,22) (Higman–Sims 1968): a point ∞, the 22
// points and the 77 hexads; ∞ ~ points, point ~ hexads through it, hexads ~ disjoint hexads. srg(100,22,0,6).

import { EdgeBuffer } from "../../graph/builder.js";
import type { Graph } from "../../graph/graph.js";
import { namedFamily } from "./define.js";
import { extendedGolayCodewords } from "./golay.js";
import { popcount } from "../../graph/bits.js";

/** The 77 hexads of S(3,6,22) on points 0..21: octads of the Golay code through coordinates 22 and 23, with both removed. */
export function steinerHexads(): number[] {
  const both = (1 << 22) | (1 << 23);
  const out: number[] = [];
  for (const w of extendedGolayCodewords()) {
    if (popcount(w) === 8 && (w & both) === both) out.push(w & ~both);
  }
  return out.sort((a, b) => a - b);
}

export function higmanSims(): Graph {
  const hexads = steinerHexads();
  const buf = new EdgeBuffer({ capacity: 1100 });
  const H = (i: number) => 23 + i; // vertex 0 = ∞, 1..22 = points, 23.. = hexads
  for (let x = 0; x < 22; x++) buf.add(0, 1 + x);
  for (let i = 0; i < hexads.length; i++) {
    for (let x = 0; x < 22; x++) if ((hexads[i] >>> x) & 1) buf.add(1 + x, H(i));
    for (let j = i + 1; j < hexads.length; j++) if ((hexads[i] & hexads[j]) === 0) buf.add(H(i), H(j));
  }
  return buf.build(23 + hexads.length).graph;
}

export const higmanSimsFamily = namedFamily({
  name: "higman-sims",
  summary: "Higman–Sims graph: ∞, the points and the hexads of the Steiner system S(3,6,22)",
  n: 100,
  m: 1100,
  minDegree: 22,
  maxDegree: 22,
  freeOf: [{ pattern: "K3", citation: "srg(100,22,0,6): λ = 0 (Higman–Sims 1968)" }],
  build: higmanSims,
});
