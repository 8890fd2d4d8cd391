// `halfplus merge a.db b.db --into all.db`: union of results stores. Rows with the same key must
// agree on every result field; any disagreement refuses the merge and names the key and fields.
// Census tables and the hunt frontier come along (src/experiment/merge-tables.ts has their rules).
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { mergeHelp } from "./help/merge.js";
import { mergeStores } from "../../experiment/index.js";
import { writeLine } from "../output.js";

export const mergeCommand: CommandSpec = {
  ...mergeHelp,
  async run(args, io) {
    const into = args.options["into"] as string | undefined;
    if (into === undefined || into === "") throw new InputError("--into FILE is required: the store to merge into");
    const report = mergeStores(args.positionals, into);
    if (args.options["json"] === true) await writeLine(io.stdout, JSON.stringify(report));
    else {
      const lines: string[] = [];
      for (const s of report.sources) {
        lines.push(`${s.path}: ${s.rows} rows, ${s.added} added, ${s.alreadyThere} already in ${report.into}`);
        const c = s.census;
        if (c !== undefined) {
          lines.push(`${s.path}: ${c.censuses} census${c.censuses === 1 ? "" : "es"}, ${c.added} added, ${c.alreadyThere} already in ${report.into}, ${c.advanced} further along in ${s.path} (taken), ${c.behind} further along in ${report.into} (kept)`);
        }
        const f = s.frontier;
        if (f !== undefined) {
          lines.push(`${s.path}: ${f.rows} hunt frontier rows, ${f.added} added, ${f.alreadyThere} already in ${report.into}, ${f.improved} better than ${report.into}'s (replaced them), ${f.notBetter} no better than ${report.into}'s (kept ${report.into}'s)`);
        }
      }
      lines.push(`${report.into}: ${report.total} rows`);
      if (report.censuses !== undefined) lines.push(`${report.into}: ${report.censuses} census${report.censuses === 1 ? "" : "es"}`);
      if (report.frontierRows !== undefined) lines.push(`${report.into}: ${report.frontierRows} hunt frontier rows`);
      await writeLine(io.stdout, lines.join("\n"));
    }
    return 0;
  },
};
