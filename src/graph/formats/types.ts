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
  file: string;
  /** Position in the stream, counted from 1 like lines (always 1 for whole-file formats). */
  position: number;
  /** 1-based line the graph starts on (1 for whole-file formats). */
  line: number;
  format: GraphFormat;
  report: BuildReport;
}

/** Where a piece of text came from, for error messages. */
export interface Where {
  /** File name; "input" when omitted. */
  file?: string;
  line?: number;
}

/** Options of the whole-file text parsers. */
export interface TextParseOptions {
  /** File name used in messages; "input" when omitted. */
  file?: string;
  build?: BuildOptions;
}

/** The name messages use for text that came with no file name. */
export const DEFAULT_FILE_NAME = "input";
