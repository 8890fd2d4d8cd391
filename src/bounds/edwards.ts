// Edwards' lower bounds on the max cut of an unweighted graph: m/2 + (√(8m+1) − 1)/8 for every
// graph (Edwards 1973), and m/2 + (n − c)/4 for a graph with c components (Edwards 1975's
// (n−1)/4 for connected graphs, summed over the components).

import type { Graph } from "../graph/graph.js";
import { connectedComponents } from "../graph/structure/components.js";
import { boundApplies, boundDoesNotApply, type LowerBoundRecord } from "./types.js";

export function edwardsEdgeBound(graph: Graph): LowerBoundRecord {
  const name = "edwards-edges";
  if (graph.weighted) return boundDoesNotApply(name, "proved for unweighted graphs only");
  const surplus = (Math.sqrt(8 * graph.m + 1) - 1) / 8;
  return boundApplies(name, graph.m, surplus, "Edwards (1973): every graph has maxcut ≥ m/2 + (√(8m+1) − 1)/8; tight exactly for complete graphs of odd order");
}

export function edwardsVertexBound(graph: Graph): LowerBoundRecord {
  const name = "edwards-vertices";
  if (graph.weighted) return boundDoesNotApply(name, "proved for unweighted graphs only");
  const c = connectedComponents(graph).count;
  const reason =
    c <= 1
      ? "Edwards (1975): a connected graph has maxcut ≥ m/2 + (n−1)/4"
      : `Edwards (1975) per component: (n_c − 1)/4 summed over the ${c} components gives maxcut ≥ m/2 + (n − c)/4`;
  return boundApplies(name, graph.m, (graph.n - c) / 4, reason);
}
