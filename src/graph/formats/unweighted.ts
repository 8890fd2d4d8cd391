// Guard for writers of formats without weights (graph6, sparse6, DIMACS edge format):
// a weighted graph would lose its weights, so it is refused rather than written.

import { InputError } from "../../errors.js";
import type { Graph } from "../graph.js";

export function assertUnitWeights(g: Graph, format: string): void {
  const w = g.weights;
  if (w === null) return;
  for (let i = 0; i < w.length; i++) {
    if (w[i] !== 1) {
      throw new InputError(`${format} cannot store edge weights (found weight ${w[i]}); write gset or an edge list instead`);
    }
  }
}
