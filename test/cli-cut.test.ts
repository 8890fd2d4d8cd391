// End-to-end: `halfplus cut` writes bracket records and `halfplus verify` re-checks them, through
// the built bin, as a user would run them.

import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { itNeeds, tool } from "./helpers/requirements.js";

beforeAll(ensureBuilt);
const dir = mkdtempSync(join(tmpdir(), "halfplus-cli-cut-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("halfplus cut", () => {
  it("petersen --json: one record, max cut 12 proven (from memory), nothing on stderr", () => {
    const r = halfplus(["cut", "petersen", "--json"]);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe("");
    const lines = r.stdout.trim().split("\n");
    expect(lines).toHaveLength(1);
    const rec = JSON.parse(lines[0]);
    expect(rec).toMatchObject({ n: 10, m: 15, lower: 12, upper: 12, exact: true, surplusLower: 4.5, source: { spec: "petersen" } });
    expect(rec.partition).toHaveLength(10);
  });

  it("prints a readable summary by default, and --out still writes the JSON record", () => {
    const out = join(dir, "c7.json");
    const r = halfplus(["cut", "cycle:n=7", "--out", out]);
    expect(r.code).toBe(0);
    // C7 is an odd cycle: max cut 6 (common knowledge).
    expect(r.stdout).toMatch(/max cut\s+6\s+\(optimal\)/);
    expect(JSON.parse(readFileSync(out, "utf8")).lower).toBe(6);
  });

  it("--progress reports on stderr only; stdout stays one JSON line", () => {
    // Record plumbing, common practice, no source.
    const r = halfplus(["cut", "gnp:n=70,p=0.1,seed=2", "--json", "--progress", "--seconds", "1", "--effort", "heuristic"]);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/gnp:n=70/);
    const lines = r.stdout.trim().split("\n");
    expect(lines).toHaveLength(1);
    expect(JSON.parse(lines[0]).lower).toBeLessThanOrEqual(JSON.parse(lines[0]).upper);
  });

  it("--symmetry on branches on orbits and records the maps verify re-checks; off records none", () => {
    // Values: the exact optimum of GP(15,4) from the tree search itself on both settings, and verify
    // re-derives every region bound and map from the graph (test/tree-orbital.test.ts checks the
    // same rule against exactMaxCut and the MILP). Plumbing check, common practice, no source.
    const seen: Record<string, unknown> = {};
    for (const s of ["on", "off"]) {
      const out = join(dir, `gp-${s}.jsonl`);
      const r = halfplus(["cut", "generalized-petersen:n=15,k=4", "--effort", "deep", "--node-bound", "plain", "--branching", "most-decided", "--symmetry", s, "--work", "300000000", "--json", "--out", out]);
      expect(r.code, r.stderr).toBe(0);
      const rec = JSON.parse(r.stdout.trim());
      const tree = rec.runs.find((x: { method: string }) => x.method === "exact-sdp-tree");
      expect(tree?.status).toBe("optimal");
      seen[s] = rec.lower;
      expect(rec.exact).toBe(true);
      if (s === "on") expect(tree.details.orbitalBranches).toBeGreaterThan(0);
      else expect(tree.details.orbitalBranches).toBe(0);
      expect(JSON.stringify(rec.certificate).includes('"orbital"')).toBe(s === "on");
      const v = halfplus(["verify", out]);
      expect(v.code, v.stdout).toBe(0);
    }
    expect(seen["on"]).toBe(seen["off"]);
  });

  it("--parity on closes regions by the cuts' parity and verify re-derives them; off closes none", () => {
    // C30(1,4,7) is 6-regular, so every cut is even (handshake argument; common practice, no source):
    // with parity on the tree rounds bounds to even integers. Values: both settings agree, and verify
    // re-derives every region (test/tree-parity.test.ts checks the rule against exactMaxCut and the MILP).
    const seen: Record<string, unknown> = {};
    for (const s of ["on", "off"]) {
      const out = join(dir, `parity-${s}.jsonl`);
      const r = halfplus(["cut", "circulant:n=30,s=1+4+7", "--effort", "deep", "--node-bound", "plain", "--branching", "most-decided", "--parity", s, "--node-budget", "5000", "--work", "300000000", "--json", "--out", out]);
      expect(r.code, r.stderr).toBe(0);
      const rec = JSON.parse(r.stdout.trim());
      const tree = rec.runs.find((x: { method: string }) => x.method === "exact-sdp-tree");
      seen[s] = rec.lower;
      expect(rec.exact).toBe(true);
      expect(tree?.status).toBe("optimal");
      if (s === "on") expect(tree.details.parityClosed).toBeGreaterThan(0);
      else expect(tree.details.parityClosed).toBe(0);
      const v = halfplus(["verify", out]);
      expect(v.code, v.stdout).toBe(0);
    }
    expect(seen["on"]).toBe(seen["off"]);
  });

  it("bad options and sources exit 2 with one line", () => {
    for (const args of [
      ["cut", "petersen", "--seconds", "0"],
      ["cut", "petersen", "--effort", "fastest"],
      ["cut", "petersen", "--effort", "deep", "--branching", "random"],
      ["cut", "petersen", "--effort", "deep", "--symmetry", "maybe"],
      ["cut", "petersen", "--effort", "deep", "--parity", "maybe"],
      ["cut", "petersen", "--solver-seed", "-3"],
      ["cut", "petersen", "--seed", "3"],
      ["cut", "petersen", "--method", "exact"],
      ["cut", "no-such-graph-file.g6"],
      ["cut"],
    ]) {
      const r = halfplus(args);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.stderr.trim().split("\n"), args.join(" ")).toHaveLength(1);
      expect(r.stdout).toBe("");
    }
  });

  itNeeds([tool("nauty-geng")], "reads a graph6 stream: one record per graph; verify matches them to --graph by position", () => {
    // nauty-geng -c 5 emits the 21 connected graphs on 5 vertices (OEIS A001349).
    const g6 = spawnSync("nauty-geng", ["-cq", "5"]).stdout;
    const file = join(dir, "c5.g6");
    writeFileSync(file, g6);
    const r = halfplus(["cut", "-", "--json", "--seconds", "1"], g6);
    expect(r.code).toBe(0);
    const recs = r.stdout.trim().split("\n").map((l) => JSON.parse(l));
    expect(recs).toHaveLength(21);
    expect(recs.every((x) => x.exact && x.source.path === "-")).toBe(true);
    expect(recs.map((x) => x.source.position)).toEqual(Array.from({ length: 21 }, (_, i) => i + 1));
    const recFile = join(dir, "c5.json");
    writeFileSync(recFile, r.stdout);
    const v = halfplus(["verify", recFile, "--graph", file]);
    expect(v.code).toBe(0);
    expect(v.stdout).toMatch(/21 of 21 records verified/);
  });
});

