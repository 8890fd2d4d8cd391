// Rows measured elsewhere (a CSV with a header: m and surplus bounds at least; n and degree
// measures if known) become store rows of origin "import", so fits and figures treat them like
// swept rows. Each row's key is the CSV's `key` column or `import|family|file:line`; importing
// the same file again adds nothing, and a changed row with the same key is refused.

import { readFileSync } from "node:fs";
import { basename } from "node:path";
import { InputError } from "../errors.js";
import type { StoredRow } from "./columns.js";
import { parseCsv } from "./csv.js";
import { STORED_DEGREES, type StoredDegree } from "./rows.js";
import { disagreements } from "./merge.js";
import type { ResultStore } from "./store.js";

// IMPORT_COLUMNS lives in ./import-columns.ts (`halfplus import --help` lists them without loading this file).
import { IMPORT_COLUMNS } from "./import-columns.js";
export { IMPORT_COLUMNS };

export interface ImportOptions {
  /** Family label for rows without a `family` column (default: the file name without extension). */
  family?: string;
  /** What a `d` column means (default degeneracy). */
  dIs?: StoredDegree;
  /** Leave out columns halfplus does not know, and say which (default: refuse them). */
  skipUnknown?: boolean;
}

export interface ImportReport {
  file: string;
  rows: number;
  added: number;
  alreadyThere: number;
  skippedColumns: string[];
}

