// The results store: rows written by a sweep (checked against a brute-force oracle and known
// values), evidence round trips, export, import, merge, fit rows, and re-checking rows from the store.
import Database from "better-sqlite3";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import { COLUMNS, exportColumns, rowOfValues, rowValues, type StoredRow } from "../src/experiment/columns.js";
import { parseCsv } from "../src/experiment/csv.js";
import { exportLines } from "../src/experiment/export.js";
import { fitRowsFromStore, surplusRowsFromStore } from "../src/experiment/fit-rows.js";
import { importCsvFile } from "../src/experiment/import.js";
import { mergeStores } from "../src/experiment/merge.js";
import { storedBrackets, verifyStoredRows } from "../src/experiment/records.js";
import { isStoreFile, openStore } from "../src/experiment/sqlite-store.js";
import { runSweep } from "../src/experiment/sweep.js";
import { loadPlan, type SweepPlan } from "../src/experiment/plan.js";
import { planSlices } from "../src/experiment/shards.js";
import { packJson, packPartition, unpackJson, unpackPartition } from "../src/experiment/witness.js";
import { family } from "../src/families/registry.js";
import { Rng } from "../src/random/prng.js";
import { boundTightnessFigure } from "../src/plot/figures/bound-tightness.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";
import { allRows } from "./helpers/store.js";

