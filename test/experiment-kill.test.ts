// Crash safety of the store: a sweep killed with SIGKILL at seeded random moments (six times),
// then resumed, ends with exactly the rows of an uninterrupted run; after every kill the file
// passes SQLite's integrity check and holds no half-written or duplicated row.
import Database from "better-sqlite3";
import { spawn } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { unpackJson, unpackPartition } from "../src/experiment/witness.js";
import { Rng } from "../src/random/prng.js";
import { BIN, ROOT, ensureBuilt, halfplus } from "./helpers/cli.js";

beforeAll(ensureBuilt);
const dir = mkdtempSync(join(tmpdir(), "halfplus-kill-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// 300 graphs of 12 to 20 vertices under effort "exact": every bracket is closed by exhaustive
// search, so the rows (wall-clock fields aside) do not depend on timing, kills or workers.
const plan = join(dir, "kill.json");
writeFileSync(
  plan,
  JSON.stringify({
    name: "kill",
    bracket: { effort: "exact", work: 1_000_000_000 },
    families: [{ family: "gnp", grid: { n: [12, 16, 20], p: 0.3 }, graphSeeds: { from: 0, count: 100 } }],
  }),
);
const JOBS = 300;
const KILLS = 6;

const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

function rowCount(path: string): number {
  try {
    const db = new Database(path, { readonly: true, fileMustExist: true });
    try {
      return db.prepare("select count(*) from results").pluck().get() as number;
    } finally {
      db.close();
    }
  } catch {
    return 0; // not created yet, or the schema is still being written
  }
}

interface Checked {
  rows: number;
  integrity: string;
  duplicates: number;
}

/** Every row whole: its evidence decodes, its numbers are there. */
function checkStore(path: string): Checked {
  const db = new Database(path, { readonly: true });
  try {
    const integrity = db.pragma("integrity_check", { simple: true }) as string;
    const duplicates = db.prepare("select count(*) - count(distinct key) from results").pluck().get() as number;
    const rows = db.prepare("select key, n, lower, upper, exact, witness, certificate from results").all() as { key: string; n: number; lower: number; upper: number; exact: number; witness: Buffer; certificate: Buffer | string }[];
    for (const r of rows) {
      expect(r.exact, r.key).toBe(1);
      expect(r.upper, r.key).toBe(r.lower);
      expect(unpackPartition(r.witness, r.n)).toHaveLength(r.n);
      expect(unpackJson(r.certificate, r.key)).toMatchObject({ kind: "exhaustive" });
    }
    return { rows: rows.length, integrity, duplicates };
  } finally {
    db.close();
  }
}

/** Start a sweep; once the store holds `target` rows, wait `extraMs` more and SIGKILL it. */
async function sweepAndKill(store: string, target: number, extraMs: number): Promise<{ killed: boolean; rowsAtKill: number }> {
  const child = spawn(process.execPath, [BIN, "sweep", plan, "--store", store, "--workers", "2", "--no-progress"], { cwd: ROOT, stdio: "ignore" });
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => child.on("exit", (code, signal) => resolve({ code, signal })));
  let finished = false;
  void exited.then(() => (finished = true));
  const t0 = Date.now();
  while (!finished && rowCount(store) < target && Date.now() - t0 < 60_000) await sleep(15);
  if (!finished) await sleep(extraMs);
  const rowsAtKill = rowCount(store);
  if (!finished) child.kill("SIGKILL");
  const end = await exited;
  return { killed: end.signal === "SIGKILL", rowsAtKill };
}

describe("SIGKILL during a sweep", () => {
  it(`${KILLS} kills at random moments, then a resumed run: exactly the rows of an uninterrupted run`, async () => {
    const reference = join(dir, "reference.db");
    const ref = halfplus(["sweep", plan, "--store", reference, "--workers", "2", "--no-progress"]);
    expect(ref.code, ref.stderr).toBe(0);

    const store = join(dir, "killed.db");
    // Seeded moments: kill once the store holds a random number of rows (spread over the run),
    // plus a random few milliseconds, so kills land inside batches and transactions alike.
    const rng = new Rng(20_240_611);
    const targets = Array.from({ length: KILLS }, () => 1 + rng.nextInt(JOBS - 60)).sort((a, b) => a - b);
    let previous = 0;
    let kills = 0;
    for (const target of targets) {
      const { killed, rowsAtKill } = await sweepAndKill(store, Math.max(target, previous + 1), rng.nextInt(40));
      expect(killed, `the run reached its end before the kill at ${target} rows`).toBe(true);
      kills++;
      const c = checkStore(store);
      expect(c.integrity).toBe("ok"); // SQLite's own check of the file
      expect(c.duplicates).toBe(0);
      // Nothing committed is lost: at least the rows seen just before the kill are there.
      expect(c.rows).toBeGreaterThanOrEqual(rowsAtKill);
      expect(c.rows).toBeGreaterThanOrEqual(previous);
      expect(c.rows).toBeLessThan(JOBS);
      previous = c.rows;
    }
    expect(kills).toBeGreaterThanOrEqual(5);

    const resume = halfplus(["sweep", plan, "--store", store, "--workers", "2", "--no-progress", "--json"]);
    expect(resume.code, resume.stderr).toBe(0);
    const summary = JSON.parse(resume.stdout);
    expect(summary.computed + summary.skipped).toBe(JOBS);
    expect(summary.skipped).toBe(previous); // only what was missing is computed
    expect(checkStore(store)).toEqual({ rows: JOBS, integrity: "ok", duplicates: 0 });

    // Row for row: the export (no wall-clock fields) and the evidence match the uninterrupted run.
    const a = halfplus(["export", reference, "--csv", "-"]);
    const b = halfplus(["export", store, "--csv", "-"]);
    expect(b.stdout.split("\n")).toHaveLength(JOBS + 2);
    expect(b.stdout).toBe(a.stdout);
    const evidence = (path: string): string[] => {
      const db = new Database(path, { readonly: true });
      const out = (db.prepare("select key, hex(witness) || ':' || hex(certificate) as e from results order by key").all() as { key: string; e: string }[]).map((r) => `${r.key} ${r.e}`);
      db.close();
      return out;
    };
    expect(evidence(store)).toEqual(evidence(reference));
    // The killed runs stay in the log as "running"; the last one finished.
    const db = new Database(store, { readonly: true });
    const statuses = db.prepare("select status from sweeps order by startedAt").pluck().all();
    db.close();
    expect(statuses).toEqual([...Array(KILLS).fill("running"), "finished"]);
  }, 180_000);
});

describe("Ctrl-C during a sweep", () => {
  it("SIGINT finishes the jobs in flight, says it stopped (exit 1); the next run completes the plan", async () => {
    const store = join(dir, "interrupted.db");
    const child = spawn(process.execPath, [BIN, "sweep", plan, "--store", store, "--workers", "2", "--no-progress"], { cwd: ROOT, stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    child.stdout.on("data", (d: Buffer) => (out += d.toString()));
    const exited = new Promise<number | null>((resolve) => child.on("exit", (code) => resolve(code)));
    const t0 = Date.now();
    while (rowCount(store) < 20 && Date.now() - t0 < 60_000) await sleep(15);
    child.kill("SIGINT");
    expect(await exited).toBe(1);
    expect(out).toMatch(/^kill: stopped, \d+ rows computed, 0 already in .*\n  .*\n  run the same command again to finish the remaining \d+ jobs\n$/);
    const c = checkStore(store);
    expect(c).toMatchObject({ integrity: "ok", duplicates: 0 });
    expect(c.rows).toBeLessThan(JOBS);
    const db = new Database(store, { readonly: true });
    expect(db.prepare("select status from sweeps").pluck().all()).toEqual(["stopped"]);
    db.close();
    const again = halfplus(["sweep", plan, "--store", store, "--workers", "2", "--no-progress", "--json"]);
    expect(JSON.parse(again.stdout)).toMatchObject({ skipped: c.rows, computed: JOBS - c.rows });
  }, 120_000);
});
