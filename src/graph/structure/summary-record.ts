// The record behind `halfplus graph --json`: the shared envelope (kind, version, graph hash,
// source) around a structure summary, so a summary and a bracket of the same graph join by hash.

import type { Graph } from "../graph.js";
import { recordEnvelope, type RecordEnvelope } from "../record/envelope.js";
import type { GraphSource } from "../record/source.js";
import { describeGraph, type DescribeOptions, type GraphSummary } from "./describe.js";

export const GRAPH_SUMMARY_KIND = "halfplus/graph-summary";
export const GRAPH_SUMMARY_VERSION = 1;

export interface GraphSummaryRecord extends RecordEnvelope<typeof GRAPH_SUMMARY_KIND>, GraphSummary {
  /** Things the reader should know about the graph (e.g. what the reader merged or dropped). */
  notes: string[];
}

export interface GraphSummaryRecordOptions extends DescribeOptions {
  source?: GraphSource;
  notes?: readonly string[];
}

export function graphSummaryRecord(graph: Graph, options: GraphSummaryRecordOptions = {}): GraphSummaryRecord {
  const { kind, version, graphHash, source } = recordEnvelope(GRAPH_SUMMARY_KIND, GRAPH_SUMMARY_VERSION, graph, options.source);
  // The embedded graph goes last, so the numbers come first in a JSON line.
  return { kind, version, graphHash, ...describeGraph(graph, options), notes: [...(options.notes ?? [])], source };
}
