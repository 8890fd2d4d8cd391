// Union of results stores: rows whose key is new are copied, rows already present must agree on
// every result column (columns.ts `comparedColumns`: not timing, provenance or evidence), and any
// disagreement refuses the whole merge, naming the key and the fields. Merging twice adds nothing.
// The store does each source's union itself where it can (set-based in SQLite: sqlite-store.ts
// `unionFrom`); `unionRowByRow` is the plain path for any other store, with the same outcome.
// The census tables and the hunt frontier merge by their own rules (merge-tables.ts) in the same
// transaction, so a refusal anywhere writes nothing.

import { realpathSync, existsSync } from "node:fs";
import { InputError } from "../errors.js";
import { comparedColumns, type CellValue, type StoredRow } from "./columns.js";
import { mergeCensuses, mergeFrontier, type CensusMergeReport, type FrontierMergeReport } from "./merge-tables.js";
import { openStore } from "./sqlite-store.js";
import type { ResultStore, UnionOutcome } from "./store.js";

const COMPARED = comparedColumns();

function same(a: CellValue | undefined, b: CellValue | undefined): boolean {
  const x = a ?? null;
  const y = b ?? null;
  if (x instanceof Uint8Array || y instanceof Uint8Array) return x instanceof Uint8Array && y instanceof Uint8Array && Buffer.compare(x, y) === 0;
  return x === y;
}

const show = (v: CellValue | undefined): string => (v === null || v === undefined ? "null" : v instanceof Uint8Array ? `${v.length} bytes` : typeof v === "string" ? JSON.stringify(v) : String(v));

/** The result fields on which two rows with the same key differ, as `field (a vs b)`. */
export function disagreements(a: StoredRow, b: StoredRow): string[] {
  const out: string[] = [];
  for (const c of COMPARED) if (!same(a[c.name], b[c.name])) out.push(`${c.name} (${show(a[c.name])} vs ${show(b[c.name])})`);
  return out;
}

export interface MergeSourceReport {
  path: string;
  rows: number;
  added: number;
  /** Rows the target already held, identical in every result field. */
  alreadyThere: number;
  /** The source's censuses (present when it holds any). */
  census?: CensusMergeReport;
  /** The source's hunt frontier (present when it holds any rows). */
  frontier?: FrontierMergeReport;
}

export interface MergeReport {
  into: string;
  sources: MergeSourceReport[];
  /** Rows in the target afterwards. */
  total: number;
  /** Censuses and hunt frontier rows in the target afterwards (present when there are any). */
  censuses?: number;
  frontierRows?: number;
}

function realOrSelf(path: string): string {
  return existsSync(path) ? realpathSync(path) : path;
}

const COMPARED_NAMES = COMPARED.map((c) => c.name);

/** Thrown inside the row-by-row union to roll its writes back; never leaves this module. */
class Refused {
  constructor(readonly outcome: UnionOutcome) {}
}

/**
 * The plain union, for a store that cannot do it set-based (`unionFrom` gives undefined): each
 * source row is looked up by key, new rows are inserted in batches, and a disagreement rolls the
 * source's writes back, so the outcome is the same as the store's own.
 */
export function unionRowByRow(target: ResultStore, src: ResultStore): UnionOutcome {
  try {
    return target.transaction((): UnionOutcome => {
      const out: UnionOutcome = { rows: 0, added: 0, alreadyThere: 0, conflicting: 0 };
      let batch: StoredRow[] = [];
      for (const row of src.rows()) {
        out.rows++;
        const key = String(row.key);
        const have = target.get(key);
        if (have === undefined) {
          batch.push(row);
          if (batch.length >= 1000) {
            out.added += target.insert(batch);
            batch = [];
          }
        } else if (disagreements(have, row).length === 0) out.alreadyThere++;
        else {
          out.conflicting++;
          out.firstConflict ??= key;
        }
      }
      out.added += target.insert(batch);
      if (out.conflicting > 0) throw new Refused({ ...out, added: 0 });
      return out;
    });
  } catch (e) {
    if (e instanceof Refused) return e.outcome;
    throw e;
  }
}

/** Copy into `target` the rows of each source (in one transaction; nothing is written on a conflict). */
export function mergeInto(target: ResultStore, sources: readonly ResultStore[]): MergeReport {
  const reports: MergeSourceReport[] = [];
  target.transaction(() => {
    for (const src of sources) {
      const out = target.unionFrom(src, COMPARED_NAMES) ?? unionRowByRow(target, src);
      if (out.conflicting > 0) {
        const key = out.firstConflict!;
        const diff = disagreements(target.get(key)!, [...src.rows({ keys: [key] })][0]);
        const more = out.conflicting > 1 ? ` (and ${out.conflicting - 1} more row${out.conflicting > 2 ? "s" : ""})` : "";
        throw new InputError(`${src.path}: disagrees with ${target.path}: key ${JSON.stringify(key)} differs in ${diff.join(", ")}${more}; nothing merged`);
      }
      for (const s of src.sweeps()) target.logSweep(s);
      const report: MergeSourceReport = { path: src.path, rows: out.rows, added: out.added, alreadyThere: out.alreadyThere };
      const census = mergeCensuses(target, src);
      if (census.censuses > 0) report.census = census;
      const frontier = mergeFrontier(target, src);
      if (frontier.rows > 0) report.frontier = frontier;
      reports.push(report);
    }
  });
  const result: MergeReport = { into: target.path, sources: reports, total: target.count() };
  const censuses = target.census().list().length;
  const frontierRows = target.huntEntries().length;
  if (censuses > 0) result.censuses = censuses;
  if (frontierRows > 0) result.frontierRows = frontierRows;
  return result;
}

/** `halfplus merge a.db b.db --into all.db`: open the files and merge. */
export function mergeStores(sources: readonly string[], into: string): MergeReport {
  if (sources.length === 0) throw new InputError("merge: name at least one store to merge");
  const targetReal = realOrSelf(into);
  const seen = new Set<string>();
  for (const s of sources) {
    if (!existsSync(s)) throw new InputError(`${s}: no such results store`);
    const real = realpathSync(s);
    if (real === targetReal) throw new InputError(`${s}: is the target store itself`);
    if (seen.has(real)) throw new InputError(`${s}: named twice`);
    seen.add(real);
  }
  const opened: ResultStore[] = [];
  try {
    for (const s of sources) opened.push(openStore(s, { readonly: true }));
    const target = openStore(into);
    try {
      return mergeInto(target, opened);
    } finally {
      target.close();
    }
  } finally {
    for (const s of opened) s.close();
  }
}
