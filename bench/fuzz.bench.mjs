// The fuzz suite at a larger scale: test/fuzz.test.ts run by vitest with HALFPLUS_FUZZ_SCALE
// (default 20: about 90,000 cases), its counts and findings written to bench/out/fuzz.json.
// Time is judged here, not in the unit test: the slowest single case must stay under
// MAX_CASE_SECONDS (memory is asserted by the suite itself against HALFPLUS_MEMORY_LIMIT).
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { report } from "./util.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, "..");
const scale = process.env.HALFPLUS_FUZZ_SCALE ?? "20";
const seed = process.env.HALFPLUS_FUZZ_SEED ?? "20250301";
// Legitimate specs with small parameters can denote millions of edges (norm-graph:q=11,t=4 has
// 8.8·10^6): building them is work in proportion, not a hang.
const MAX_CASE_SECONDS = 30;
const out = join(here, "out", "fuzz-raw.json");

const t0 = process.hrtime.bigint();
const r = spawnSync("npx", ["vitest", "run", "test/fuzz.test.ts"], {
  cwd: root,
  stdio: "inherit",
  env: { ...process.env, HALFPLUS_FUZZ_SCALE: scale, HALFPLUS_FUZZ_SEED: seed, HALFPLUS_FUZZ_REPORT: out },
});
const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
const raw = JSON.parse(readFileSync(out, "utf8"));
const rows = Object.entries(raw.stats).map(([target, s]) => ({
  target,
  cases: s.cases,
  accepted: s.accepted,
  refused: s.refused,
  findings: s.findings.length,
  slowestMs: Math.round(s.slowestMs),
  slowestCase: s.slowestCase.slice(0, 80),
}));
report("fuzz", { scale: Number(scale), seed: Number(seed), seconds: Math.round(seconds), maxRssMB: raw.maxRssMB, capMB: raw.capMB, rows });
const slow = rows.filter((x) => x.slowestMs > MAX_CASE_SECONDS * 1000);
for (const x of slow) console.log(`too slow: ${x.target}: ${x.slowestMs} ms on ${x.slowestCase}`);
for (const [target, s] of Object.entries(raw.stats)) for (const f of s.findings) console.log(`finding (${target}): ${f}`);
process.exit(r.status === 0 && slow.length === 0 ? 0 : 1);
