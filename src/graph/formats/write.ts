// One entry point for writers: the text of a graph in any supported format, ending in "\n"
// (graph6/sparse6: one line, so outputs concatenate into a stream).

import type { Graph } from "../graph.js";
import { writeDimacs } from "./dimacs.js";
import { writeEdgeList } from "./edgelist.js";
import { encodeGraph6 } from "./graph6.js";
import { writeGset } from "./gset.js";
import { encodeSparse6 } from "./sparse6.js";
import type { GraphFormat } from "./types.js";

export function writeGraph(g: Graph, format: GraphFormat): string {
  switch (format) {
    case "graph6":
      return encodeGraph6(g) + "\n";
    case "sparse6":
      return encodeSparse6(g) + "\n";
    case "edgelist":
      return writeEdgeList(g);
    case "gset":
      return writeGset(g);
    case "dimacs":
      return writeDimacs(g);
  }
}