describe("halfplus verify", () => {
  const recFile = join(dir, "petersen.json");

  it("accepts the record `cut --json` wrote (exit 0)", () => {
    const r = halfplus(["cut", "petersen", "--json"]);
    writeFileSync(recFile, r.stdout);
    const v = halfplus(["verify", recFile]);
    expect(v.stderr).toBe("");
    expect(v.code).toBe(0);
    expect(v.stdout).toMatch(/verified: max cut = 12/);
  });

  it("rejects tampered copies (exit 1) and names the failing check", () => {
    // Input validation, common practice, no source.
    const rec = JSON.parse(readFileSync(recFile, "utf8"));
    const raised = { ...rec, lower: 13, upper: 13, surplusLower: 5.5, surplusUpper: 5.5 };
    const flipped = { ...rec, partition: rec.partition.map((s: number, i: number) => (i === 0 ? 1 - s : s)) };
    for (const [name, bad, check] of [["raised", raised, /lower/], ["flipped", flipped, /lower/]] as const) {
      const f = join(dir, `tampered-${name}.json`);
      writeFileSync(f, JSON.stringify(bad) + "\n");
      const v = halfplus(["verify", f]);
      expect(v.code, name).toBe(1);
      expect(v.stdout).toMatch(/REJECTED/);
      expect(v.stdout).toMatch(check);
    }
  });

  it("a heuristic record with a dual certificate verifies, and a lowered shift is caught", () => {
    const r = halfplus(["cut", "gnp:n=80,p=0.2,seed=5", "--json", "--effort", "heuristic", "--seconds", "1"]);
    expect(r.code).toBe(0);
    const rec = JSON.parse(r.stdout);
    expect(rec.certificate.kind).toBe("psd-dual");
    const f = join(dir, "gnp.json");
    writeFileSync(f, r.stdout);
    expect(halfplus(["verify", f]).code).toBe(0);
    rec.certificate.shift -= 1;
    writeFileSync(f, JSON.stringify(rec));
    const v = halfplus(["verify", f, "--json"]);
    expect(v.code).toBe(1);
    const verdict = JSON.parse(v.stdout);
    expect(verdict.ok).toBe(false);
    expect(verdict.checks.find((c: { name: string }) => c.name === "upper").ok).toBe(false);
  });

  it("unreadable input exits 2 with one line", () => {
    const notRecord = join(dir, "not-record.json");
    writeFileSync(notRecord, JSON.stringify({ hello: 1 }));
    const garbage = join(dir, "garbage.json");
    writeFileSync(garbage, "{\n not json\n");
    for (const args of [["verify", join(dir, "missing.json")], ["verify", notRecord], ["verify", garbage], ["verify", recFile, "--seconds", "-1"]]) {
      const v = halfplus(args);
      expect(v.code, args.join(" ")).toBe(2);
      expect(v.stderr.trim().split("\n")).toHaveLength(1);
    }
  });
});

