// Start-up cost of the `halfplus` command: the process CPU (user + system, all threads, from
// /usr/bin/time) of short invocations, this tree's build against another build given as
// BENCH_CLI_BASE (a checkout's root with its own dist/, e.g. the main branch; without it only this
// tree is measured). Runs alternate the two builds back to back, so load from elsewhere falls on
// both alike; medians and ranges over BENCH_CLI_ROUNDS rounds (default 7).
import { spawnSync } from "node:child_process";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadavg } from "node:os";
import { report } from "./util.mjs";

const here = join(dirname(fileURLToPath(import.meta.url)), "..");
const base = process.env.BENCH_CLI_BASE;
const rounds = Number(process.env.BENCH_CLI_ROUNDS ?? 7);
const CASES = [["--version"], ["--help"], ["cut", "--help"], ["cut", "petersen"], ["graph", "petersen"], ["families"]];

/** CPU-seconds of one `node <root>/dist/cli/main.js ...args` run. */
function cpuSeconds(root, args) {
  const r = spawnSync("/usr/bin/time", ["-f", "%U %S", process.execPath, join(root, "dist", "cli", "main.js"), ...args], { encoding: "utf8" });
  if (r.status !== 0) throw new Error(`${args.join(" ")}: exit ${r.status}: ${r.stderr}`);
  const [u, s] = r.stderr.trim().split("\n").at(-1).split(" ").map(Number);
  return u + s;
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const fmt = (xs) => (xs.length === 0 ? "" : `${median(xs).toFixed(2)} (${Math.min(...xs).toFixed(2)}–${Math.max(...xs).toFixed(2)})`);
const load0 = loadavg()[0];
const rows = [];
for (const args of CASES) {
  const mine = [], theirs = [];
  cpuSeconds(here, args); // warm the file cache for both
  if (base) cpuSeconds(base, args);
  for (let i = 0; i < rounds; i++) {
    const first = i % 2 === 0 || !base;
    if (first) mine.push(cpuSeconds(here, args));
    if (base) theirs.push(cpuSeconds(base, args));
    if (!first) mine.push(cpuSeconds(here, args));
  }
  rows.push({ command: `halfplus ${args.join(" ")}`, base_cpu_s: fmt(theirs), this_cpu_s: fmt(mine) });
}
console.log(`load average ${load0.toFixed(1)} → ${loadavg()[0].toFixed(1)}; ${rounds} rounds; median (min–max) CPU-seconds`);
report("cli-startup", rows);
