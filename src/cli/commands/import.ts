// `halfplus import rows.csv --into results.db`: rows measured elsewhere (m, surplus bounds, and
// n and degree measures when known) become store rows that fits and figures read like swept ones.
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { importHelp } from "./help/import.js";
import { importCsvFile, openStore, type StoredDegree } from "../../experiment/index.js";
import { writeLine } from "../output.js";

export const importCommand: CommandSpec = {
  ...importHelp,
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
