// Where a row was made: the halfplus version (part of every row key), the git commit of the
// checkout when there is one, the Node.js version and the platform. Read once per sweep.

import { spawnSync } from "node:child_process";
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

function gitCommit(): string | null {
  const head = spawnSync("git", ["rev-parse", "HEAD"], { cwd: ROOT, encoding: "utf8", stdio: ["ignore", "pipe", "ignore"] });
  if (head.status !== 0 || head.stdout.trim() === "") return null;
  const clean = spawnSync("git", ["diff", "--quiet", "HEAD", "--", "src"], { cwd: ROOT, stdio: "ignore" });
  return head.stdout.trim() + (clean.status === 0 ? "" : "+modified");
}

export function provenance(): Provenance {
  return { version: halfplusVersion(), gitCommit: gitCommit(), nodeVersion: process.version, platform: `${process.platform}-${process.arch}` };
}
