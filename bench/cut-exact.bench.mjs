// Exact max-cut timings: Gray-code enumeration at n = 30 and branch and bound on sparse n = 60 and
// dense n = 35 random graphs (target < 60 s each), plus a few harder instances for context.
import { family } from "../dist/families/registry.js";
import { randomRegularFamily } from "../dist/families/random-regular.js";
import { grayCodeMaxCut } from "../dist/cut/exact/gray-code.js";
import { branchAndBoundMaxCut } from "../dist/cut/exact/branch-and-bound.js";
import { exactMaxCut } from "../dist/cut/exact/exact-max-cut.js";
import { report, timeBest } from "./util.mjs";

const TARGET_S = 60;
const rows = [];
function run(label, spec, solve, reps = 1) {
  const g = family(spec);
  const { ms, result } = timeBest(() => solve(g), reps);
  rows.push({
    case: label,
    graph: spec,
    n: g.n,
    m: g.m,
    method: result.method,
    status: result.status,
    value: result.value,
    upper: result.upper,
    graySteps: result.graySteps,
    branchNodes: result.branchNodes,
    seconds: +(ms / 1000).toFixed(3),
    target_s: TARGET_S,
  });
}

const budget = { seconds: TARGET_S };
run("gray n=30 (dense)", "gnp:n=30,p=0.5,seed=1", (g) => grayCodeMaxCut(g, budget), 3);
run("gray n=30 (K30, no pruning)", "complete:n=30", (g) => grayCodeMaxCut(g, budget), 3);
run("gray n=30 (sparse)", "gnp:n=30,p=0.15,seed=1", (g) => grayCodeMaxCut(g, budget), 3);
run("bnb n=30 (dense)", "gnp:n=30,p=0.5,seed=1", (g) => branchAndBoundMaxCut(g, budget), 3);
for (const seed of [1, 2, 3]) {
  run(`bnb sparse n=60 avg deg 6`, `gnp:n=60,p=0.1,seed=${seed}`, (g) => branchAndBoundMaxCut(g, budget));
  run(`bnb sparse n=60 3-regular`, `${randomRegularFamily.name}:n=60,d=3,seed=${seed}`, (g) => branchAndBoundMaxCut(g, budget));
  run(`bnb dense n=35 p=0.5`, `gnp:n=35,p=0.5,seed=${seed}`, (g) => branchAndBoundMaxCut(g, budget));
}
run("bnb sparse n=60 avg deg 9", "gnp:n=60,p=0.15,seed=1", (g) => branchAndBoundMaxCut(g, budget));
run("bnb dense n=40 p=0.5", "gnp:n=40,p=0.5,seed=1", (g) => branchAndBoundMaxCut(g, budget));
run("exact sparse n=100 avg deg 3", "gnp:n=100,p=0.03,seed=1", (g) => exactMaxCut(g, budget));
run("bnb K40 (symmetric, hard)", "complete:n=40", (g) => branchAndBoundMaxCut(g, { seconds: 10 }));
report("cut-exact", rows);
