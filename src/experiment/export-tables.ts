// The store's other tables as CSV or JSON lines, beside the results rows of export.ts: the census
// runs, cells and histogram bars, and the hunt frontier. Same conventions as the results export:
// a fixed column and row order, numbers in JavaScript's shortest round-trip form (±inf, nan in
// CSV), wall-clock fields only on request (`timing`), evidence kept for verify (the frontier's
// bracket record) not exported. Lists (a cell's witnesses) are a JSON array in JSON lines and
// graph6 texts separated by single spaces in CSV (graph6 never holds a space).

import { InputError } from "../errors.js";
import { csvText, type ExportFormat } from "./export.js";
import type { HuntFrontierFilter, HuntFrontierRow } from "./hunt-store.js";
import type { ResultStore } from "./store.js";

/** The store's tables an export can write: `results` is export.ts's; the others are here. */
export const STORE_TABLES = ["results", "census-runs", "census-cells", "census-histogram", "hunt-frontier"] as const;
export type StoreTable = (typeof STORE_TABLES)[number];
export type OtherTable = Exclude<StoreTable, "results">;

type Value = string | number | boolean | null | readonly string[];

interface TableColumn {
  name: string;
  /** A wall-clock field: exported only with `timing`. */
  timing?: boolean;
}

const col = (name: string, timing = false): TableColumn => ({ name, timing });

/** Every column of each table, in export order. */
export const TABLE_COLUMNS: Record<OtherTable, readonly TableColumn[]> = {
  "census-runs": [col("census"), col("consumed"), col("fingerprint"), col("witnessLimit"), col("source"), col("complete"), col("version"), col("startedAt", true), col("updatedAt", true), col("finishedAt", true)],
  "census-cells": [col("census"), col("n"), col("m"), col("graphs"), col("minSurplus"), col("attaining"), col("witnesses"), col("minRatio"), col("ratioWitness"), col("ratioDegeneracy"), col("ratioSurplus")],
  "census-histogram": [col("census"), col("n"), col("m"), col("surplus"), col("graphs")],
  "hunt-frontier": [col("pattern"), col("n"), col("objective"), col("m"), col("value"), col("surplusLower"), col("surplusUpper"), col("degeneracy"), col("graph6"), col("graphHash"), col("start"), col("solverSeed"), col("iteration"), col("foundAt", true)],
};

export interface TableExportOptions {
  /** Include the wall-clock fields (census times, the frontier's foundAt). */
  timing?: boolean;
  /** Census tables: only this census. */
  census?: string;
  /** Hunt frontier: only these rows. */
  frontier?: HuntFrontierFilter;
}

/** A table name as given on the command line (`--table`), checked. */
export function parseStoreTable(text: string): StoreTable {
  if (!(STORE_TABLES as readonly string[]).includes(text)) throw new InputError(`--table: no table ${JSON.stringify(text)} (tables: ${STORE_TABLES.join(", ")})`);
  return text as StoreTable;
}

/** The table's rows as plain records, in export order: censuses by name, cells by (n, m), bars by surplus; frontier by (pattern, n, objective, m). */
function* tableRecords(store: ResultStore, table: OtherTable, options: TableExportOptions): Generator<Record<string, Value>> {
  if (table === "hunt-frontier") {
    for (const r of store.huntEntries(options.frontier ?? {})) yield frontierRecord(r);
    return;
  }
  const tables = store.census();
  const states = tables.list().filter((s) => options.census === undefined || s.name === options.census);
  if (options.census !== undefined && states.length === 0) throw new InputError(`${store.path}: no census named ${JSON.stringify(options.census)}`);
  for (const s of states) {
    if (table === "census-runs") {
      yield { census: s.name, consumed: s.consumed, fingerprint: s.fingerprint, witnessLimit: s.witnessLimit, source: s.source, complete: s.finishedAt !== null, version: s.version, startedAt: s.startedAt, updatedAt: s.updatedAt, finishedAt: s.finishedAt };
      continue;
    }
    for (const c of tables.cells(s.name)) {
      if (table === "census-cells") {
        yield { census: s.name, n: c.n, m: c.m, graphs: c.graphs, minSurplus: c.minSurplus, attaining: c.attaining, witnesses: c.witnesses, minRatio: c.minRatio, ratioWitness: c.ratioWitness, ratioDegeneracy: c.ratioDegeneracy, ratioSurplus: c.ratioSurplus };
      } else {
        for (const [twice, graphs] of [...c.histogram.entries()].sort((a, b) => a[0] - b[0])) yield { census: s.name, n: c.n, m: c.m, surplus: twice / 2, graphs };
      }
    }
  }
}

function frontierRecord(r: HuntFrontierRow): Record<string, Value> {
  const { record: _evidence, ...rest } = r;
  return rest;
}

function csvValue(v: Value): string {
  if (v === null) return "";
  if (typeof v === "number") return Number.isFinite(v) ? String(v) : v > 0 ? "inf" : v < 0 ? "-inf" : "nan";
  if (typeof v === "boolean") return v ? "true" : "false";
  if (typeof v === "string") return csvText(v);
  return csvText(v.join(" "));
}

/** The columns a table's export writes. */
export function tableExportColumns(table: OtherTable, options: Pick<TableExportOptions, "timing"> = {}): string[] {
  return TABLE_COLUMNS[table].filter((c) => options.timing === true || c.timing !== true).map((c) => c.name);
}

/** Export lines of one of the store's other tables (each without its newline): the CSV header first, or one JSON object per row. */
export function* exportTableLines(store: ResultStore, table: OtherTable, format: ExportFormat, options: TableExportOptions = {}): Generator<string> {
  const names = tableExportColumns(table, options);
  if (format === "csv") yield names.join(",");
  for (const r of tableRecords(store, table, options)) {
    if (format === "csv") yield names.map((n) => csvValue(r[n] ?? null)).join(",");
    else {
      const o: Record<string, Value> = {};
      for (const n of names) o[n] = r[n] ?? null; // JSON has no ±inf or nan: they print as null
      yield JSON.stringify(o);
    }
  }
}
