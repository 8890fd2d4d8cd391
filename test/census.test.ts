// `halfplus census` against outside sources: every aggregate of the triangle-free and C4-free
// censuses for n ≤ 9 against a brute force written here, graph counts against OEIS (through
// nauty's geng), the largest m of the C4-free census against ex(n, C4); resuming after SIGKILL,
// after --at-most, and refusing a different stream.
import Database from "better-sqlite3";
import { spawn, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Readable } from "node:stream";
import { censusesToShow, censusRecords, censusSurplusRows, runCensus, type CensusOptions } from "../src/experiment/census/index.js";
import { normalisedRatioFigure } from "../src/plot/figures/normalised-ratio.js";
import { openStore } from "../src/experiment/sqlite-store.js";
import { parseGraph6 } from "../src/graph/formats/graph6.js";
import { BIN, ROOT, ensureBuilt, halfplus } from "./helpers/cli.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";
import { gengLines } from "./helpers/nauty.js";
import { itNeeds, tool } from "./helpers/requirements.js";

beforeAll(ensureBuilt);
const dir = mkdtempSync(join(tmpdir(), "halfplus-census-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Cell {
  n: number;
  m: number;
  graphs: number;
  minSurplus: number;
  attaining: number;
  witnesses: string[];
  minRatio: number | null;
  ratioWitness: string | null;
  ratioDegeneracy: number | null;
  ratioSurplus: number | null;
  histogram: { surplus: number; graphs: number }[];
}

/** Degeneracy by peeling a vertex of least degree until none is left (common practice, no source). */
function peelDegeneracy(n: number, edges: [number, number][]): number {
  const nb: Set<number>[] = Array.from({ length: n }, () => new Set());
  for (const [u, v] of edges) {
    nb[u].add(v);
    nb[v].add(u);
  }
  const left = new Set(Array.from({ length: n }, (_, v) => v));
  let d = 0;
  while (left.size > 0) {
    let best = -1;
    for (const v of left) if (best < 0 || nb[v].size < nb[best].size) best = v;
    d = Math.max(d, nb[best].size);
    for (const u of nb[best]) nb[u].delete(best);
    left.delete(best);
  }
  return d;
}

/** The census computed here, graph by graph: brute-force max cut, peeled degeneracy, first witnesses in stream order. */
function oracle(lines: string[], witnessLimit: number): Map<string, Cell> {
  const cells = new Map<string, Cell>();
  const hist = new Map<string, Map<number, number>>();
  for (const line of lines) {
    const g = parseGraph6(line);
    const edges: [number, number][] = [];
    g.forEachEdge((u, v) => edges.push([u, v]));
    const m = edges.length;
    const surplus = bruteForceMaxCut(g) - m / 2;
    const key = `${g.n},${m}`;
    let c = cells.get(key);
    if (c === undefined) {
      c = { n: g.n, m, graphs: 0, minSurplus: Infinity, attaining: 0, witnesses: [], minRatio: null, ratioWitness: null, ratioDegeneracy: null, ratioSurplus: null, histogram: [] };
      cells.set(key, c);
      hist.set(key, new Map());
    }
    c.graphs++;
    const h = hist.get(key)!;
    h.set(surplus, (h.get(surplus) ?? 0) + 1);
    if (surplus < c.minSurplus) {
      c.minSurplus = surplus;
      c.attaining = 0;
      c.witnesses = [];
    }
    if (surplus === c.minSurplus) {
      c.attaining++;
      if (c.witnesses.length < witnessLimit) c.witnesses.push(line);
    }
    if (m > 0) {
      const d = peelDegeneracy(g.n, edges);
      const ratio = (surplus * Math.sqrt(d)) / m;
      if (c.minRatio === null || ratio < c.minRatio) {
        c.minRatio = ratio;
        c.ratioWitness = line;
        c.ratioDegeneracy = d;
        c.ratioSurplus = surplus;
      }
    }
  }
  for (const [key, c] of cells) c.histogram = [...hist.get(key)!.entries()].sort((a, b) => a[0] - b[0]).map(([surplus, graphs]) => ({ surplus, graphs }));
  return cells;
}

function census(args: string[], input?: string | Buffer): { code: number; stdout: string; stderr: string } {
  return halfplus(["census", ...args], input, 300_000);
}

/** Count a stream in this process (workers from the build), as the command does. */
function count(text: string, store: string, options: Partial<CensusOptions> = {}): ReturnType<typeof runCensus> {
  return runCensus({ input: "-", stdin: Readable.from([Buffer.from(text)]), store, workers: 2, ...options });
}

/** A census's cells read back through the library (records as `--json` prints them). */
function cellsIn(path: string, name?: string): Cell[] {
  const store = openStore(path, { readonly: true });
  try {
    return censusesToShow(store, name).flatMap((state) => censusRecords(store, state)) as unknown as Cell[];
  } finally {
    store.close();
  }
}

function cellsOf(store: string, name?: string): Cell[] {
  const r = census([store, "--json", ...(name === undefined ? [] : ["--name", name])]);
  expect(r.stderr).toBe("");
  expect(r.code).toBe(0);
  return r.stdout
    .trim()
    .split("\n")
    .map((l) => JSON.parse(l) as Cell & { kind: string });
}

/** The aggregates only (the source label and counts beside them may differ between runs). */
function aggregates(cells: Cell[]): unknown[] {
  return cells.map((c) => ({ n: c.n, m: c.m, graphs: c.graphs, minSurplus: c.minSurplus, attaining: c.attaining, witnesses: c.witnesses, minRatio: c.minRatio, ratioWitness: c.ratioWitness, ratioDegeneracy: c.ratioDegeneracy, ratioSurplus: c.ratioSurplus, histogram: c.histogram }));
}

function compareWithOracle(got: Cell[], want: Map<string, Cell>): void {
  expect(got.length).toBe(want.size);
  for (const c of got) {
    const w = want.get(`${c.n},${c.m}`);
    expect(w, `cell n=${c.n} m=${c.m}`).toBeDefined();
    expect(aggregates([c])[0], `cell n=${c.n} m=${c.m}`).toEqual(aggregates([w!])[0]);
  }
}

const gengOver = (flag: string, ns: number[]): string[] => ns.flatMap((n) => gengLines([flag, String(n)]));
const range = (a: number, b: number): number[] => Array.from({ length: b - a + 1 }, (_, i) => a + i);

describe("halfplus census", () => {
  itNeeds([tool("nauty-geng")], "triangle-free graphs, n ≤ 9: every aggregate equals the brute force; graph counts equal A006785", () => {
    const lines = gengOver("-t", range(1, 9));
    const store = join(dir, "tf.db");
    // Through the command once (the other cases count in this process, through the same library call).
    const r = census(["-", "--store", store, "--workers", "2", "--batch", "97", "--witnesses", "3", "--no-progress"], lines.join("\n") + "\n");
    expect(r.stderr).toBe("");
    expect(r.code).toBe(0);
    const got = cellsOf(store);
    expect(cellsIn(store)).toEqual(got);
    compareWithOracle(got, oracle(lines, 3));
    // OEIS A006785, triangle-free graphs on n vertices: 1, 2, 3, 7, 14, 38, 107, 410, 1897.
    const perN = range(1, 9).map((n) => got.filter((c) => c.n === n).reduce((s, c) => s + c.graphs, 0));
    expect(perN).toEqual([1, 2, 3, 7, 14, 38, 107, 410, 1897]);
    // Every triangle-free graph with an edge has surplus ≥ 1/2 (common practice, no source: a maximal
    // bipartite subgraph argument gives max cut ≥ m/2 + 1/2 when m ≥ 1); the census must not go below it.
    for (const c of got) if (c.m > 0) expect(c.minSurplus).toBeGreaterThanOrEqual(0.5);
  });

  itNeeds([tool("nauty-geng")], "C4-free graphs: counts equal A006786 (n ≤ 11), the largest m equals ex(n, C4) (A006855), aggregates equal the brute force (n ≤ 9)", async () => {
    const small = gengOver("-f", range(1, 9));
    const all = [...small, ...gengOver("-f", [10, 11])];
    const store = join(dir, "c4.db");
    const summary = await count(all.join("\n") + "\n", store, { name: "c4-free" });
    expect(summary).toMatchObject({ consumed: all.length, counted: all.length, finished: true, stopped: false });
    const got = cellsIn(store, "c4-free");
    // OEIS A006786, squarefree (C4-free) graphs on n nodes: 1, 2, 4, 8, 18, 44, 117, 351, 1230, 5069, 25181
    // (from memory; the same numbers as nauty-geng -f -u on this machine).
    const perN = range(1, 11).map((n) => got.filter((c) => c.n === n).reduce((s, c) => s + c.graphs, 0));
    expect(perN).toEqual([1, 2, 4, 8, 18, 44, 117, 351, 1230, 5069, 25181]);
    // OEIS A006855, ex(n, C4) for n = 1..11: 0, 1, 3, 4, 6, 7, 9, 11, 13, 16, 18.
    const largestM = range(1, 11).map((n) => Math.max(...got.filter((c) => c.n === n).map((c) => c.m)));
    expect(largestM).toEqual([0, 1, 3, 4, 6, 7, 9, 11, 13, 16, 18]);
    compareWithOracle(
      got.filter((c) => c.n <= 9),
      oracle(small, 8),
    );
    // The extremal graphs as rows for the figures: one per cell with an edge, its ratio the cell's.
    const store2 = openStore(store, { readonly: true });
    const rows = censusSurplusRows(store2, censusesToShow(store2, "c4-free")[0]);
    store2.close();
    const withEdges = got.filter((c) => c.m > 0);
    expect(rows.length).toBe(withEdges.length);
    for (const [i, row] of rows.entries()) {
      expect((row.surplusLower * Math.sqrt(row.degeneracy)) / row.m).toBe(withEdges[i].minRatio);
      expect(row.maxDegree).toBeGreaterThanOrEqual(row.degeneracy);
      expect(row.key).toBe(withEdges[i].ratioWitness);
    }
    const figure = normalisedRatioFigure(rows);
    expect(figure.data.length).toBeGreaterThan(0);
  });

  itNeeds([tool("nauty-geng"), tool("nauty-copyg")], "reads sparse6 as it reads graph6 (the same graphs through nauty-copyg -s give the same cells)", async () => {
    const lines = gengOver("-f", range(5, 8));
    const s6 = spawnSync("nauty-copyg", ["-q", "-s"], { input: lines.join("\n") + "\n", encoding: "utf8" });
    expect(s6.status).toBe(0);
    expect(s6.stdout.split("\n").filter((l) => l.startsWith(":")).length).toBe(lines.length);
    const a = join(dir, "g6.db");
    const b = join(dir, "s6.db");
    await count(lines.join("\n") + "\n", a);
    await count(s6.stdout, b);
    expect(aggregates(cellsIn(b))).toEqual(aggregates(cellsIn(a)));
    expect(cellsIn(b).length).toBeGreaterThan(10);
  });

  itNeeds([tool("nauty-geng")], "resumes after SIGKILL with the same aggregates as an uninterrupted run (triangle-free, n = 11)", async () => {
    const stream = join(dir, "t11.g6");
    const lines = gengLines(["-t", "11"]);
    // OEIS A006785: 105071 triangle-free graphs on 11 vertices.
    expect(lines.length).toBe(105071);
    writeFileSync(stream, lines.join("\n") + "\n");
    const whole = join(dir, "whole.db");
    await count(lines.join("\n") + "\n", whole);
    const killed = join(dir, "killed.db");
    const consumedAt: number[] = [];
    for (let kill = 0; kill < 3; kill++) {
      const child = spawn(process.execPath, [BIN, "census", stream, "--store", killed, "--workers", "2", "--batch", "500", "--no-progress"], { cwd: ROOT, stdio: "ignore" });
      let gone = false;
      const exited = new Promise<number | null>((resolve) =>
        child.on("exit", (code) => {
          gone = true;
          resolve(code);
        }),
      );
      // Kill once this run has committed something new (a work-based trigger: no clock decides the test).
      const before = consumedAt.at(-1) ?? 0;
      let now = before;
      while (now <= before) {
        await new Promise((r) => setTimeout(r, 20));
        now = storedConsumed(killed);
        if (now >= lines.length || gone) break;
      }
      child.kill("SIGKILL");
      await exited;
      consumedAt.push(storedConsumed(killed));
    }
    // The kills landed part-way (otherwise the check below proves nothing about resuming).
    expect(consumedAt[0]).toBeGreaterThan(0);
    expect(consumedAt[0]).toBeLessThan(lines.length);
    const last = census([stream, "--store", killed, "--workers", "2", "--no-progress"]);
    expect(last.code).toBe(0);
    expect(last.stdout).toMatch(/resumed after \d+/);
    expect(aggregates(cellsIn(killed))).toEqual(aggregates(cellsIn(whole)));
    const total = cellsIn(killed).reduce((s, c) => s + c.graphs, 0);
    expect(total).toBe(105071);
  }, 300_000);

  itNeeds([tool("nauty-geng")], "continues after atMost, and refuses a different, shorter or re-configured stream", async () => {
    const lines = gengOver("-t", [8, 9]);
    const text = lines.join("\n") + "\n";
    const split = join(dir, "split.db");
    const first = await count(text, split, { atMost: 1000, batchGraphs: 300 });
    expect(first).toMatchObject({ counted: 1000, consumed: 1000, stopped: true, finished: false });
    const second = await count(text, split, { workers: 0 });
    expect(second).toMatchObject({ resumedFrom: 1000, counted: lines.length - 1000, finished: true });
    compareWithOracle(cellsIn(split), oracle(lines, 8));

    const other = join(dir, "other.db");
    await count(text, other, { atMost: 500 });
    const changed = [...lines];
    [changed[10], changed[11]] = [changed[11], changed[10]];
    await expect(count(changed.join("\n") + "\n", other)).rejects.toThrow(/first 500 graphs differ/);
    await expect(count(lines.slice(0, 100).join("\n") + "\n", other)).rejects.toThrow(/holds 100 graphs.*already counted 500/);
    await expect(count(text, other, { witnessLimit: 2 })).rejects.toThrow(/keeps 8 witnesses/);
    // Blank lines and headers carry no graph and do not move the position (nauty's formats.txt allows both).
    const padded = [">>graph6<<" + lines[0], "", ...lines.slice(1, 500), "  ", ...lines.slice(500)].join("\n");
    const again = await count(padded, join(dir, "padded.db"), { batchGraphs: 7 });
    expect(again).toMatchObject({ consumed: lines.length, finished: true });
    expect(aggregates(cellsIn(join(dir, "padded.db")))).toEqual(aggregates(cellsIn(split)));
  });

  itNeeds([tool("nauty-geng")], "a bad line is one error naming file:line (exit 2); the graphs before it stay counted", async () => {
    const lines = gengOver("-t", [7]);
    const bad = [...lines.slice(0, 50), "B!", ...lines.slice(50)];
    const file = join(dir, "bad.g6");
    writeFileSync(file, bad.join("\n") + "\n");
    const store = join(dir, "bad.db");
    const r = census([file, "--store", store, "--batch", "10", "--workers", "1", "--no-progress"]);
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split("\n")).toEqual([`halfplus census: ${file}:51: invalid graph6 character "!" at column 2`]);
    expect(storedConsumed(store)).toBe(50);
    // The same through a stream delivered 5 bytes at a time, with blank and header lines: the line is still named right.
    const text = Buffer.from(["", ">>graph6<<", ...bad.slice(0, 80)].join("\n") + "\n");
    const pieces = Array.from({ length: Math.ceil(text.length / 5) }, (_, i) => text.subarray(5 * i, 5 * i + 5));
    await expect(runCensus({ input: "-", stdin: Readable.from(pieces), store: join(dir, "bad2.db"), workers: 0, batchGraphs: 3 })).rejects.toThrow(/^stdin:53: invalid graph6 character/);
  });

  it("is listed in halfplus --help and explains its options", () => {
    expect(halfplus(["--help"]).stdout).toContain("  census ");
    const h = census(["--help"]);
    expect(h.code).toBe(0);
    expect(h.stdout).toMatch(/^halfplus census/);
    for (const o of ["--store FILE", "--name NAME", "--workers N", "--witnesses N", "--batch N", "--at-most N", "--table", "--json", "--progress"]) expect(h.stdout).toContain(o);
    // Neither a store to count into nor a view asked for: one line, exit 2.
    const r = census(["-"], "");
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toMatch(/--store FILE.*--table \/ --json/);
  });

  it("keeps stores made before the census valid: shown as holding none, given the tables when written", () => {
    const store = join(dir, "old.db");
    // A store with only the tables of the sweep era (meta, results, sweeps) as the store made them.
    const db = new Database(store);
    db.exec(`CREATE TABLE meta (name TEXT PRIMARY KEY, value TEXT NOT NULL); INSERT INTO meta VALUES ('format', 'halfplus-results'), ('schema', '1');`);
    db.exec(`CREATE TABLE results (key TEXT PRIMARY KEY NOT NULL, family TEXT, n INTEGER, m INTEGER); CREATE TABLE sweeps (id TEXT PRIMARY KEY);`);
    db.close();
    const show = census([store, "--table"]);
    expect(show.code).toBe(2);
    expect(show.stderr).toMatch(/holds no census/);
    const add = census(["-", "--store", store, "--no-progress"], "Bw\nCr\n");
    expect(add.code).toBe(0);
    const table = census([store, "--table"]);
    expect(table.code).toBe(0);
    // "Bw" is K3 (max cut 2, surplus 1/2), "Cr" is C4 (bipartite: max cut 4, surplus 2) by graph6's bit
    // order (nauty's formats.txt); the max cuts are common practice, no source.
    expect(table.stdout).toMatch(/census census: 2 graphs from stdin/);
    expect(table.stdout).toMatch(/^ +3 +3 +1 +0\.5 +1 +0\.2357 +Bw$/m);
    expect(table.stdout).toMatch(/^ +4 +4 +1 +2 +1 +0\.7071 +Cr$/m);
  });
});

function storedConsumed(path: string): number {
  try {
    const db = new Database(path, { readonly: true, fileMustExist: true });
    try {
      return (db.prepare("SELECT consumed FROM census_runs WHERE name = 'census'").pluck().get() as number | undefined) ?? 0;
    } finally {
      db.close();
    }
  } catch {
    return 0; // not created yet
  }
}