const dir = mkdtempSync(join(tmpdir(), "halfplus-store-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Small graphs only, under a work budget: effort "exact" closes every bracket, so the rows are deterministic.
const PLAN: SweepPlan = {
  name: "small",
  bracket: { effort: "exact", work: 1_000_000_000 },
  families: [
    { specs: ["petersen", "cycle:n=5", "kneser:n=7,k=2"] },
    { family: "gnp", grid: { n: [8, 11], p: 0.4 }, graphSeeds: { from: 0, count: 3 } },
    { family: "andrasfai", grid: { k: { range: { from: 2, to: 4 } } } },
  ],
};
const JOBS = 3 + 2 * 3 + 3;

const full = join(dir, "full.db");
beforeAll(async () => {
  const s = await runSweep(PLAN, { store: full, workers: 0 });
  expect(s).toMatchObject({ total: JOBS, computed: JOBS, skipped: 0, stopped: false });
});

function csvOf(path: string, timing = false): string {
  const st = openStore(path, { readonly: true });
  try {
    return [...exportLines(st, "csv", { timing })].join("\n");
  } finally {
    st.close();
  }
}

describe("evidence encoding", () => {
  it("partitions round-trip through packed bits, compressed above 1 KB", () => {
    const rng = new Rng(5);
    for (const n of [0, 1, 7, 8, 9, 100, 20_000]) {
      const p = Array.from({ length: n }, () => rng.nextInt(2));
      const blob = packPartition(p);
      expect(unpackPartition(blob, n)).toEqual(p);
      expect(blob.length).toBeLessThanOrEqual(Math.ceil(n / 8) + 1);
    }
    expect(() => unpackPartition(packPartition([1, 0, 1]), 20)).toThrow(InputError);
    const big = { y: Array.from({ length: 500 }, (_, i) => i / 7) };
    const blob = packJson(big);
    expect(blob[0]).toBe(1); // deflated
    expect(unpackJson(blob, "x")).toEqual(big);
  });
});

describe("rows written by a sweep", () => {
  it("one row per job, each bracket closed at the brute-force max cut", () => {
    const rows = allRows(full);
    expect(rows).toHaveLength(JOBS);
    for (const r of rows) {
      const g = family(String(r.spec));
      // bruteForceMaxCut: the suites' oracle (Gray-code enumeration; common practice, no source).
      expect(r.lower, String(r.key)).toBe(bruteForceMaxCut(g));
      expect(r).toMatchObject({ upper: r.lower, exact: 1, upperKind: "proven", origin: "sweep", n: g.n, m: g.m, budgetKind: "work", workLimit: 1_000_000_000, budgetSeconds: null, effort: "exact" });
      // Closed by exact search well inside the budget (deterministic: the same count on any machine).
      expect(r.workUsed as number).toBeGreaterThan(0);
      expect(r.workUsed as number).toBeLessThan(1_000_000_000);
      expect(r.surplusLower).toBe((r.lower as number) - g.m / 2);
      expect(typeof r.startedAt).toBe("string");
      expect(r.witness).toBeInstanceOf(Uint8Array);
    }
  });

  it("known values: Petersen max cut 12, girth 5, no triangles or 4-cycles; Edwards' bound; C5", () => {
    const rows = allRows(full);
    const pet = rows.find((r) => r.spec === "petersen")!;
    // Petersen graph: max cut 12 of 15 edges, girth 5, 3-regular (from memory).
    expect(pet).toMatchObject({ lower: 12, n: 10, m: 15, triangles: 0, fourCycles: 0, girth: 5, degeneracy: 3, maxDegree: 3, minDegree: 3, freeK3: 1, freeC4: 1, freeC5: 0, bipartite: 0 });
    // Edwards (1973): surplus ≥ (√(8m+1) − 1)/8 = (√121 − 1)/8 = 1.25 at m = 15.
    expect(pet.edwardsEdges).toBe(1.25);
    // Edwards (1975): connected graph, surplus ≥ (n − 1)/4 = 9/4.
    expect(pet.edwardsVertices).toBe(2.25);
    // Triangle-free bound (1/2π)Σ√d_i = 10·√3/(2π) for the 3-regular Petersen graph (src/bounds; the formula).
    expect(pet.triangleFree).toBeCloseTo((10 * Math.sqrt(3)) / (2 * Math.PI), 12);
    const c5 = rows.find((r) => r.spec === "cycle:n=5")!;
    // An odd cycle C_n has max cut n − 1 (common knowledge).
    expect(c5).toMatchObject({ lower: 4, surplusLower: 1.5, girth: 5 });
    // Kneser KG(7,2) has triangles (three disjoint pairs in a 7-set): the triangle-free bound does not apply.
    const kg = rows.find((r) => r.spec === "kneser:n=7,k=2")!;
    expect(kg.freeK3).toBe(0);
    expect(kg.triangleFree).toBeNull();
    expect(typeof kg.vectorMethod).toBe("number");
  });

  it("re-running computes nothing; a larger plan computes only the new jobs", async () => {
    const again = await runSweep(PLAN, { store: full, workers: 0 });
    expect(again).toMatchObject({ computed: 0, skipped: JOBS });
    const path = join(dir, "grow.db");
    await runSweep({ ...PLAN, families: [PLAN.families[0]] }, { store: path, workers: 0 });
    const grown = await runSweep(PLAN, { store: path, workers: 0 });
    expect(grown).toMatchObject({ computed: JOBS - 3, skipped: 3 });
    expect(csvOf(path)).toBe(csvOf(full));
    const st = openStore(path, { readonly: true });
    expect(st.sweeps().map((s) => s.status)).toEqual(["finished", "finished"]);
    st.close();
  });

  it("SQLite's own integrity check passes and every key is unique", () => {
    const db = new Database(full, { readonly: true });
    expect(db.pragma("integrity_check", { simple: true })).toBe("ok");
    expect(db.prepare("select count(*) - count(distinct key) from results").pluck().get()).toBe(0);
    expect(db.pragma("journal_mode", { simple: true })).toBe("wal");
    db.close();
  });
});

describe("export", () => {
  it("CSV and JSON lines carry the same values in the same order; timing only on request", () => {
    const st = openStore(full, { readonly: true });
    try {
      const csv = [...exportLines(st, "csv")];
      const jsonl = [...exportLines(st, "jsonl")].map((l) => JSON.parse(l) as Record<string, unknown>);
      const cols = exportColumns();
      expect(csv[0]).toBe(cols.map((c) => c.name).join(","));
      expect(cols.some((c) => c.name === "seconds" || c.name === "startedAt")).toBe(false);
      expect(csv).toHaveLength(JOBS + 1);
      const parsed = parseCsv(csv.join("\n"), "x").slice(1);
      parsed.forEach((rec, i) => {
        const o = jsonl[i];
        expect(Object.keys(o)).toEqual(cols.map((c) => c.name));
        cols.forEach((c, j) => {
          const v = o[c.name];
          expect(rec.fields[j], `${c.name} of row ${i + 1}`).toBe(v === null ? "" : String(v));
        });
      });
      // Export order: family, n, m, key.
      const order = jsonl.map((o) => [o.family, o.n, o.m, o.key] as [string, number, number, string]);
      const sorted = [...order].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : a[1] - b[1] || a[2] - b[2] || (a[3] < b[3] ? -1 : 1)));
      expect(order).toEqual(sorted);
      const timed = [...exportLines(st, "csv", { timing: true })];
      expect(timed[0]).toMatch(/,seconds,startedAt,/);
      expect([...exportLines(st, "csv", { columns: ["key", "lower"] })][1]).toMatch(/^"andrasfai:k=2\|.*",4$/);
      expect(() => [...exportLines(st, "csv", { columns: ["key", "nope"] })]).toThrow(/--columns: no column "nope"/);
      expect(() => [...exportLines(st, "csv", { columns: ["witness"] })]).toThrow(/evidence/);
    } finally {
      st.close();
    }
  });
});

