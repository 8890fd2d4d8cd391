// What a timed `halfplus hunt` reaches: (C4, n = 31) against the polarity graph ER_5 (31
// vertices: Erdős–Rényi 1962, Brown 1966), once from all starts and once from the C4-free process
// only, and (K3, n = 20..30) against the triangle-free constructions on each n. Each case prints
// the best certified surplus/(m/√d), the best reference construction's value, the moves made and
// whether every frontier record passes `halfplus verify`. Other load on the machine means fewer
// moves in the same minutes: the figures are noisy.
// HALFPLUS_HUNT_MINUTES (default 10) sets the budget per case; HALFPLUS_HUNT_CASES picks cases
// by name (comma-separated, e.g. "C4-31,K3-24").
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { report } from "./util.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const bin = join(here, "..", "dist", "cli", "main.js");
const minutes = Number(process.env.HALFPLUS_HUNT_MINUTES ?? 10);
const cases = [
  { name: "C4-31", h: "C4", n: 31, start: "references" },
  { name: "C4-31-process", h: "C4", n: 31, start: "process" },
  ...Array.from({ length: 11 }, (_, i) => ({ name: `K3-${20 + i}`, h: "K3", n: 20 + i, start: "references" })),
];
const wanted = process.env.HALFPLUS_HUNT_CASES?.split(",");
const dir = mkdtempSync(join(tmpdir(), "halfplus-hunt-bench-"));
const rows = [];
for (const c of cases.filter((c) => wanted === undefined || wanted.includes(c.name))) {
  const records = join(dir, `${c.name}.jsonl`);
  const args = [bin, "hunt", "--free", c.h, "--n", String(c.n), "--minutes", String(minutes), "--start", c.start, "--store", join(dir, "hunt.db"), "--records", records, "--no-progress"];
  const r = spawnSync(process.execPath, args, { encoding: "utf8", maxBuffer: 1 << 28 });
  if (r.status !== 0) throw new Error(r.stderr);
  const out = r.stdout;
  const best = /best: ([\d.]+) at m = (\d+)/.exec(out);
  const moves = /; (\d+) moves/.exec(out);
  const refs = [...out.matchAll(/reference (\S+): m = (\d+), d = (\d+), \S+ ≤ ([\d.]+)/g)].map((m) => ({ label: m[1], value: Number(m[4]) }));
  const bestRef = refs.reduce((a, b) => (a === null || b.value < a.value ? b : a), null);
  const verify = spawnSync(process.execPath, [bin, "verify", records], { encoding: "utf8", maxBuffer: 1 << 28 });
  rows.push({
    case: c.name,
    start: c.start,
    minutes,
    best: best ? Number(best[1]) : null,
    bestM: best ? Number(best[2]) : null,
    bestReference: bestRef?.label ?? null,
    referenceValue: bestRef?.value ?? null,
    moves: moves ? Number(moves[1]) : null,
    verified: verify.status === 0,
  });
}
rmSync(dir, { recursive: true, force: true });
mkdirSync(join(here, "out"), { recursive: true });
report("hunt", rows);
