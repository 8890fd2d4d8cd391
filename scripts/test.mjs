// Runs the whole suite and ends with one plain line "tests: N passed, N failed, N skipped",
// so any log reader sees the totals. Exit code is vitest's.
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, existsSync } from "node:fs";

mkdirSync(".tmp", { recursive: true });
const out = ".tmp/vitest-report.json";
const r = spawnSync("npx", ["vitest", "run", "--reporter=default", "--reporter=json", `--outputFile=${out}`, ...process.argv.slice(2)], {
  stdio: "inherit",
});
let code = r.status ?? 1;
if (existsSync(out)) {
  const j = JSON.parse(readFileSync(out, "utf8"));
  const skipped = (j.numPendingTests ?? 0) + (j.numTodoTests ?? 0);
  console.log(`tests: ${j.numPassedTests} passed, ${j.numFailedTests} failed, ${skipped} skipped`);
  if (j.numTotalTests === 0) code = code || 1;
} else {
  console.log("tests: 0 passed, 1 failed");
  code = code || 1;
}
process.exit(code);
