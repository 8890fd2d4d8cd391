// Cluster runs: (1) per-task throughput, one shard of 4 run as an array task runs it (one worker),
// for small exact brackets and for budget-bound heuristic ones; (2) the slicing every task computes
// before it starts, for a plan of 10^5 jobs; (3) merging 100 shard stores of 10^3 rows each (the
// merge job's work). The shard stores of (3) are copies of one real store of 10^3 swept rows with
// their keys suffixed by the shard number (rows are real, keys made distinct for the benchmark).
// Rates per CPU-second divide by the CPU time of the whole process, so other load counts less.
// Usage: node bench/cluster.bench.mjs [--shards 100] [--rows 1000]
import { mkdtempSync, rmSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { loadPlan, mergeStores, openStore, planSlices, runSweep } from "../dist/experiment/index.js";
import { report } from "./util.mjs";

const args = process.argv.slice(2);
const opt = (name, fallback) => {
  const i = args.indexOf(`--${name}`);
  return i < 0 ? fallback : Number(args[i + 1]);
};
const SHARDS = opt("shards", 100);
const ROWS = opt("rows", 1000);
const dir = mkdtempSync(join(tmpdir(), "halfplus-bench-cluster-"));
const rows = [];
const cpuSeconds = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};

async function shardThroughput(name, plan) {
  const store = join(dir, `${name}.db`);
  const t0 = performance.now();
  const c0 = cpuSeconds();
  const s = await runSweep(plan, { store, workers: 1, shard: "0/4" });
  const wall = (performance.now() - t0) / 1000;
  const cpu = cpuSeconds() - c0;
  rows.push({ measure: `one task (shard 0/4, 1 worker): ${name}`, jobs: s.computed, seconds: +wall.toFixed(2), "jobs/s": +(s.computed / wall).toFixed(1), "jobs/CPU-s": +(s.computed / cpu).toFixed(1) });
  return store;
}

try {
  // (1) Small graphs closed by exact search (n = 8…14), and heuristic brackets stopped by a 0.5 s budget.
  const small = await shardThroughput("small exact (gnp n=8..14)", {
    name: "bench-small",
    bracket: { effort: "exact", seconds: 30 },
    evaluators: ["edwards-edges", "triangle-free"],
    families: [{ family: "gnp", grid: { n: [8, 10, 12, 14], p: 0.4 }, graphSeeds: { from: 0, count: 250 } }],
  });
  await shardThroughput("budget-bound heuristic (gnp n=400, 0.5 s)", {
    name: "bench-large",
    bracket: { effort: "heuristic", seconds: 0.5 },
    families: [{ family: "gnp", grid: { n: 400, p: 0.02 }, graphSeeds: { from: 0, count: 16 } }],
  });

  // (2) The slicing of a 10^5-job plan into 1000 shards (every task computes it before starting).
  const big = loadPlan({ families: [{ family: "gnp", grid: { n: { range: { from: 10, to: 1009 } }, p: 0.1 }, graphSeeds: { from: 0, count: 100 } }] });
  const t1 = performance.now();
  const slices = await planSlices(big, 1000);
  const sliceSeconds = (performance.now() - t1) / 1000;
  rows.push({ measure: `slicing ${big.total} jobs into 1000 shards`, jobs: big.total, seconds: +sliceSeconds.toFixed(2), "largest/smallest shard": +(Math.max(...slices.costs) / Math.min(...slices.costs)).toFixed(4) });

  // (3) 100 shard stores of 10^3 rows each, merged into one.
  const source = openStore(small, { readonly: true });
  const base = [...source.rows()].slice(0, ROWS);
  source.close();
  while (base.length < ROWS) base.push(...base.slice(0, ROWS - base.length).map((r) => ({ ...r, key: `${r.key}#copy${base.length}` })));
  const paths = [];
  for (let s = 0; s < SHARDS; s++) {
    const p = join(dir, `shard-${s}.db`);
    const st = openStore(p);
    st.insert(base.map((r) => ({ ...r, key: `${r.key}#shard${s}` })));
    st.close();
    paths.push(p);
  }
  const into = join(dir, "merged.db");
  const t2 = performance.now();
  const c2 = cpuSeconds();
  const merged = mergeStores(paths, into);
  const mergeSeconds = (performance.now() - t2) / 1000;
  const mergeCpu = cpuSeconds() - c2;
  rows.push({ measure: `merge ${SHARDS} shard stores of ${ROWS} rows`, jobs: merged.total, seconds: +mergeSeconds.toFixed(2), "rows/s": Math.round(merged.total / mergeSeconds), "CPU seconds": +mergeCpu.toFixed(2) });
  const t3 = performance.now();
  const c3 = cpuSeconds();
  const again = mergeStores(paths, into);
  const againSeconds = (performance.now() - t3) / 1000;
  rows.push({ measure: "the same merge again (every row already there: compared, not copied)", jobs: again.total, seconds: +againSeconds.toFixed(2), "rows/s": Math.round(again.total / againSeconds), "CPU seconds": +(cpuSeconds() - c3).toFixed(2) });
} finally {
  rmSync(dir, { recursive: true, force: true });
}
rows.push({ measure: `load average at the end (1 min): ${loadavg()[0].toFixed(2)}` });
report("cluster", rows);
