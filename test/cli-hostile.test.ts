// Hostile input through the built `halfplus` bin, as a user (or an attacker) would send it: signals
// during `cut`, forged and malformed records for `verify`, inputs that declare more than they hold,
// ambiguous files, non-decimal numbers, empty files and unprintable names. Every check is about the
// program's own contract (one-line errors, exit statuses, nothing lost), common practice, no source,
// unless a comment names one.
import { spawn, spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { BIN, ROOT, ensureBuilt, halfplus } from "./helpers/cli.js";
import { itNeeds, tool } from "./helpers/requirements.js";

beforeAll(ensureBuilt);
const dir = mkdtempSync(join(tmpdir(), "halfplus-hostile-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Exit 2 with exactly one line on stderr that matches `re`, nothing on stdout. */
function expectBadInput(args: string[], re: RegExp, env: NodeJS.ProcessEnv = {}): string {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: ROOT, env: { ...process.env, ...env }, timeout: 120_000 });
  const err = r.stderr.toString();
  expect(r.status, `${args.join(" ")}: ${err}`).toBe(2);
  expect(err.trim().split("\n"), args.join(" ")).toHaveLength(1);
  expect(err).toMatch(re);
  expect(r.stdout.toString()).toBe("");
  return err;
}

/** Run `halfplus cut` until its first progress line, then send `signal`; resolves with what it wrote. */
function interruptCut(args: string[], signal: NodeJS.Signals): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [BIN, "cut", ...args, "--progress"], { cwd: ROOT });
    let stdout = "", stderr = "", sent = false;
    const timer = setTimeout(() => {
      child.kill("SIGKILL");
      reject(new Error(`no progress within 60 s: ${stderr}`));
    }, 60_000);
    child.stdout.on("data", (d: Buffer) => (stdout += d.toString()));
    child.stderr.on("data", (d: Buffer) => {
      stderr += d.toString();
      // The first bound after the start line: the bracket is well under way, far from done.
      if (!sent && /after (multi-start local search|eigenvalue bound|Goemans|exhaustive search|branch and bound|breakout search)/.test(stderr)) {
        sent = true;
        child.kill(signal);
      }
    });
    child.on("exit", (code) => {
      clearTimeout(timer);
      resolve({ code, stdout, stderr });
    });
  });
}

