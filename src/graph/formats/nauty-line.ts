// One line of a nauty stream: blank lines and a lone `>>graph6<<`/`>>sparse6<<` header carry no
// graph; otherwise ':' starts sparse6, anything else is graph6 (nauty's tools mix both freely).
// Incremental sparse6 (';') and digraph6 ('&') are refused with a clear message.

import { inputErrorAt } from "../../errors.js";
import type { BuildOptions, BuildReport } from "../builder.js";
import type { Graph } from "../graph.js";
import { decodeGraph6, GRAPH6_HEADER } from "./graph6.js";
import { hasPrefix, isBlank } from "./scan.js";
import { decodeSparse6, SPARSE6_HEADER } from "./sparse6.js";
import { DEFAULT_FILE_NAME, type Where } from "./types.js";

export interface NautyLineGraph {
  graph: Graph;
  report: BuildReport;
  format: "graph6" | "sparse6";
}

const NO_REPORT: Readonly<BuildReport> = Object.freeze({ mergedDuplicates: 0, droppedLoops: 0 });

/** Decode buf[start, end) (no "\n"); null when the line holds no graph. */
export function decodeNautyLine(buf: Uint8Array, start: number, end: number, where: Where, build: BuildOptions | undefined): NautyLineGraph | null {
  if (end > start && buf[end - 1] === 13) end--; // CRLF files
  let p = start;
  while (p < end && isBlank(buf[p])) p++;
  if (p === end) return null;
  p = start;
  let header: "graph6" | "sparse6" | null = null;
  if (buf[p] === 62) {
    if (hasPrefix(buf, p, end, GRAPH6_HEADER)) {
      header = "graph6";
      p += GRAPH6_HEADER.length;
    } else if (hasPrefix(buf, p, end, SPARSE6_HEADER)) {
      header = "sparse6";
      p += SPARSE6_HEADER.length;
    } else if (hasPrefix(buf, p, end, ">>digraph6<<")) {
      throw inputErrorAt(where.file ?? DEFAULT_FILE_NAME, where.line, "digraph6 is not supported: halfplus reads undirected graphs");
    }
    if (p === end) return null;
  }
  const c = buf[p];
  const fail = (problem: string) => inputErrorAt(where.file ?? DEFAULT_FILE_NAME, where.line, problem);
  if (c === 59) throw fail("incremental sparse6 (a line starting with ';') is not supported");
  if (c === 38) throw fail("digraph6 (a line starting with '&') is not supported: halfplus reads undirected graphs");
  if (c === 58) {
    if (header === "graph6") throw fail("a sparse6 line follows a >>graph6<< header");
    const r = decodeSparse6(buf, start, p, end, where, build);
    return { graph: r.graph, report: r.report, format: "sparse6" };
  }
  if (header === "sparse6") throw fail("a graph6 line follows a >>sparse6<< header");
  return { graph: decodeGraph6(buf, start, p, end, where), report: { ...NO_REPORT }, format: "graph6" };
}

/**
 * Does buf[start, end) (no "\n") hold a graph? The same rule as decodeNautyLine's null cases
 * (blank, or a lone header), without decoding: a census splits a stream into batches by graph
 * count in one thread and decodes them in others. Malformed lines count as graphs (their
 * decoder reports them).
 */
export function nautyLineHoldsGraph(buf: Uint8Array, start: number, end: number): boolean {
  const c = buf[start];
  if (c >= 63 && c <= 126 && c !== 62) return true; // the common case: a graph6/sparse6 line
  if (end > start && buf[end - 1] === 13) end--;
  let p = start;
  while (p < end && isBlank(buf[p])) p++;
  if (p === end) return false;
  if (p === start && (hasPrefix(buf, p, end, GRAPH6_HEADER) || hasPrefix(buf, p, end, SPARSE6_HEADER))) return end - p > GRAPH6_HEADER.length;
  return true;
}
