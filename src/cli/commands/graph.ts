// `halfplus graph <source>`: structure summary of each graph a source denotes. Reads a
// graph6 stream one graph at a time and writes one JSON object per line with --json.
import type { CommandSpec } from "../args.js";
import { openSource } from "../../sources/index.js";
import { describeGraph, type GraphSummary } from "../../graph/structure/index.js";
import { SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";
import { writeLine } from "../output.js";

function fmt(x: number | null | boolean): string {
  if (x === null) return "—";
  if (typeof x === "boolean") return x ? "yes" : "no";
  return Number.isInteger(x) ? String(x) : x.toFixed(4);
}

export function formatSummary(label: string, s: GraphSummary, notes: string[]): string {
  const free = Object.entries(s.free)
    .map(([k, v]) => (v === null ? `${k}?` : v ? `${k}-free` : `has ${k}`))
    .join(", ");
  const rows: [string, string][] = [
    ["vertices, edges", `${s.n}, ${s.m}${s.totalWeight !== s.m ? ` (total weight ${fmt(s.totalWeight)})` : ""}`],
    ["degree min/avg/max", `${s.minDegree} / ${fmt(s.avgDegree)} / ${s.maxDegree}`],
    ["degeneracy", fmt(s.degeneracy)],
    ["components", fmt(s.components)],
    ["bipartite", fmt(s.bipartite)],
    ["girth", s.girth !== null ? fmt(s.girth) : s.undecided.includes("girth") ? "—" : "∞ (forest)"],
    ["triangles, 4-cycles", `${fmt(s.triangles)}, ${fmt(s.fourCycles)}`],
    ["forbidden subgraphs", free],
  ];
  const w = Math.max(...rows.map((r) => r[0].length));
  const out = [`${label}`, ...rows.map(([k, v]) => `  ${k.padEnd(w)}  ${v}`)];
  if (s.undecided.length > 0) out.push(`  not decided: ${s.undecided.join(", ")}`);
  for (const n of notes) out.push(`  note: ${n}`);
  return out.join("\n") + "\n";
}

export const graphCommand: CommandSpec = {
  name: "graph",
  summary: "structure of each graph in a file, stream or family spec",
  positionals: "<source>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [{ name: "json", type: "boolean", description: "one JSON object per graph, one per line" }, ...SOURCE_OPTIONS],
  examples: [
    "halfplus graph petersen",
    "halfplus graph graphs.g6 --json",
    "nauty-geng -c 8 -t | halfplus graph - --json",
    "halfplus graph kneser:n=8,k=3",
  ],
  async run(args, io) {
    const json = args.options["json"] === true;
    let first = true;
    const arg = args.positionals[0];
    for await (const item of openSource(arg, sourceOptionsFrom(args, io.stdin))) {
      const summary = describeGraph(item.graph);
      if (json) {
        await writeLine(io.stdout, JSON.stringify({ source: item.label, ...summary, notes: item.notes.length > 0 ? item.notes : undefined }));
      } else {
        await writeLine(io.stdout, (first ? "" : "\n") + formatSummary(item.label, summary, item.notes).trimEnd());
      }
      first = false;
    }
    // An empty stream in a pipe is normal (a filter kept nothing); an empty named file deserves a word.
    if (first && arg !== "-") io.stderr.write(`halfplus graph: no graphs read from ${arg}\n`);
    return 0;
  },
};
