import { spawnSync } from "node:child_process";
import { closeSync, mkdtempSync, openSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { BIN, ensureBuilt, halfplus } from "./helpers/cli.js";
import { itNeeds, tool } from "./helpers/requirements.js";

beforeAll(ensureBuilt);

const REQUIRED = ["n", "m", "totalWeight", "minDegree", "maxDegree", "avgDegree", "degeneracy", "triangles", "fourCycles", "girth", "bipartite", "components", "free"];

describe("halfplus graph", () => {
  it("describes the Petersen graph (n 10, m 15, 3-regular, girth 5, K3- and C4-free: common knowledge, from memory)", () => {
    const r = halfplus(["graph", "petersen", "--json"]);
    expect(r.stderr).toBe("");
    expect(r.code).toBe(0);
    const s = JSON.parse(r.stdout);
    for (const k of REQUIRED) expect(s).toHaveProperty(k);
    expect(s).toMatchObject({ n: 10, m: 15, minDegree: 3, maxDegree: 3, avgDegree: 3, girth: 5, triangles: 0, fourCycles: 0, bipartite: false, components: 1 });
    expect(s.free).toMatchObject({ K3: true, K4: true, C4: true, C5: false });
  });

  it("prints a readable summary by default", () => {
    // Record plumbing, common practice, no source.
    const r = halfplus(["graph", "petersen"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/girth\s+5/);
  });

  itNeeds([tool("nauty-geng")], "reads a graph6 stream from stdin: one JSON line per graph, as many as nauty-geng emits", () => {
    // Source: nauty-geng itself reports how many graphs it generated (on stderr).
    const geng = spawnSync("nauty-geng", ["-c", "-t", "8"]);
    const reported = Number(/(\d+) graphs generated/.exec(geng.stderr.toString())![1]);
    const r = halfplus(["graph", "-", "--json"], geng.stdout);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split("\n").map((l) => JSON.parse(l));
    expect(lines.length).toBe(reported);
    // -t asks geng for triangle-free graphs and -c for connected ones.
    expect(lines.every((s) => s.triangles === 0 && s.free.K3 === true && s.components === 1)).toBe(true);
  });

  it("rejects a truncated graph6 line with one line naming stdin and the line, exit 2", () => {
    // graph6 for 5 vertices needs 2 body characters after "D" (nauty formats.txt); "Ds" has one.
    const r = halfplus(["graph", "-", "--format", "graph6"], "DQc\nDs\n");
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toMatch(/stdin:2/);
  });

  it("names a missing file, an unknown family and a bad parameter; exit 2", () => {
    for (const [arg, re] of [
      ["no-such-file.g6", /no-such-file\.g6: no such file/],
      ["nosuchfamily:q=3", /no family called "nosuchfamily"/],
      ["complete:n=-2", /invalid `n`/],
    ] as const) {
      const r = halfplus(["graph", arg]);
      expect(r.code).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(re);
    }
    const bad = halfplus(["graph", "petersen", "--format", "xml"]);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/^halfplus graph: --format must be one of/);
  });

  it("refuses a header vertex count too large to hold, and a non-decimal spec number, in one line", () => {
    // Input validation, common practice, no source.
    const dir = mkdtempSync(join(tmpdir(), "halfplus-cli-"));
    const f = join(dir, "huge.txt");
    writeFileSync(f, "2000000000 1\n1 2 1\n");
    const r = halfplus(["graph", f, "--format", "gset"]);
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split("\n")).toHaveLength(1);
    expect(r.stderr).toContain(`${f}: vertex count n = 2000000000`);
    expect(r.stderr).toMatch(/at most 1e\+8 vertices/);
    const hex = halfplus(["graph", "kneser:n=8,k=0x3"]);
    expect(hex.code).toBe(2);
    expect(hex.stderr).toMatch(/invalid `k`: should be a number/);
  });

  it("names file and line for a duplicate edge in an edge list", () => {
    const dir = mkdtempSync(join(tmpdir(), "halfplus-cli-"));
    const f = join(dir, "dup.edges");
    writeFileSync(f, "# a comment\n0 1\n1 2\n2 1\n");
    const r = halfplus(["graph", f]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`${f}:4`);
    expect(r.stderr).toMatch(/duplicate/);
    const merged = halfplus(["graph", f, "--merge-duplicates", "--json"]);
    expect(merged.code).toBe(0);
    expect(JSON.parse(merged.stdout).m).toBe(2);
    expect(JSON.parse(merged.stdout).notes).toEqual(["merged 1 duplicate edge(s)"]);
  });
  it("refuses a directory on standard input instead of reading it as zero graphs", () => {
    // Node hands a directory on fd 0 over as an empty stream (common practice, no source):
    // without the check `halfplus graph - < dir` printed nothing and exited 0.
    const dir = mkdtempSync(join(tmpdir(), "halfplus-stdin-dir-"));
    const fd = openSync(dir, "r");
    try {
      const r = spawnSync(process.execPath, [BIN, "graph", "-"], { stdio: [fd, "pipe", "pipe"], timeout: 60_000 });
      expect(r.status).toBe(2);
      const err = r.stderr.toString();
      expect(err.trim().split("\n")).toHaveLength(1);
      expect(err).toMatch(/^halfplus graph: stdin: is a directory/);
    } finally {
      closeSync(fd);
    }
  });
});
