// The rows a fit reads (one per bracketed graph, as the results store produces them), the laws a
// fit can take, and the screening that decides which rows a fit uses and why the others are dropped.

import { InputError } from "../errors.js";
import { DEGREE_MEASURES, type DegreeMeasure, type FitRow } from "../experiment/rows.js";

export { DEGREE_MEASURES, type DegreeMeasure, type FitRow };

/**
 * The growth laws a fit can take, all fitted on the log scale (ln = natural log):
 * - "m-and-d": surplus ≈ C·m^a·d^b, terms constant (= ln C), mExponent (a), dExponent (b);
 * - "m": surplus ≈ C·m^a, terms constant, slope (a);
 * - "m-over-sqrt-d": surplus ≈ C·(m/√d)^a, terms constant, slope (a).
 */
export type PowerLaw = "m-and-d" | "m" | "m-over-sqrt-d";
export const POWER_LAWS: readonly PowerLaw[] = ["m-and-d", "m", "m-over-sqrt-d"];

/** Which end of the bracket is the response: the certified lower end, the upper end, or closed brackets only. */
export type SurplusResponse = "lower" | "upper" | "exact";
export const SURPLUS_RESPONSES: readonly SurplusResponse[] = ["lower", "upper", "exact"];

/** A row a fit left out, with the reason in words. `index` is the row's position in the input array (0-based). */
export interface DroppedRow {
  index: number;
  key?: string;
  reason: string;
}

/** A row a fit used: its position in the input array (0-based) and its key. */
export interface UsedRow {
  index: number;
  key?: string;
}

export function lawNeedsDegree(law: PowerLaw): boolean {
  return law !== "m";
}

/** The row's position in a user's eyes: "row 3" or "row 3 (key …)"; rows are numbered from 1. */
export function rowLabel(index: number, key?: string): string {
  return key === undefined ? `row ${index + 1}` : `row ${index + 1} (${key})`;
}

/** Rows that survived screening: their positions, log m, log d (NaN when not needed) and log surplus. */
export interface ScreenedRows {
  used: UsedRow[];
  dropped: DroppedRow[];
  logM: Float64Array;
  logD: Float64Array;
  logSurplus: Float64Array;
}

export interface ScreenOptions {
  response: SurplusResponse;
  degree: DegreeMeasure;
  needsDegree: boolean;
  owner: string;
  /** Row positions in the caller's original array (fitByFamily passes a family's subset). */
  positions?: readonly number[];
}

/**
 * Decide for each row whether a log-scale fit can use it. A row is dropped (with its reason) when the
 * response is missing, not positive (log undefined) or not finite, when m or d is missing, not
 * positive or not finite, or (response "exact") when its bracket is open. Malformed rows (an exact
 * row whose ends differ, a lower end above the upper end) are errors, not drops: they mean the data
 * is wrong, and fitting around them would hide that.
 */
export function screenRows(rows: readonly FitRow[], options: ScreenOptions): ScreenedRows {
  const { response, degree, needsDegree, owner } = options;
  if (!Array.isArray(rows)) throw new InputError(`${owner}: invalid \`rows\`: should be an array of rows (got ${typeof rows})`);
  const used: UsedRow[] = [];
  const dropped: DroppedRow[] = [];
  const logM: number[] = [];
  const logD: number[] = [];
  const logS: number[] = [];
  for (let i = 0; i < rows.length; i++) {
    const row = rows[i];
    const index = options.positions?.[i] ?? i;
    if (row === null || typeof row !== "object") throw new InputError(`${owner}: ${rowLabel(index)}: should be an object (got ${JSON.stringify(row)})`);
    const key = row.key;
    const drop = (reason: string): void => {
      dropped.push(key === undefined ? { index, reason } : { index, key, reason });
    };
    const lo = row.surplusLower;
    const hi = row.surplusUpper;
    if (typeof lo === "number" && typeof hi === "number" && lo > hi + 1e-9 * Math.max(1, Math.abs(hi))) {
      throw new InputError(`${owner}: ${rowLabel(index, key)}: surplusLower ${lo} is above surplusUpper ${hi}`);
    }
    if (row.exact === true && typeof lo === "number" && typeof hi === "number" && Math.abs(lo - hi) > 1e-9 * Math.max(1, Math.abs(hi))) {
      throw new InputError(`${owner}: ${rowLabel(index, key)}: exact is true but surplusLower ${lo} differs from surplusUpper ${hi}`);
    }
    let s: number | null;
    let field: string;
    if (response === "exact") {
      if (row.exact !== true) {
        drop("bracket not closed (response \"exact\" uses closed brackets only)");
        continue;
      }
      s = typeof lo === "number" ? lo : hi;
      field = typeof lo === "number" ? "surplusLower" : "surplusUpper";
    } else {
      s = response === "lower" ? lo : hi;
      field = response === "lower" ? "surplusLower" : "surplusUpper";
    }
    if (s === null || s === undefined) {
      drop(`${field} missing`);
      continue;
    }
    if (typeof s !== "number" || !Number.isFinite(s)) {
      drop(`${field} not a finite number`);
      continue;
    }
    if (s <= 0) {
      drop(`${field} ≤ 0 (no logarithm)`);
      continue;
    }
    const m = row.m;
    if (typeof m !== "number" || !Number.isFinite(m) || m <= 0) {
      drop(m === undefined || m === null ? "m missing" : "m not a positive finite number");
      continue;
    }
    let ld = NaN;
    if (needsDegree) {
      const d = row[degree];
      const name = degree;
      if (d === undefined || d === null) {
        drop(`${name} missing`);
        continue;
      }
      if (typeof d !== "number" || !Number.isFinite(d) || d <= 0) {
        drop(`${name} not a positive finite number`);
        continue;
      }
      ld = Math.log(d);
    }
    used.push(key === undefined ? { index } : { index, key });
    logM.push(Math.log(m));
    logD.push(ld);
    logS.push(Math.log(s));
  }
  return { used, dropped, logM: Float64Array.from(logM), logD: Float64Array.from(logD), logSurplus: Float64Array.from(logS) };
}

/** Counts per reason, most frequent first, for summaries (reasons are fixed phrases, so they group). */
export function droppedCounts(dropped: readonly DroppedRow[]): { reason: string; count: number }[] {
  const byReason = new Map<string, number>();
  for (const d of dropped) byReason.set(d.reason, (byReason.get(d.reason) ?? 0) + 1);
  return [...byReason.entries()].map(([reason, count]) => ({ reason, count })).sort((a, b) => b.count - a.count || a.reason.localeCompare(b.reason));
}
