// Where a row was made: the halfplus version (part of every row key), the git commit of the
// checkout when there is one, the Node.js version and the platform. Read once per sweep.

import { execFile } from "node:child_process";
import { readFileSync } from "node:fs";
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

/** Exit status and output of a git command in ROOT (status null when git could not be started). */
function git(args: string[]): Promise<{ status: number | null; stdout: string }> {
  return new Promise((done) => {
    execFile("git", args, { cwd: ROOT, encoding: "utf8" }, (error, stdout) => {
      const code = error === null ? 0 : typeof error.code === "number" ? error.code : null;
      done({ status: code, stdout: String(stdout) });
    });
  });
}

async function gitCommit(): Promise<string | null> {
  // Both at once: neither needs the other's answer.
  const [head, clean] = await Promise.all([git(["rev-parse", "HEAD"]), git(["diff", "--quiet", "HEAD", "--", "src"])]);
  if (head.status !== 0 || head.stdout.trim() === "") return null;
  return head.stdout.trim() + (clean.status === 0 ? "" : "+modified");
}

/**
 * Asynchronous because the two git commands take 25–230 ms of wall time on a loaded machine:
 * runSweep starts them first and checks the plan and opens the store meanwhile (both run while
 * the sweep workers load their code).
 */
export async function provenance(): Promise<Provenance> {
  return { version: halfplusVersion(), gitCommit: await gitCommit(), nodeVersion: process.version, platform: `${process.platform}-${process.arch}` };
}
