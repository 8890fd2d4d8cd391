// Structure checks on a uniform random graph, n = 10^5, m = 10^6 (distinct pairs from Rng).
// Targets: buildGraph < 1 s, countTriangles < 1 s, degeneracy < 0.5 s (one core).
import { buildGraph } from "../dist/graph/builder.js";
import {
  countFourCycles,
  countTriangles,
  degeneracy,
  describeGraph,
  findClique,
  findCycle,
  findSubgraph,
  girth,
  patternGraph,
} from "../dist/graph/structure/index.js";
import { Rng } from "../dist/random/prng.js";
import { randomDistinctPairs, report, timeBest } from "./util.mjs";

const N = 100_000;
const M = 1_000_000;
const SEED = 1;

const { us, vs } = randomDistinctPairs(N, M, new Rng(SEED));
const rows = [];
const row = (name, target, t, result) => {
  rows.push({ step: name, ms: Math.round(t.ms * 10) / 10, targetMs: target ?? "", ok: target === null ? "" : t.ms < target, result });
};

const b = timeBest(() => buildGraph(N, us, vs).graph, 3);
const g = b.result;
row("buildGraph (CSR)", 1000, b, `n=${g.n} m=${g.m}`);
const tri = timeBest(() => countTriangles(g), 3);
row("countTriangles", 1000, tri, `${tri.result.total} triangles`);
const dg = timeBest(() => degeneracy(g), 3);
row("degeneracy", 500, dg, `degeneracy ${dg.result.degeneracy}`);
const c4 = timeBest(() => countFourCycles(g), 3);
row("countFourCycles", null, c4, `${c4.result.total} 4-cycles`);
const gi = timeBest(() => girth(g), 3);
row("girth", null, gi, `girth ${gi.result.girth}`);
const k4 = timeBest(() => findClique(g, 4), 3);
row("findClique(K4)", null, k4, `found ${k4.result.found} after ${k4.result.nodesExplored} nodes`);
const c5 = timeBest(() => findCycle(g, 5), 3);
row("findCycle(C5)", null, c5, `found ${c5.result.found} after ${c5.result.nodesExplored} nodes`);
const k23 = timeBest(() => findSubgraph(g, patternGraph("K2,3")), 3);
row("findSubgraph(K2,3)", null, k23, `found ${k23.result.found} (${k23.result.method})`);
const p5 = timeBest(() => findSubgraph(g, patternGraph("P5"), { strategy: "backtracking" }), 3);
row("findSubgraph(P5, backtracking)", null, p5, `found ${p5.result.found} after ${p5.result.nodesExplored} nodes`);
const d = timeBest(() => describeGraph(g), 2);
row("describeGraph", null, d, JSON.stringify(d.result.free));

report("structure", rows);
if (rows.some((r) => r.ok === false)) process.exitCode = 1;
