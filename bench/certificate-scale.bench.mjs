// Certificates above the dense proof's size: which kind each graph's SDP dual certificate gets
// (sparse Cholesky proof, probable shift with δ = 1e-9, or a bare estimate) and what it costs, and
// what verify's re-check costs. Graphs: the G-set graphs above 3000 vertices present in
// ../shared/reference/gset (G55…G81 when present; G48, 3000 vertices, is certified with the dense
// proof off so its sparse route is timed too), and, in their place when absent, toroidal ±1 grids
// and random sparse graphs of the same sizes built here (seeded). The SDP runs a fixed number of
// sweeps (CERT_BENCH_SWEEPS, default 150): the certificate's cost hardly depends on how far it ran.
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { certifyDual, solveSdp, verifyCertificate } from "../dist/cut/index.js";
import { parseGset } from "../dist/graph/formats/gset.js";
import { graphFromEdges } from "../dist/graph/builder.js";
import { Rng } from "../dist/random/prng.js";
import { SHARED_REFERENCE, hasShared, randomDistinctPairs, report } from "./util.mjs";

const sweeps = Number(process.env.CERT_BENCH_SWEEPS ?? 150);
const rows = [];

function torus(a, b, seed) {
  const rng = new Rng(seed);
  const e = [];
  for (let r = 0; r < a; r++) {
    for (let c = 0; c < b; c++) {
      e.push([r * b + c, r * b + ((c + 1) % b), rng.nextFloat() < 0.5 ? -1 : 1]);
      e.push([r * b + c, ((r + 1) % a) * b + c, rng.nextFloat() < 0.5 ? -1 : 1]);
    }
  }
  return graphFromEdges(a * b, e);
}

function sparseRandom(n, m, seed) {
  const { us, vs } = randomDistinctPairs(n, m, new Rng(seed));
  return graphFromEdges(n, Array.from(us, (u, k) => [u, vs[k]]));
}

function measure(label, g, options = {}) {
  globalThis.gc?.();
  const sdp = solveSdp(g, { maxSweeps: sweeps, gapTolerance: 0, rank: 16 });
  const t0 = process.hrtime.bigint();
  const bound = certifyDual(g, sdp.y, options);
  const certify = Number(process.hrtime.bigint() - t0) / 1e9;
  const t1 = process.hrtime.bigint();
  const check = verifyCertificate(g, bound.certificate);
  const verify = Number(process.hrtime.bigint() - t1) / 1e9;
  const d = bound.details;
  rows.push({
    graph: label,
    n: g.n,
    m: g.m,
    kind: bound.certificate.shiftProof,
    "δ": bound.certificate.probable?.failureProbability ?? null,
    "certify s": Number(certify.toFixed(2)),
    "verify s": Number(verify.toFixed(2)),
    verdict: check.ok ? check.kind : "REJECTED",
    bound: Number(bound.value.toFixed(2)),
    primal: Number(sdp.value.toFixed(2)),
    "envelope width": d.envelopeWidth ?? null,
    "sparse work": d.sparseWork ?? null,
    "filter degree": d.filterDegree ?? null,
  });
  console.log(JSON.stringify(rows[rows.length - 1]));
}

// G-set graphs above 3000 vertices (toroidal: G57, G62, G65, G66, G67, G72, G77, G81; random: G55, G56, G58–G61, G63, G64, G70).
const gset = [55, 56, 57, 58, 59, 60, 61, 62, 63, 64, 65, 66, 67, 70, 72, 77, 81].map((k) => `G${k}`);
const dir = join(SHARED_REFERENCE, "gset");
const present = hasShared() ? gset.filter((name) => existsSync(join(dir, `${name}.txt`))) : [];
for (const name of present) measure(name, parseGset(readFileSync(join(dir, `${name}.txt`))).graph);
if (hasShared() && existsSync(join(dir, "G48.txt"))) measure("G48 (dense proof off)", parseGset(readFileSync(join(dir, "G48.txt"))).graph, { denseLimit: 0 });
if (present.length < gset.length) {
  console.log(`G-set graphs absent from ${dir}: ${gset.filter((x) => !present.includes(x)).join(", ")}; using built stand-ins of the same sizes`);
  // Toroidal ±1 grids of the toroidal G-set sizes, and random graphs at G55's and G70's densities.
  for (const [a, b] of [[50, 100], [70, 100], [100, 100], [100, 200]]) measure(`torus ${a}×${b} ±1`, torus(a, b, a * b));
  measure("random n=5000 m=12498", sparseRandom(5000, 12498, 55));
  measure("random n=10000 m=9999", sparseRandom(10000, 9999, 70));
}
report("certificate-scale", rows);
