// `halfplus verify <records>`: re-checks bracket records written by `halfplus cut --json` against
// their graphs (the copy embedded in a record, else rebuilt from its source, or taken from
// --graph). Exit 0 when every check passes, 1 when any fails, 2 for unreadable input.
import { readFile } from "node:fs/promises";
import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { sourceLabel } from "../../graph/record/source.js";
import { readBracketRecords } from "../../cut/bracket/read-records.js";
import { verifyBracket } from "../../cut/bracket/verify.js";
import { SourceResolver, pickGivenGraph, readAllGraphs } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { formatRows } from "../format.js";
import { writeLine } from "../output.js";
import { SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";
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

export const verifyCommand: CommandSpec = {
  name: "verify",
  summary: "re-check bracket records (from `halfplus cut --json`, or the rows of a results store) against their graphs",
  positionals: "<records|store.db>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "Trusts nothing the solvers did: the cut of the record's partition is recomputed, and the upper bound is re-derived from its certificate (the dual certificate's shift proved again, or the exact search rerun). The graph is the copy embedded in the record (standard input and small graphs), else rebuilt from its spec or file, else the one given with --graph.",
    "Records are numbered from 1. `-` reads the records from standard input.",
  ],
  options: [
    { name: "graph", type: "string", description: "take the graphs from this source instead of the records' own: a single graph serves every record, otherwise graph k serves the record at position k", placeholder: "SOURCE" },
    { name: "seconds", type: "number", description: "time budget for rerunning exact search on exhaustive-search certificates", default: 60, min: 0.001, max: 1e7, placeholder: "S" },
    { name: "json", type: "boolean", description: "one JSON verdict per record, one per line" },
    ...SOURCE_OPTIONS,
    // Results stores (halfplus sweep): see verify-store.ts.
    { name: "row", type: "string", description: "store only: re-check the row with this key, or rows at these positions in export order (from 1, e.g. 3 or 2,5,9)", placeholder: "KEY|N" },
    { name: "family", type: "string", description: "store only: re-check the rows of this family label", placeholder: "NAME" },
  ],
  examples: [
    "halfplus cut petersen --json > p.jsonl && halfplus verify p.jsonl",
    "printf 'DQc\\n' | halfplus cut - --json | halfplus verify -",
    "halfplus verify results.jsonl --graph G1.txt",
    "halfplus verify results/halfplus.db --row 3",
  ],
  async run(args, io) {
    const path = args.positionals[0];
    if (isStoreFile(path)) return verifyStore(path, args, io);
    if (args.options["row"] !== undefined || args.options["family"] !== undefined) throw new InputError(`--row and --family select rows of a results store; ${path} is not one`);
    const where = path === "-" ? "stdin" : path;
    const graphArg = args.options["graph"] as string | undefined;
    const seconds = args.options["seconds"] as number;
    const json = args.options["json"] === true;
    const sourceOptions = sourceOptionsFrom(args, io.stdin);
    if (graphArg === "-" && path === "-") throw new InputError("records and --graph cannot both come from standard input");
    const records = readBracketRecords(await readAll(path, io.stdin), where);
    const given = graphArg === undefined ? null : await readAllGraphs(graphArg, sourceOptions);
    const resolver = new SourceResolver(sourceOptions);
    let failures = 0;
    for (const { record, where: at, position } of records) {
      const label = `record ${position} (${sourceLabel(record.source)})`;
      const graph: Graph = given !== null ? pickGivenGraph(given, record.source, position, `--graph ${graphArg}`) : await resolver.resolve(record.source, at);
      const report = verifyBracket(graph, record, { seconds });
      if (!report.ok) failures++;
      if (json) {
        await writeLine(io.stdout, JSON.stringify({ position, label: sourceLabel(record.source), ok: report.ok, checks: report.checks }));
      } else {
        const failed = report.checks.filter((c) => !c.ok).map((c) => c.name);
        const verdict = report.ok
          ? `verified: max cut ${record.exact ? `= ${record.lower}` : `in [${record.lower}, ${record.upper}]`}`
          : `REJECTED (${failed.join(", ")})`;
        const rows = formatRows(report.checks.map((c) => [`${c.ok ? "pass" : "FAIL"}  ${c.name}`, c.message] as const));
        await writeLine(io.stdout, [`${label}: ${verdict}`, ...rows].join("\n"));
      }
    }
    if (!json && records.length > 1) await writeLine(io.stdout, `${records.length - failures} of ${records.length} records verified`);
    return failures === 0 ? 0 : 1;
  },
};
