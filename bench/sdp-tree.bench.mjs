// The SDP with triangle inequalities and the branch and bound it bounds.
// Part 1 (gap): on family graphs and small G-set graphs, how much of the SDP gap (plain SDP bound −
//   best cut) the strengthened bound closes, and its time against dsdp5's time for the plain SDP on
//   the same graph in the same run.
// Part 2 (exact): time to close, or the bracket when the budget ran out, on the targets ER_q (q ≤ 9),
//   KG(8,3), random 3-regular graphs with 100 vertices and G(80, 0.3), one core each, with the plain
//   and the strengthened node bound.
// Environment: SDP_TREE_SECONDS (per target, default 600), SDP_TREE_PARTS ("gap,exact"),
// SDP_TREE_TARGETS (comma-separated spec filter), SDP_TREE_BOUNDS ("plain,triangles"),
// SDP_TREE_GSET (G-set names, default "G11,G14": 800 vertices, minutes each).
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { solveTriangleSdp, verifyTriangleCertificate, relaxationTreeSearch, verifyTreeCertificate, toSdpa, breakoutSearch } from "../dist/cut/index.js";
import { family } from "../dist/families/index.js";
import { parseGset } from "../dist/graph/formats/gset.js";
import { SHARED_REFERENCE, hasShared, report } from "./util.mjs";

const seconds = Number(process.env.SDP_TREE_SECONDS ?? 600);
const parts = (process.env.SDP_TREE_PARTS ?? "gap,exact").split(",");
const targetFilter = process.env.SDP_TREE_TARGETS?.split(",");
const bounds = (process.env.SDP_TREE_BOUNDS ?? "plain,triangles").split(",");
const hasDsdp = spawnSync("sh", ["-c", "command -v dsdp5"]).status === 0;
const work = mkdtempSync(join(tmpdir(), "halfplus-tree-bench-"));
const rows = [];

function dsdp(graph, name) {
  if (!hasDsdp) return { seconds: NaN, value: NaN };
  const file = join(work, `${name.replace(/[^A-Za-z0-9]/g, "_")}.dat-s`);
  writeFileSync(file, toSdpa(graph));
  const t0 = process.hrtime.bigint();
  const r = spawnSync("dsdp5", [file], { maxBuffer: 1 << 26, cwd: dirname(file) });
  const s = Number(process.hrtime.bigint() - t0) / 1e9;
  const m = /DSDP Solution:\s*(\S+)/.exec(r.stdout.toString());
  return { seconds: s, value: m === null ? NaN : -Number(m[1]) };
}

const round = (x, d = 3) => Math.round(x * 10 ** d) / 10 ** d;

if (parts.includes("gap")) {
  const graphs = [
    ["polarity:q=5,loops=drop", family("polarity:q=5,loops=drop")],
    ["polarity:q=7,loops=drop", family("polarity:q=7,loops=drop")],
    ["kneser:n=8,k=3", family("kneser:n=8,k=3")],
    ["random-regular:n=100,d=3,seed=1", family("random-regular:n=100,d=3,seed=1")],
    ["gnp:n=80,p=0.3,seed=1", family("gnp:n=80,p=0.3,seed=1")],
    ["gnp:n=60,p=0.1,seed=1", family("gnp:n=60,p=0.1,seed=1")],
  ];
  if (hasShared()) {
    for (const name of (process.env.SDP_TREE_GSET ?? "G11,G14").split(",").filter(Boolean)) {
      const path = join(SHARED_REFERENCE, "gset", `${name}.txt`);
      if (existsSync(path)) graphs.push([name, parseGset(readFileSync(path)).graph]);
    }
  }
  for (const [name, g] of graphs) {
    const cut = breakoutSearch(g, { seconds: Math.min(10, 0.02 * g.n), solverSeed: 1 });
    const d = dsdp(g, name);
    const t0 = process.hrtime.bigint();
    const r = solveTriangleSdp(g, { iterations: 60, target: cut.value, seconds: Math.max(60, seconds / 5) });
    const s = Number(process.hrtime.bigint() - t0) / 1e9;
    const v = verifyTriangleCertificate(g, r.certificate);
    const gap = r.plainValue - cut.value;
    rows.push({
      part: "gap", graph: name, n: g.n, m: g.m, cut: cut.value, plainSdp: round(r.plainValue), triangles: round(r.value),
      gapClosedPct: gap > 0 ? round((100 * (r.plainValue - r.value)) / gap, 1) : null,
      inequalities: r.inequalities, rounds: r.rounds, seconds: round(s, 2), dsdpSeconds: round(d.seconds, 2), dsdpValue: round(d.value), verified: v.ok,
    });
    console.log(JSON.stringify(rows.at(-1)));
  }
}

if (parts.includes("exact")) {
  const targets = [
    "polarity:q=5,loops=drop", "polarity:q=7,loops=drop", "polarity:q=8,loops=drop", "polarity:q=9,loops=drop",
    "kneser:n=8,k=3", "random-regular:n=100,d=3,seed=1", "random-regular:n=100,d=3,seed=2", "gnp:n=80,p=0.3,seed=1",
  ].filter((s) => targetFilter === undefined || targetFilter.some((f) => s.startsWith(f)));
  for (const spec of targets) {
    const g = family(spec);
    for (const relaxation of bounds) {
      const cut = breakoutSearch(g, { seconds: 2, solverSeed: 1 });
      const t0 = process.hrtime.bigint();
      let last = 0;
      const r = relaxationTreeSearch(g, {
        seconds, relaxation, initial: cut.partition, solverSeed: 1,
        onProgress: (p) => {
          if (p.seconds - last >= 30) {
            last = p.seconds;
            console.error(`  ${spec} ${relaxation}: [${p.lower}, ${p.upper}] after ${Math.round(p.seconds)} s, ${p.nodes} nodes, ${p.open} open`);
          }
        },
      });
      const s = Number(process.hrtime.bigint() - t0) / 1e9;
      const v = verifyTreeCertificate(g, r.certificate);
      rows.push({ part: "exact", graph: spec, n: g.n, m: g.m, relaxation, status: r.status, lower: r.value, upper: r.upper, nodes: r.nodes, seconds: round(s, 1), regions: r.certificate.regions.length, verified: v.ok });
      console.log(JSON.stringify(rows.at(-1)));
    }
  }
}
rmSync(work, { recursive: true, force: true });
report("sdp-tree", rows);
