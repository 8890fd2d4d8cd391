// The combined bracket: on a 10^6-edge G(n, p) (target: under 2 minutes, with peak RSS) and on the
// gset graphs in ../shared/reference (skipped when absent), set against the best-known cuts and the
// published SDP bounds. Usage: node bench/bracket.bench.mjs [seconds-per-gset-graph] [--no-large]
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { family } from "../dist/families/registry.js";
import { parseGset } from "../dist/graph/formats/gset.js";
import { bracket } from "../dist/cut/bracket/bracket.js";
import { verifyBracket } from "../dist/cut/bracket/verify.js";
import { SHARED_REFERENCE, hasShared, readGsetTable, report } from "./util.mjs";

const args = process.argv.slice(2);
const gsetSeconds = Number(args.find((a) => /^[0-9.]+$/.test(a)) ?? 10);
const rows = [];

function measure(label, graph, seconds, extra = {}) {
  globalThis.gc?.();
  const t0 = performance.now();
  const r = bracket(graph, { seconds, solverSeed: 1 });
  const wall = (performance.now() - t0) / 1000;
  const v0 = performance.now();
  const verdict = verifyBracket(graph, JSON.parse(JSON.stringify(r)));
  const verifySeconds = (performance.now() - v0) / 1000;
  const row = {
    graph: label,
    n: graph.n,
    m: graph.m,
    budget_s: seconds,
    seconds: +wall.toFixed(2),
    lower: r.lower,
    upper: +r.upper.toFixed(2),
    gap_pct: +((100 * (r.upper - r.lower)) / Math.abs(r.upper)).toFixed(3),
    lowerMethod: r.lowerMethod,
    upperMethod: r.upperMethod,
    upperKind: r.upperKind,
    verified: verdict.ok,
    verify_s: +verifySeconds.toFixed(2),
    ...extra(r),
  };
  rows.push(row);
  console.log(JSON.stringify(row));
}

if (!args.includes("--no-large")) {
  // About 10^6 edges: n = 20000, p = 0.005 (expected m = 999,900).
  const g = family("gnp:n=20000,p=0.005,seed=1");
  const before = process.memoryUsage().rss;
  measure("gnp:n=20000,p=0.005 (10^6 edges)", g, 60, () => ({
    target_s: 120,
    rss_before_MB: Math.round(before / 2 ** 20),
    peak_rss_MB: Math.round(process.resourceUsage().maxRSS / 1024),
  }));
}

if (hasShared()) {
  const best = readGsetTable("best-known.csv");
  const sdp = readGsetTable("sdp-upper-bound.csv");
  for (const name of ["G1", "G11", "G14", "G22", "G43", "G48"]) {
    const g = parseGset(readFileSync(join(SHARED_REFERENCE, "gset", `${name}.txt`))).graph;
    measure(name, g, gsetSeconds, (r) => ({
      best_known: best.get(name),
      lower_pct_of_best: +((100 * r.lower) / best.get(name)).toFixed(3),
      sdp_published: sdp.get(name),
      upper_vs_sdp_pct: +((100 * (r.upper - sdp.get(name))) / sdp.get(name)).toFixed(3),
    }));
  }
} else {
  console.log("../shared/reference absent: gset rows skipped");
}
report("bracket", rows);
