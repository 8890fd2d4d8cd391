// Erdős–Rényi orthogonal-polarity graph ER_q: the points of PG(2, q), x ~ y iff x·y = 0 (x ≠ y).
// The q+1 absolute points (x·x = 0) would carry loops; the simple graph drops them and reports them separately.

import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { checkPrimePower, finiteField } from "./finite-field.js";
import { pg2Coordinates, pg2PointCount, pg2PolarLine } from "./pg2.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily } from "./types.js";

export interface PolarityGraph {
  q: number;
  /** The simple graph (absolute points keep their other q neighbours, no loop). */
  graph: Graph;
  /** The q+1 absolute points, ascending: where the adjacency matrix with loops has a 1 on the diagonal. */
  absolutePoints: Int32Array;
}

function buildPolarity(q: number): PolarityGraph {
  const F = finiteField(q, "polarity");
  const n = pg2PointCount(q);
  const buf = new EdgeBuffer({ capacity: (q * (q + 1) * (q + 1)) / 2 });
  const x = new Int32Array(3);
  const line = new Int32Array(q + 1);
  const absolute = new Int32Array(q + 1);
  let a = 0;
  for (let i = 0; i < n; i++) {
    pg2Coordinates(q, i, x);
    const len = pg2PolarLine(F, x[0], x[1], x[2], line);
    for (let j = 0; j < len; j++) {
      const y = line[j];
      if (y > i) buf.add(i, y); // each edge is met from both ends; keep it once
      else if (y === i) absolute[a++] = i;
    }
  }
  return { q, graph: buf.build(n).graph, absolutePoints: a === q + 1 ? absolute : absolute.slice(0, a) };
}

/** ER_q with its absolute points (a typed call validated like the spec `polarity:q=…`). */
export function polarityWithAbsolutePoints(q: number): PolarityGraph {
  const p = resolveTyped(polarityFamily, { q, loops: "drop" });
  return buildPolarity(p.q);
}

/** ER_q as a simple graph (loops at the absolute points dropped). */
export function polarity(q: number): Graph {
  return polarityWithAbsolutePoints(q).graph;
}

export const polarityFamily = defineFamily({
  name: "polarity",
  summary: "Erdős–Rényi orthogonal-polarity graph ER_q on the points of PG(2,q), x ~ y iff x·y = 0",
  params: [
    { name: "q", type: "integer", description: "field order, a prime power", default: 5, min: 2, max: 1000 },
    {
      name: "loops",
      type: "string",
      description: "loops at the q+1 absolute points: drop them silently from the simple graph, or drop and report which points they were",
      default: "drop",
      choices: ["drop", "report"],
    },
  ],
  random: false,
  validate: (p) => {
    checkPrimePower("polarity", "q", p.q);
  },
  freeOf: () => [{ pattern: "C4", citation: "two points have one common neighbour at most: Erdős–Rényi 1962; Brown 1966" }],
  predictedSize: (p) => {
    const q = p.q;
    return { n: q * q + q + 1, m: (q * (q + 1) * (q + 1)) / 2, mExact: true, minDegree: q, maxDegree: q + 1 };
  },
  build: (p, ctx) => {
    const r = buildPolarity(p.q);
    if (p.loops === "report") {
      ctx.note(`${r.absolutePoints.length} absolute points (loops dropped): ${Array.from(r.absolutePoints).join(" ")}`);
    }
    return r.graph;
  },
  notes: ["q+1 absolute points have degree q (their loop is dropped), the rest q+1; with loops the adjacency spectrum is q+1 once and ±√q."],
});
