// The surplus arguments at scale: the best vector choice (block coordinate ascent) and the
// decomposition cut on K4-free process graphs, G(n, p) and polarity graphs, with their values beside
// the default and few-triangles guarantees. Target: each under a few seconds at m ≈ 10^5.
// Usage: node bench/bounds.bench.mjs
import { family } from "../dist/families/registry.js";
import { optimiseVectorChoice } from "../dist/bounds/vector-choice.js";
import { fewTrianglesBound } from "../dist/bounds/few-triangles.js";
import { decompositionCut } from "../dist/cut/decomposition/decomposition-cut.js";
import { report, timeBest } from "./util.mjs";

const specs = [
  "hfree-process:n=400,h=K4,seed=1",
  "hfree-process:n=1000,h=K4,seed=1",
  "gnp:n=2000,p=0.05,seed=1",
  "gnp:n=1000,p=0.2,seed=1",
  "polarity:q=31",
  "random-regular:n=20000,d=10,seed=1",
];

const rows = [];
for (const spec of specs) {
  const g = family(spec);
  const opt = timeBest(() => optimiseVectorChoice(g), 1);
  const dec = timeBest(() => decompositionCut(g, { solverSeed: 1 }), 1);
  const few = fewTrianglesBound(g);
  rows.push({
    graph: spec,
    n: g.n,
    m: g.m,
    triangles: few.triangles,
    default: +opt.result.defaultSurplus.toFixed(2),
    fewTriangles: +few.surplus.toFixed(2),
    optimised: +opt.result.guarantee.surplus.toFixed(2),
    sweeps: opt.result.sweeps,
    optimise_ms: Math.round(opt.ms),
    decompositionSurplus: dec.result.surplus,
    decompositionGuarantee: +dec.result.guarantee.toFixed(2),
    pieces: dec.result.pieces.length,
    decompose_ms: Math.round(dec.ms),
  });
}
report("bounds", rows);