describe("halfplus verify: malformed `source`", () => {
  it("a record without a usable `source` field is bad input (exit 2, one line), not an internal error", () => {
    const r = halfplus(["cut", "petersen", "--json"]);
    expect(r.code).toBe(0);
    const rec = JSON.parse(r.stdout);
    const noSource = { ...rec };
    delete noSource.source;
    for (const [name, bad] of [["missing", noSource], ["number", { ...rec, source: 5 }]] as const) {
      const f = join(dir, `source-${name}.json`);
      writeFileSync(f, JSON.stringify(bad) + "\n");
      for (const args of [["verify", f], ["verify", f, "--graph", "petersen"]]) {
        const v = halfplus(args);
        expect(v.code, `${name}: ${args.join(" ")}`).toBe(2);
        expect(v.stderr.trim().split("\n"), name).toHaveLength(1);
        expect(v.stderr).toMatch(/source/);
      }
    }
  });
});

describe("records that stand alone", () => {
  it("a record made from standard input verifies by itself: printf 'DQc\\n' | cut - --json > r.jsonl && verify r.jsonl", () => {
    // DQc is the 5-cycle in graph6 (nauty's formats.txt example); C5 has max cut 4 (common knowledge).
    const r = halfplus(["cut", "-", "--json"], "DQc\n");
    expect(r.code).toBe(0);
    const rec = JSON.parse(r.stdout);
    expect(rec).toMatchObject({ kind: "halfplus/bracket", version: 3, lower: 4, upper: 4, exact: true, upperKind: "proven", effort: "auto", solverSeed: 0 });
    expect(rec.source).toMatchObject({ path: "-", position: 1, format: "graph6", embedded: { format: "graph6", text: "DQc" } });
    expect(rec.graphHash).toMatch(/^sha256:[0-9a-f]{64}$/);
    const f = join(dir, "r.jsonl");
    writeFileSync(f, r.stdout);
    const v = halfplus(["verify", f]);
    expect(v.stderr).toBe("");
    expect(v.code).toBe(0);
    expect(v.stdout).toMatch(/record 1 \(stdin\): verified: max cut = 4/);
    // Records read from standard input too, and a tampered embedded graph is caught by its hash.
    expect(halfplus(["verify", "-"], r.stdout).code).toBe(0);
    const other = { ...rec, source: { ...rec.source, embedded: { format: "graph6", text: "D~{" } } }; // K5 (formats.txt)
    const t = halfplus(["verify", "-", "--json"], JSON.stringify(other));
    expect(t.code).toBe(1);
    expect(JSON.parse(t.stdout).checks.find((c: { name: string }) => c.name === "graph").ok).toBe(false);
  });

  it("a graph summary and a bracket of the same graph share the envelope and join by hash", () => {
    const s = JSON.parse(halfplus(["graph", "kneser:n=6,k=2", "--json"]).stdout);
    const c = JSON.parse(halfplus(["cut", "kneser:n=6,k=2", "--json", "--seconds", "2"]).stdout);
    expect(s.kind).toBe("halfplus/graph-summary");
    expect(c.kind).toBe("halfplus/bracket");
    for (const rec of [s, c]) {
      expect(Number.isInteger(rec.version)).toBe(true);
      expect(rec.source).toMatchObject({ spec: "kneser:n=6,k=2", graphSeed: null });
      expect(Array.isArray(rec.notes)).toBe(true);
    }
    expect(s.graphHash).toBe(c.graphHash);
  });

  it("two seeds: --graph-seed picks the random graph (source.graphSeed), --solver-seed the solvers (solverSeed)", () => {
    const a = JSON.parse(halfplus(["cut", "gnp:n=40,p=0.2", "--graph-seed", "3", "--solver-seed", "5", "--json", "--seconds", "1"]).stdout);
    const b = JSON.parse(halfplus(["cut", "gnp:n=40,p=0.2,seed=3", "--json", "--seconds", "1"]).stdout);
    expect(a.source).toMatchObject({ spec: "gnp:n=40,p=0.2,seed=3", graphSeed: 3 });
    expect(a.solverSeed).toBe(5);
    expect(a.graphHash).toBe(b.graphHash);
    const unseeded = JSON.parse(halfplus(["cut", "gnp:n=40,p=0.2", "--json", "--seconds", "1"]).stdout);
    expect(unseeded.source.graphSeed).toBe(0);
    expect(unseeded.notes.join(" ")).toMatch(/no seed given: using graph seed 0/);
    for (const [args, re] of [
      [["cut", "petersen", "--seed", "3"], /--solver-seed.*--graph-seed/],
      [["cut", "gnp:n=40,p=0.2,seed=1", "--graph-seed", "2"], /seed=1 but --graph-seed says 2/],
      [["cut", "petersen", "--graph-seed", "2"], /random families, and petersen is not one/],
    ] as const) {
      const r = halfplus([...args]);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(re);
    }
  });

  it("every command's --help explains its options, and cut's names both seeds", () => {
    const top = halfplus(["--help"]);
    expect(top.code).toBe(0);
    for (const cmd of ["families", "graph", "encode", "cut", "bounds", "verify", "sdp-export", "sweep", "export", "import", "merge", "fit", "census", "hunt", "cluster", "kernel"]) {
      expect(top.stdout).toContain(`  ${cmd} `);
      const h = halfplus([cmd, "--help"]);
      expect(h.code, cmd).toBe(0);
      expect(h.stdout, cmd).toMatch(new RegExp(`^halfplus ${cmd}`));
    }
    const cut = halfplus(["cut", "--help"]).stdout;
    expect(cut).toMatch(/--solver-seed N/);
    expect(cut).toMatch(/--graph-seed N/);
    expect(cut).toMatch(/--effort E/);
  });
});
