// Small reference graphs for the suites, built straight from edge lists so that they do not
// depend on src/families (constructions are textbook definitions, from memory), and seeded G(n, p).
import { buildGraph, graphFromEdges } from "../../src/graph/builder.js";
import type { Graph } from "../../src/graph/graph.js";
import { Rng } from "../../src/random/prng.js";

/** The cycle C_n: edges {i, i+1 mod n}. */
export function cycle(n: number): Graph {
  return graphFromEdges(n, Array.from({ length: n }, (_, i) => [i, (i + 1) % n] as [number, number]));
}

/** The complete graph K_n. */
export function complete(n: number): Graph {
  const e: [number, number][] = [];
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) e.push([u, v]);
  return graphFromEdges(n, e);
}

/** Petersen graph: outer 5-cycle 0..4, spokes i–(i+5), inner pentagram on 5..9. */
export function petersen(): Graph {
  const e: [number, number][] = [];
  for (let i = 0; i < 5; i++) e.push([i, (i + 1) % 5], [i, i + 5], [5 + i, 5 + ((i + 2) % 5)]);
  return graphFromEdges(10, e);
}

/** The d-dimensional hypercube Q_d: vertices 0..2^d−1, adjacent when they differ in one bit. */
export function hypercube(d: number): Graph {
  const e: [number, number][] = [];
  for (let v = 0; v < 1 << d; v++) for (let b = 0; b < d; b++) if ((v ^ (1 << b)) > v) e.push([v, v ^ (1 << b)]);
  return graphFromEdges(1 << d, e);
}

export interface RandomGraphOptions {
  /** Weight of each kept edge, drawn right after its coin; absent → unweighted graph. */
  weight?: (rng: Rng) => number;
  /**
   * Order in which the pairs are visited (and coins drawn): "rows" (default) u < v with u outer,
   * "columns" u < v with v outer.
   */
  order?: "rows" | "columns";
}

const rngOf = (rng: Rng | number): Rng => (typeof rng === "number" ? new Rng(rng) : rng);

/** Visits each pair u < v in the given order, drawing one coin each; `keep` sees the kept pairs. */
function drawPairs(n: number, p: number, r: Rng, order: "rows" | "columns", keep: (u: number, v: number) => void): void {
  if (order === "rows") {
    for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) if (r.nextFloat() < p) keep(u, v);
  } else {
    for (let v = 1; v < n; v++) for (let u = 0; u < v; u++) if (r.nextFloat() < p) keep(u, v);
  }
}

/** Seeded G(n, p) edge list (unweighted pairs): each pair {u, v}, u < v, kept when rng.nextFloat() < p. */
export function randomEdges(n: number, p: number, rng: Rng | number, options: Pick<RandomGraphOptions, "order"> = {}): [number, number][] {
  const e: [number, number][] = [];
  drawPairs(n, p, rngOf(rng), options.order ?? "rows", (u, v) => e.push([u, v]));
  return e;
}

/** Seeded G(n, p) as a Graph; weighted exactly when options.weight is given (even with no edges). */
export function randomGraph(n: number, p: number, rng: Rng | number, options: RandomGraphOptions = {}): Graph {
  const r = rngOf(rng);
  const { weight } = options;
  const us: number[] = [], vs: number[] = [], ws: number[] = [];
  drawPairs(n, p, r, options.order ?? "rows", (u, v) => {
    us.push(u);
    vs.push(v);
    ws.push(weight ? weight(r) : 1);
  });
  return buildGraph(n, us, vs, weight ? ws : null).graph;
}

/** Seeded random bipartite graph on parts {0..a−1}, {a..a+b−1}: each cross pair kept with probability p. */
export function randomBipartite(a: number, b: number, p: number, rng: Rng | number): Graph {
  const r = rngOf(rng);
  const e: [number, number][] = [];
  for (let u = 0; u < a; u++) for (let v = a; v < a + b; v++) if (r.nextFloat() < p) e.push([u, v]);
  return graphFromEdges(a + b, e);
}

/** Edges as "u-v" strings in the graph's own (CSR) order. */
export function edgeStrings(g: Graph): string[] {
  const { us, vs } = g.edgeArrays();
  return Array.from(us, (u, i) => `${u}-${vs[i]}`);
}
