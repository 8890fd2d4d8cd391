// `halfplus verify <records>`: re-checks bracket records written by `halfplus cut --json` against
// their graphs (the copy embedded in a record, else rebuilt from its source, or taken from
// --graph). Exit 0 when every record is verified with a proven upper end, 1 when any check fails,
// 3 when every check passes but some upper end is only an estimate (0 with --accept-estimates),
// 2 for unreadable or malformed input. A results store (`halfplus sweep`) follows the same rules.
import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { sourceLabel } from "../../graph/record/source.js";
import { readBracketRecords } from "../../cut/bracket/read-records.js";
import { EXIT_ESTIMATE, verifyBracket } from "../../cut/bracket/verify.js";
import { readTextInput } from "../../limits/input.js";
import { SourceResolver, pickGivenGraph, readAllGraphs } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES } from "./summaries.js";
import { writeLine } from "../output.js";
import { VerdictTally, shortLabel, verdictJson, verdictText } from "../verdicts.js";
import { SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";
import { isStoreFile } from "../../experiment/index.js";
import { verifyStore } from "./verify-store.js";

/** Largest records input: V8's longest string (a record of a 10^6-vertex graph is about 20 MB). */
const MAX_RECORDS_BYTES = 2 ** 29 - 64;

export const verifyCommand: CommandSpec = {
  name: "verify",
  summary: COMMAND_SUMMARIES["verify"],
  positionals: "<records|store.db>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "Trusts nothing the solvers did: the cut of the record's partition is recomputed, and the upper bound is re-derived from its certificate (the dual certificate's shift proved again, or the exact search rerun) with verify's own rounding allowances, never the record's. The graph is the copy embedded in the record (standard input and small graphs), else rebuilt from its spec or file, else the one given with --graph.",
    `Verdicts: verified (every check passed, the upper end proven), estimate (every check passed, but the upper end rests on a Lanczos estimate of the shift: not a proof), REJECTED (a check failed). Exit status 0 when all are verified, 1 when any is rejected, ${EXIT_ESTIMATE} when some upper end is an estimate (0 with --accept-estimates), 2 for unreadable or malformed input.`,
    "Records are numbered from 1. `-` reads the records from standard input.",
    "A results store is re-checked row by row; unless --row or --family picks rows, its census tables (each cell's histogram, least surplus and witnesses, re-solved exactly) and its hunt frontier (each graph H-free with the stated n and m, its bracket record, its value) are re-checked too, each with its own tally.",
  ],
  options: [
    { name: "graph", type: "string", description: "take the graphs from this source instead of the records' own: a single graph serves every record, otherwise graph k serves the record at position k", placeholder: "SOURCE" },
    { name: "seconds", type: "number", description: "time budget for rerunning exact search on exhaustive-search certificates", default: 60, min: 0.001, max: 1e7, placeholder: "S" },
    { name: "accept-estimates", type: "boolean", description: `exit 0, not ${EXIT_ESTIMATE}, when an upper end is an estimate rather than a proof` },
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
    "halfplus verify big.jsonl --accept-estimates",
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
    const acceptEstimates = args.options["accept-estimates"] === true;
    const sourceOptions = sourceOptionsFrom(args, io.stdin);
    if (graphArg === "-" && path === "-") throw new InputError("records and --graph cannot both come from standard input");
    const records = readBracketRecords(await readTextInput(path, io.stdin, MAX_RECORDS_BYTES, "records"), where);
    const given = graphArg === undefined ? null : await readAllGraphs(graphArg, sourceOptions);
    const resolver = new SourceResolver(sourceOptions);
    const tally = new VerdictTally();
    for (const { record, where: at, position } of records) {
      const label = shortLabel(sourceLabel(record.source));
      const graph: Graph = given !== null ? pickGivenGraph(given, record.source, position, `--graph ${graphArg}`) : await resolver.resolve(record.source, at);
      const verdict = verifyBracket(graph, record, { seconds });
      tally.add(verdict);
      if (json) await writeLine(io.stdout, JSON.stringify({ position, label, ...verdictJson(verdict) }));
      else await writeLine(io.stdout, verdictText(`record ${position} (${label})`, record, verdict));
    }
    if (!json && records.length > 1) await writeLine(io.stdout, tally.summary("records"));
    return tally.exitStatus(acceptEstimates);
  },
};
