// Stored rows in the shapes the fits and the figures read: FitRow (surplus bounds with m and the
// degree measures) and SurplusRow (the same plus the bounds a figure sets against the bracket).
// src/fit and src/plot declare structurally identical types; nothing here imports them.

import type { StoredRow } from "./columns.js";
import type { ResultStore, RowFilter } from "./store.js";

/** One bracketed graph as a fit reads it. */
export interface FitRow {
  key?: string;
  family?: string;
  n?: number;
  m: number;
  degeneracy?: number;
  maxDegree?: number;
  averageDegree?: number;
  /** Best cut − W/2; null when unknown. */
  surplusLower: number | null;
  /** Certified upper bound − W/2; null when unknown. */
  surplusUpper: number | null;
  /** The bracket is closed by proof. */
  exact: boolean;
}

/**
 * One bracketed graph as a figure reads it: the bracket and the closed-form bounds beside it (all
 * as surpluses). Every field but the optional ones is present: rows lacking one are left out
 * (see `surplusRowsFromStore`).
 */
export interface SurplusRow {
  key: string;
  family: string;
  n: number;
  m: number;
  degeneracy: number;
  maxDegree: number;
  averageDegree: number;
  surplusLower: number;
  surplusUpper: number;
  exact: boolean;
  /** The best cut found (a cut value, not a surplus). */
  bestCut?: number;
  /** Surplus bound from the certified SDP dual, when the SDP ran. */
  sdpBound?: number;
  /** Surplus guaranteed by the explicit vector method. */
  vectorGuarantee?: number;
  /** Edwards' surplus bound (√(8m+1) − 1)/8. */
  edwardsBound?: number;
}

export interface FitRowFilter extends RowFilter {
  /** Closed brackets only. */
  exactOnly?: boolean;
}

const FIT_COLUMNS = ["key", "family", "n", "m", "degeneracy", "maxDegree", "averageDegree", "surplusLower", "surplusUpper", "exact", "lower", "sdpUpper", "totalWeight", "vectorMethod", "edwardsEdges"];

const numOrNull = (v: unknown): number | null => (typeof v === "number" ? v : null);

function* selected(store: ResultStore, filter: FitRowFilter | undefined): Generator<StoredRow> {
  for (const r of store.rows(filter, FIT_COLUMNS)) {
    if (typeof r.m !== "number") continue; // every stored row has m; guards hand-edited stores
    if (filter?.exactOnly === true && r.exact !== 1) continue;
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
    const W = typeof r.totalWeight === "number" ? r.totalWeight : (r.m as number);
    if (typeof r.lower === "number") row.bestCut = r.lower;
    if (typeof r.sdpUpper === "number") row.sdpBound = r.sdpUpper - W / 2;
    if (typeof r.vectorMethod === "number") row.vectorGuarantee = r.vectorMethod;
    if (typeof r.edwardsEdges === "number") row.edwardsBound = r.edwardsEdges;
    out.push(row);
  }
  return out;
}
