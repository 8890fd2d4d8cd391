// Build times of the structured families from dist/: ER_q at q = 101 (target < 1 s) and KG(13,5)
// (target < 0.2 s), plus other algebraic families and the finite fields they rest on.
import { family } from "../dist/families/registry.js";
import { finiteField, finiteFieldOf } from "../dist/families/finite-field.js";
import { report, timeBest } from "./util.mjs";

const rows = [];
function graph(spec, targetS = null, reps = 5) {
  const { ms, result: g } = timeBest(() => family(spec), reps);
  rows.push({ case: spec, n: g.n, m: g.m, seconds: +(ms / 1000).toFixed(4), target_s: targetS, ok: targetS === null ? "" : ms / 1000 < targetS ? "yes" : "NO" });
}
function field(label, make, reps = 3) {
  const { ms, result: F } = timeBest(make, reps);
  rows.push({ case: label, n: F.q, m: "", seconds: +(ms / 1000).toFixed(4), target_s: null, ok: "" });
}

graph("polarity:q=101", 1);
graph("kneser:n=13,k=5", 0.2);
graph("polarity:q=211");
graph("projective-plane:q=101");
graph("kneser:n=16,k=7");
graph("paley:q=4001");
graph("paley:q=3125");
graph("norm-graph:q=7,t=4");
graph("norm-graph:q=17,t=3");
graph("norm-graph:q=49,t=2");
graph("andrasfai:k=1000");
graph("hypercube:dim=18", null, 3);
graph("generalized-petersen:n=1000000,k=3", null, 3);
graph("mycielski-chain:steps=12", null, 3);
graph("higman-sims");
field("GF(997)", () => finiteField(997));
field("GF(3^6) = GF(729)", () => finiteField(729));
field("GF(2^20)", () => finiteFieldOf(2, 20));
field("GF(3^12)", () => finiteFieldOf(3, 12));
report("families-structured", rows);