/** Parse the CSV into rows (every value checked, errors naming file:line and column). */
export function importRows(text: string, file: string, options: ImportOptions = {}): { rows: StoredRow[]; skippedColumns: string[] } {
  const records = parseCsv(text, file);
  if (records.length === 0) throw new InputError(`${file}: empty (expected a header line and rows)`);
  const header = records[0].fields.map((h) => h.trim());
  const known = new Set<string>(IMPORT_COLUMNS);
  const skipped = header.filter((h) => !known.has(h));
  if (skipped.length > 0 && options.skipUnknown !== true) {
    throw new InputError(`${file}:1: unknown column ${JSON.stringify(skipped[0])} (known: ${IMPORT_COLUMNS.join(", ")}; --skip-unknown leaves such columns out)`);
  }
  const dup = header.find((h, i) => header.indexOf(h) !== i);
  if (dup !== undefined) throw new InputError(`${file}:1: column ${JSON.stringify(dup)} appears twice`);
  if (!header.includes("m")) throw new InputError(`${file}:1: needs an \`m\` column (edges)`);
  if (!["surplusLower", "surplusUpper", "surplus", "lower", "upper"].some((c) => header.includes(c))) {
    throw new InputError(`${file}:1: needs surplus bounds: surplusLower and/or surplusUpper (or surplus, or lower/upper cut values)`);
  }
  const dIs = options.dIs ?? "degeneracy";
  if (!STORED_DEGREES.includes(dIs)) throw new InputError(`import: invalid \`dIs\`: should be one of ${STORED_DEGREES.join(", ")} (got ${JSON.stringify(dIs)})`);
  if (header.includes("d") && header.includes(dIs)) throw new InputError(`${file}:1: has both \`d\` and \`${dIs}\`, which d stands for`);
  const familyDefault = options.family ?? basename(file).replace(/\.[^.]*$/, "");
  const base = basename(file);

  const rows: StoredRow[] = [];
  const keys = new Set<string>();
  for (const rec of records.slice(1)) {
    const at = `${file}:${rec.line}`;
    if (rec.fields.length !== header.length) throw new InputError(`${at}: ${rec.fields.length} fields, the header has ${header.length}`);
    const cell = new Map<string, string>();
    header.forEach((h, i) => cell.set(h, rec.fields[i].trim()));
    const text = (c: string): string | null => {
      const v = cell.get(c);
      return v === undefined || v === "" ? null : v;
    };
    const number = (c: string, integer = false, min = -Infinity): number | null => {
      const v = text(c);
      if (v === null) return null;
      const x = Number(v);
      if (!Number.isFinite(x) || !/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(v)) throw new InputError(`${at}: column ${c}: not a number (${JSON.stringify(v)})`);
      if (integer && !Number.isInteger(x)) throw new InputError(`${at}: column ${c}: should be an integer (got ${v})`);
      if (x < min) throw new InputError(`${at}: column ${c}: should be at least ${min} (got ${v})`);
      return x;
    };
    const m = number("m", true, 0);
    if (m === null) throw new InputError(`${at}: column m: missing`);
    const n = number("n", true, 0);
    const W = number("totalWeight") ?? m;
    // A cut value and a surplus bound are two spellings of one number: take either, check both agree.
    const end = (surplusCol: string, cutCol: string): number | null => {
      const s = number(surplusCol);
      const c = number(cutCol);
      if (s !== null && c !== null && Math.abs(c - W / 2 - s) > 1e-9 * Math.max(1, Math.abs(c))) {
        throw new InputError(`${at}: ${cutCol} ${c} and ${surplusCol} ${s} disagree (${cutCol} − W/2 = ${c - W / 2})`);
      }
      return s ?? (c === null ? null : c - W / 2);
    };
    let sl = end("surplusLower", "lower");
    let su = end("surplusUpper", "upper");
    const s = number("surplus");
    if (s !== null) {
      if ((sl !== null && sl !== s) || (su !== null && su !== s)) throw new InputError(`${at}: surplus ${s} disagrees with the bounds given`);
      sl = s;
      su = s;
    }
    if (sl === null && su === null) throw new InputError(`${at}: no surplus bound given`);
    if (sl !== null && su !== null && sl > su) throw new InputError(`${at}: surplusLower ${sl} is above surplusUpper ${su}`);
    const ex = text("exact");
    let exact: boolean;
    if (ex === null) exact = sl !== null && su !== null && sl === su;
    else if (/^(true|1|yes)$/i.test(ex)) exact = true;
    else if (/^(false|0|no)$/i.test(ex)) exact = false;
    else throw new InputError(`${at}: column exact: should be true or false (got ${JSON.stringify(ex)})`);
    if (exact && (sl === null || su === null || sl !== su)) throw new InputError(`${at}: exact is true but the bounds are not equal`);
    const family = text("family") ?? familyDefault;
    const key = text("key") ?? `import|${family}|${base}:${rec.line}`;
    if (keys.has(key)) throw new InputError(`${at}: key ${JSON.stringify(key)} repeats an earlier row`);
    keys.add(key);
    const degree = (measure: StoredDegree): number | null => number(measure === dIs && cell.has("d") ? "d" : measure, measure !== "averageDegree", 0);
    let notes: string[] = [`imported from ${base}:${rec.line}`];
    const given = text("notes");
    if (given !== null) notes = [...notes, given];
    rows.push({
      key,
      origin: "import",
      family,
      n,
      m,
      totalWeight: W,
      degeneracy: degree("degeneracy"),
      maxDegree: degree("maxDegree"),
      averageDegree: degree("averageDegree"),
      minDegree: degree("minDegree"),
      lower: sl === null ? null : sl + W / 2,
      upper: su === null ? null : su + W / 2,
      surplusLower: sl,
      surplusUpper: su,
      exact: exact ? 1 : 0,
      budgetKind: "none",
      notes: JSON.stringify(notes),
    });
  }
  return { rows, skippedColumns: skipped };
}

/** Import a CSV file into a store (one transaction; a conflicting row refuses the whole file). */
export function importCsvFile(store: ResultStore, file: string, options: ImportOptions = {}): ImportReport {
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(`${file}: cannot read (${code === "ENOENT" ? "no such file" : (code ?? String(e))})`);
  }
  const { rows, skippedColumns } = importRows(text, file, options);
  let added = 0;
  let alreadyThere = 0;
  store.transaction(() => {
    const fresh: StoredRow[] = [];
    for (const r of rows) {
      const have = store.get(String(r.key));
      if (have === undefined) fresh.push(r);
      else {
        const diff = disagreements(have, { ...have, ...r });
        if (diff.length > 0) throw new InputError(`${file}: key ${JSON.stringify(r.key)} is already stored with other values: ${diff.join(", ")}; nothing imported`);
        alreadyThere++;
      }
    }
    added = store.insert(fresh);
  });
  return { file, rows: rows.length, added, alreadyThere, skippedColumns };
}