describe("import", () => {
  it("reads m, n, d and surplus bounds; idempotent; refuses changed rows, unknown columns and bad numbers", () => {
    const path = join(dir, "imported.db");
    const csv = join(dir, "measured.csv");
    writeFileSync(csv, "family,n,m,d,surplusLower,surplusUpper\nmine,10,15,3,4.5,4.5\nmine,20,40,\"4\",7,9.25\n");
    const st = openStore(path);
    try {
      expect(importCsvFile(st, csv)).toMatchObject({ rows: 2, added: 2, alreadyThere: 0 });
      expect(importCsvFile(st, csv)).toMatchObject({ rows: 2, added: 0, alreadyThere: 2 });
      const rows = fitRowsFromStore(st);
      expect(rows).toEqual([
        { key: "import|mine|measured.csv:2", family: "mine", n: 10, m: 15, degeneracy: 3, surplusLower: 4.5, surplusUpper: 4.5, exact: true },
        { key: "import|mine|measured.csv:3", family: "mine", n: 20, m: 40, degeneracy: 4, surplusLower: 7, surplusUpper: 9.25, exact: false },
      ]);
      // Imported rows without the maximum and average degree cannot be drawn on every axis: left out of SurplusRow.
      const skipped = { count: 0 };
      expect(surplusRowsFromStore(st, undefined, skipped)).toEqual([]);
      expect(skipped.count).toBe(2);
      const lines = [...exportLines(st, "jsonl")].map((l) => JSON.parse(l));
      expect(lines[1]).toMatchObject({ origin: "import", lower: 27, upper: 29.25, budgetKind: "none" });
      writeFileSync(csv, "family,n,m,d,surplusLower,surplusUpper\nmine,10,15,3,4.5,4.5\nmine,20,40,4,7.5,9.25\n");
      expect(() => importCsvFile(st, csv)).toThrow(/key "import\|mine\|measured\.csv:3" is already stored with other values: lower \(27 vs 27\.5\), surplusLower \(7 vs 7\.5\); nothing imported$/);
      expect(st.count()).toBe(2);
      writeFileSync(csv, "m,surplusLower,colour\n5,1,red\n");
      expect(() => importCsvFile(st, csv)).toThrow(/measured\.csv:1: unknown column "colour"/);
      expect(importCsvFile(st, csv, { skipUnknown: true, family: "x" })).toMatchObject({ added: 1, skippedColumns: ["colour"] });
      writeFileSync(csv, "m,surplusLower\n5,1\n6,one\n");
      expect(() => importCsvFile(st, csv)).toThrow(/^.*measured\.csv:3: column surplusLower: not a number \("one"\)$/);
      writeFileSync(csv, "n,surplusLower\n5,1\n");
      expect(() => importCsvFile(st, csv)).toThrow(/needs an `m` column/);
      writeFileSync(csv, "m,lower,surplusLower\n10,7,1\n");
      expect(() => importCsvFile(st, csv)).toThrow(/lower 7 and surplusLower 1 disagree/);
    } finally {
      st.close();
    }
  });
});

