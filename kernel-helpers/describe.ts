// A graph's structure at a glance: the `halfplus graph` summary (describeGraph) as a small
// two-column table.

import { describeGraph, type DescribeOptions, type Graph, type GraphSummary } from "halfplus";
import { displayOutput, type MimeBundle } from "./channel.js";
import { CELL_LEFT_STYLE, CELL_STYLE, TABLE_STYLE, caption, frame, htmlEscape } from "./style.js";

export interface DescribeDisplayOptions extends DescribeOptions {
  /** A heading, e.g. the family spec the graph came from. */
  label?: string;
}

function yesNo(v: boolean | null): string {
  return v === null ? "not decided" : v ? "yes" : "no";
}

function round(v: number): string {
  return Number.isInteger(v) ? String(v) : v.toFixed(3);
}

/** The rows shown: quantity and value, in reading order. */
export function summaryRows(s: GraphSummary): [string, string][] {
  const free = (["K3", "K4", "C4", "C5"] as const).filter((k) => s.free[k] === true);
  const present = (["K3", "K4", "C4", "C5"] as const).filter((k) => s.free[k] === false);
  const rows: [string, string][] = [
    ["vertices", String(s.n)],
    ["edges", String(s.m)],
    ["degree min / avg / max", `${s.minDegree} / ${round(s.avgDegree)} / ${s.maxDegree}`],
    ["degeneracy", String(s.degeneracy)],
    ["triangles", s.triangles === null ? "skipped" : String(s.triangles)],
    ["4-cycles", s.fourCycles === null ? "skipped" : String(s.fourCycles)],
    ["girth", s.girth === null ? (s.unknown.includes("girth") ? "skipped" : "∞ (forest)") : String(s.girth)],
    ["bipartite", yesNo(s.bipartite)],
    ["components", String(s.components)],
    ["free of", free.length > 0 ? free.join(", ") : "none of K3, K4, C4, C5"],
    ["contains", present.length > 0 ? present.join(", ") : "none of K3, K4, C4, C5"],
  ];
  if (s.weighted) rows.splice(2, 0, ["total weight", round(s.totalWeight)]);
  if (s.unknown.length > 0) rows.push(["unknown", s.unknown.join(", ")]);
  return rows;
}

/** The bundle `describe` shows. */
export function describeBundle(graph: Graph, options: DescribeDisplayOptions = {}): MimeBundle {
  const { label, ...describeOptions } = options;
  const rows = summaryRows(describeGraph(graph, describeOptions));
  const body = rows.map(([k, v]) => `<tr><th scope="row" style="${CELL_LEFT_STYLE};font-weight:600">${htmlEscape(k)}</th><td style="${CELL_STYLE}">${htmlEscape(v)}</td></tr>`).join("");
  const html = frame(`${caption(label ?? "graph")}<table style="${TABLE_STYLE}"><tbody>${body}</tbody></table>`, "describe");
  const w = Math.max(...rows.map(([k]) => k.length));
  const text = [label ?? "graph", ...rows.map(([k, v]) => `${k.padEnd(w)}  ${v}`)].join("\n");
  return { "text/plain": text, "text/html": html };
}

/** Shows a graph's summary (size, degrees, degeneracy, short cycles, which small patterns it avoids). */
export function describe(graph: Graph, options: DescribeDisplayOptions = {}): void {
  displayOutput(describeBundle(graph, options));
}
