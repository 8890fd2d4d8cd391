// Time budgets hold: how long each solver takes past the seconds it was given. Unit tests stop
// solvers with work budgets (deterministic); promptness against the clock is measured here.
// Target: every overrun under MAX_OVERRUN seconds, including brackets of large graphs. Then, under
// work budgets, the units per second of every bracket stage.
import { buildGraph } from "../dist/graph/builder.js";
import { family } from "../dist/families/registry.js";
import { BreakoutSearcher } from "../dist/cut/heuristic/breakout.js";
import { Rank2Searcher } from "../dist/cut/heuristic/rank2.js";
import { MultiStartSearcher } from "../dist/cut/heuristic/local-search.js";
import { branchAndBoundMaxCut } from "../dist/cut/exact/branch-and-bound.js";
import { grayCodeMaxCut } from "../dist/cut/exact/gray-code.js";
import { exactMaxCut } from "../dist/cut/exact/exact-max-cut.js";
import { bracket } from "../dist/cut/bracket/bracket.js";
import { report } from "./util.mjs";

const MAX_OVERRUN = 3;
const rows = [];
function measure(name, budget, f) {
  const t0 = performance.now();
  f();
  const seconds = (performance.now() - t0) / 1000;
  rows.push({ name, budget, seconds: Number(seconds.toFixed(3)), overrun: Number(Math.max(0, seconds - budget).toFixed(3)) });
}

const g = family("gnp:n=2000,p=0.01,seed=1");
for (const [name, S] of [["breakout", BreakoutSearcher], ["rank2", Rank2Searcher], ["multi-start", MultiStartSearcher]]) {
  measure(`${name} run({seconds: 0.05}) on G(2000, 0.01)`, 0.05, () => new S(g, { solverSeed: 1 }).run({ seconds: 0.05 }));
}
measure("branch and bound, K_44, 0.2 s", 0.2, () => branchAndBoundMaxCut(family("complete:n=44"), { seconds: 0.2 }));
measure("Gray code, K_34, 0.1 s", 0.1, () => grayCodeMaxCut(family("complete:n=34"), { seconds: 0.1 }));
measure("exact search, effort exact on 10^7 vertices and one edge, 5 s", 5, () => exactMaxCut(buildGraph(1e7, [0], [1]).graph, { seconds: 5 }));
for (const [spec, s] of [["complete:n=2000", 3], ["gnp:n=50000,p=0.0004,seed=2", 3], ["hypercube:dim=16", 3]]) {
  const h = family(spec);
  measure(`bracket ${spec}, ${s} s`, s, () => bracket(h, { seconds: s, effort: "heuristic" }));
}
report("budgets", rows);

// Work budgets: units per second of every bracket stage (src/cut/bracket/work-units.ts), so a
// user can size `--work` from seconds, and how far the work used passes the limit. The units are
// deterministic; the rates are not (they move with the machine and its load).
const rates = [];
const WORK = 100_000_000;
for (const spec of ["polarity:q=13", "gnp:n=45,p=0.5,seed=1", "gnp:n=400,p=0.05,seed=1", "random-regular:n=2000,d=3,seed=1", "hypercube:dim=10", "complete:n=300"]) {
  const h = family(spec);
  const c0 = process.cpuUsage();
  const r = bracket(h, { work: WORK });
  const c = process.cpuUsage(c0);
  const cpu = (c.user + c.system) / 1e6;
  const b = r.budget;
  // Per CPU-second as well: on a loaded machine the wall-clock rate mostly measures the load.
  rates.push({ graph: spec, stage: "(all)", units: b.workUsed, seconds: Number(b.secondsUsed.toFixed(3)), unitsPerSecond: Math.round(b.workUsed / b.secondsUsed), unitsPerCpuSecond: Math.round(b.workUsed / cpu), overLimit: Number((b.workUsed / WORK - 1).toFixed(4)) });
  for (const st of b.stages) {
    if (st.secondsUsed < 0.01) continue; // too short to time
    rates.push({ graph: spec, stage: st.stage, units: st.workUsed, seconds: Number(st.secondsUsed.toFixed(3)), unitsPerSecond: Math.round(st.workUsed / st.secondsUsed), overLimit: null });
  }
}
report("budgets-work", rates);
const late = rows.filter((r) => r.overrun > MAX_OVERRUN);
for (const r of late) console.log(`over budget by ${r.overrun} s: ${r.name}`);
process.exit(late.length === 0 ? 0 : 1);
