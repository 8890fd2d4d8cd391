// The hunt's frontier in the results store (a table of its own, older stores stay valid), the
// frontier figure as data, and `halfplus hunt` end to end: its records pass `halfplus verify`,
// its graphs pass nauty-pickg's C4 filter, bad input exits 2 with one line naming the option.
// Outside sources: nauty-pickg -W0 (no 4-cycle), SQLite's own catalogue (sqlite_master).
import Database from "better-sqlite3";
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { HuntFrontierRow } from "../src/experiment/hunt-store.js";
import { openStore } from "../src/experiment/sqlite-store.js";
import { runSweep } from "../src/experiment/sweep.js";
import { huntFrontierFigure } from "../src/plot/figures/hunt-frontier.js";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { describeNeeds, tool } from "./helpers/requirements.js";

const dir = mkdtempSync(join(tmpdir(), "halfplus-hunt-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function row(m: number, value: number, graph6: string): HuntFrontierRow {
  return {
    pattern: "C4", n: 5, objective: "ratio", m, value, surplusLower: 1, surplusUpper: 1, degeneracy: 2, graph6, graphHash: `sha256:${graph6}`,
    start: "test", solverSeed: 0, iteration: 0, foundAt: "2026-01-01T00:00:00Z", record: "{}",
  };
}

describe("the hunt frontier in the results store", () => {
  it("a store made before the hunt table existed opens, reads no frontier, and keeps its rows when a frontier is added", async () => {
    const path = join(dir, "old.db");
    await runSweep({ name: "tiny", bracket: { effort: "exact", seconds: 10 }, families: [{ specs: ["cycle:n=5", "petersen"] }] }, { store: path, workers: 0 });
    const raw = new Database(path, { readonly: true });
    // sqlite_master lists the tables: the sweep made no hunt table.
    expect(raw.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name = 'hunt_frontier'`).all()).toEqual([]);
    raw.close();
    const ro = openStore(path, { readonly: true });
    expect(ro.huntEntries()).toEqual([]);
    ro.close();
    const s = openStore(path);
    expect(s.putHuntEntry(row(5, 0.5, "Dhc"))).toBe(true);
    expect(s.count()).toBe(2);
    s.close();
  });

  it("keeps the better graph per (pattern, n, objective, m) and refuses a worse one", () => {
    const s = openStore(join(dir, "frontier.db"));
    expect(s.putHuntEntry(row(5, 0.5, "Dhc"))).toBe(true);
    expect(s.putHuntEntry(row(5, 0.6, "DQc"))).toBe(false);
    expect(s.putHuntEntry(row(5, 0.5, "DQc"))).toBe(false); // a tie keeps the first
    expect(s.putHuntEntry(row(5, 0.4, "DUW"))).toBe(true);
    expect(s.putHuntEntry(row(4, 0.9, "DQW"))).toBe(true);
    expect(s.putHuntEntry({ ...row(5, 0.1, "DQW"), objective: "power:0.75" })).toBe(true);
    const ratio = s.huntEntries({ objective: "ratio" });
    expect(ratio.map((r) => [r.m, r.value, r.graph6])).toEqual([[4, 0.9, "DQW"], [5, 0.4, "DUW"]]);
    expect(s.huntEntries().length).toBe(3);
    s.close();
  });
});

describe("the frontier figure", () => {
  const fig = huntFrontierFigure(
    [{ m: 72, value: 0.46, start: "a" }, { m: 71, value: 0.47 }],
    [{ label: "polarity:q=5", m: 90, value: 0.4472 }, { label: "cycle:n=31", m: 31, value: 0.66 }],
    { n: 31, pattern: "C4" },
  );
  it("draws the frontier in m order, one marker per construction and a line at the best construction", () => {
    expect(fig.data[0].x).toEqual([71, 72]);
    expect(fig.data[0].y).toEqual([0.47, 0.46]);
    expect(fig.data.filter((t) => t.uid.startsWith("reference-") && t.mode === "markers").map((t) => t.name)).toEqual(["polarity:q=5", "cycle:n=31"]);
    const line = fig.data.find((t) => t.uid === "reference-best")!;
    expect(line.y).toEqual([0.4472, 0.4472]);
    expect(line.x).toEqual([31, 90]);
    expect(fig.layout.meta.figure).toBe("hunt-frontier");
    expect(fig.layout.title?.text).toContain("C4-free, n = 31");
  });
  it("breaks the frontier line where an m was not reached", () => {
    const g = huntFrontierFigure([{ m: 3, value: 1 }, { m: 4, value: 0.9 }, { m: 7, value: 0.8 }]);
    expect(g.data[0].x).toEqual([3, 4, null, 7]);
    expect(g.data[0].y).toEqual([1, 0.9, null, 0.8]);
  });
  it("refuses a point without a finite value, naming it", () => {
    expect(() => huntFrontierFigure([{ m: 3, value: Number.NaN }])).toThrow(/frontier point 1: `value`/);
    expect(() => huntFrontierFigure([], [{ label: "x", m: 0, value: 1 }])).toThrow(/reference 1: `m`/);
  });
});

describeNeeds([tool("nauty-pickg")], "halfplus hunt", () => {
  beforeAll(() => ensureBuilt());

  it("writes the frontier to the store and records that `halfplus verify` accepts; every graph is C4-free by nauty-pickg", () => {
    const store = join(dir, "hunt.db");
    const records = join(dir, "frontier.jsonl");
    const r = halfplus(["hunt", "--free", "C4", "--n", "20", "--iterations", "400", "--start", "process", "--process-runs", "2", "--store", store, "--records", records, "--json", "--no-progress"]);
    expect(r.stderr).toBe("");
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split("\n").map((l) => JSON.parse(l) as { m: number; graph6: string; value: number });
    expect(lines.length).toBeGreaterThan(0);
    const g6 = lines.map((l) => l.graph6);
    expect(execFileSync("nauty-pickg", ["-q", "-W0"], { input: g6.join("\n") + "\n" }).toString().trim().split("\n")).toEqual(g6);
    const v = halfplus(["verify", records]);
    expect(v.code, v.stdout + v.stderr).toBe(0);
    expect(v.stdout).toContain(`${lines.length} of ${lines.length} records verified`);
    const s = openStore(store, { readonly: true });
    const stored = s.huntEntries({ pattern: "C4", n: 20, objective: "ratio" });
    s.close();
    expect(stored.map((x) => [x.m, x.graph6, x.value])).toEqual(lines.map((l) => [l.m, l.graph6, l.value]));
    expect(readFileSync(records, "utf8").trim().split("\n").length).toBe(lines.length);
  }, 60_000);

  it("refuses bad input with exit 2 and one line naming the option", () => {
    const cases: [string[], RegExp][] = [
      [["--free", "C4", "--n", "10", "--iterations", "5", "--objective", "power"], /--alpha/],
      [["--free", "C4", "--n", "10"], /budget/],
      [["--free", "Q7", "--n", "10", "--iterations", "5"], /Q7/],
      [["--free", "C4", "--n", "3", "--iterations", "5"], /--n 3/],
      [["--free", "C4", "--n", "10", "--iterations", "5", "--m", "4"], /--m belongs/],
      [["--free", "C4", "--n", "10", "--minutes", "0"], /--minutes must be positive/],
    ];
    for (const [args, message] of cases) {
      const r = halfplus(["hunt", ...args, "--store", join(dir, "bad.db"), "--no-progress"]);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.stderr.trim().split("\n").length).toBe(1);
      expect(r.stderr).toMatch(message);
    }
  });
});
