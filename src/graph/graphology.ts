// Interop with graphology, for users who already build graphs with it.
// Node keys map to 0..n-1 in graphology's iteration order; the key list is returned
// so results can be mapped back.

import { UndirectedGraph } from "graphology";
import type { AbstractGraph } from "graphology-types";
import { InputError } from "../errors.js";
import { buildGraph, type BuildOptions } from "./builder.js";
import type { Graph } from "./graph.js";

export interface FromGraphologyOptions extends BuildOptions {
  /** Edge attribute holding the weight; when omitted the graph is unweighted. */
  weightAttribute?: string;
}

export function fromGraphology(
  g: AbstractGraph,
  options: FromGraphologyOptions = {},
): { graph: Graph; keys: string[] } {
  if (g.type === "directed") throw new InputError("fromGraphology: directed graphs are not supported (max cut is defined on undirected graphs)");
  const keys = g.nodes();
  const index = new Map<string, number>();
  keys.forEach((k, i) => index.set(k, i));
  const us: number[] = [];
  const vs: number[] = [];
  const ws: number[] | null = options.weightAttribute === undefined ? null : [];
  const attr = options.weightAttribute;
  g.forEachEdge((edge, attrs, source, target) => {
    if (g.isDirected(edge)) throw new InputError(`fromGraphology: edge ${edge} is directed`);
    us.push(index.get(source)!);
    vs.push(index.get(target)!);
    if (ws !== null) ws.push(attrs[attr!] === undefined ? 1 : Number(attrs[attr!]));
  });
  const { graph } = buildGraph(keys.length, us, vs, ws, {
    ...options,
    describeEdge: (i) => `graphology edge ${JSON.stringify(keys[us[i]])}–${JSON.stringify(keys[vs[i]])}`,
  });
  return { graph, keys };
}

/** An undirected graphology graph with keys "0".."n-1" and, when weighted, a `weight` attribute. */
export function toGraphology(graph: Graph): UndirectedGraph {
  const out = new UndirectedGraph({ multi: false, allowSelfLoops: false });
  for (let v = 0; v < graph.n; v++) out.addNode(String(v));
  graph.forEachEdge((u, v, w) => {
    if (graph.weighted) out.addEdge(String(u), String(v), { weight: w });
    else out.addEdge(String(u), String(v));
  });
  return out;
}
