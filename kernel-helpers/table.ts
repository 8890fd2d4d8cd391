// Rows of plain values as a notebook table: HTML for the notebook, aligned text as the fallback.
// Numbers are shown as the report page shows them (`cellText`: six significant digits).

import { InputError, cellText, type ReportValue } from "halfplus";
import { displayOutput, type MimeBundle } from "./channel.js";
import { CELL_LEFT_STYLE, CELL_STYLE, HEAD_LEFT_STYLE, HEAD_STYLE, TABLE_STYLE, caption, frame, htmlEscape } from "./style.js";

export type TableValue = ReportValue;
/** A row: any object; its own enumerable keys are the columns (interfaces welcome, no index signature needed). */
export type TableRow = object;

/** A value as a cell: numbers to six significant digits, yes/no, lists joined, other objects as JSON. */
export function cellString(v: unknown): string {
  if (v === null || v === undefined || typeof v === "number" || typeof v === "string" || typeof v === "boolean") return cellText(v);
  if (Array.isArray(v) && v.every((x) => typeof x === "number" || typeof x === "string")) return cellText(v as (string | number)[]);
  if (typeof v === "bigint") return String(v);
  return JSON.stringify(v) ?? String(v);
}

function value(row: TableRow, column: string): unknown {
  return (row as Record<string, unknown>)[column];
}

export interface TableOptions {
  /** Column order (default: keys in first-seen order across rows). */
  columns?: readonly string[];
  /** A line above the table. */
  caption?: string;
  /** Rows shown before the rest is summarised in one line (default 200). */
  maxRows?: number;
}

function checkedColumns(rows: readonly TableRow[], options: TableOptions): string[] {
  if (!Array.isArray(rows)) throw new InputError("table: `rows` should be an array of objects");
  rows.forEach((r, i) => {
    if (r === null || typeof r !== "object" || Array.isArray(r)) throw new InputError(`table: row ${i + 1} should be an object of column → value`);
  });
  if (options.columns !== undefined && !(Array.isArray(options.columns) && options.columns.every((c) => typeof c === "string")))
    throw new InputError("table: invalid `columns`: a list of column names");
  return options.columns ? [...options.columns] : [...new Set(rows.flatMap((r) => Object.keys(r)))];
}

function numeric(rows: readonly TableRow[], column: string): boolean {
  let any = false;
  for (const r of rows) {
    const v = value(r, column);
    if (v === null || v === undefined) continue;
    if (typeof v !== "number") return false;
    any = true;
  }
  return any;
}

/** Columns padded to equal width: numbers to the right, text to the left. */
export function textTable(rows: readonly TableRow[], columns: readonly string[]): string {
  const right = columns.map((c) => numeric(rows, c));
  const cells = [columns.map((c) => c), ...rows.map((r) => columns.map((c) => cellString(value(r, c))))];
  const width = columns.map((_, j) => Math.max(...cells.map((line) => line[j].length)));
  const pad = (s: string, j: number) => (right[j] ? s.padStart(width[j]) : s.padEnd(width[j]));
  const lines = cells.map((line) => line.map(pad).join("  ").trimEnd());
  lines.splice(1, 0, width.map((w) => "-".repeat(w)).join("  "));
  return lines.join("\n");
}

/** The bundle `table` shows (for tests and for composing larger outputs). */
export function tableBundle(rows: readonly TableRow[], options: TableOptions = {}): MimeBundle {
  const columns = checkedColumns(rows, options);
  const maxRows = options.maxRows ?? 200;
  if (!Number.isInteger(maxRows) || maxRows < 1) throw new InputError(`table: invalid \`maxRows\`: a positive integer (got ${JSON.stringify(options.maxRows)})`);
  const shown = rows.slice(0, maxRows);
  const more = rows.length - shown.length;
  const right = columns.map((c) => numeric(rows, c));
  const head = `<tr>${columns.map((c, j) => `<th scope="col" style="${right[j] ? HEAD_STYLE : HEAD_LEFT_STYLE}">${htmlEscape(c)}</th>`).join("")}</tr>`;
  const body = shown.map((r) => `<tr>${columns.map((c, j) => `<td style="${right[j] ? CELL_STYLE : CELL_LEFT_STYLE}">${htmlEscape(cellString(value(r, c)))}</td>`).join("")}</tr>`).join("");
  const tail = more > 0 ? `<div style="font-size:12px;padding-top:4px">… ${more} more row${more === 1 ? "" : "s"} not shown</div>` : "";
  const html = frame(`${options.caption ? caption(options.caption) : ""}<table style="${TABLE_STYLE}"><thead>${head}</thead><tbody>${body}</tbody></table>${tail}`, "table");
  const text = [options.caption ?? "", textTable(shown, columns), more > 0 ? `… ${more} more row${more === 1 ? "" : "s"} not shown` : ""].filter((s) => s !== "").join("\n");
  return { "text/plain": text, "text/html": html };
}

/** Shows rows as a table in the notebook (text outside one). */
export function table(rows: readonly TableRow[], options: TableOptions = {}): void {
  displayOutput(tableBundle(rows, options));
}
