// `halfplus import rows.csv --into results.db`: rows measured elsewhere (m, surplus bounds, and
// n and degree measures when known) become store rows that fits and figures read like swept ones.
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES } from "./summaries.js";
import { STORED_DEGREES, IMPORT_COLUMNS, importCsvFile, openStore, type StoredDegree } from "../../experiment/index.js";
import { writeLine } from "../output.js";

export const importCommand: CommandSpec = {
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
  async run(args, io) {
    const o = args.options;
    const into = o["into"] as string | undefined;
    if (into === undefined || into === "") throw new InputError("--into FILE is required: the store to import into");
    const store = openStore(into);
    try {
      const r = importCsvFile(store, args.positionals[0], { family: o["family"] as string | undefined, dIs: o["d-is"] as StoredDegree, skipUnknown: o["skip-unknown"] === true });
      const skipped = r.skippedColumns.length > 0 ? `; columns left out: ${r.skippedColumns.join(", ")}` : "";
      await writeLine(io.stdout, `${r.file}: ${r.rows} rows, ${r.added} added, ${r.alreadyThere} already in ${into}${skipped}`);
    } finally {
      store.close();
    }
    return 0;
  },
};