describe("merge", () => {
  it("two shards merge into the full store; merging again adds nothing", async () => {
    const a = join(dir, "shard0.db");
    const b = join(dir, "shard1.db");
    await runSweep(PLAN, { store: a, workers: 0, shard: "0/2" });
    await runSweep(PLAN, { store: b, workers: 0, shard: "1/2" });
    const into = join(dir, "merged.db");
    const r = mergeStores([a, b], into);
    expect(r.total).toBe(JOBS);
    // Each shard holds the jobs its cost-balanced slice names (src/experiment/shards.ts).
    const slices = await planSlices(loadPlan(PLAN), 2);
    expect(r.sources.map((s) => s.added)).toEqual(slices.sizes);
    expect(csvOf(into)).toBe(csvOf(full));
    const again = mergeStores([a, b, full], into);
    expect(again.sources.map((s) => s.added)).toEqual([0, 0, 0]);
    expect(again.sources[2].alreadyThere).toBe(JOBS);
    expect(() => mergeStores([into], into)).toThrow(/is the target store itself/);
  });

  it("refuses rows that disagree on the same key, naming the key and the fields, and writes nothing", () => {
    const bad = join(dir, "tampered.db");
    const src = allRows(full);
    const victim = src.find((r) => r.spec === "cycle:n=5")!;
    const st = openStore(bad);
    st.insert([{ ...victim, lower: 5, surplusLower: 2.5 }, { ...src[0], key: "extra|solverSeed=0|x|halfplus@0" }]);
    st.close();
    const into = join(dir, "merged-conflict.db");
    mergeStores([full], into);
    expect(() => mergeStores([bad], into)).toThrow(
      new RegExp(`tampered\\.db: disagrees with .*merged-conflict\\.db: key "cycle:n=5\\|solverSeed=0\\|effort=exact,work=1000000000\\|halfplus@[^"]+" differs in lower \\(4 vs 5\\), surplusLower \\(1\\.5 vs 2\\.5\\); nothing merged$`),
    );
    const after = openStore(into, { readonly: true });
    expect(after.count()).toBe(JOBS); // the extra row of the refused store was not merged
    after.close();
  });
});

describe("rows for fits and figures", () => {
  it("FitRow and SurplusRow carry the bracket and the bounds", () => {
    const st = openStore(full, { readonly: true });
    try {
      const fit = fitRowsFromStore(st, { family: "petersen" });
      expect(fit).toEqual([{ key: expect.stringMatching(/^petersen\|/), family: "petersen", n: 10, m: 15, degeneracy: 3, maxDegree: 3, averageDegree: 3, surplusLower: 4.5, surplusUpper: 4.5, exact: true }]);
      const plot = surplusRowsFromStore(st, { family: "petersen" });
      // Figures read cut values: Edwards' bound m/2 + (√(8m+1) − 1)/8 = 7.5 + 1.25 for m = 15 (Edwards 1973).
      expect(plot[0]).toMatchObject({ bestCut: 12, edwardsBound: 8.75, exact: true, degeneracy: 3 });
      expect(plot[0].totalWeight).toBeUndefined(); // unweighted: W = m
      expect(typeof plot[0].vectorGuarantee).toBe("number");
      // The bound-tightness figure draws them as surpluses again: the store and the figure agree on units.
      const fig = boundTightnessFigure(plot);
      const surplusOf = (name: string): number | undefined => fig.data.find((t) => t.name === name)?.y?.[0] as number | undefined;
      expect(surplusOf("Edwards bound")).toBeCloseTo(1.25, 12);
      expect(surplusOf("best cut found")).toBe(4.5);
      expect(fitRowsFromStore(st, { exactOnly: true })).toHaveLength(JOBS);
      expect(fitRowsFromStore(st, { family: ["andrasfai", "gnp"] })).toHaveLength(9);
    } finally {
      st.close();
    }
  });
});

describe("verify from the store", () => {
  it("every stored row re-checks; a tampered witness or bound is rejected", async () => {
    const st = openStore(full, { readonly: true });
    const verdicts = [];
    for await (const v of verifyStoredRows(st)) verdicts.push(v);
    st.close();
    expect(verdicts).toHaveLength(JOBS);
    expect(verdicts.every((v) => v.ok)).toBe(true);

    const path = join(dir, "forged.db");
    const rows = allRows(full);
    const pet = rows.find((r) => r.spec === "petersen")!;
    const flipped = unpackPartition(pet.witness as Uint8Array, 10);
    flipped[0] ^= 1;
    const forged = openStore(path);
    forged.insert([
      { ...pet, witness: packPartition(flipped) },
      { ...rows.find((r) => r.spec === "cycle:n=5")!, upper: 3, surplusUpper: 0.5, lower: 3, surplusLower: 0.5 },
    ]);
    const out = [];
    for await (const v of verifyStoredRows(forged)) out.push(v);
    forged.close();
    const byGraph = new Map(out.map((v) => [v.key.split("|")[0], v]));
    expect(byGraph.get("petersen")!.ok).toBe(false);
    expect(byGraph.get("petersen")!.checks.find((c) => c.name === "lower")!.ok).toBe(false);
    expect(byGraph.get("cycle:n=5")!.ok).toBe(false);
  });

  it("storedBrackets yields records and graphs; imported rows are passed over", async () => {
    const st = openStore(join(dir, "imported.db"), { readonly: true });
    const got = [];
    for await (const b of storedBrackets(st)) got.push(b);
    st.close();
    expect(got).toHaveLength(0);
  });
});

