// Speed of the graph file formats: parsing the G22 benchmark file (target < 50 ms), a stream of
// 10^6 small graph6 graphs through readGraphs with memory sampled along the way (must stay flat),
// and the encoders. Run after `npx tsc -p tsconfig.build.json`: node --expose-gc bench/formats.bench.mjs
import { spawnSync } from "node:child_process";
import { createWriteStream, existsSync, mkdtempSync, readFileSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import {
  encodeGraph6,
  encodeSparse6,
  parseGraph6,
  parseGset,
  parseSparse6,
  readGraphFile,
  readGraphs,
  writeGset,
} from "../dist/graph/formats/index.js";
import { Rng } from "../dist/random/prng.js";
import { graphFromEdges } from "../dist/graph/builder.js";
import { SHARED_REFERENCE, hasShared, report, timeBest } from "./util.mjs";

const rows = [];
const mb = (x) => Math.round((x / 2 ** 20) * 10) / 10;
const gc = () => globalThis.gc?.();

// --- G22: whole-file parse from a Buffer, and the full file read -------------------------------
const g22 = join(SHARED_REFERENCE, "gset", "G22.txt");
if (hasShared() && existsSync(g22)) {
  const buf = readFileSync(g22);
  for (let i = 0; i < 5; i++) parseGset(buf, { file: "G22.txt" }); // warm-up
  const t = timeBest(() => parseGset(buf, { file: "G22.txt" }), 20);
  rows.push({ case: "parseGset G22 (2000 v, 19990 e), Buffer", ms: +t.ms.toFixed(2), target: "< 50 ms", ok: t.ms < 50 });
  let best = Infinity;
  for (let i = 0; i < 10; i++) {
    const t0 = process.hrtime.bigint();
    await readGraphFile(g22);
    best = Math.min(best, Number(process.hrtime.bigint() - t0) / 1e6);
  }
  rows.push({ case: "readGraphFile G22 (detect + read + parse)", ms: +best.toFixed(2) });
  const g = t.result.graph;
  const w = timeBest(() => writeGset(g), 10);
  rows.push({ case: "writeGset G22", ms: +w.ms.toFixed(2) });
} else {
  rows.push({ case: "G22", ms: null, note: "../shared/reference absent: skipped" });
}

// --- 10^6 small graphs as a graph6 stream --------------------------------------------------------
const dir = mkdtempSync(join(tmpdir(), "halfplus-bench-formats-"));
const streamFile = join(dir, "small.g6");
const COUNT = 1_000_000;
let source;
// The first 10^6 of the 12005168 graphs on 10 vertices (OEIS A000088), written to a file first
// so the timing is ours alone, not geng's.
const geng = spawnSync("sh", ["-c", `nauty-geng -q 10 2>/dev/null | head -n ${COUNT} > ${streamFile}`]);
if (geng.status === 0 && existsSync(streamFile) && statSync(streamFile).size > 0) source = "nauty-geng -q 10 | head -n 1000000";
else {
  // No nauty: random 10-vertex graphs from the project's PRNG, same shape of stream.
  const out = createWriteStream(streamFile);
  const rng = new Rng(1);
  for (let i = 0; i < COUNT; i++) {
    const edges = [];
    for (let v = 1; v < 10; v++) for (let u = 0; u < v; u++) if (rng.nextFloat() < 0.5) edges.push([u, v]);
    if (!out.write(encodeGraph6(graphFromEdges(10, edges)) + "\n")) await new Promise((r) => out.once("drain", r));
  }
  await new Promise((r) => out.end(r));
  source = "generated with Rng (nauty-geng missing)";
}
gc();
const before = process.memoryUsage();
const samples = [];
let count = 0;
let edges = 0;
const t0 = process.hrtime.bigint();
const cpu0 = process.cpuUsage();
for await (const loaded of readGraphs({ path: streamFile })) {
  count++;
  edges += loaded.graph.m;
  if (count % 200_000 === 0) {
    gc();
    const m = process.memoryUsage();
    samples.push({ rss: m.rss, heap: m.heapUsed });
  }
}
const secs = Number(process.hrtime.bigint() - t0) / 1e9;
const cpu = process.cpuUsage(cpu0);
gc();
const after = process.memoryUsage();
const heaps = samples.map((s) => s.heap);
rows.push({
  case: `readGraphs graph6 stream, ${count} graphs (${source})`,
  ms: Math.round(secs * 1000),
  cpuMs: Math.round((cpu.user + cpu.system) / 1000),
  graphsPerSec: Math.round(count / secs),
  graphsPerCpuSec: Math.round(count / ((cpu.user + cpu.system) / 1e6)),
  edges,
  heapBeforeMB: mb(before.heapUsed),
  heapAfterMB: mb(after.heapUsed),
  heapSpreadDuringMB: mb(Math.max(...heaps) - Math.min(...heaps)),
  rssBeforeMB: mb(before.rss),
  rssAfterMB: mb(after.rss),
});
rmSync(dir, { recursive: true, force: true });

// --- encoders and a large sparse6 line -----------------------------------------------------------
{
  const rng = new Rng(2);
  const n = 2000;
  const list = [];
  for (let v = 1; v < n; v++) for (let u = 0; u < v; u++) if (rng.nextFloat() < 0.01) list.push([u, v]);
  const g = graphFromEdges(n, list);
  const g6 = encodeGraph6(g);
  const s6 = encodeSparse6(g);
  rows.push({ case: `encodeGraph6 n=${n} m=${g.m}`, ms: +timeBest(() => encodeGraph6(g), 10).ms.toFixed(2) });
  rows.push({ case: `parseGraph6 n=${n} m=${g.m}`, ms: +timeBest(() => parseGraph6(g6), 10).ms.toFixed(2) });
  rows.push({ case: `encodeSparse6 n=${n} m=${g.m}`, ms: +timeBest(() => encodeSparse6(g), 10).ms.toFixed(2) });
  rows.push({ case: `parseSparse6 n=${n} m=${g.m}`, ms: +timeBest(() => parseSparse6(s6), 10).ms.toFixed(2) });
}

report("formats", rows);
