// Merging results stores, on both paths: the SQLite store's set-based union (sqlite-store.ts
// `unionFrom`) and the plain row-by-row union any other store gets (merge.ts `unionRowByRow`).
// A disagreement in any one compared column refuses the merge, naming the key and that field, with
// nothing written; an older store lacking columns still merges, as source and as target.
// The rules checked are the store's own contract (common practice, no source).
import Database from "better-sqlite3";
import { copyFileSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { comparedColumns, type CellValue, type ColumnSpec, type StoredRow } from "../src/experiment/columns.js";
import { disagreements, mergeInto, unionRowByRow } from "../src/experiment/merge.js";
import { openStore } from "../src/experiment/sqlite-store.js";
import type { ResultStore } from "../src/experiment/store.js";
import { runSweep } from "../src/experiment/sweep.js";
import type { SweepPlan } from "../src/experiment/plan.js";
import { allRows } from "./helpers/store.js";

const dir = mkdtempSync(join(tmpdir(), "halfplus-merge-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Small graphs closed by exact search: deterministic rows.
const PLAN: SweepPlan = {
  name: "merge",
  bracket: { effort: "exact", seconds: 30 },
  families: [{ specs: ["petersen", "cycle:n=5", "kneser:n=7,k=2"] }, { family: "gnp", grid: { n: 8, p: 0.4 }, graphSeeds: { from: 0, count: 2 } }],
};
const JOBS = 5;
const full = join(dir, "full.db");
let rows: StoredRow[] = [];

beforeAll(async () => {
  await runSweep(PLAN, { store: full, workers: 0 });
  rows = allRows(full);
  expect(rows).toHaveLength(JOBS);
});

/** A value of the column's type that differs from `v` (null included). */
function changed(spec: ColumnSpec, v: CellValue): CellValue {
  switch (spec.type) {
    case "integer":
      return typeof v === "number" ? v + 1 : 1;
    case "real":
      return typeof v === "number" ? v + 0.5 : 0.5;
    case "boolean":
      return v === 1 ? 0 : 1;
    case "text":
      return typeof v === "string" ? `${v}~` : "x";
    case "blob":
      throw new Error(`${spec.name}: blobs are evidence, never compared`);
  }
}

function storeOf(name: string, content: StoredRow[]): string {
  const path = join(dir, `${name}.db`);
  const st = openStore(path);
  st.insert(content);
  st.close();
  return path;
}

/** Merge the stores at `paths` into `target` (opened read-only, closed after). */
function mergeFiles(target: ResultStore, paths: string[]): ReturnType<typeof mergeInto> {
  const srcs = paths.map((p) => openStore(p, { readonly: true }));
  try {
    return mergeInto(target, srcs);
  } finally {
    for (const s of srcs) s.close();
  }
}

function refusal(target: ResultStore, paths: string[]): string {
  try {
    mergeFiles(target, paths);
  } catch (e) {
    return (e as Error).message;
  }
  throw new Error("the merge was not refused");
}

// The same store without its set-based union: merge takes the plain row-by-row path.
const plain = (s: ResultStore): ResultStore => Object.assign(Object.create(s) as ResultStore, { unionFrom: () => undefined });
const PATHS: [string, (s: ResultStore) => ResultStore][] = [
  ["set-based", (s) => s],
  ["row by row", plain],
];

describe.each(PATHS)("merge, %s", (name, wrap) => {
  it("a disagreement in any one compared column is refused, naming the key and the field; nothing is written", () => {
    const target = openStore(join(dir, `into-${name}.db`));
    try {
      expect(mergeFiles(wrap(target), [full]).sources[0]).toMatchObject({ rows: JOBS, added: JOBS, alreadyThere: 0 });
      const victim = rows.find((r) => r.spec === "petersen")!;
      const extra = `${String(victim.key)}#extra`;
      const cols = comparedColumns();
      expect(cols.length).toBeGreaterThan(40);
      for (const c of cols) {
        const bad = { ...victim, [c.name]: changed(c, victim[c.name]) };
        const diff = disagreements(victim, bad);
        expect(diff).toHaveLength(1);
        expect(diff[0].startsWith(`${c.name} (`)).toBe(true);
        const path = storeOf(`bad-${name}-${c.name}`, [bad, { ...victim, key: extra }]);
        const msg = refusal(wrap(target), [path]);
        expect(msg.startsWith(`${path}: disagrees with ${target.path}: `)).toBe(true);
        expect(msg.endsWith(`: key ${JSON.stringify(victim.key)} differs in ${diff[0]}; nothing merged`)).toBe(true);
        expect(target.has(extra)).toBe(false);
      }
      expect(target.count()).toBe(JOBS);
      expect([...target.rows()]).toEqual(rows);
      // Two disagreeing rows: the first in export order (family, n, m, key) is named, the other counted.
      const two = storeOf(`two-${name}`, rows.filter((r) => r.spec === "petersen" || r.spec === "cycle:n=5").map((r) => ({ ...r, lower: Number(r.lower) + 1 })));
      expect(refusal(wrap(target), [two])).toMatch(/: key "cycle:n=5\|[^"]+" differs in lower \(4 vs 5\) \(and 1 more row\); nothing merged$/);
      // A later source's conflict undoes the earlier sources' rows too: one transaction.
      const fresh = storeOf(`fresh-${name}`, [{ ...victim, key: extra }]);
      expect(refusal(wrap(target), [fresh, two])).toMatch(/two-.*nothing merged$/);
      expect(target.count()).toBe(JOBS);
      const again = mergeFiles(wrap(target), [full, fresh]);
      expect(again.sources.map((s) => [s.added, s.alreadyThere])).toEqual([
        [0, JOBS],
        [1, 0],
      ]);
      expect(again.total).toBe(JOBS + 1);
    } finally {
      target.close();
    }
  });

  it("an older store lacking columns merges, as source and as target (missing values read as null)", () => {
    // workLimit is compared and null in these rows (no work budget); runs is evidence.
    expect(rows.every((r) => r.workLimit === null)).toBe(true);
    const older = join(dir, `older-${name}.db`);
    copyFileSync(full, older);
    const db = new Database(older);
    db.exec(`ALTER TABLE results DROP COLUMN "workLimit"`);
    db.exec(`ALTER TABLE results DROP COLUMN "runs"`);
    db.close();

    const target = openStore(join(dir, `from-older-${name}.db`));
    try {
      expect(mergeFiles(wrap(target), [older]).sources[0]).toMatchObject({ rows: JOBS, added: JOBS, alreadyThere: 0 });
      expect([...target.rows()]).toEqual(rows.map((r) => ({ ...r, runs: null })));
      expect(mergeFiles(wrap(target), [full]).sources[0]).toMatchObject({ added: 0, alreadyThere: JOBS });
    } finally {
      target.close();
    }

    // Opened for writing, the older store gains the missing columns and takes the newer rows.
    const grown = openStore(older);
    try {
      const extra = { ...rows[0], key: `${String(rows[0].key)}#new` };
      const r = mergeFiles(wrap(grown), [full, storeOf(`newer-${name}`, [extra])]);
      expect(r.sources.map((s) => [s.added, s.alreadyThere])).toEqual([
        [0, JOBS],
        [1, 0],
      ]);
      expect(grown.get(String(extra.key))).toEqual(extra);
    } finally {
      grown.close();
    }

    // A compared column the older store lacks but the other holds values for disagrees (null vs value).
    const lacking = join(dir, `lacking-${name}.db`);
    copyFileSync(full, lacking);
    const db2 = new Database(lacking);
    db2.exec(`ALTER TABLE results DROP COLUMN "decompositionGuarantee"`);
    db2.close();
    const into = openStore(join(dir, `vs-lacking-${name}.db`));
    try {
      mergeFiles(wrap(into), [full]);
      expect(rows.every((r) => typeof r.decompositionGuarantee === "number")).toBe(true);
      expect(refusal(wrap(into), [lacking])).toMatch(/differs in decompositionGuarantee \([-\d.e]+ vs null\)( \(and 4 more rows\))?; nothing merged$/);
      expect(into.count()).toBe(JOBS);
    } finally {
      into.close();
    }
  });
});

describe("both paths", () => {
  it("give the same outcome source by source, and a refused union writes nothing", () => {
    const names = comparedColumns().map((c) => c.name);
    const victim = rows.find((r) => r.spec === "cycle:n=5")!;
    const mixed = storeOf("mixed", [{ ...victim, surplusUpper: 9 }, { ...victim, key: "new|one" }, rows.find((r) => r.spec === "petersen")!]);
    const targets = [openStore(join(dir, "parity-a.db")), openStore(join(dir, "parity-b.db"))];
    try {
      for (const path of [full, mixed, full]) {
        const src = openStore(path, { readonly: true });
        try {
          const a = targets[0].unionFrom(src, names);
          const b = unionRowByRow(targets[1], src);
          expect(a).toEqual(b);
          for (const t of targets) expect(t.count()).toBe(JOBS);
          if (path === mixed) expect(b).toEqual({ rows: 3, added: 0, alreadyThere: 1, conflicting: 1, firstConflict: victim.key });
          else expect(b!.conflicting).toBe(0);
        } finally {
          src.close();
        }
      }
      expect([...targets[0].rows()]).toEqual([...targets[1].rows()]);
    } finally {
      for (const t of targets) t.close();
    }
  });
});