describe("the store file", () => {
  it("refuses files that are not stores, with one line", () => {
    const text = join(dir, "not-a-store.db");
    writeFileSync(text, "hello\n");
    expect(() => openStore(text)).toThrow(/not-a-store\.db: not a halfplus results store \(not an SQLite file\)/);
    const other = join(dir, "other.sqlite");
    const db = new Database(other);
    db.exec("create table t (x)");
    db.close();
    expect(isStoreFile(other)).toBe(true);
    expect(() => openStore(other)).toThrow(/an SQLite file, but not a halfplus results store/);
    expect(() => openStore(join(dir, "missing.db"), { readonly: true })).toThrow(/no such results store/);
    expect(readFileSync(text, "utf8")).toBe("hello\n"); // untouched
  });

  it("a store made before a column existed gains it on open (values read as null)", () => {
    const path = join(dir, "old.db");
    const st = openStore(path);
    st.insert([allRows(full)[0]]);
    st.close();
    const db = new Database(path);
    db.exec(`alter table results drop column "vectorMethod"`);
    db.close();
    const ro = openStore(path, { readonly: true });
    expect([...ro.rows()][0].vectorMethod).toBeNull();
    ro.close();
    const rw = openStore(path);
    rw.close();
    const check = new Database(path, { readonly: true });
    expect((check.prepare("pragma table_info(results)").all() as { name: string }[]).map((c) => c.name)).toEqual(COLUMNS.map((c) => c.name).filter((n) => n !== "vectorMethod").concat("vectorMethod"));
    check.close();
  });

  it("value arrays and row objects convert both ways", () => {
    const r = allRows(full)[3];
    expect(rowOfValues(rowValues(r))).toEqual(r);
  });
});

describe("surplus arguments recorded per row", () => {
  it("stores the optimised vector guarantee, the few-triangles form and both decomposition columns, each at most the exact surplus", async () => {
    // Lower bounds on the surplus may never exceed the exact surplus (the bracket closes by exhaustive
    // search on these small graphs; brute force below is the independent check): common practice, no source.
    const path = join(dir, "arguments.db");
    const plan: SweepPlan = {
      name: "arguments",
      bracket: { effort: "exact", work: 1_000_000_000 },
      evaluators: ["vector-method", "vector-optimised", "few-triangles", "decomposition"],
      families: [{ specs: ["petersen", "complete:n=7", "kneser:n=7,k=2", "hfree-process:n=12,h=K4,seed=2"] }],
    };
    await runSweep(plan, { store: path, workers: 0 });
    const rows = allRows(path);
    expect(rows).toHaveLength(4);
    for (const r of rows) {
      const g = family(String(r.spec));
      const exactSurplus = bruteForceMaxCut(g) - g.m / 2;
      expect(r.exact).toBe(1);
      expect(r.surplusLower).toBe(exactSurplus);
      for (const c of ["vectorOptimised", "fewTriangles", "decompositionCut", "decompositionGuarantee"]) {
        expect(typeof r[c], `${String(r.spec)} ${c}`).toBe("number");
        expect(r[c] as number).toBeLessThanOrEqual(exactSurplus + 1e-9);
      }
      // The best vector choice starts from the default one and never loses to it.
      expect(r.vectorOptimised as number).toBeGreaterThanOrEqual((r.vectorMethod as number) - 1e-9);
      // A stage guarantee never claims more than the cut it comes with reaches.
      expect(r.decompositionGuarantee as number).toBeLessThanOrEqual((r.decompositionCut as number) + 1e-9);
    }
  });
});
