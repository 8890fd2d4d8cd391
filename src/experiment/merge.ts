// Union of results stores: rows whose key is new are copied, rows already present must agree on
// every result column (columns.ts `comparedColumns`: not timing, provenance or evidence), and any
// disagreement refuses the whole merge, naming the key and the fields. Merging twice adds nothing.

import { realpathSync, existsSync } from "node:fs";
import { InputError } from "../errors.js";
import { comparedColumns, type CellValue, type StoredRow } from "./columns.js";
import { openStore } from "./sqlite-store.js";
import type { ResultStore } from "./store.js";

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
}

export interface MergeReport {
  into: string;
  sources: MergeSourceReport[];
  /** Rows in the target afterwards. */
  total: number;
}

function realOrSelf(path: string): string {
  return existsSync(path) ? realpathSync(path) : path;
}

/** Copy into `target` the rows of each source (in one transaction; nothing is written on a conflict). */
export function mergeInto(target: ResultStore, sources: readonly ResultStore[]): MergeReport {
  const reports: MergeSourceReport[] = [];
  target.transaction(() => {
    for (const src of sources) {
      const rep: MergeSourceReport = { path: src.path, rows: 0, added: 0, alreadyThere: 0 };
      const conflicts: string[] = [];
      let conflicting = 0;
      let batch: StoredRow[] = [];
      for (const row of src.rows()) {
        rep.rows++;
        const key = String(row.key);
        const have = target.get(key);
        if (have === undefined) {
          batch.push(row);
          if (batch.length >= 1000) {
            rep.added += target.insert(batch);
            batch = [];
          }
          continue;
        }
        const diff = disagreements(have, row);
        if (diff.length === 0) rep.alreadyThere++;
        else {
          conflicting++;
          if (conflicts.length === 0) conflicts.push(`key ${JSON.stringify(key)} differs in ${diff.join(", ")}`);
        }
      }
      rep.added += target.insert(batch);
      if (conflicting > 0) {
        const more = conflicting > 1 ? ` (and ${conflicting - 1} more row${conflicting > 2 ? "s" : ""})` : "";
        throw new InputError(`${src.path}: disagrees with ${target.path}: ${conflicts[0]}${more}; nothing merged`);
      }
      for (const s of src.sweeps()) target.logSweep(s);
      reports.push(rep);
    }
  });
  return { into: target.path, sources: reports, total: target.count() };
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
