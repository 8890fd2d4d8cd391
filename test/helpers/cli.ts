// Runs the built `halfplus` bin (dist/cli/main.js; `npm test` builds first) as a user would.
import { spawnSync, execSync } from "node:child_process";
import { existsSync, readdirSync, statSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

export const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), "..", "..");
export const BIN = join(ROOT, "dist", "cli", "main.js");

function newestSourceMtime(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newestSourceMtime(p) : e.name.endsWith(".ts") ? statSync(p).mtimeMs : 0);
  }
  return t;
}

/** `npm test` builds first; when a suite runs on its own, rebuild a missing or stale dist. */
export function ensureBuilt(): void {
  const notebookEntry = join(ROOT, "dist", "notebook", "index.js");
  // The worker threads' single-file bundles (scripts/bundle-worker.mjs), the build's second step.
  const workerBundles = ["experiment/worker-bundle.js", "cut/bracket/bracket-worker-bundle.js", "experiment/census/census-worker-bundle.js"].map((f) => join(ROOT, "dist", f));
  const srcTime = newestSourceMtime(join(ROOT, "src"));
  const fresh =
    existsSync(BIN) &&
    existsSync(notebookEntry) &&
    workerBundles.every((f) => existsSync(f) && statSync(f).mtimeMs >= srcTime) &&
    statSync(BIN).mtimeMs >= srcTime &&
    statSync(notebookEntry).mtimeMs >= Math.max(srcTime, newestSourceMtime(join(ROOT, "kernel-helpers")));
  if (fresh) return;
  // Both builds: the package (src → dist) and halfplus/notebook (kernel-helpers → dist/notebook).
  execSync("npm run --silent build", { cwd: ROOT, stdio: "inherit" });
}

export interface CliResult {
  code: number;
  stdout: string;
  stderr: string;
}

export function halfplus(args: string[], input?: string | Buffer, timeoutMs = 120_000): CliResult {
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd: ROOT, input, timeout: timeoutMs, maxBuffer: 1 << 28 });
  return { code: r.status ?? -1, stdout: r.stdout.toString(), stderr: r.stderr.toString() };
}
