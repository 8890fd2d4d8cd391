// Shared vocabulary of the graph file readers and writers: the format names, read options,
// what a reader hands back per graph, and how a place in a file is written in messages.

import type { BuildOptions, BuildReport } from "../builder.js";
import type { Graph } from "../graph.js";

export type GraphFormat = "graph6" | "sparse6" | "edgelist" | "gset" | "dimacs";

export const GRAPH_FORMATS: readonly GraphFormat[] = ["graph6", "sparse6", "edgelist", "gset", "dimacs"];

export interface ReadOptions {
  /** Skip detection and read this format (graph6 and sparse6 streams accept both kinds of line). */
  format?: GraphFormat;
  /** Vertex numbering of edge lists (other formats fix their own numbering). */
  base?: 0 | 1;
  /** Loops/duplicates policy handed to the builder; `describeEdge` is supplied by the reader. */
  build?: BuildOptions;
}

export interface LoadedGraph {
  graph: Graph;
  /** File name as given, or the stream's name ("stdin"). */
  source: string;
  /** 0-based position in the stream (always 0 for whole-file formats). */
  index: number;
  /** 1-based line the graph starts on (1 for whole-file formats). */
  line: number;
  format: GraphFormat;
  report: BuildReport;
}

/** Where a piece of text came from, for error messages. */
export interface Where {
  source?: string;
  line?: number;
}

/** Options of the whole-file text parsers. */
export interface TextParseOptions {
  /** File name used in messages; "input" when omitted. */
  source?: string;
  build?: BuildOptions;
}

export const DEFAULT_SOURCE = "input";
