// Can triangle or pentagonal inequalities lower the root SDP bound of the polarity graphs ER_q?
// The plain SDP's optimum set is convex and invariant under the graph's automorphisms, so the
// average of P_g X P_gᵀ over the automorphism group, X the mixing method's solution, is optimal too.
// If that average satisfies every inequality of a class, adding the class cannot lower the bound
// (it stays feasible with the same objective). Checked exhaustively over all triples and all
// 5-subsets with all sign vectors b: triangle Σ_{i<j} b_i b_j X_ij ≥ −1 (|b| = 3), pentagonal ≥ −2
// (|b| = 5; the pentagonal case of the hypermetric inequalities, Deza and Laurent, "Geometry of
// Cuts and Metrics", 1997). Prints per q: the SDP value, the averaged objective, the smallest
// left-hand sides (≥ −1 and ≥ −2 mean no violation). BENCH_ROOT_Q (default "7 8"; 9 takes about
// three CPU-minutes: 43 million 5-subsets).
import { solveTriangleSdp } from "../dist/cut/relaxation/index.js";
import { family } from "../dist/families/index.js";
import { listAutomorphisms } from "../dist/graph/structure/index.js";
import { report } from "./util.mjs";

const qs = (process.env.BENCH_ROOT_Q ?? "7 8").split(/\s+/).filter(Boolean).map(Number);
const rows = [];
for (const q of qs) {
  const c0 = process.cpuUsage();
  const g = family(`polarity:q=${q},loops=drop`);
  const s = solveTriangleSdp(g, { iterations: 0, solverSeed: 1 });
  const n = g.n, r = s.rank, V = s.vectors;
  const X = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let d = 0;
      for (let t = 0; t < r; t++) d += V[i * r + t] * V[j * r + t];
      X[i * n + j] = d;
    }
  }
  const group = listAutomorphisms(g).elements;
  const Y = new Float64Array(n * n);
  for (const p of group) for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) Y[p[i] * n + p[j]] += X[i * n + j] / group.length;
  let objective = 0;
  g.forEachEdge((u, v, w) => (objective += (w * (1 - Y[u * n + v])) / 2));
  let minTriangle = Infinity;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      for (let k = j + 1; k < n; k++) {
        const a = Y[i * n + j], b = Y[i * n + k], c = Y[j * n + k];
        minTriangle = Math.min(minTriangle, a + b + c, a - b - c, -a + b - c, -a - b + c);
      }
    }
  }
  let minPentagonal = Infinity;
  const x = new Float64Array(10);
  const id = [0, 0, 0, 0, 0];
  for (id[0] = 0; id[0] < n; id[0]++) for (id[1] = id[0] + 1; id[1] < n; id[1]++) for (id[2] = id[1] + 1; id[2] < n; id[2]++) {
    for (id[3] = id[2] + 1; id[3] < n; id[3]++) {
      for (id[4] = id[3] + 1; id[4] < n; id[4]++) {
        let p = 0;
        for (let a = 0; a < 5; a++) for (let b = a + 1; b < 5; b++) x[p++] = Y[id[a] * n + id[b]];
        // b_0 = +1 (b and −b give the same sum).
        for (let m = 0; m < 16; m++) {
          const sg = [1, m & 1 ? -1 : 1, m & 2 ? -1 : 1, m & 4 ? -1 : 1, m & 8 ? -1 : 1];
          let v = 0;
          p = 0;
          for (let a = 0; a < 5; a++) for (let b = a + 1; b < 5; b++) v += sg[a] * sg[b] * x[p++];
          if (v < minPentagonal) minPentagonal = v;
        }
      }
    }
  }
  const cpu = process.cpuUsage(c0);
  rows.push({
    graph: `ER_${q}`, n, automorphisms: group.length, sdp: Number(s.value.toFixed(4)), averagedObjective: Number(objective.toFixed(4)),
    minTriangle: Number(minTriangle.toFixed(4)), minPentagonal: Number(minPentagonal.toFixed(4)), cpuSeconds: Number(((cpu.user + cpu.system) / 1e6).toFixed(1)),
  });
  console.log(JSON.stringify(rows.at(-1)));
}
report("root-inequalities", rows);
