// Provenance's commit: recorded only for a checkout whose top level is the package itself.
// Uses the git binary (Debian's git; common practice, no source, for what `rev-parse` prints).
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { checkoutCommit } from "../src/experiment/provenance.js";

const dirs: string[] = [];
afterAll(() => {
  for (const dir of dirs) rmSync(dir, { recursive: true, force: true });
});

function repo(): { top: string; head: string } {
  const top = mkdtempSync(join(tmpdir(), "halfplus-prov-"));
  dirs.push(top);
  const run = (...args: string[]) =>
    execFileSync("git", ["-c", "user.name=t", "-c", "user.email=t@example.invalid", ...args], { cwd: top, encoding: "utf8" });
  run("init", "-q");
  mkdirSync(join(top, "src"));
  writeFileSync(join(top, "src", "a.ts"), "export {};\n");
  mkdirSync(join(top, "node_modules", "halfplus"), { recursive: true });
  writeFileSync(join(top, "node_modules", "halfplus", "package.json"), "{}\n");
  run("add", "src");
  run("commit", "-q", "-m", "one");
  return { top, head: run("rev-parse", "HEAD").trim() };
}

describe("checkoutCommit", () => {
  it("gives the commit of a checkout rooted at the package, marked when src/ changed", async () => {
    const { top, head } = repo();
    expect(await checkoutCommit(top)).toBe(head);
    writeFileSync(join(top, "src", "a.ts"), "export const x = 1;\n");
    expect(await checkoutCommit(top)).toBe(`${head}+modified`);
  });

  it("gives null for a package installed inside another project's checkout", async () => {
    const { top } = repo();
    expect(await checkoutCommit(join(top, "node_modules", "halfplus"))).toBeNull();
  });

  it("gives null outside any checkout", async () => {
    const dir = mkdtempSync(join(tmpdir(), "halfplus-prov-none-"));
    dirs.push(dir);
    expect(await checkoutCommit(dir)).toBeNull();
  });
});