describe("halfplus cut: SIGINT and SIGTERM keep the best record so far", () => {
  for (const [signal, status] of [["SIGINT", 130], ["SIGTERM", 143]] as const) {
    it(`${signal} during a 60 s run writes the record (marked interrupted) to stdout and -o, exits ${status}, and the record verifies`, async () => {
      // 128 + signal number is the shell's convention for a process ended by a signal (POSIX.1 §2.8.2).
      const out = join(dir, `interrupted-${signal}.json`);
      const r = await interruptCut(["gnp:n=300,p=0.1,seed=1", "--seconds", "60", "--effort", "heuristic", "--json", "-o", out], signal);
      expect(r.code, r.stderr).toBe(status);
      const lines = r.stdout.trim().split("\n");
      expect(lines).toHaveLength(1);
      const rec = JSON.parse(lines[0]);
      expect(rec.interrupted).toBe(true);
      expect(rec.lower).toBeLessThanOrEqual(rec.upper);
      expect(readFileSync(out, "utf8").trim()).toBe(lines[0]);
      expect(r.stderr).toMatch(new RegExp(`interrupted by ${signal}`));
      const v = halfplus(["verify", out]);
      expect(v.code, v.stdout).toBe(0);
      expect(v.stdout).toMatch(/verified: max cut in \[/);
    });
  }
});

describe("halfplus verify: exit statuses and verdict words", () => {
  it("an estimated upper end exits 3 with the word estimate on the verdict line; --accept-estimates exits 0", () => {
    // K_400 quick within 0.3 s: the eigenvalue bound's shift is a Lanczos estimate (dense proof too slow).
    const c = halfplus(["cut", "complete:n=400", "--effort", "quick", "--seconds", "0.3", "--json"]);
    expect(c.code).toBe(0);
    const rec = JSON.parse(c.stdout);
    const f = join(dir, "estimate.json");
    // Force the estimate case whatever the machine managed: re-run the eigenvalue bound as an estimate.
    if (rec.certificate.kind !== "psd-dual" || rec.certificate.shiftProof !== "lanczos-estimate") {
      rec.certificate = { kind: "psd-dual", y: new Array(400).fill(0), shift: 400.000001, shiftProof: "lanczos-estimate", roundedDown: true, tolerance: 0 };
      rec.upper = 40000;
      rec.surplusUpper = rec.upper - rec.totalWeight / 2;
      rec.upperKind = "estimate";
      rec.exact = false;
    }
    writeFileSync(f, JSON.stringify(rec) + "\n");
    const v = halfplus(["verify", f]);
    expect(v.code).toBe(3);
    expect(v.stdout.split("\n")[0]).toMatch(/: estimate: max cut in \[/);
    expect(v.stdout).not.toMatch(/verified/);
    const ok = halfplus(["verify", f, "--accept-estimates"]);
    expect(ok.code).toBe(0);
    expect(ok.stdout.split("\n")[0]).toMatch(/estimate/);
    const json = JSON.parse(halfplus(["verify", f, "--json"]).stdout);
    expect(json.verdict).toBe("estimate");
    expect(json.upperKind).toBe("estimate");
  });

  it("the reported forgery (upper = lower − 100 on two edges of weight 10^9 + 0.5) exits 1 and never prints a value", () => {
    const g = join(dir, "heavy.gset");
    writeFileSync(g, "3000 2\n1 2 1000000000.5\n3 4 1000000000.5\n");
    const c = halfplus(["cut", g, "--json", "--seconds", "2"]);
    expect(c.code).toBe(0);
    const rec = JSON.parse(c.stdout);
    for (const [name, kind, exact] of [["search", "unfinished-search", false], ["exhaustive", "exhaustive", true]] as const) {
      const forged = { ...rec, upper: rec.lower - 100, surplusUpper: rec.lower - 100 - rec.totalWeight / 2, exact, certificate: { kind, search: "exact-bnb", graySteps: 0, branchNodes: 1, roundedDown: false, tolerance: 119 } };
      const f = join(dir, `forged-${name}.json`);
      writeFileSync(f, JSON.stringify(forged) + "\n");
      const v = halfplus(["verify", f]);
      expect(v.code, name).toBe(1);
      expect(v.stdout.split("\n")[0]).toMatch(/REJECTED \(.*upper.*consistency/);
      expect(v.stdout).not.toMatch(/max cut =/);
    }
  });

  it("malformed records and duplicate keys exit 2 with one line naming the record and the field", () => {
    const c = halfplus(["cut", "cycle:n=9", "--json"]);
    const rec = JSON.parse(c.stdout);
    const cases: [string, string, RegExp][] = [
      ["spec-null", JSON.stringify({ ...rec, source: { spec: null } }), /record 1\): field `source\.spec`/],
      // (source.spec = 42, source.path = 123, source.position = −1, 0 or 0.5: test/verify-forgery.test.ts, in-process)
      ["huge-dual", JSON.stringify({ ...rec, certificate: { kind: "psd-dual", y: [1e200, 0, 0, 0, 0, 0, 0, 0, 0], shift: 4, shiftProof: "gershgorin", roundedDown: true, tolerance: 0 } }), /field `certificate\.y\[0\]`/],
      ["duplicate-key", JSON.stringify(rec).replace('{"kind"', '{"upper":1,"kind"'), /duplicate key "upper"/],
      ["second-record", `${JSON.stringify(rec)}\n${JSON.stringify({ ...rec, lower: "12" })}\n`, /:2 \(record 2\): field `lower`/],
    ];
    for (const [name, text, re] of cases) {
      const f = join(dir, `malformed-${name}.json`);
      writeFileSync(f, text);
      expectBadInput(["verify", f], re);
    }
  });

  it("a record whose source is a device or a missing file is refused, not read", () => {
    const rec = JSON.parse(halfplus(["cut", "cycle:n=9", "--json"]).stdout);
    const f = join(dir, "dev-zero.json");
    writeFileSync(f, JSON.stringify({ ...rec, source: { path: "/dev/zero", format: "graph6" } }));
    expectBadInput(["verify", f], /source\.path "\/dev\/zero": is not a regular file/);
    expectBadInput(["verify", "/dev/zero"], /\/dev\/zero: is not a regular file/);
  });
});

describe("hostile graph input", () => {
  it("graph /dev/zero --format graph6 stops at the line cap with one line", () => {
    // Input validation, common practice, no source.
    expectBadInput(["graph", "/dev/zero", "--format", "graph6"], /\/dev\/zero:1: line longer than 256\.0 MB/);
  });

  it("a 10-byte sparse6 line declaring n = 10^8 and a gset header `100000000 1` are refused by the memory cap, naming the file", () => {
    const s6 = join(dir, "huge.s6");
    // N(n) for n = 10^8: "~~" then 36 bits in six bytes (nauty's formats.txt).
    let text = ":~~";
    for (let sh = 30; sh >= 0; sh -= 6) text += String.fromCharCode((Math.floor(1e8 / 2 ** sh) % 64) + 63);
    writeFileSync(s6, text + "\n");
    expect(text.length).toBe(9);
    expectBadInput(["graph", s6], new RegExp(`${s6.replace(/[.]/g, "\\.")}:1: sparse6 graph with n = 100000000: needs about .* of memory`), { HALFPLUS_MEMORY_LIMIT: "512M" });
    const gs = join(dir, "huge.gset");
    writeFileSync(gs, "100000000 1\n1 2 1\n");
    expectBadInput(["cut", gs, "--effort", "exact", "--seconds", "5"], new RegExp(`${gs.replace(/[.]/g, "\\.")}:1: gset header n = 100000000`), { HALFPLUS_MEMORY_LIMIT: "512M" });
    expectBadInput(["graph", "complete:n=30000"], /complete:n=30000: needs about .* of memory/, { HALFPLUS_MEMORY_LIMIT: "2G" });
    expectBadInput(["graph", "hypercube:dim=25"], /hypercube:dim=25: needs about/, { HALFPLUS_MEMORY_LIMIT: "2G" });
    expectBadInput(["graph", "disjoint-union:of=[complete:n=20000]+[complete:n=20000]"], /needs about .* of memory/, { HALFPLUS_MEMORY_LIMIT: "2G" });
  });

  it("nested specs deeper than 32 levels are one line; 1000 levels of blow-up are refused at once", () => {
    // Input validation, common practice, no source.
    let deep = "petersen";
    for (let i = 0; i < 4000; i++) deep = `complement:of=[${deep}]`;
    const err = expectBadInput(["graph", deep], /nested more than 32 levels deep/);
    // The 64 KB spec is not echoed in full.
    expect(err.length).toBeLessThan(600);
    let blow = "cycle:n=5";
    for (let i = 0; i < 1000; i++) blow = `blow-up:of=[${blow}],t=1`;
    expectBadInput(["graph", blow], /nested more than 32 levels deep/);
    let ok = "cycle:n=5";
    for (let i = 0; i < 32; i++) ok = `blow-up:of=[${ok}],t=1`;
    const r = halfplus(["graph", ok, "--json"]);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).n).toBe(5);
  });

  it("a headered unweighted file `5 3` + three edges is refused as ambiguous, never read with the header as an edge", () => {
    const f = join(dir, "headered.txt");
    writeFileSync(f, "5 3\n0 1\n1 2\n2 3\n");
    expectBadInput(["graph", f], /headered\.txt:1: the first line "5 3" reads like a header "n m"/);
    // Said explicitly, the user gets what the format says: four edges, n = 6.
    const r = halfplus(["graph", f, "--format", "edgelist", "--json"]);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ n: 6, m: 4 });
  });

  it("non-decimal numbers are refused in specs and options", () => {
    expectBadInput(["graph", "circulant:n=13,s=0x1+0b101"], /circulant: invalid `s`/);
    expectBadInput(["graph", "induced-subgraph:of=[petersen],vertices=0x1+0o2"], /induced-subgraph: invalid `vertices`/);
    expectBadInput(["cut", "petersen", "--solver-seed", "0x10"], /--solver-seed must be a decimal number/);
    expectBadInput(["cut", "petersen", "--seconds", " 5"], /--seconds must be a decimal number/);
  });

  it("an empty or blank named file says so on stderr (exit 0); an empty pipe stays silent", () => {
    // Input validation, common practice, no source.
    for (const [name, text] of [["empty.g6", ""], ["blank.txt", "\n  \n"], ["header-only.g6", ">>graph6<<\n"]] as const) {
      const f = join(dir, name);
      writeFileSync(f, text);
      const r = halfplus(["graph", f]);
      expect(r.code, name).toBe(0);
      expect(r.stdout).toBe("");
      expect(r.stderr.trim()).toBe(`halfplus graph: no graphs read from ${f}`);
    }
    const pipe = halfplus(["cut", "-"], "");
    expect(pipe.code).toBe(0);
    expect(pipe.stderr).toBe("");
  });

  it("a file name holding a newline and a 100 KB spec give one short line", () => {
    expectBadInput(["graph", join(dir, "no\nsuch.g6")], /no\\nsuch\.g6: no such file/);
    const long = `kneser:n=8,k=3,${"x".repeat(100_000)}=1`;
    const err = expectBadInput(["graph", long], /kneser/);
    expect(err.length).toBeLessThan(2100);
  });
});

describe("strict CI", () => {
  itNeeds([tool("nauty-geng")], "CI=true with nauty hidden from PATH fails and names nauty", () => {
    // A PATH holding only sh and node (Debian's /bin is /usr/bin, so dropping one directory is not
    // enough): the requirement helper must turn the nauty suite's skips into failures naming nauty.
    const bin = mkdtempSync(join(tmpdir(), "halfplus-path-"));
    symlinkSync("/bin/sh", join(bin, "sh"));
    symlinkSync(process.execPath, join(bin, "node"));
    const r = spawnSync(process.execPath, [join(ROOT, "node_modules", "vitest", "vitest.mjs"), "run", "test/cut-exact-geng.test.ts"], {
      cwd: ROOT,
      env: { ...process.env, CI: "true", PATH: bin },
      timeout: 120_000,
    });
    rmSync(bin, { recursive: true, force: true });
    const out = r.stdout.toString() + r.stderr.toString();
    expect(r.status).not.toBe(0);
    expect(out).toMatch(/CI is missing the program nauty-geng/);
  });
});
