// A graph written into a record, so the record stands alone: graph6 or sparse6 (whichever is
// shorter) for unweighted graphs, an edge list for weighted ones; and read back for `verify`.
// Policy: a graph whose source cannot be read again (standard input, or no source at all) is
// always embedded; any other graph is embedded when its text fits in EMBED_MAX_CHARS.

import { InputError } from "../../errors.js";
import type { Graph } from "../graph.js";
import { parseEdgeList, writeEdgeList } from "../formats/edgelist.js";
import { encodeGraph6, parseGraph6 } from "../formats/graph6.js";
import { encodeGraphSize } from "../formats/graph-size.js";
import { encodeSparse6, parseSparse6, sparse6Width } from "../formats/sparse6.js";
import { canReread, type EmbeddedFormat, type EmbeddedGraph, type GraphSource } from "./source.js";

/**
 * Largest embedded text for a graph that could also be rebuilt from its spec or file: 16 KiB
 * holds graph6 up to about 440 vertices and sparse6 up to a few thousand edges, so small graphs
 * travel with their records while large ones (G-set, big family members) are named, not copied.
 */
export const EMBED_MAX_CHARS = 16384;

const EMBEDDED_FORMATS: readonly EmbeddedFormat[] = ["graph6", "sparse6", "edgelist"];

/** The graph as text in the most compact format that holds it, or null when longer than `maxChars`. */
export function embedGraph(graph: Graph, maxChars = Infinity): EmbeddedGraph | null {
  if (graph.weighted) {
    // Edge-list lines are at least 6 characters ("0 1 2\n"): skip the writing when that is already too long.
    if (6 * graph.m > maxChars) return null;
    const text = writeEdgeList(graph);
    return text.length <= maxChars ? { format: "edgelist", text } : null;
  }
  const n = graph.n;
  const graph6Length = encodeGraphSize(n).length + Math.ceil((n * (n - 1)) / 12);
  // sparse6 spends at least 1 + k bits per edge (k = bits of n − 1).
  const sparse6AtLeast = 1 + encodeGraphSize(n).length + Math.ceil((graph.m * (sparse6Width(n) + 1)) / 6);
  if (Math.min(graph6Length, sparse6AtLeast) > maxChars) return null;
  const sparse = sparse6AtLeast < graph6Length ? encodeSparse6(graph) : null;
  if (sparse !== null && sparse.length < graph6Length) return sparse.length <= maxChars ? { format: "sparse6", text: sparse } : null;
  return graph6Length <= maxChars ? { format: "graph6", text: encodeGraph6(graph) } : null;
}

/** The source with the graph embedded where the policy above asks for it (an existing copy is kept). */
export function withEmbeddedGraph(graph: Graph, source: GraphSource): GraphSource {
  if (source.embedded !== undefined) return source;
  const embedded = embedGraph(graph, canReread(source) ? EMBED_MAX_CHARS : Infinity);
  return embedded === null ? source : { ...source, embedded };
}

/** Rebuild an embedded graph; malformed text is bad input naming `where`. */
export function readEmbeddedGraph(e: EmbeddedGraph, where: string): Graph {
  if (typeof e !== "object" || e === null || typeof e.text !== "string" || !EMBEDDED_FORMATS.includes(e.format)) {
    throw new InputError(`${where}: \`source.embedded\` should be {format: ${EMBEDDED_FORMATS.join(" | ")}, text}`);
  }
  const place = { file: `${where} (embedded ${e.format})` };
  switch (e.format) {
    case "graph6":
      return parseGraph6(e.text, place);
    case "sparse6":
      return parseSparse6(e.text, place);
    case "edgelist":
      return parseEdgeList(e.text, place).graph;
  }
}
