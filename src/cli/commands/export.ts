// `halfplus export <store>`: stored rows as CSV and/or JSON lines, in a fixed column and row
// order (wall-clock fields only with --timing), to files or standard output ("-"). `--table`
// picks another of the store's tables: the census runs, cells or histogram, or the hunt frontier.
import { closeSync, openSync, writeSync } from "node:fs";
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { exportHelp } from "./help/export.js";
import { exportLines, exportTableLines, openStore, parseStoreTable, resolveExportColumns, type ExportFormat, type ExportOptions } from "../../experiment/index.js";
import { writeLine } from "../output.js";

async function writeAll(target: string, lines: Iterable<string>, stdout: NodeJS.WritableStream): Promise<void> {
  if (target === "-") {
    for (const l of lines) await writeLine(stdout, l);
    return;
  }
  let fd: number;
  try {
    fd = openSync(target, "w");
  } catch (e) {
    throw new InputError(`${target}: cannot write (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
  }
  try {
    let buf: string[] = [];
    let size = 0;
    for (const l of lines) {
      buf.push(l);
      size += l.length + 1;
      if (size >= 1 << 16) {
        writeSync(fd, buf.join("\n") + "\n");
        buf = [];
        size = 0;
      }
    }
    if (buf.length > 0) writeSync(fd, buf.join("\n") + "\n");
  } finally {
    closeSync(fd);
  }
}

export const exportCommand: CommandSpec = {
  ...exportHelp,
  async run(args, io) {
    const o = args.options;
    const csv = o["csv"] as string | undefined;
    const jsonl = o["jsonl"] as string | undefined;
    if (csv === undefined && jsonl === undefined) throw new InputError("give --csv FILE and/or --jsonl FILE (- for standard output)");
    if (csv === "-" && jsonl === "-") throw new InputError("--csv and --jsonl cannot both go to standard output");
    for (const [name, v] of [["csv", csv], ["jsonl", jsonl]] as const) if (v === "") throw new InputError(`--${name} needs a file name`);
    const table = parseStoreTable(o["table"] as string);
    if (table !== "results") {
      if (o["columns"] !== undefined || o["family"] !== undefined) throw new InputError(`--${o["columns"] !== undefined ? "columns" : "family"} applies to --table results, not ${table}`);
      if (o["name"] !== undefined && !table.startsWith("census-")) throw new InputError(`--name picks a census; --table ${table} has none`);
      const store = openStore(args.positionals[0], { readonly: true });
      try {
        const tableOptions = { timing: o["timing"] === true, census: o["name"] as string | undefined };
        // Check the census name before any file is touched.
        if (tableOptions.census !== undefined && store.census().state(tableOptions.census) === undefined) throw new InputError(`${store.path}: no census named ${JSON.stringify(tableOptions.census)}`);
        if (csv !== undefined) await writeAll(csv, exportTableLines(store, table, "csv", tableOptions), io.stdout);
        if (jsonl !== undefined) await writeAll(jsonl, exportTableLines(store, table, "jsonl", tableOptions), io.stdout);
      } finally {
        store.close();
      }
      return 0;
    }
    if (o["name"] !== undefined) throw new InputError("--name picks a census: give --table census-runs, census-cells or census-histogram");
    const columnsText = o["columns"] as string | undefined;
    const options: ExportOptions = {
      timing: o["timing"] === true,
      columns: columnsText === undefined ? undefined : columnsText.split(",").map((c) => c.trim()).filter((c) => c !== ""),
      filter: o["family"] === undefined ? undefined : { family: o["family"] as string },
    };
    resolveExportColumns(options); // a bad column name fails before any file is touched
    const store = openStore(args.positionals[0], { readonly: true });
    try {
      const targets: [ExportFormat, string][] = [];
      if (csv !== undefined) targets.push(["csv", csv]);
      if (jsonl !== undefined) targets.push(["jsonl", jsonl]);
      for (const [format, target] of targets) await writeAll(target, exportLines(store, format, options), io.stdout);
    } finally {
      store.close();
    }
    return 0;
  },
};
