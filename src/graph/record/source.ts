// Where a graph came from, precisely enough to rebuild it: the `source` every result record
// carries. A plain description at the bottom of the layers, so solvers copy it without knowing how
// a source is opened (that is src/sources/) and anyone holding a record can find its graph again.

import type { GraphFormat } from "../formats/types.js";

/** Formats a graph may be embedded in: the compact nauty formats, or an edge list for weights. */
export type EmbeddedFormat = "graph6" | "sparse6" | "edgelist";

/** The graph itself, as text, inside a record. */
export interface EmbeddedGraph {
  format: EmbeddedFormat;
  text: string;
}

/** Where a graph came from. Every field is optional: a record says what it knows. */
export interface GraphSource {
  /** Canonical family spec (every parameter written out, `seed=` included for random families). */
  spec?: string;
  /** Seed of a random family's graph (the spec's `seed=`); null for deterministic families and files. */
  graphSeed?: number | null;
  /** File the graph was read from; "-" for standard input. */
  path?: string;
  /** Position of the graph in its file or stream, counted from 1 like line numbers. */
  position?: number;
  /** Format the file was read as. */
  format?: GraphFormat;
  /** The graph itself, for sources that cannot be read again (standard input) and for small graphs. */
  embedded?: EmbeddedGraph;
}

/**
 * A short human label: the spec; else the file name (`stdin` for standard input) with `#k` for the
 * k-th graph of a stream when k > 1; else "embedded graph" or "graph".
 */
export function sourceLabel(source: GraphSource | null | undefined): string {
  if (source === null || source === undefined) return "graph";
  if (source.spec !== undefined) return source.spec;
  if (source.path !== undefined) {
    const name = source.path === "-" ? "stdin" : source.path;
    return source.position !== undefined && source.position > 1 ? `${name}#${source.position}` : name;
  }
  return source.embedded !== undefined ? "embedded graph" : "graph";
}

/** Can the graph be found again from this source without an embedded copy? (A spec or a named file.) */
export function canReread(source: GraphSource): boolean {
  return source.spec !== undefined || (source.path !== undefined && source.path !== "-");
}
