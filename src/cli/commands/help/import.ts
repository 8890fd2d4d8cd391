// `halfplus import`: its options and help text, apart from its implementation (../import.ts), so that
// `halfplus import --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { IMPORT_COLUMNS } from "../../../experiment/import-columns.js";
import { STORED_DEGREES } from "../../../experiment/rows.js";

export const importHelp: CommandHelp = {
  name: "import",
  summary: COMMAND_SUMMARIES["import"],
  positionals: "<rows.csv>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [
    { name: "into", type: "string", description: "the results store (created if missing)", placeholder: "FILE" },
    { name: "family", type: "string", description: "family label for rows without a family column (default: the file name)", placeholder: "NAME" },
    { name: "d-is", type: "string", description: "what a `d` column holds", default: "degeneracy", choices: STORED_DEGREES, placeholder: "MEASURE" },
    { name: "skip-unknown", type: "boolean", description: "leave out columns halfplus does not know (and list them) instead of refusing the file" },
  ],
  examples: [`halfplus import measured.csv --into results/halfplus.db --family my-graphs   # columns: ${IMPORT_COLUMNS.slice(2, 6).join(", ")}, surplusLower, surplusUpper, ...`],
};
