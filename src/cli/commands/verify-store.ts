// `halfplus verify <store.db>`: re-check stored rows (all, a family's, or one picked with --row)
// from the store alone: each row's witness partition and certificate against its graph. Verdicts,
// their text and the exit status (an estimate exits 3 unless --accept-estimates) are those of
// record files (src/cli/verdicts.ts). Without --row or --family the census tables and the hunt
// frontier are re-checked too (src/experiment/verify-tables.ts), each with its own closing tally.
import { InputError } from "../../errors.js";
import type { ParsedArgs, CommandIO } from "../args.js";
import { openStore, verifyCensusTables, verifyFrontierTable, verifyStoredRows, type RowFilter } from "../../experiment/index.js";
import { writeLine } from "../output.js";
import { VerdictTally, checkedText, verdictJson, verdictText } from "../verdicts.js";

/** `--row`: a key, or positions in the store's export order counted from 1 (`3`, `2,5,9`). */
function rowSelection(text: string | undefined): { keys?: string[]; positions?: Set<number> } {
  if (text === undefined) return {};
  if (/^\s*\d+(\s*,\s*\d+)*\s*$/.test(text)) {
    const positions = new Set(text.split(",").map((x) => Number(x.trim())));
    if (positions.has(0)) throw new InputError("--row: positions count from 1");
    return { positions };
  }
  return { keys: [text] };
}

export async function verifyStore(path: string, args: ParsedArgs, io: CommandIO): Promise<number> {
  const o = args.options;
  if (o["graph"] !== undefined) throw new InputError("--graph applies to record files; a store row carries its own graph");
  const sel = rowSelection(o["row"] as string | undefined);
  const filter: RowFilter = {};
  if (sel.keys !== undefined) filter.keys = sel.keys;
  if (o["family"] !== undefined) filter.family = o["family"] as string;
  const json = o["json"] === true;
  const store = openStore(path, { readonly: true });
  const tally = new VerdictTally();
  try {
    const selected = store.count(filter);
    if (sel.keys !== undefined && selected === 0) throw new InputError(`${path}: no row with key ${JSON.stringify(sel.keys[0])}`);
    if (sel.positions !== undefined) {
      const all = store.count();
      const beyond = [...sel.positions].filter((p) => p > all);
      if (beyond.length > 0) throw new InputError(`--row ${beyond[0]}: the store holds ${all} row${all === 1 ? "" : "s"}`);
    }
    for await (const v of verifyStoredRows(store, { filter, positions: sel.positions, seconds: o["seconds"] as number })) {
      tally.add(v);
      if (json) await writeLine(io.stdout, JSON.stringify({ row: v.position, key: v.key, ...verdictJson(v) }));
      else await writeLine(io.stdout, verdictText(`row ${v.position} (${v.key.split("|")[0]})`, v.record, v));
    }
    // Rows selected but not re-checked are imported ones (measured elsewhere, no evidence).
    const imported = sel.positions === undefined ? selected - tally.total : 0;
    // --row and --family pick results rows; otherwise the other tables are re-checked as well.
    const everything = sel.keys === undefined && sel.positions === undefined && filter.family === undefined;
    const hasOthers = everything && (store.census().list().length > 0 || store.huntEntries().length > 0);
    if (!json && (selected > 0 || !hasOthers)) {
      const tail = imported > 0 ? `; ${imported} imported row${imported === 1 ? " carries" : "s carry"} no bracket to re-check` : "";
      await writeLine(io.stdout, tally.summary("stored rows", tail));
    }
    if (hasOthers) {
      const census = new VerdictTally();
      for (const v of verifyCensusTables(store)) {
        census.add(v);
        tally.add(v);
        if (json) await writeLine(io.stdout, JSON.stringify(v));
        else if (v.table === "census-runs") await writeLine(io.stdout, checkedText(`census ${JSON.stringify(v.census)}`, "its cells hold the graphs it counted", v));
        else await writeLine(io.stdout, checkedText(`census ${JSON.stringify(v.census)} n=${v.n} m=${v.m}`, "histogram, least surplus and witnesses re-checked", v));
      }
      if (!json && census.total > 0) await writeLine(io.stdout, census.summary("census rows"));
      const frontier = new VerdictTally();
      for (const v of verifyFrontierTable(store, o["seconds"] as number)) {
        frontier.add(v);
        tally.add(v);
        const what = `hunt frontier ${v.pattern}-free n=${v.n} ${v.objective} m=${v.m}`;
        if (json) await writeLine(io.stdout, JSON.stringify({ table: v.table, pattern: v.pattern, n: v.n, objective: v.objective, m: v.m, ...verdictJson(v) }));
        else await writeLine(io.stdout, v.record === null ? checkedText(what, "", v) : verdictText(what, v.record, v));
      }
      if (!json && frontier.total > 0) await writeLine(io.stdout, frontier.summary("hunt frontier rows"));
    }
  } finally {
    store.close();
  }
  return tally.exitStatus(o["accept-estimates"] === true);
}
