// `halfplus verify <records>`: re-checks bracket records written by `halfplus cut --json` against
// their graphs (the copy embedded in a record, else rebuilt from its source, or taken from
// --graph). Exit 0 when every record is verified with a proven upper end, 1 when any check fails,
// 3 when every check passes but some upper end is only an estimate (0 with --accept-estimates),
// 2 for unreadable or malformed input. A results store (`halfplus sweep`) follows the same rules.
import { InputError } from "../../errors.js";
import type { Graph } from "../../graph/graph.js";
import { sourceLabel } from "../../graph/record/source.js";
import { readBracketRecords } from "../../cut/bracket/read-records.js";
import { verifyBracket } from "../../cut/bracket/verify.js";
import { readTextInput } from "../../limits/input.js";
import { SourceResolver, pickGivenGraph, readAllGraphs } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { verifyHelp } from "./help/verify.js";
import { writeLine } from "../output.js";
import { VerdictTally, shortLabel, verdictJson, verdictText } from "../verdicts.js";
import { sourceOptionsFrom } from "./source-options.js";
import { isStoreFile } from "../../experiment/index.js";
import { verifyStore } from "./verify-store.js";

/** Largest records input: V8's longest string (a record of a 10^6-vertex graph is about 20 MB). */
const MAX_RECORDS_BYTES = 2 ** 29 - 64;

export const verifyCommand: CommandSpec = {
  ...verifyHelp,
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
