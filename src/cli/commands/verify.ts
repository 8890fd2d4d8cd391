// `halfplus verify <records>`: re-checks bracket records written by `halfplus cut --json` against
// their graphs (rebuilt from each record's source, or taken from --graph). Exit 0 when every check
// passes, 1 when any fails, 2 for unreadable input.
import { readFile } from "node:fs/promises";
import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import type { CommandSpec } from "../args.js";
import { openSource, resolveSourceRef, type OpenSourceOptions, type SourceRef } from "../../sources/index.js";
import type { BracketRecord } from "../../cut/bracket.js";
import { parseBracketRecord, verifyBracket } from "../../cut/verify.js";
import { SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";
import { writeLine } from "../output.js";
import { isStoreFile } from "../../experiment/index.js";
import { verifyStore } from "./verify-store.js";

async function readAll(path: string, stdin: NodeJS.ReadableStream): Promise<string> {
  if (path === "-") {
    const chunks: Buffer[] = [];
    for await (const c of stdin) chunks.push(typeof c === "string" ? Buffer.from(c) : (c as Buffer));
    return Buffer.concat(chunks).toString("utf8");
  }
  try {
    return await readFile(path, "utf8");
  } catch (e) {
    throw new InputError(`${path}: cannot read (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
  }
}

/** One JSON object (possibly pretty-printed), or JSON lines as `halfplus cut --json` writes them. */
export function parseRecords(text: string, where: string): BracketRecord[] {
  const trimmed = text.trim();
  if (trimmed === "") throw new InputError(`${where}: holds no record`);
  let whole: unknown;
  let single = true;
  try {
    whole = JSON.parse(trimmed);
  } catch {
    single = false; // not one JSON value: read it as JSON lines below
  }
  if (single) return [parseBracketRecord(whole, where)];
  const records: BracketRecord[] = [];
  text.split("\n").forEach((line, i) => {
    if (line.trim() === "") return;
    let value: unknown;
    try {
      value = JSON.parse(line);
    } catch {
      throw new InputError(`${where}:${i + 1}: not valid JSON`);
    }
    records.push(parseBracketRecord(value, `${where}:${i + 1}`));
  });
  return records;
}

function describeSource(ref: SourceRef | null): string {
  if (ref === null) return "unknown source";
  if (ref.spec !== undefined) return ref.spec;
  return ref.index !== undefined && ref.index > 0 ? `${ref.path}#${ref.index}` : String(ref.path);
}

async function loadAll(arg: string, options: OpenSourceOptions): Promise<Graph[]> {
  const out: Graph[] = [];
  for await (const g of openSource(arg, options)) out.push(g.graph);
  if (out.length === 0) throw new InputError(`${arg}: holds no graph`);
  return out;
}

export const verifyCommand: CommandSpec = {
  name: "verify",
  summary: "re-check max-cut bracket records (from `halfplus cut --json`, or the rows of a results store) against their graphs",
  positionals: "<records.json|store.db>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [
    { name: "graph", type: "string", description: "take the graph(s) from this source instead of each record's own source", placeholder: "SOURCE" },
    { name: "seconds", type: "number", description: "budget for re-running exact search on exhaustive certificates", default: 60, min: 0.001, max: 1e7, placeholder: "S" },
    { name: "json", type: "boolean", description: "one JSON verdict per record, one per line" },
    ...SOURCE_OPTIONS,
    // Results stores (halfplus sweep): see verify-store.ts.
    { name: "row", type: "string", description: "store only: re-check the row with this key, or rows at these positions in export order (from 1, e.g. 3 or 2,5,9)", placeholder: "KEY|N" },
    { name: "family", type: "string", description: "store only: re-check the rows of this family label", placeholder: "NAME" },
  ],
  examples: ["halfplus cut petersen --json > p.json && halfplus verify p.json", "halfplus verify results.json --graph G1.txt", "halfplus verify results/halfplus.db --row 3"],
  async run(args, io) {
    const path = args.positionals[0];
    if (isStoreFile(path)) return verifyStore(path, args, io);
    if (args.options["row"] !== undefined || args.options["family"] !== undefined) throw new InputError(`--row and --family select rows of a results store; ${path} is not one`);
    const where = path === "-" ? "stdin" : path;
    const records = parseRecords(await readAll(path, io.stdin), where);
    const graphArg = args.options["graph"] as string | undefined;
    const seconds = args.options["seconds"] as number;
    const json = args.options["json"] === true;
    const sourceOptions = sourceOptionsFrom(args, io.stdin);
    if (graphArg === "-" && path === "-") throw new InputError("records and --graph cannot both come from standard input");
    const given = graphArg === undefined ? null : await loadAll(graphArg, sourceOptions);
    const byPath = new Map<string, Graph[]>();
    let failures = 0;
    for (let k = 0; k < records.length; k++) {
      const rec = records[k];
      const label = `record ${k + 1} (${describeSource(rec.source)})`;
      let graph: Graph;
      if (given !== null) {
        const idx = given.length === 1 ? 0 : (rec.source?.index ?? k);
        if (idx >= given.length) throw new InputError(`--graph ${graphArg}: has ${given.length} graphs, ${label} needs graph #${idx}`);
        graph = given[idx];
      } else if (rec.source === null || (rec.source.spec === undefined && rec.source.path === undefined)) {
        throw new InputError(`${label}: records no source; pass the graph with --graph SOURCE`);
      } else if (rec.source.spec === undefined && rec.source.path !== undefined && rec.source.path !== "-") {
        // Files are read once, however many records point into them.
        let all = byPath.get(rec.source.path);
        if (all === undefined) {
          all = await loadAll(rec.source.path, { ...sourceOptions, format: rec.source.format ?? sourceOptions.format });
          byPath.set(rec.source.path, all);
        }
        const idx = rec.source.index ?? 0;
        if (idx >= all.length) throw new InputError(`${rec.source.path}: has no graph #${idx}`);
        graph = all[idx];
      } else {
        graph = await resolveSourceRef(rec.source, sourceOptions);
      }
      const report = verifyBracket(graph, rec, { seconds });
      if (!report.ok) failures++;
      if (json) {
        await writeLine(io.stdout, JSON.stringify({ record: k + 1, source: describeSource(rec.source), ok: report.ok, checks: report.checks }));
      } else {
        const failed = report.checks.filter((c) => !c.ok).map((c) => c.name);
        const verdict = report.ok
          ? `verified: max cut ${rec.exact ? `= ${rec.lower}` : `in [${rec.lower}, ${rec.upper}]`}`
          : `REJECTED (${failed.join(", ")})`;
        const w = Math.max(...report.checks.map((c) => c.name.length));
        const lines = [`${label}: ${verdict}`, ...report.checks.map((c) => `  ${c.ok ? "pass" : "FAIL"}  ${c.name.padEnd(w)}  ${c.message}`)];
        await writeLine(io.stdout, lines.join("\n"));
      }
    }
    if (!json && records.length > 1) await writeLine(io.stdout, `${records.length - failures} of ${records.length} records verified`);
    return failures === 0 ? 0 : 1;
  },
};
