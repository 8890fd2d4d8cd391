// Stored rows in the shapes the fits and the figures read (declared in rows.ts): FitRow (surplus
// bounds with m and the degree measures) and SurplusRow (the same plus the bounds a figure sets
// against the bracket, as cut values).

import { invalidParameter } from "../errors.js";
import type { StoredRow } from "./columns.js";
import type { FitRow, SurplusRow } from "./rows.js";
import type { ResultStore, RowFilter } from "./store.js";

export interface FitRowFilter extends RowFilter {
  /** Closed brackets only. */
  exactOnly?: boolean;
  /**
   * Rows whose upper end is at least this certain (the `upperKind` column): "proven" keeps proven upper
   * ends only, "probable" also those holding with a stated probability, "estimate" (default) every row.
   */
  upperAtLeast?: "proven" | "probable" | "estimate";
}

/** Rank of each upper-end kind, most certain first; rows with another or no kind count as estimates. */
const CERTAINTY: Readonly<Record<string, number>> = { proven: 2, probable: 1, estimate: 0 };

const FIT_COLUMNS = ["key", "family", "n", "m", "degeneracy", "maxDegree", "averageDegree", "surplusLower", "surplusUpper", "exact", "lower", "sdpUpper", "totalWeight", "vectorMethod", "edwardsEdges", "upperKind"];

const numOrNull = (v: unknown): number | null => (typeof v === "number" ? v : null);

function* selected(store: ResultStore, filter: FitRowFilter | undefined): Generator<StoredRow> {
  const least = filter?.upperAtLeast;
  if (least !== undefined && !(least in CERTAINTY)) throw invalidParameter("fitRowsFromStore", "upperAtLeast", "should be one of proven, probable, estimate", least);
  for (const r of store.rows(filter, FIT_COLUMNS)) {
    if (typeof r.m !== "number") continue; // every stored row has m; guards hand-edited stores
    if (filter?.exactOnly === true && r.exact !== 1) continue;
    if (filter?.upperAtLeast !== undefined && (CERTAINTY[String(r.upperKind)] ?? 0) < (CERTAINTY[filter.upperAtLeast] ?? 0)) continue;
    yield r;
  }
}

/** Rows for src/fit, in export order. Optional fields are left out when the row does not have them. */
export function fitRowsFromStore(store: ResultStore, filter?: FitRowFilter): FitRow[] {
  const out: FitRow[] = [];
  for (const r of selected(store, filter)) {
    const row: FitRow = { key: String(r.key), family: String(r.family), m: r.m as number, surplusLower: numOrNull(r.surplusLower), surplusUpper: numOrNull(r.surplusUpper), exact: r.exact === 1 };
    if (typeof r.n === "number") row.n = r.n;
    if (typeof r.degeneracy === "number") row.degeneracy = r.degeneracy;
    if (typeof r.maxDegree === "number") row.maxDegree = r.maxDegree;
    if (typeof r.averageDegree === "number") row.averageDegree = r.averageDegree;
    out.push(row);
  }
  return out;
}

/**
 * Rows for src/plot, in export order. A row without n, one of the three degree measures or one of
 * the two surplus bounds (an imported row, a plan that kept fewer measures) cannot be drawn on
 * every axis and is left out; `skipped` (when given) counts those.
 */
export function surplusRowsFromStore(store: ResultStore, filter?: FitRowFilter, skipped?: { count: number }): SurplusRow[] {
  const out: SurplusRow[] = [];
  const need = ["n", "degeneracy", "maxDegree", "averageDegree", "surplusLower", "surplusUpper"];
  for (const r of selected(store, filter)) {
    if (need.some((k) => typeof r[k] !== "number")) {
      if (skipped !== undefined) skipped.count++;
      continue;
    }
    const row: SurplusRow = {
      key: String(r.key),
      family: String(r.family),
      n: r.n as number,
      m: r.m as number,
      degeneracy: r.degeneracy as number,
      maxDegree: r.maxDegree as number,
      averageDegree: r.averageDegree as number,
      surplusLower: r.surplusLower as number,
      surplusUpper: r.surplusUpper as number,
      exact: r.exact === 1,
    };
    // The bound columns hold surpluses; a figure reads cut values (surplus + W/2).
    const W = typeof r.totalWeight === "number" ? r.totalWeight : (r.m as number);
    if (W !== r.m) row.totalWeight = W;
    if (typeof r.lower === "number") row.bestCut = r.lower;
    if (typeof r.sdpUpper === "number") row.sdpBound = r.sdpUpper;
    if (typeof r.vectorMethod === "number") row.vectorGuarantee = r.vectorMethod + W / 2;
    if (typeof r.edwardsEdges === "number") row.edwardsBound = r.edwardsEdges + W / 2;
    out.push(row);
  }
  return out;
}
