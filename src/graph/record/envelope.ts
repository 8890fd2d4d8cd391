// The envelope every result record carries, whatever it reports (a structure summary, a max-cut
// bracket, ...): what kind of record it is, the version of that kind, the graph's hash and where
// the graph came from. Records of the same graph can then be joined by hash in a results store.

import type { Graph } from "../graph.js";
import { graphHash } from "../hash.js";
import { withEmbeddedGraph } from "./embed.js";
import type { GraphSource } from "./source.js";

export interface RecordEnvelope<K extends string = string> {
  /** What the record reports, e.g. "halfplus/bracket", "halfplus/graph-summary". */
  kind: K;
  /** Version of that kind's layout; readers refuse versions they do not know. */
  version: number;
  /** `graphHash(graph)`: "sha256:…". */
  graphHash: string;
  source: GraphSource;
}

/** The envelope for a record about `graph`; the source gets an embedded copy of the graph where needed. */
export function recordEnvelope<K extends string>(kind: K, version: number, graph: Graph, source: GraphSource = {}): RecordEnvelope<K> {
  return { kind, version, graphHash: graphHash(graph), source: withEmbeddedGraph(graph, source) };
}
