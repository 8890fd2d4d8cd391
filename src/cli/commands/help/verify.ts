// `halfplus verify`: its options and help text, apart from its implementation (../verify.ts), so that
// `halfplus verify --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { EXIT_ESTIMATE } from "../../../cut/bracket/exit-estimate.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { SOURCE_OPTIONS } from "../source-options.js";

export const verifyHelp: CommandHelp = {
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
};
