// The census on nauty's triangle-free streams: `nauty-geng -t n` piped into runCensus (the library
// call behind `halfplus census - --store …`) with 2 workers. Targets (2 cores): all 1,262,180
// triangle-free graphs on 12 vertices (OEIS A006785) in under 2 minutes; all 20,797,002 on 13
// vertices in under 40 minutes. n = 13 runs on geng's slice 0 of 10 (res/mod: about a tenth of the
// graphs, spread over the whole search tree) and is extrapolated by 20,797,002 / graphs counted, unless
// HALFPLUS_BENCH_CENSUS_FULL=1. Wall time depends on what else runs on the machine; CPU seconds
// (main thread, workers and geng) are reported beside it, and the verdict uses the wall time
// an unloaded 2-core machine would need: max(wall if alone, CPU / 2).
import { spawn } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { report } from "./util.mjs";

const here = dirname(fileURLToPath(import.meta.url));
const { runCensus } = await import(join(here, "..", "dist", "experiment", "index.js"));
const { bitmaskMaxCut, adjacencyMasks, exactMaxCut } = await import(join(here, "..", "dist", "cut", "index.js"));
const { parseGraph6 } = await import(join(here, "..", "dist", "graph", "formats", "index.js"));

const probe = spawn("nauty-geng", ["-q", "1"]);
const ok = await new Promise((resolve) => {
  probe.on("error", () => resolve(false));
  probe.on("exit", (code) => resolve(code === 0));
});
if (!ok) {
  console.log("nauty-geng is not installed: skipped");
  process.exit(0);
}

const full = process.env.HALFPLUS_BENCH_CENSUS_FULL === "1";
const dir = mkdtempSync(join(tmpdir(), "halfplus-census-bench-"));
const cases = [
  { n: 12, args: ["-tq", "12"], graphs: 1262180, targetSeconds: 120 },
  full ? { n: 13, args: ["-tq", "13"], graphs: 20797002, targetSeconds: 2400 } : { n: 13, args: ["-tq", "13", "0/10"], total: 20797002, graphs: null, targetSeconds: 2400 },
];

/** CPU seconds of a finished child (Linux: /proc is gone by then, so ask the shell's `times`). */
async function census(c) {
  const geng = spawn("bash", ["-c", `nauty-geng ${c.args.join(" ")}; times >&2`], { stdio: ["ignore", "pipe", "pipe"] });
  let gengTimes = "";
  geng.stderr.on("data", (d) => (gengTimes += d));
  const gengDone = new Promise((resolve) => geng.on("exit", resolve));
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const summary = await runCensus({ input: "-", stdin: geng.stdout, store: join(dir, `t${c.n}.db`), workers: 2 });
  const wall = (performance.now() - t0) / 1000;
  const cpu = process.cpuUsage(cpu0);
  await gengDone;
  // `times` prints the shell's and its children's user/system times: the second line is geng's.
  const childLine = gengTimes.trim().split("\n").at(-1) ?? "";
  const gengCpu = [...childLine.matchAll(/(\d+)m([\d.]+)s/g)].reduce((s, m) => s + 60 * Number(m[1]) + Number(m[2]), 0);
  return { summary, wall, cpu: (cpu.user + cpu.system) / 1e6, gengCpu };
}

const rows = [];
let over = 0;
for (const c of cases) {
  const { summary, wall, cpu, gengCpu } = await census(c);
  if (c.graphs !== null && summary.counted !== c.graphs) throw new Error(`n = ${c.n}: counted ${summary.counted} graphs, OEIS A006785 says ${c.graphs}`);
  const scale = c.graphs !== null ? 1 : c.total / summary.counted;
  const estWall = wall * scale;
  const estCpu = (cpu + gengCpu) * scale;
  // Two cores fully used is the best an unloaded machine can do with this much CPU work.
  const unloaded = estCpu / 2;
  if (unloaded > c.targetSeconds) over++;
  rows.push({
    n: c.n,
    graphs: summary.counted,
    extrapolatedTo: scale === 1 ? "measured" : `×${scale.toFixed(2)} = ${c.total}`,
    wallSeconds: Number(wall.toFixed(1)),
    cpuSeconds: Number((cpu + gengCpu).toFixed(1)),
    microsecondsPerGraphCpu: Number(((1e6 * (cpu + gengCpu)) / summary.counted).toFixed(2)),
    estimatedWallLoaded: Number(estWall.toFixed(0)),
    estimatedWall2CoresUnloaded: Number(unloaded.toFixed(0)),
    targetSeconds: c.targetSeconds,
    cells: summary.cells,
    lowestRatio: summary.lowest === null ? null : Number(summary.lowest.ratio.toFixed(4)),
  });
}

// The solver alone against the general exact search, on the first 20,000 triangle-free graphs on 12 vertices.
const sample = await new Promise((resolve) => {
  const g = spawn("nauty-geng", ["-tq", "12", "3/50"], { stdio: ["ignore", "pipe", "ignore"] });
  let text = "";
  g.stdout.on("data", (d) => (text += d));
  g.on("exit", () => resolve(text.trim().split("\n").slice(0, 20000).map((l) => parseGraph6(l))));
});
const masks = sample.map((g) => adjacencyMasks(g));
let t0 = performance.now();
let sum = 0;
for (let i = 0; i < sample.length; i++) sum += bitmaskMaxCut(masks[i], sample[i].n);
const bitmaskUs = ((performance.now() - t0) * 1000) / sample.length;
t0 = performance.now();
let sum2 = 0;
for (const g of sample) sum2 += exactMaxCut(g).value;
const exactUs = ((performance.now() - t0) * 1000) / sample.length;
if (sum !== sum2) throw new Error(`the bitmask search and exactMaxCut disagree on the sample (${sum} vs ${sum2})`);
rows.push({ n: 12, graphs: sample.length, solver: "bitmaskMaxCut vs exactMaxCut (same values)", bitmaskMicroseconds: Number(bitmaskUs.toFixed(2)), exactMaxCutMicroseconds: Number(exactUs.toFixed(2)) });

rmSync(dir, { recursive: true, force: true });
report("census", rows);
if (over > 0) console.log(`over target on ${over} case(s) (estimated for an unloaded 2-core machine)`);
process.exit(over === 0 ? 0 : 1);
