// Where a row was made: the halfplus version (part of every row key), the git commit of the
// checkout when there is one, the Node.js version and the platform. Read once per sweep.

import { execFile } from "node:child_process";
import { readFileSync, realpathSync } from "node:fs";
import { dirname, resolve } from "node:path";
import { fileURLToPath } from "node:url";

/** The package root: two levels above this file, both in src/ (tests) and dist/ (the bin). */
const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..", "..");

let cachedVersion: string | undefined;

export function halfplusVersion(): string {
  if (cachedVersion === undefined) {
    cachedVersion = String((JSON.parse(readFileSync(resolve(ROOT, "package.json"), "utf8")) as { version: string }).version);
  }
  return cachedVersion;
}

export interface Provenance {
  version: string;
  /** Commit hash, with "+modified" when the checkout's src/ differs from it; null outside a git checkout. */
  gitCommit: string | null;
  nodeVersion: string;
  platform: string;
}

/** Exit status and output of a git command in DIR (status null when git could not be started). */
function git(dir: string, args: string[]): Promise<{ status: number | null; stdout: string }> {
  return new Promise((done) => {
    execFile("git", args, { cwd: dir, encoding: "utf8" }, (error, stdout) => {
      const code = error === null ? 0 : typeof error.code === "number" ? error.code : null;
      done({ status: code, stdout: String(stdout) });
    });
  });
}

/** DIR with symbolic links resolved, or DIR itself when it cannot be resolved. */
function realDir(dir: string): string {
  try {
    return realpathSync(dir);
  } catch {
    return dir;
  }
}

/**
 * The commit of the checkout whose top level is ROOTDIR, with "+modified" when its src/ differs;
 * null when ROOTDIR is not the top of a git checkout. A package installed inside someone else's
 * repository (node_modules/halfplus) must not record that repository's commit as its own.
 */
export async function checkoutCommit(rootDir: string): Promise<string | null> {
  // Both at once: neither needs the other's answer.
  const [head, clean] = await Promise.all([
    git(rootDir, ["rev-parse", "--show-toplevel", "HEAD"]),
    git(rootDir, ["diff", "--quiet", "HEAD", "--", "src"]),
  ]);
  if (head.status !== 0) return null;
  const [top, hash] = head.stdout.trim().split("\n").map((line) => line.trim());
  if (top === undefined || hash === undefined || hash === "" || realDir(top) !== realDir(rootDir)) return null;
  return hash + (clean.status === 0 ? "" : "+modified");
}

/**
 * Asynchronous because the two git commands take 25–230 ms of wall time on a loaded machine:
 * runSweep starts them first and checks the plan and opens the store meanwhile (both run while
 * the sweep workers load their code).
 */
export async function provenance(): Promise<Provenance> {
  return { version: halfplusVersion(), gitCommit: await checkoutCommit(ROOT), nodeVersion: process.version, platform: `${process.platform}-${process.arch}` };
}
