// `halfplus cut` on a graph6 stream of many small graphs: the brackets run in one worker thread
// for the whole stream (src/cut/bracket/bracket-runner.ts), so the cost per graph is the bracket
// itself plus message passing, not a worker start-up. Stream: the 112 connected graphs on 6
// vertices from nauty-geng (OEIS A001349), repeated. Target: at most TARGET_MS per graph.
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { report } from "./util.mjs";

const TARGET_MS = 10;
const here = dirname(fileURLToPath(import.meta.url));
const bin = join(here, "..", "dist", "cli", "main.js");
const geng = spawnSync("nauty-geng", ["-cq", "6"], { encoding: "utf8" });
if (geng.status !== 0) {
  console.log("nauty-geng is not installed: skipped");
  process.exit(0);
}
const lines = geng.stdout.trim().split("\n");
const dir = mkdtempSync(join(tmpdir(), "halfplus-cut-stream-"));
const rows = [];
for (const copies of [1, 10]) {
  const file = join(dir, `stream-${copies}.g6`);
  writeFileSync(file, Array.from({ length: copies }, () => lines.join("\n")).join("\n") + "\n");
  const graphs = lines.length * copies;
  const t0 = performance.now();
  const r = spawnSync(process.execPath, [bin, "cut", file, "--json"], { encoding: "utf8", maxBuffer: 1 << 28 });
  const ms = performance.now() - t0;
  if (r.status !== 0) throw new Error(r.stderr);
  rows.push({ graphs, seconds: Number((ms / 1000).toFixed(2)), msPerGraph: Number((ms / graphs).toFixed(2)) });
}
rmSync(dir, { recursive: true, force: true });
report("cut-stream", rows);
const slow = rows.filter((r) => r.graphs >= 1000 && r.msPerGraph > TARGET_MS);
for (const r of slow) console.log(`over target: ${r.msPerGraph} ms per graph on ${r.graphs} graphs (target ${TARGET_MS})`);
process.exit(slow.length === 0 ? 0 : 1);
