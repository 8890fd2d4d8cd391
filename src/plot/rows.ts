// Checking the rows and options a figure is asked to draw.
// Bad rows stop with one line naming the row (1-based, like every position in halfplus) and the
// field; rows that are fine but cannot be drawn (say, on log axes) are left out with a note.

import { InputError, invalidParameter } from "../errors.js";
import type { SurplusRow } from "./types.js";

/** Throws unless `value` is one of `allowed`. */
export function checkChoice<T extends string>(owner: string, name: string, value: T | undefined, allowed: readonly T[], fallback: T): T {
  if (value === undefined) return fallback;
  if (!allowed.includes(value)) throw invalidParameter(owner, name, `one of ${allowed.join(", ")}`, value);
  return value;
}

/** Throws unless the confidence level is strictly between 0 and 1. */
export function checkLevel(owner: string, level: number | undefined): number {
  if (level === undefined) return 0.95;
  if (!(typeof level === "number" && level > 0 && level < 1)) throw invalidParameter(owner, "level", "a number strictly between 0 and 1", level);
  return level;
}

const COUNT_FIELDS = ["n", "m", "degeneracy", "maxDegree", "averageDegree"] as const;
const OPTIONAL_CUT_FIELDS = ["bestCut", "sdpBound", "vectorGuarantee", "edwardsBound"] as const;

function where(owner: string, i: number, row: SurplusRow | undefined): string {
  const label = row && typeof row.family === "string" ? ` (${row.key ?? row.family})` : "";
  return `${owner}: row ${i + 1}${label}`;
}

/** Validates every row up front: numbers finite and non-negative, the bracket ordered. */
export function checkRows(owner: string, rows: readonly SurplusRow[]): void {
  if (!Array.isArray(rows)) throw new InputError(`${owner}: \`rows\` should be an array of rows (got ${typeof rows})`);
  rows.forEach((row, i) => {
    if (row === null || typeof row !== "object") throw new InputError(`${where(owner, i, undefined)}: should be an object`);
    if (typeof row.family !== "string" || row.family === "") throw new InputError(`${where(owner, i, row)}: \`family\` should be a non-empty string`);
    for (const f of COUNT_FIELDS) {
      const v = row[f];
      if (!(typeof v === "number" && Number.isFinite(v) && v >= 0))
        throw new InputError(`${where(owner, i, row)}: \`${f}\` should be a finite number ≥ 0 (got ${JSON.stringify(v)})`);
    }
    for (const f of ["surplusLower", "surplusUpper"] as const) {
      const v = row[f];
      if (!(typeof v === "number" && Number.isFinite(v))) throw new InputError(`${where(owner, i, row)}: \`${f}\` should be a finite number (got ${JSON.stringify(v)})`);
    }
    if (row.surplusLower > row.surplusUpper)
      throw new InputError(`${where(owner, i, row)}: \`surplusLower\` ${row.surplusLower} is above \`surplusUpper\` ${row.surplusUpper}`);
    if (row.totalWeight !== undefined && !(typeof row.totalWeight === "number" && Number.isFinite(row.totalWeight)))
      throw new InputError(`${where(owner, i, row)}: \`totalWeight\` should be a finite number when given (got ${JSON.stringify(row.totalWeight)})`);
    for (const f of OPTIONAL_CUT_FIELDS) {
      const v = row[f];
      if (v !== undefined && !(typeof v === "number" && Number.isFinite(v)))
        throw new InputError(`${where(owner, i, row)}: \`${f}\` should be a finite number when given (got ${JSON.stringify(v)})`);
    }
    if (row.degrees !== undefined) {
      const degrees: unknown = row.degrees;
      if (!Array.isArray(degrees) || !degrees.every((d: unknown) => Number.isInteger(d) && (d as number) >= 0))
        throw new InputError(`${where(owner, i, row)}: \`degrees\` should be an array of integers ≥ 0`);
    }
  });
}

/** Counts of rows left out, by reason, turned into notes. */
export class LeftOut {
  private readonly counts = new Map<string, number>();
  add(reason: string): void {
    this.counts.set(reason, (this.counts.get(reason) ?? 0) + 1);
  }
  notes(): string[] {
    return [...this.counts].map(([reason, k]) => `${k} ${k === 1 ? "row" : "rows"} left out: ${reason}`);
  }
}

/** Distinct families in first-seen order. */
export function familiesOf(rows: readonly { family?: string }[], unnamed = "all"): string[] {
  const seen: string[] = [];
  for (const r of rows) {
    const f = r.family ?? unnamed;
    if (!seen.includes(f)) seen.push(f);
  }
  return seen;
}
