// Stored rows as CSV or JSON lines: columns in the order of columns.ts, rows in the store's
// export order (family, n, m, key), numbers in JavaScript's shortest round-trip form. Wall-clock
// fields are left out unless asked for, so two runs of the same deterministic plan export the
// same bytes whatever the number of workers.

import { InputError } from "../errors.js";
import { COLUMNS, columnSpec, exportColumns, type CellValue, type ColumnSpec } from "./columns.js";
import type { ResultStore, RowFilter } from "./store.js";

export type ExportFormat = "csv" | "jsonl";

export interface ExportOptions {
  /** Include the wall-clock fields (seconds, startedAt). */
  timing?: boolean;
  /** These columns only, in this order (evidence blobs cannot be exported). */
  columns?: readonly string[];
  filter?: RowFilter;
}

/** The columns an export writes, checked (an unknown name is an InputError naming it). */
export function resolveExportColumns(options: ExportOptions = {}): ColumnSpec[] {
  if (options.columns === undefined) return exportColumns({ timing: options.timing });
  return options.columns.map((name) => {
    const c = columnSpec(name);
    if (c === undefined) throw new InputError(`--columns: no column ${JSON.stringify(name)} (columns: ${exportColumns({ timing: true }).map((x) => x.name).join(", ")})`);
    if (c.group === "evidence") throw new InputError(`--columns: ${name} is evidence kept for verify, not an exportable value`);
    return c;
  });
}

/** A CSV field: quoted when it holds a quote, comma or line break, or leading/trailing blanks (RFC 4180). */
export function csvText(s: string): string {
  return /[",\r\n]/.test(s) || s !== s.trim() ? `"${s.replace(/"/g, '""')}"` : s;
}

function plain(c: ColumnSpec, v: CellValue): string | number | boolean | null {
  if (v === null || v === undefined) return null;
  if (c.type === "boolean") return v === 1;
  if (v instanceof Uint8Array) return null;
  return v;
}

function csvCell(c: ColumnSpec, v: CellValue): string {
  const x = plain(c, v);
  if (x === null) return "";
  if (typeof x === "number") return Number.isFinite(x) ? String(x) : x > 0 ? "inf" : x < 0 ? "-inf" : "nan";
  if (typeof x === "boolean") return x ? "true" : "false";
  return csvText(x);
}

/** Export lines (each without its newline): the CSV header first, or one JSON object per row. */
export function* exportLines(store: ResultStore, format: ExportFormat, options: ExportOptions = {}): Generator<string> {
  const cols = resolveExportColumns(options);
  const names = cols.map((c) => c.name);
  if (format === "csv") yield names.join(",");
  for (const row of store.rows(options.filter, names)) {
    if (format === "csv") yield cols.map((c) => csvCell(c, row[c.name])).join(",");
    else {
      const o: Record<string, unknown> = {};
      for (const c of cols) o[c.name] = plain(c, row[c.name]);
      yield JSON.stringify(o);
    }
  }
}

export { COLUMNS };
