// Start-up cost of each worker thread the product starts: the process CPU (all threads, V8's helpers
// included) from `new Worker` until the worker's script has been imported, for the one-file bundle
// (scripts/bundle-worker.mjs) against tsc's module graph it was made from, and an empty worker as the
// floor. Rounds alternate the scripts back to back, so load from elsewhere falls on both alike;
// medians and ranges over BENCH_WORKER_ROUNDS rounds (default 15). The main thread only waits meanwhile.
import { dirname, join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import { loadavg } from "node:os";
import { report } from "./util.mjs";

const dist = join(dirname(fileURLToPath(import.meta.url)), "..", "dist");
const rounds = Number(process.env.BENCH_WORKER_ROUNDS ?? 15);
const WORKERS = [
  ["sweep", "experiment/worker.js", "experiment/worker-bundle.js"],
  ["cut (bracket)", "cut/bracket/bracket-worker.js", "cut/bracket/bracket-worker-bundle.js"],
  ["census", "experiment/census/census-worker.js", "experiment/census/census-worker-bundle.js"],
];
// A CommonJS eval worker that imports the script and reports once its module graph has run.
const LOADER = `const { parentPort, workerData } = require("node:worker_threads");
import(workerData).then(() => parentPort.postMessage("ready"));`;

/** Process CPU-milliseconds from starting a worker on `script` (null: nothing) until it is ready. */
function startCpuMs(script) {
  return new Promise((resolve, reject) => {
    const t0 = process.cpuUsage();
    const w = script === null ? new Worker(`require("node:worker_threads").parentPort.postMessage("ready")`, { eval: true }) : new Worker(LOADER, { eval: true, workerData: pathToFileURL(join(dist, script)).href });
    w.once("error", reject);
    w.once("message", () => {
      const d = process.cpuUsage(t0);
      void w.terminate().then(() => resolve((d.user + d.system) / 1000));
    });
  });
}

const median = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const fmt = (xs) => `${median(xs).toFixed(0)} (${Math.min(...xs).toFixed(0)}–${Math.max(...xs).toFixed(0)})`;
const load0 = loadavg()[0];
const rows = [];
const empty = [];
for (const [name, graphFile, bundleFile] of WORKERS) {
  const graph = [], bundle = [];
  await startCpuMs(graphFile); // first reads warm the file cache for both
  await startCpuMs(bundleFile);
  for (let i = 0; i < rounds; i++) {
    const first = i % 2 === 0;
    (first ? graph : bundle).push(await startCpuMs(first ? graphFile : bundleFile));
    (first ? bundle : graph).push(await startCpuMs(first ? bundleFile : graphFile));
    empty.push(await startCpuMs(null));
  }
  rows.push({ worker: name, module_graph_cpu_ms: fmt(graph), bundle_cpu_ms: fmt(bundle) });
}
rows.push({ worker: "empty worker", module_graph_cpu_ms: fmt(empty), bundle_cpu_ms: fmt(empty) });
console.log(`load average ${load0.toFixed(1)} → ${loadavg()[0].toFixed(1)}; ${rounds} rounds; median (min–max)`);
report("worker-startup", rows);
