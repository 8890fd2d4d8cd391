// `halfplus verify <records>`: re-checks bracket records written by `halfplus cut --json` against
// their graphs (rebuilt from each record's source, or taken from --graph). Exit 0 when every record
// is verified with a proven upper end, 1 when any check fails, 3 when every check passes but some
// upper end is only an estimate (0 with --accept-estimates), 2 for unreadable or malformed input.
import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import type { CommandSpec } from "../args.js";
import { openSource, requireRegularFile, resolveSourceRef, type OpenSourceOptions, type SourceRef } from "../../sources/index.js";
import type { BracketRecord } from "../../cut/bracket.js";
import { parseBracketRecord, verifyBracket } from "../../cut/verify.js";
import { parseJsonSequence } from "../../limits/strict-json.js";
import { readTextInput } from "../../limits/input.js";
import { SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";
import { writeLine } from "../output.js";

/** Exit status when every check passed but an upper end is an estimate (and --accept-estimates is not given). */
export const EXIT_ESTIMATE = 3;

/** Largest records input: V8's longest string (a record of a 10^6-vertex graph is about 20 MB). */
const MAX_RECORDS_BYTES = 2 ** 29 - 64;

export interface NumberedRecord {
  record: BracketRecord;
  /** Where it came from in messages: "file:line". */
  where: string;
}

/** Every record in the text: one JSON object (possibly pretty-printed) or JSON lines as `halfplus cut --json` writes them. */
export function parseRecords(text: string, where: string): NumberedRecord[] {
  const values = parseJsonSequence(text, where);
  if (values.length === 0) throw new InputError(`${where}: holds no record`);
  return values.map((v, k) => {
    const at = `${where}:${v.line} (record ${k + 1})`;
    return { record: parseBracketRecord(v.value, at), where: at };
  });
}

function describeSource(ref: SourceRef | null): string {
  if (ref === null) return "unknown source";
  if (ref.spec !== undefined) return ref.spec.length > 80 ? `${ref.spec.slice(0, 80)}...` : ref.spec;
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
  summary: "re-check max-cut bracket records (from `halfplus cut --json`) against their graphs",
  positionals: "<records.json>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [
    { name: "graph", type: "string", description: "take the graph(s) from this source instead of each record's own source", placeholder: "SOURCE" },
    { name: "seconds", type: "number", description: "budget for re-running exact search on exhaustive certificates", default: 60, min: 0.001, max: 1e7, placeholder: "S" },
    { name: "accept-estimates", type: "boolean", description: `exit 0, not ${EXIT_ESTIMATE}, when an upper end is an estimate rather than a proof` },
    { name: "json", type: "boolean", description: "one JSON verdict per record, one per line" },
    ...SOURCE_OPTIONS,
  ],
  examples: ["halfplus cut petersen --json > p.json && halfplus verify p.json", "halfplus verify results.json --graph G1.txt"],
  async run(args, io) {
    const path = args.positionals[0];
    const where = path === "-" ? "stdin" : path;
    const records = parseRecords(await readTextInput(path, io.stdin, MAX_RECORDS_BYTES, "records"), where);
    const graphArg = args.options["graph"] as string | undefined;
    const seconds = args.options["seconds"] as number;
    const json = args.options["json"] === true;
    const acceptEstimates = args.options["accept-estimates"] === true;
    const sourceOptions = sourceOptionsFrom(args, io.stdin);
    if (graphArg === "-" && path === "-") throw new InputError("records and --graph cannot both come from standard input");
    const given = graphArg === undefined ? null : await loadAll(graphArg, sourceOptions);
    const byPath = new Map<string, Graph[]>();
    let rejected = 0;
    let estimates = 0;
    for (let k = 0; k < records.length; k++) {
      const { record: rec, where: at } = records[k];
      const label = `record ${k + 1} (${describeSource(rec.source)})`;
      let graph: Graph;
      if (given !== null) {
        const idx = given.length === 1 ? 0 : (rec.source?.index ?? k);
        if (idx >= given.length) throw new InputError(`--graph ${graphArg}: has ${given.length} graphs, ${label} needs graph #${idx}`);
        graph = given[idx];
      } else if (rec.source === null || (rec.source.spec === undefined && rec.source.path === undefined)) {
        throw new InputError(`${at}: records no source; pass the graph with --graph SOURCE`);
      } else if (rec.source.spec === undefined && rec.source.path !== undefined && rec.source.path !== "-") {
        // Files are read once, however many records point into them; only regular files (a record
        // naming /dev/zero must not read forever).
        let all = byPath.get(rec.source.path);
        if (all === undefined) {
          requireRegularFile(rec.source.path, `${at}: source.path`);
          all = await loadAll(rec.source.path, { ...sourceOptions, format: rec.source.format ?? sourceOptions.format });
          byPath.set(rec.source.path, all);
        }
        const idx = rec.source.index ?? 0;
        if (idx >= all.length) throw new InputError(`${at}: source.path ${rec.source.path} has no graph #${idx}`);
        graph = all[idx];
      } else {
        graph = await resolveSourceRef(rec.source, sourceOptions);
      }
      const report = verifyBracket(graph, rec, { seconds });
      const verdict = !report.ok ? "rejected" : report.upperKind === "estimate" ? "estimate" : "verified";
      if (verdict === "rejected") rejected++;
      else if (verdict === "estimate") estimates++;
      if (json) {
        await writeLine(io.stdout, JSON.stringify({ record: k + 1, source: describeSource(rec.source), ok: report.ok, verdict, upperKind: report.upperKind, checks: report.checks }));
      } else {
        const range = !rec.exact ? `in [${rec.lower}, ${rec.upper}]` : rec.upper > rec.lower ? `= ${rec.lower} (within ${rec.upper - rec.lower})` : `= ${rec.lower}`;
        const head =
          verdict === "verified"
            ? `verified: max cut ${range}`
            : verdict === "estimate"
              ? `estimate: max cut in [${rec.lower}, ${rec.upper}]; the upper end is an estimate, not a proof`
              : `REJECTED (${report.checks.filter((c) => !c.ok).map((c) => c.name).join(", ")})`;
        const w = Math.max(...report.checks.map((c) => c.name.length));
        const lines = [`${label}: ${head}`, ...report.checks.map((c) => `  ${c.ok ? "pass" : "FAIL"}  ${c.name.padEnd(w)}  ${c.message}`)];
        await writeLine(io.stdout, lines.join("\n"));
      }
    }
    if (!json && records.length > 1) {
      const verified = records.length - rejected - estimates;
      const extra = [estimates > 0 ? `${estimates} with an estimated upper end` : "", rejected > 0 ? `${rejected} rejected` : ""].filter(Boolean);
      await writeLine(io.stdout, `${verified} of ${records.length} records verified${extra.length > 0 ? ` (${extra.join(", ")})` : ""}`);
    }
    if (rejected > 0) return 1;
    return estimates > 0 && !acceptEstimates ? EXIT_ESTIMATE : 0;
  },
};
