// The summary record behind `halfplus graph --json`: size, degrees, degeneracy, triangle and
// 4-cycle counts, girth, bipartiteness, components, and which of K3, K4, C4, C5 are absent.

import { invalidParameter } from "../../errors.js";
import type { Graph } from "../graph.js";
import { bipartition } from "./bipartite.js";
import { findClique } from "./cliques.js";
import { connectedComponents } from "./components.js";
import { findCycle } from "./cycles.js";
import { sharedDegeneracy } from "./degeneracy.js";
import { degreeStats } from "./degrees.js";
import { countFourCycles } from "./four-cycles.js";
import { girth } from "./girth.js";
import { sharedTriangleCount } from "./triangles.js";

/** The pieces that can be expensive on huge graphs and may be skipped. */
export const DESCRIBE_PIECES = ["triangles", "fourCycles", "girth", "K4", "C5"] as const;
export type DescribePiece = (typeof DESCRIBE_PIECES)[number];

export interface DescribeOptions {
  /** Pieces not to compute; their fields become null unless a cheap fact settles them. */
  skip?: readonly DescribePiece[];
  /** Node budget for each of the K4 and C5 searches (default: unlimited); an unfinished search gives null. */
  maxSearchNodes?: number;
}

export interface GraphSummary {
  n: number;
  m: number;
  totalWeight: number;
  weighted: boolean;
  minDegree: number;
  maxDegree: number;
  avgDegree: number;
  degeneracy: number;
  /** null: skipped. */
  triangles: number | null;
  /** null: skipped. */
  fourCycles: number | null;
  /** Length of a shortest cycle; null for a forest, or when skipped (then "girth" is listed in `unknown`). */
  girth: number | null;
  bipartite: boolean;
  components: number;
  /** true: the graph has no such subgraph (not necessarily induced); null: not decided (see `unknown`). */
  free: { K3: boolean | null; K4: boolean | null; C4: boolean | null; C5: boolean | null };
  /** A copy of each pattern that is present (vertex lists), null when absent or unknown. */
  witnesses: { K3: number[] | null; K4: number[] | null; C4: number[] | null; C5: number[] | null };
  /** Fields left null because they were skipped or a search ran out of budget. */
  unknown: string[];
}

/** Each quantity is computed once; cheap facts (bipartite, degeneracy, girth) settle the rest where they can. */
export function describeGraph(g: Graph, options: DescribeOptions = {}): GraphSummary {
  const skip = new Set<string>(options.skip ?? []);
  for (const s of skip) {
    if (!(DESCRIBE_PIECES as readonly string[]).includes(s)) {
      throw invalidParameter("describeGraph", "skip", `should list pieces among ${DESCRIBE_PIECES.join(", ")}`, s);
    }
  }
  const budget = { maxNodes: options.maxSearchNodes ?? Infinity };
  const unknown: string[] = [];
  const deg = degreeStats(g);
  const comps = connectedComponents(g);
  const bip = bipartition(g);
  const dg = sharedDegeneracy(g);
  const bipartite = bip.bipartite;

  const tri = skip.has("triangles") ? null : sharedTriangleCount(g);
  const c4 = skip.has("fourCycles") ? null : countFourCycles(g);
  const gi = skip.has("girth") ? null : girth(g);
  if (tri === null) unknown.push("triangles");
  if (c4 === null) unknown.push("fourCycles");
  if (gi === null) unknown.push("girth");
  const girthValue = gi === null ? null : gi.girth;
  const shortest = gi === null ? null : gi.cycle;
  // With the girth known: a forest has no cycles, C_k is absent for k < girth and present for k = girth.
  const girthSays = (k: number): boolean | null => (gi === null ? null : girthValue === null || girthValue > k ? true : girthValue === k ? false : null);

  const witnesses: GraphSummary["witnesses"] = { K3: null, K4: null, C4: null, C5: null };
  let K3: boolean | null;
  if (tri !== null) {
    K3 = tri.total === 0;
    witnesses.K3 = tri.witness === null ? null : tri.witness.slice(); // the shared count stays unchanged
  } else if (bipartite || dg.degeneracy < 2) K3 = true;
  else {
    K3 = girthSays(3);
    if (K3 === false) witnesses.K3 = shortest;
  }

  let C4: boolean | null;
  if (c4 !== null) {
    C4 = c4.total === 0;
    witnesses.C4 = c4.witness;
  } else {
    C4 = girthSays(4);
    if (C4 === false) witnesses.C4 = shortest;
  }

  let K4: boolean | null;
  if (K3 === true || dg.degeneracy < 3) K4 = true;
  else if (skip.has("K4")) K4 = null;
  else {
    const r = findClique(g, 4, budget);
    K4 = r.exhaustive ? !r.found : null;
    witnesses.K4 = r.witness;
  }

  let C5: boolean | null = bipartite ? true : girthSays(5);
  if (C5 === false) witnesses.C5 = shortest;
  else if (C5 === null && !skip.has("C5")) {
    const r = findCycle(g, 5, budget);
    C5 = r.exhaustive ? !r.found : null;
    witnesses.C5 = r.witness;
  }
  if (K4 === null) unknown.push("free.K4");
  if (C5 === null) unknown.push("free.C5");
  if (K3 === null) unknown.push("free.K3");
  if (C4 === null) unknown.push("free.C4");

  return {
    n: g.n,
    m: g.m,
    totalWeight: g.totalWeight,
    weighted: g.weighted,
    minDegree: deg.min,
    maxDegree: deg.max,
    avgDegree: deg.mean,
    degeneracy: dg.degeneracy,
    triangles: tri === null ? null : tri.total,
    fourCycles: c4 === null ? null : c4.total,
    girth: girthValue,
    bipartite,
    components: comps.count,
    free: { K3, K4, C4, C5 },
    witnesses,
    unknown,
  };
}
