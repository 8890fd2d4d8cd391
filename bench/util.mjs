// Shared helpers for benchmark scripts: timing, the ../shared reference folder and its tables,
// random edge sets, output files.
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const here = dirname(fileURLToPath(import.meta.url));
export const SHARED_REFERENCE = process.env.HALFPLUS_REFERENCE ?? resolve(here, "..", "..", "shared", "reference");
export const hasShared = () => existsSync(SHARED_REFERENCE);

/** A `name,value` table from ../shared/reference/gset (header line skipped) as a Map name → Number(value). */
export function readGsetTable(file) {
  const lines = readFileSync(join(SHARED_REFERENCE, "gset", file), "utf8").trim().split("\n").slice(1);
  return new Map(lines.map((l) => l.split(",")).map(([k, v]) => [k, Number(v)]));
}

/** m distinct pairs {u, v}, u ≠ v, on n vertices, drawn uniformly from rng (rejection on loops and repeats). */
export function randomDistinctPairs(n, m, rng) {
  const us = new Int32Array(m);
  const vs = new Int32Array(m);
  const seen = new Set();
  let k = 0;
  while (k < m) {
    const u = rng.nextInt(n);
    const v = rng.nextInt(n);
    if (u === v) continue;
    const key = u < v ? u * n + v : v * n + u;
    if (seen.has(key)) continue;
    seen.add(key);
    us[k] = u;
    vs[k] = v;
    k++;
  }
  return { us, vs };
}

/** Best of `reps` wall-clock times of f(), in milliseconds, and f's last result. */
export function timeBest(f, reps = 3) {
  let best = Infinity, result;
  for (let i = 0; i < reps; i++) {
    globalThis.gc?.();
    const t0 = process.hrtime.bigint();
    result = f();
    const ms = Number(process.hrtime.bigint() - t0) / 1e6;
    if (ms < best) best = ms;
  }
  return { ms: best, result };
}

export function report(name, rows) {
  console.table(rows);
  mkdirSync(join(here, "out"), { recursive: true }); // a bench run on its own, not through run.mjs
  writeFileSync(join(here, "out", `${name}.json`), JSON.stringify(rows, null, 2));
}
