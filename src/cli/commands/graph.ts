// `halfplus graph <source>`: structure summary of each graph a source denotes. Reads a graph6
// stream one graph at a time and writes one JSON record per line with --json.
import { describeGraph, type GraphSummary } from "../../graph/structure/describe.js";
import { graphSummaryRecord } from "../../graph/structure/summary-record.js";
import { openSource } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { graphHelp } from "./help/graph.js";
import { formatNumber as num, formatRows } from "../format.js";
import { writeLine } from "../output.js";
import { sourceOptionsFrom } from "./source-options.js";

function text(x: number | null | boolean): string {
  if (x === null) return "not known";
  if (typeof x === "boolean") return x ? "yes" : "no";
  return num(x);
}

export function formatSummary(label: string, s: GraphSummary, notes: readonly string[]): string {
  const free = Object.entries(s.free)
    .map(([k, v]) => (v === null ? `${k} not known` : v ? `no ${k}` : `has ${k}`))
    .join(", ");
  const rows: [string, string][] = [
    ["vertices, edges", `${s.n}, ${s.m}${s.totalWeight !== s.m ? ` (total weight ${num(s.totalWeight)})` : ""}`],
    ["degree min/avg/max", `${s.minDegree} / ${num(s.avgDegree)} / ${s.maxDegree}`],
    ["degeneracy", text(s.degeneracy)],
    ["components", text(s.components)],
    ["bipartite", text(s.bipartite)],
    ["girth", s.girth !== null ? text(s.girth) : s.unknown.includes("girth") ? "not known" : "∞ (no cycles)"],
    ["triangles, 4-cycles", `${text(s.triangles)}, ${text(s.fourCycles)}`],
    ["subgraphs", free],
  ];
  const out = [label, ...formatRows(rows)];
  if (s.unknown.length > 0) out.push(`  not known (skipped, or the search ran out of budget): ${s.unknown.join(", ")}`);
  for (const n of notes) out.push(`  note: ${n}`);
  return out.join("\n") + "\n";
}

export const graphCommand: CommandSpec = {
  ...graphHelp,
  async run(args, io) {
    const json = args.options["json"] === true;
    let first = true;
    const arg = args.positionals[0];
    for await (const item of openSource(arg, sourceOptionsFrom(args, io.stdin))) {
      if (json) {
        await writeLine(io.stdout, JSON.stringify(graphSummaryRecord(item.graph, { source: item.source, notes: item.notes })));
      } else {
        await writeLine(io.stdout, (first ? "" : "\n") + formatSummary(item.label, describeGraph(item.graph), item.notes).trimEnd());
      }
      first = false;
    }
    // An empty stream in a pipe is normal (a filter kept nothing); an empty named file deserves a word.
    if (first && arg !== "-") io.stderr.write(`halfplus graph: no graphs read from ${arg}\n`);
    return 0;
  },
};
