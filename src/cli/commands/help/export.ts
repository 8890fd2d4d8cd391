// `halfplus export`: its options and help text, apart from its implementation (../export.ts), so that
// `halfplus export --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { STORE_TABLES } from "../../../experiment/export-tables.js";

export const exportHelp: CommandHelp = {
  name: "export",
  summary: COMMAND_SUMMARIES["export"],
  positionals: "<store.db>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [
    { name: "csv", type: "string", description: "write CSV with a header line to FILE (- for standard output)", placeholder: "FILE" },
    { name: "jsonl", type: "string", description: "write one JSON object per row to FILE (- for standard output)", placeholder: "FILE" },
    { name: "timing", type: "boolean", description: "include the wall-clock fields seconds and startedAt (a census's start, update and finish times; a frontier row's foundAt): they differ from run to run" },
    { name: "columns", type: "string", description: "results only: these columns, comma-separated, in this order", placeholder: "A,B,..." },
    { name: "family", type: "string", description: "results only: rows of this family label", placeholder: "NAME" },
    { name: "table", type: "string", description: "which table: results (the swept and imported rows), census-runs, census-cells, census-histogram (halfplus census) or hunt-frontier (halfplus hunt)", choices: STORE_TABLES, default: "results", placeholder: "TABLE" },
    { name: "name", type: "string", description: "census tables only: the census of this name (default: every census)", placeholder: "NAME" },
  ],
  examples: [
    "halfplus export results/halfplus.db --csv rows.csv",
    "halfplus export results/halfplus.db --jsonl - --family polarity | head",
    "halfplus export results/census.db --table census-cells --csv cells.csv",
    "halfplus export results/hunt.db --table hunt-frontier --jsonl -",
  ],
};
