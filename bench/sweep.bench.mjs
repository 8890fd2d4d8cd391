// Sweep and store speed: (1) overhead of the sweep machinery (scheduling, rows, store writes) over
// the solver's own time on 1000 small graphs (target < 5 %); (2) throughput of 2 workers against
// 1 on the same plan (target ≥ 1.7×); (3) a graph6 stream of 10^5 small graphs closed by exact
// search, end to end into the store (target ≥ 10,000 graphs/s per core). "Per core" divides by
// the CPU seconds the whole process used (all threads), so other load on the machine does not
// count against it; the wall-clock rates are shown too.
// Usage: node bench/sweep.bench.mjs [--only overhead|scaling|stream] [--stream-n 7] [--stream-count 100000]
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { runSweep } from "../dist/experiment/index.js";
import { encodeGraph6 } from "../dist/graph/formats/graph6.js";
import { graphFromEdges } from "../dist/graph/builder.js";
import { report } from "./util.mjs";

const args = process.argv.slice(2);
const opt = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i < 0 ? fallback : args[i + 1];
};
const only = opt("only", null);
const streamN = Number(opt("stream-n", 7));
const streamCount = Number(opt("stream-count", 100_000));
const dir = mkdtempSync(join(tmpdir(), "halfplus-bench-sweep-"));
const rows = [];

async function timed(plan, workers, label) {
  const store = join(dir, `${label}-${workers}.db`);
  rmSync(store, { force: true });
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const s = await runSweep(plan, { store, workers, base: dir });
  const wall = (performance.now() - t0) / 1000;
  const u = process.cpuUsage(cpu0);
  const cpu = (u.user + u.system) / 1e6;
  return { ...s, wall, cpu };
}

// 1000 graphs of 26 vertices (G(26, 0.3)), each closed by exact search in about 10 ms.
const SMALL = {
  name: "overhead",
  bracket: { effort: "exact", seconds: 60 },
  families: [{ family: "gnp", grid: { n: 26, p: 0.3 }, graphSeeds: { from: 0, count: 1000 } }],
};

if (only === null || only === "overhead" || only === "scaling") {
  const one = await timed(SMALL, 1, "small");
  const overhead = one.wall / one.solverSeconds - 1;
  if (only !== "scaling") {
    rows.push({
      bench: "overhead, 1000 x G(26,0.3), 1 worker",
      graphs: one.computed,
      wall_s: +one.wall.toFixed(2),
      solver_s: +one.solverSeconds.toFixed(2),
      jobs_s: +one.jobSeconds.toFixed(2),
      // Building each graph, measuring its structure and bounds, making its row: inside the worker.
      measuring_pct: +(100 * (one.jobSeconds / one.solverSeconds - 1)).toFixed(1),
      // Everything else: start-up, plan, scheduling, messages, store writes (wall time not inside a job).
      machinery_pct: +(100 * (one.wall / one.jobSeconds - 1)).toFixed(1),
      overhead_pct: +(100 * overhead).toFixed(1),
      target: "< 5 %",
      load: loadavg()[0].toFixed(1),
    });
    console.log(JSON.stringify(rows[rows.length - 1]));
  }
  if (only !== "overhead") {
    const two = await timed(SMALL, 2, "small");
    rows.push({
      bench: "scaling, 1000 x G(26,0.3)",
      one_worker_per_s: +(one.computed / one.wall).toFixed(1),
      two_workers_per_s: +(two.computed / two.wall).toFixed(1),
      speedup: +(one.wall / two.wall).toFixed(2),
      target: "≥ 1.7",
      load: loadavg()[0].toFixed(1),
    });
    console.log(JSON.stringify(rows[rows.length - 1]));
  }
}

if (only === null || only === "stream") {
  // streamCount distinct labelled graphs on streamN vertices: the k-th graph's edge set is the bit
  // pattern (k·0x9E3779B1) mod 2^(n choose 2), distinct for k < 2^(n choose 2) (odd multiplier).
  const pairs = [];
  for (let v = 1; v < streamN; v++) for (let u = 0; u < v; u++) pairs.push([u, v]);
  const bits = pairs.length;
  const mod = 2 ** bits;
  if (streamCount > mod) throw new Error(`only ${mod} labelled graphs on ${streamN} vertices`);
  const lines = [];
  for (let k = 0; k < streamCount; k++) {
    const mask = Number((BigInt(k) * 0x9e3779b1n) % BigInt(mod));
    const edges = pairs.filter((_, i) => Math.floor(mask / 2 ** i) % 2 === 1);
    lines.push(encodeGraph6(graphFromEdges(streamN, edges)));
  }
  writeFileSync(join(dir, "stream.g6"), lines.join("\n") + "\n");
  const plan = { name: "stream", bracket: { effort: "exact", seconds: 60 }, families: [{ source: "stream.g6" }] };
  for (const workers of [1, 2]) {
    const r = await timed(plan, workers, "stream");
    rows.push({
      bench: `stream, ${streamCount} graphs on ${streamN} vertices, ${workers} worker${workers > 1 ? "s" : ""}`,
      graphs: r.computed,
      wall_s: +r.wall.toFixed(2),
      cpu_s: +r.cpu.toFixed(2),
      per_s_wall: Math.round(r.computed / r.wall),
      per_cpu_second: Math.round(r.computed / r.cpu),
      target: "≥ 10000 per core",
      load: loadavg()[0].toFixed(1),
    });
    console.log(JSON.stringify(rows[rows.length - 1]));
  }
}

report("sweep", rows);
rmSync(dir, { recursive: true, force: true });
