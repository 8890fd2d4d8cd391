// Number of 4-cycles (C4 subgraphs, not necessarily induced) in O(m·√m), by pairing 2-paths
// below each cycle's top vertex in (degree, id) order (Chiba & Nishizeki 1985).

import type { Graph } from "../graph.js";
import { int32Pool } from "../scratch.js";
import { firstAbove, scratchDegreeRanking } from "./orientation.js";

const pathsPool = int32Pool(), middlePool = int32Pool(), touchedPool = int32Pool();

export interface FourCycleCount {
  /** Number of 4-cycles. */
  total: number;
  /** One 4-cycle [a, b, c, d] (a~b~c~d~a) when total > 0, else null. */
  witness: number[] | null;
}

/**
 * Each 4-cycle is counted once, from its vertex u of largest (degree, id), by pairing the
 * 2-paths u–v–w that stay below u in that order. Counts are doubles: exact below 2^53.
 */
export function countFourCycles(g: Graph): FourCycleCount {
  return scanFourCycles(g, false);
}

/**
 * The one 4-cycle scan, shared by counting and by `findCycle(g, 4)`. With `stopAtFirst`
 * it returns as soon as a witness exists (total is then only a lower bound, ≥ 1).
 */
export function scanFourCycles(g: Graph, stopAtFirst: boolean): FourCycleCount {
  const { n } = g;
  const { offsets: off, neighbors: nb, vertexOf } = scratchDegreeRanking(g); // scratch: read only until this returns
  const paths = pathsPool.take(n).fill(0); // paths[w] = 2-paths u–·–w found so far for the current u
  const firstMiddle = middlePool.take(n); // written before read; the middle vertex of the first such path (for the witness)
  const touched = touchedPool.take(n); // written before read
  let total = 0;
  let witness: number[] | null = null;
  for (let u = 0; u < n; u++) {
    let nt = 0;
    const below = firstAbove(nb, off[u], off[u + 1], u);
    for (let i = off[u]; i < below; i++) {
      const v = nb[i];
      const vEnd = off[v + 1];
      for (let j = off[v]; j < vEnd; j++) {
        const w = nb[j];
        if (w >= u) break; // lists are sorted by rank
        const c = paths[w];
        if (c === 0) {
          touched[nt++] = w;
          firstMiddle[w] = v;
        } else {
          total += c;
          if (witness === null) {
            witness = [vertexOf[u], vertexOf[firstMiddle[w]], vertexOf[w], vertexOf[v]];
            if (stopAtFirst) return { total, witness };
          }
        }
        paths[w] = c + 1;
      }
    }
    for (let t = 0; t < nt; t++) paths[touched[t]] = 0;
  }
  return { total, witness };
}
