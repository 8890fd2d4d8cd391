// Shared helpers for benchmark scripts: timing, the ../shared reference folder, output files.
import { existsSync, writeFileSync } from "node:fs";
import { dirname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";

const here = dirname(fileURLToPath(import.meta.url));
export const SHARED_REFERENCE = resolve(here, "..", "..", "shared", "reference");
export const hasShared = () => existsSync(SHARED_REFERENCE);

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
  writeFileSync(join(here, "out", `${name}.json`), JSON.stringify(rows, null, 2));
}
