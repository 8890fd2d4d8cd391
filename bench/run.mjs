// Runs every bench/*.bench.mjs (or those named on the command line) against the built
// package in dist/, one after another so timings do not compete for the two cores.
// Each bench prints its own table; results also go to bench/out/<name>.json.
import { spawnSync } from "node:child_process";
import { readdirSync, mkdirSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

const here = dirname(fileURLToPath(import.meta.url));
mkdirSync(join(here, "out"), { recursive: true });
const wanted = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith(".bench.mjs"))
  .filter((f) => wanted.length === 0 || wanted.some((w) => f.startsWith(w)))
  .sort();
let failed = 0;
for (const f of files) {
  console.log(`\n== ${f}`);
  const r = spawnSync(process.execPath, ["--expose-gc", join(here, f)], { stdio: "inherit" });
  if (r.status !== 0) failed++;
}
process.exit(failed === 0 ? 0 : 1);
