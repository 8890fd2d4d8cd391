// Sweeps on worker threads, through the API and the built `halfplus` bin: progress, worker
// counts that give byte-identical exports, graph files as sources, the commands around the store.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { exportLines } from "../src/experiment/export.js";
import type { SweepProgress } from "../src/experiment/progress.js";
import { progressLine, progressSentence } from "../src/experiment/progress.js";
import { openStore } from "../src/experiment/sqlite-store.js";
import { runSweep } from "../src/experiment/sweep.js";
import { packJson } from "../src/experiment/witness.js";
import { eigenvalueUpperBound } from "../src/cut/relaxation/eigenvalue-bound.js";
import { encodeGraph6, parseGraph6 } from "../src/graph/formats/graph6.js";
import { parseSparse6 } from "../src/graph/formats/sparse6.js";
import { graphHash } from "../src/graph/hash.js";
import { family } from "../src/families/registry.js";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";
import { gengLines } from "./helpers/nauty.js";
import { itNeeds, tool } from "./helpers/requirements.js";

beforeAll(ensureBuilt);
const dir = mkdtempSync(join(tmpdir(), "halfplus-sweep-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// 40 random graphs on 6–12 vertices in a graph6 file, plus family members: all closed by exact search.
const g6 = join(dir, "random-small.g6");
writeFileSync(g6, Array.from({ length: 40 }, (_, i) => encodeGraph6(family(`gnp:n=${6 + (i % 7)},p=0.45,seed=${i}`))).join("\n") + "\n");
const planPath = join(dir, "mixed.json");
writeFileSync(
  planPath,
  JSON.stringify({
    name: "mixed",
    bracket: { effort: "exact", work: 1_000_000_000 },
    solverSeeds: [0, 1],
    families: [
      { source: "random-small.g6", label: "file" },
      { family: "hfree-process", grid: { n: [10, 14], h: "K3" }, graphSeeds: { from: 0, count: 4 } },
      { specs: ["petersen", "grotzsch"] },
    ],
  }),
);
const JOBS = 2 * (40 + 2 * 4 + 2);

function exportCsv(store: string): string {
  const r = halfplus(["export", store, "--csv", "-"]);
  expect(r.code, r.stderr).toBe(0);
  return r.stdout;
}

describe("runSweep on worker threads", () => {
  it("reports progress to the callback and writes the same rows as the main thread alone", async () => {
    const seen: SweepProgress[] = [];
    const threads = join(dir, "api-threads.db");
    const s = await runSweep(planPath, { store: threads, workers: 2, onProgress: (p) => seen.push(p), progressEvery: 0 });
    expect(s).toMatchObject({ total: JOBS, computed: JOBS, skipped: 0, workers: 2, stopped: false });
    const last = seen[seen.length - 1];
    expect(last).toMatchObject({ finished: true, done: JOBS, total: JOBS, computed: JOBS, degree: "degeneracy" });
    for (let i = 1; i < seen.length; i++) expect(seen[i].done).toBeGreaterThanOrEqual(seen[i - 1].done);
    expect(last.lowest).not.toBeNull();
    expect(progressLine(last)).toMatch(/^mixed 100\/100 100\.0% .* graphs\/s .*c ≤ /);
    expect(progressSentence({ ...last, finished: false, eta: 12, current: { family: "file", n: 9 } })).toMatch(/^mixed: 100 of 100 jobs done \(100\.0%, 0 already stored\), .* graphs\/s, about 0:12 left; running file n=9; lowest surplus\/\(m\/√d\) so far /);

    const inline = join(dir, "api-inline.db");
    await runSweep(planPath, { store: inline, workers: 0 });
    const a = openStore(threads, { readonly: true });
    const b = openStore(inline, { readonly: true });
    expect([...exportLines(a, "csv")]).toEqual([...exportLines(b, "csv")]);
    a.close();
    b.close();
  });

  it("rows of file graphs: the graph is embedded, the max cut matches brute force, the source position counts from 1", () => {
    const st = openStore(join(dir, "api-threads.db"), { readonly: true });
    const rows = [...st.rows({ family: "file" })];
    st.close();
    expect(rows).toHaveLength(80);
    const lines = readFileSync(g6, "utf8").trim().split("\n");
    for (const r of rows) {
      expect(r.graphHash).toMatch(/^sha256:/);
      expect(r.key).toMatch(/^sha256:[0-9a-f]{64}\|solverSeed=[01]\|effort=exact,work=1000000000\|halfplus@/);
      // Embedded as graph6 or sparse6, whichever is shorter: the same graph as the file's line.
      const text = String(r.embedded);
      const embedded = text.startsWith(":") ? parseSparse6(text) : parseGraph6(text);
      expect(graphHash(embedded)).toBe(graphHash(parseGraph6(lines[(r.sourcePosition as number) - 1])));
      expect(r.sourcePath).toBe("random-small.g6");
      // bruteForceMaxCut: the suites' oracle (common practice, no source).
      expect(r.lower).toBe(bruteForceMaxCut(embedded));
    }
  });
});

describe("halfplus sweep", () => {
  it("1 worker and 2 workers give byte-identical CSV exports", () => {
    const one = join(dir, "w1.db");
    const two = join(dir, "w2.db");
    for (const [store, w] of [[one, "1"], [two, "2"]]) {
      const r = halfplus(["sweep", planPath, "--store", store, "--workers", w, "--no-progress"]);
      expect(r.code, r.stderr).toBe(0);
      expect(r.stderr).toBe("");
      expect(r.stdout).toMatch(new RegExp(`^mixed: done, ${JOBS} rows computed, 0 already in `));
    }
    const a = exportCsv(one);
    expect(a.split("\n")).toHaveLength(JOBS + 2); // header, rows, final newline
    expect(exportCsv(two)).toBe(a);
    // With wall-clock fields the exports differ (they are excluded by default for this reason).
    expect(halfplus(["export", one, "--csv", "-", "--timing"]).stdout).not.toBe(halfplus(["export", two, "--csv", "-", "--timing"]).stdout);
  });

  it("plain progress lines when stderr is not a terminal; --list shows what is left; --json summary", () => {
    const store = join(dir, "progress.db");
    const listed = halfplus(["sweep", planPath, "--store", store, "--list"]);
    expect(listed.stdout.trim().split("\n")).toHaveLength(JOBS);
    const r = halfplus(["sweep", planPath, "--store", store, "--workers", "2", "--json", "--shard", "1/3"]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stderr).toMatch(/^mixed: \d+ of 33 jobs done/m);
    expect(JSON.parse(r.stdout)).toMatchObject({ shard: "1/3", total: 33, computed: 33 });
    const left = halfplus(["sweep", planPath, "--store", store, "--list"]);
    expect(left.stdout.trim().split("\n")).toHaveLength(JOBS - 33);
  });

  it("bad input: one line on stderr, exit 2", () => {
    const bad = join(dir, "bad.json");
    writeFileSync(bad, JSON.stringify({ families: [{ family: "kneser", grid: { n: 7, q: 2 } }] }));
    const notStore = join(dir, "notes.txt");
    writeFileSync(notStore, "just text\n");
    const noM = join(dir, "no-m.csv");
    writeFileSync(noM, "n,surplusLower\n5,1\n");
    for (const [args, pattern] of [
      [["sweep", bad, "--store", join(dir, "x.db")], /^halfplus sweep: .*bad\.json: families\[0\]\.grid\.q: kneser has no parameter `q`/],
      [["sweep", planPath, "--shard", "3/3"], /^halfplus sweep: --shard: i counts from 0/],
      [["sweep", planPath, "--store", notStore], /not a halfplus results store/],
      [["sweep", join(dir, "missing.json")], /missing\.json: cannot read plan \(no such file\)/],
      [["export", join(dir, "w1.db")], /give --csv FILE and\/or --jsonl FILE/],
      [["export", join(dir, "nope.db"), "--csv", "-"], /nope\.db: no such results store/],
      [["merge", join(dir, "w1.db")], /--into FILE is required/],
      [["import", noM, "--into", join(dir, "imp.db")], /no-m\.csv:1: needs an `m` column/],
      [["import", notStore, "--into", join(dir, "imp.db")], /notes\.txt:1: unknown column "just text"/],
      [["verify", planPath, "--row", "2"], /--row and --family select rows of a results store/],
    ] as [string[], RegExp][]) {
      const r = halfplus(args);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.stderr.trim().split("\n"), args.join(" ")).toHaveLength(1);
      expect(r.stderr, args.join(" ")).toMatch(pattern);
    }
  });

  it("a bad graph in the middle of a file stops the sweep with one line naming the file and line; the rows before it stay", () => {
    const file = join(dir, "broken.g6");
    writeFileSync(file, `${encodeGraph6(family("cycle:n=5"))}\n${encodeGraph6(family("petersen"))}\n${encodeGraph6(family("cycle:n=7"))}\nD??zzz\n${encodeGraph6(family("cycle:n=9"))}\n`);
    const plan = join(dir, "broken.json");
    writeFileSync(plan, JSON.stringify({ name: "broken", bracket: { effort: "exact", work: 1_000_000_000 }, families: [{ source: "broken.g6" }] }));
    const store = join(dir, "broken.db");
    const r = halfplus(["sweep", plan, "--store", store, "--workers", "1", "--no-progress"]);
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toMatch(/^halfplus sweep: .*broken\.g6:4: /);
    const st = openStore(store, { readonly: true });
    expect(st.count()).toBe(3);
    expect(st.sweeps().map((x) => x.status)).toEqual(["failed"]);
    st.close();
  });

  itNeeds([tool("nauty-geng")], "every connected graph on 6 vertices from nauty-geng: 112 rows (OEIS A001349), each max cut as brute force finds it", () => {
    const file = join(dir, "connected6.g6");
    const lines = gengLines(["-c", "6"]);
    writeFileSync(file, lines.join("\n") + "\n");
    const plan = join(dir, "geng.json");
    writeFileSync(plan, JSON.stringify({ name: "geng6", bracket: { effort: "exact", work: 1_000_000_000 }, families: [{ source: "connected6.g6" }] }));
    const store = join(dir, "geng.db");
    const r = halfplus(["sweep", plan, "--store", store, "--workers", "2", "--no-progress"]);
    expect(r.code, r.stderr).toBe(0);
    const st = openStore(store, { readonly: true });
    const rows = [...st.rows()];
    st.close();
    // A001349: number of connected graphs on n = 6 unlabelled nodes is 112.
    expect(rows).toHaveLength(112);
    for (const row of rows) expect(row.lower).toBe(bruteForceMaxCut(parseGraph6(lines[(row.sourcePosition as number) - 1])));
  });
});

describe("commands around the store", () => {
  it("verify re-checks a store, one row by position or key; export, merge and import work from the command line", () => {
    const store = join(dir, "w1.db");
    const all = halfplus(["verify", store]);
    expect(all.code, all.stdout).toBe(0);
    expect(all.stdout).toMatch(new RegExp(`${JOBS} of ${JOBS} stored rows verified\\n$`));
    const one = halfplus(["verify", store, "--row", "3", "--json"]);
    expect(one.code).toBe(0);
    const v = JSON.parse(one.stdout);
    expect(v).toMatchObject({ row: 3, ok: true });
    const byKey = halfplus(["verify", store, "--row", v.key]);
    expect(byKey.stdout).toMatch(/^row 3 \(.*\): verified: max cut = \d+/);
    expect(halfplus(["verify", store, "--row", "9999"]).stderr).toMatch(/--row 9999: the store holds 100 rows/);

    const jsonl = join(dir, "rows.jsonl");
    expect(halfplus(["export", store, "--jsonl", jsonl, "--family", "petersen"]).code).toBe(0);
    const rows = readFileSync(jsonl, "utf8").trim().split("\n").map((l) => JSON.parse(l));
    // Petersen graph: max cut 12 (from memory), once per solver seed.
    expect(rows.map((r) => [r.spec, r.solverSeed, r.lower])).toEqual([["petersen", 0, 12], ["petersen", 1, 12]]);

    const merged = join(dir, "cli-merged.db");
    const m1 = halfplus(["merge", store, join(dir, "w2.db"), "--into", merged]);
    expect(m1.code, m1.stderr).toBe(0);
    expect(m1.stdout).toMatch(new RegExp(`w2\\.db: ${JOBS} rows, 0 added, ${JOBS} already in`));
    expect(exportCsv(merged)).toBe(exportCsv(store));

    const csv = join(dir, "elsewhere.csv");
    writeFileSync(csv, "n,m,d,surplusLower,surplusUpper\n100,300,3,40,55\n");
    const imp = halfplus(["import", csv, "--into", merged, "--family", "elsewhere"]);
    expect(imp.code, imp.stderr).toBe(0);
    expect(imp.stdout).toMatch(/1 rows, 1 added/);
    const after = halfplus(["verify", merged]);
    expect(after.stdout).toMatch(new RegExp(`${JOBS} of ${JOBS} stored rows verified; 1 imported row carries no bracket to re-check`));
  });

  it("a stored upper end that is only an estimate follows the record files' rule: exit 3, 0 with --accept-estimates", () => {
    // The Petersen graph: λmax(L) = 5 (Brouwer & Haemers, Spectra of Graphs, §1.4.1), so the
    // eigenvalue bound is 10·5/4 = 12.5, floored to 12 = its max cut (from memory). With the shift
    // taken as a Lanczos estimate the bound is not a proof, so the row verifies as an estimate.
    const w1 = openStore(join(dir, "w1.db"), { readonly: true });
    const row = [...w1.rows({ family: "petersen" })][0];
    w1.close();
    const est = eigenvalueUpperBound(family("petersen"), { shiftProof: "lanczos-estimate" });
    const certificate = { kind: "psd-dual", y: Array.from(est.certificate!.y), shift: est.certificate!.shift, shiftProof: "lanczos-estimate", roundedDown: true, tolerance: 0 };
    const path = join(dir, "estimate.db");
    const st = openStore(path);
    st.insert([{ ...row, certificate: packJson(certificate), certificateKind: "psd-dual", upper: Math.floor(est.value), surplusUpper: Math.floor(est.value) - 7.5, upperKind: "estimate", exact: 0, upperMethod: "eigenvalue" }]);
    st.close();
    const plain = halfplus(["verify", path]);
    expect(plain.code, plain.stdout).toBe(3);
    expect(plain.stdout).toMatch(/^row 1 \(petersen\): estimate: max cut in \[12, 12\]/);
    expect(plain.stdout).toMatch(/0 of 1 stored rows verified \(1 with an estimated upper end\)/);
    expect(halfplus(["verify", path, "--accept-estimates"]).code).toBe(0);
    const json = JSON.parse(halfplus(["verify", path, "--json"]).stdout);
    expect(json).toMatchObject({ row: 1, ok: true, verdict: "estimate", upperKind: "estimate" });
  });
});
