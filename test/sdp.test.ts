// The mixing-method SDP, its certified dual bound and the eigenvalue bound against published
// values, against dsdp5 on our own SDPA export, and against the G-set reference table.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { certifyDual, gershgorinShift, verifyCertificate } from "../src/cut/relaxation/certificate.js";
import { sdpUpperBound, solveAndCertifySdp } from "../src/cut/relaxation/sdp-bound.js";
import { dualBoundValue } from "../src/cut/relaxation/dual-bound.js";
import { eigenvalueUpperBound } from "../src/cut/relaxation/eigenvalue-bound.js";
import { defaultSdpRank, isGridLike, sdpObjective, solveSdp } from "../src/cut/relaxation/sdp-mixing.js";
import { toSdpa } from "../src/cut/relaxation/sdpa.js";
import type { DualCertificate } from "../src/cut/types.js";
import { family } from "../src/families/registry.js";
import { graphFromEdges } from "../src/graph/builder.js";
import { parseGset } from "../src/graph/formats/gset.js";
import type { Graph } from "../src/graph/graph.js";
import { Rng } from "../src/random/prng.js";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { cutOfPartition } from "./helpers/maxcut.js";
import { exact, exactSum } from "./helpers/exact.js";
import { complete, cycle, petersen, randomGraph as gnp } from "./helpers/graphs.js";
import { describeNeeds, file, itNeeds, tool, REFERENCE } from "./helpers/requirements.js";

const GSET_REFERENCE = join(REFERENCE, "gset");
const work = mkdtempSync(join(tmpdir(), "halfplus-sdp-"));
afterAll(() => rmSync(work, { recursive: true, force: true }));

type WeightKind = "none" | "signed" | "real";
const WEIGHTS: Record<WeightKind, ((rng: Rng) => number) | undefined> = {
  none: undefined,
  signed: (rng) => (rng.nextFloat() < 0.5 ? -1 : 1),
  real: (rng) => Math.round((3 * rng.nextFloat() - 1) * 1000) / 1000,
};
const randomGraph = (n: number, p: number, seed: number, kind: WeightKind): Graph => gnp(n, p, seed, { weight: WEIGHTS[kind] });
/** Max cut by enumeration (n ≤ 14), each cut valued by the test folder's own evaluator (test/helpers/maxcut.ts), not cutValue. */
function bruteMaxCut(g: Graph): number {
  const side = new Uint8Array(g.n);
  let best = -Infinity;
  for (let mask = 0; mask < 1 << (g.n - 1); mask++) {
    for (let i = 0; i < g.n; i++) side[i] = (mask >> i) & 1;
    best = Math.max(best, cutOfPartition(g, side));
  }
  return best;
}
const relErr = (a: number, b: number): number => Math.abs(a - b) / Math.max(Math.abs(b), 1e-12);

/** dsdp5 on our SDPA file: [primal objective, dual objective] of the GW relaxation (DSDP prints them negated). */
function dsdp(g: Graph, name: string): { primal: number; dual: number } {
  const file = join(work, `${name}.dat-s`);
  writeFileSync(file, toSdpa(g));
  const r = spawnSync("dsdp5", [file, "-gaptol", "1e-9"], { timeout: 60_000, cwd: dirname(file) }); // dsdp5 writes a results file into its cwd
  const out = r.stdout.toString();
  const dual = /DSDP Solution:\s*(\S+)/.exec(out);
  const primal = /P Objective\s*:\s*(\S+)/.exec(out);
  if (dual === null || primal === null) throw new Error(`dsdp5 output not understood:\n${out}`);
  return { dual: -Number(dual[1]), primal: -Number(primal[1]) };
}

describe("SDP values with published closed forms", () => {
  it("C5: (25 + 5√5)/8 (Goemans & Williamson, J. ACM 42 (1995), the 5-cycle example)", () => {
    const truth = (25 + 5 * Math.sqrt(5)) / 8;
    const { sdp, bound } = solveAndCertifySdp(cycle(5), { sdp: { gapTolerance: 1e-10, solverSeed: 3 } });
    expect(sdp.value).toBeLessThanOrEqual(truth + 1e-12);
    expect(relErr(sdp.value, truth)).toBeLessThan(1e-8);
    expect(bound.value).toBeGreaterThanOrEqual(truth);
    expect(relErr(bound.value, truth)).toBeLessThan(1e-6);
    expect(bound.certificate?.shiftProof).toBe("cholesky");
    expect(bruteMaxCut(cycle(5))).toBe(4);
  });

  it("Petersen 12.5 and K_n n²/4: vertex-transitive graphs meet n·λmax(L)/4 (Delorme & Poljak, Math. Programming 62 (1993))", () => {
    for (const [g, truth] of [[petersen(), 12.5], [complete(7), 49 / 4], [complete(10), 25]] as const) {
      const b = sdpUpperBound(g, { sdp: { gapTolerance: 1e-9 } });
      expect(b.value).toBeGreaterThanOrEqual(truth);
      expect(relErr(b.value, truth)).toBeLessThan(1e-4);
      expect(relErr(b.relaxationValue!, truth)).toBeLessThan(1e-4);
      const e = eigenvalueUpperBound(g);
      expect(e.value).toBeGreaterThanOrEqual(truth);
      expect(relErr(e.value, truth)).toBeLessThan(1e-9);
      expect(e.certificate?.y.every((x) => x === 0)).toBe(true);
    }
    // Max cut of Petersen is 12 and of K_n is ⌊n²/4⌋ (common practice, no source; checked by enumeration here).
    expect(bruteMaxCut(petersen())).toBe(12);
    expect(bruteMaxCut(complete(7))).toBe(12);
  });
});

describeNeeds([tool("dsdp5")], "agreement with dsdp5 (Debian dsdp) on our SDPA export", () => {
  it("a dozen random graphs, n 30–80, unweighted, ±1 and real weights: certified bound within 1e-4", () => {
    const kinds: WeightKind[] = ["none", "signed", "real"];
    for (let t = 0; t < 12; t++) {
      const n = 30 + ((t * 17) % 51);
      const g = randomGraph(n, [0.1, 0.3, 0.6][t % 3], 100 + t, kinds[t % 3]);
      const ref = dsdp(g, `rand${t}`);
      const { sdp, bound } = solveAndCertifySdp(g, { sdp: { gapTolerance: 1e-8, solverSeed: t } });
      const ok = verifyCertificate(g, bound.certificate!);
      expect(ok.ok, ok.message).toBe(true);
      expect(relErr(bound.value, ref.dual), `graph ${t}: ours ${bound.value}, dsdp ${ref.dual}`).toBeLessThan(1e-4);
      expect(relErr(sdp.value, ref.primal)).toBeLessThan(1e-4);
      // Ours is a proof: it may not fall below DSDP's (feasible) primal objective beyond its accuracy.
      expect(bound.value).toBeGreaterThanOrEqual(ref.primal * (1 - 1e-7));
      expect(bound.value).toBeGreaterThanOrEqual(sdp.value);
    }
  });
});

describeNeeds([file(join(GSET_REFERENCE, "sdp-upper-bound.csv"), "../shared/reference/gset/sdp-upper-bound.csv")], "G-set reference bounds (../shared/reference/gset/sdp-upper-bound.csv)", () => {
  const table = existsSync(join(GSET_REFERENCE, "sdp-upper-bound.csv"))
    ? new Map(
        readFileSync(join(GSET_REFERENCE, "sdp-upper-bound.csv"), "utf8")
          .trim()
          .split("\n")
          .slice(1)
          .map((l) => l.split(","))
          .map(([k, v]) => [k, Number(v)] as const),
      )
    : new Map<string, number>();
  for (const name of ["G1", "G14", "G11"]) {
    it(`${name}: certified bound within 0.05% of the table (DSDP 5.8 dual objective)`, () => {
      const g = parseGset(readFileSync(join(GSET_REFERENCE, `${name}.txt`))).graph;
      const ref = table.get(name)!;
      const b = sdpUpperBound(g, { sdp: { gapTolerance: 1e-4 } });
      // G11 is a toroidal grid: its narrow envelope makes the sparse proof far cheaper than the dense one.
      expect(b.certificate?.shiftProof).toBe(name === "G11" ? "sparse-cholesky" : "cholesky");
      // The table rounds to 4–6 significant digits; a proof may sit below it by that rounding only.
      expect(b.value).toBeGreaterThanOrEqual(ref * (1 - 1e-5));
      expect((b.value - ref) / ref).toBeLessThan(5e-4);
    });
  }
});

describe("eigenvalue bound", () => {
  it("even cycles: λmax(L) = 4 (Brouwer & Haemers, §1.4.3), so n·4/4 = n = m, proved by Gershgorin at any size", () => {
    for (const n of [10, 1200]) {
      const e = eigenvalueUpperBound(cycle(n));
      expect(e.certificate?.shiftProof).toBe("gershgorin");
      expect(e.value).toBeGreaterThanOrEqual(n);
      expect(relErr(e.value, n)).toBeLessThan(1e-12);
      expect(verifyCertificate(cycle(n), e.certificate!).proven).toBe(true);
    }
  });

  it("above denseLimit, with the sparse and probable shifts turned off, it is an honest estimate, labelled as such", () => {
    const g = randomGraph(300, 0.05, 77, "none");
    const e = eigenvalueUpperBound(g, { denseLimit: 100, sparseWorkLimit: 0, failureProbability: 0 });
    expect(e.certificate?.shiftProof).toBe("lanczos-estimate");
    const proved = eigenvalueUpperBound(g);
    expect(proved.certificate?.shiftProof).toBe("cholesky");
    expect(relErr(e.value, proved.value)).toBeLessThan(1e-8);
    const v = verifyCertificate(g, e.certificate!);
    expect(v.ok).toBe(true);
    expect(v.proven).toBe(false);
  });
});

describe("certificates", () => {
  const graphs: [string, Graph][] = [
    ["C5", cycle(5)],
    ["petersen", petersen()],
    ["gnp", randomGraph(60, 0.2, 1, "none")],
    ["signed", randomGraph(50, 0.3, 2, "signed")],
    ["real", randomGraph(40, 0.5, 3, "real")],
  ];

  it("verifyCertificate accepts every certificate we produce, for each shift proof", () => {
    for (const [name, g] of graphs) {
      const sdp = solveSdp(g, { gapTolerance: 1e-6 });
      for (const shiftProof of ["auto", "cholesky", "gershgorin", "lanczos-estimate"] as const) {
        const rec = certifyDual(g, sdp.y, { shiftProof });
        const check = verifyCertificate(g, rec.certificate!);
        expect(check.ok, `${name}/${shiftProof}: ${check.message}`).toBe(true);
        expect(check.value).toBe(rec.value);
        expect(check.proven).toBe(shiftProof !== "lanczos-estimate");
        expect(rec.value).toBeGreaterThanOrEqual(sdp.value);
      }
      const e = eigenvalueUpperBound(g);
      expect(verifyCertificate(g, e.certificate!).ok).toBe(true);
    }
  });

  it("rejects tampered certificates: y lowered, shift lowered, wrong length, NaN, unknown kind or shift proof", () => {
    // Input validation, common practice, no source.
    for (const [name, g] of graphs) {
      const b = sdpUpperBound(g, { sdp: { gapTolerance: 1e-6 } });
      const c = b.certificate!;
      const tampered: [string, DualCertificate][] = [];
      const y1 = c.y.slice();
      y1[0] -= 1;
      tampered.push(["y lowered", { ...c, y: y1 }]);
      tampered.push(["shift lowered", { ...c, shift: c.shift - 1e-3 }]);
      tampered.push(["short y", { ...c, y: c.y.slice(1) }]);
      const y2 = c.y.slice();
      y2[1] = NaN;
      tampered.push(["NaN in y", { ...c, y: y2 }]);
      tampered.push(["NaN shift", { ...c, shift: NaN }]);
      tampered.push(["unknown shift proof", { ...c, shiftProof: "trust-me" as never }]);
      tampered.push(["wrong kind", { ...c, kind: "other" as "psd-dual" }]);
      tampered.push(["Gershgorin claim", { ...c, shiftProof: "gershgorin" }]);
      for (const shiftProof of ["lanczos-estimate"] as const) {
        tampered.push([`lowered ${shiftProof}`, { ...c, shiftProof, shift: c.shift - 1e-2 }]);
      }
      for (const [what, t] of tampered) expect(verifyCertificate(g, t).ok, `${name}: ${what}`).toBe(false);
    }
  });

  it("bounds hold: max cut ≤ primal SDP ≤ certified bound ≤ eigenvalue bound (signed weights too)", () => {
    for (let t = 0; t < 6; t++) {
      const g = randomGraph(12, 0.5, 40 + t, (["none", "signed", "real"] as const)[t % 3]);
      const b = sdpUpperBound(g, { sdp: { gapTolerance: 1e-7 } });
      const e = eigenvalueUpperBound(g);
      const mc = bruteMaxCut(g);
      expect(b.relaxationValue!).toBeGreaterThanOrEqual(mc - 1e-9);
      expect(b.value).toBeGreaterThanOrEqual(b.relaxationValue!);
      // The eigenvalue bound is the dual point y = 0, so it cannot beat the SDP optimum.
      expect(e.value).toBeGreaterThanOrEqual(b.relaxationValue!);
      expect(e.value).toBeGreaterThanOrEqual(b.value * (1 - 1e-6));
      expect(gershgorinShift(g, b.certificate!.y)).toBeGreaterThanOrEqual(b.certificate!.shift - 1e-9);
    }
  });

  it("certifies any y, even a poor one, and the value is ¼(Σy + n·shift) rounded up", () => {
    const g = randomGraph(30, 0.3, 9, "signed");
    const y = Float64Array.from({ length: g.n }, (_, i) => (i % 3) - 1);
    const rec = certifyDual(g, y);
    expect(verifyCertificate(g, rec.certificate!).ok).toBe(true);
    const plain = (y.reduce((a, b) => a + b, 0) + g.n * rec.certificate!.shift) / 4;
    expect(rec.value).toBeGreaterThanOrEqual(plain);
    expect(rec.value - plain).toBeLessThan(1e-9 * Math.max(1, Math.abs(plain)));
    // Independent oracle for the rounded-up sum: exact arithmetic on the doubles (test/helpers/exact.ts),
    // 4·value ≥ Σy + n·shift exactly, and the rounding added is tiny.
    const exactFour = exactSum(y) + BigInt(g.n) * exact(rec.certificate!.shift);
    expect(4n * exact(dualBoundValue(y, rec.certificate!.shift)) >= exactFour).toBe(true);
    expect(4n * exact(rec.value) >= exactFour).toBe(true);
    expect(rec.value).toBeGreaterThanOrEqual(sdpUpperBound(g).relaxationValue!);
    expect(() => certifyDual(g, y.slice(1))).toThrow(/`y` has 29 entries but the graph has 30 vertices/);
    expect(() => certifyDual(g, Float64Array.from(y, (x, i) => (i === 4 ? Infinity : x)))).toThrow(/`y`\[4\] is Infinity/);
    expect(() => certifyDual(g, y, { shiftProof: "magic" as never })).toThrow(/invalid `shiftProof`/);
  });
});

describe("solveSdp", () => {
  it("grid-like graphs (depth from vertex 0 ≥ √n, ≥ 256 vertices) are told apart from random ones", () => {
    // Common practice, no source: a k×k torus has breadth-first depth k, a cycle n/2, G(n, p) O(log n).
    const torus = (a: number, b: number): Graph => {
      const e: [number, number, number][] = [];
      for (let r = 0; r < a; r++) for (let c = 0; c < b; c++) e.push([r * b + c, r * b + ((c + 1) % b), (r + c) % 3 === 0 ? -1 : 1], [r * b + c, ((r + 1) % a) * b + c, 1]);
      return graphFromEdges(a * b, e);
    };
    expect(isGridLike(torus(20, 40))).toBe(true);
    expect(isGridLike(cycle(300))).toBe(true);
    expect(isGridLike(cycle(200))).toBe(false); // below 256 vertices
    expect(isGridLike(gnp(800, 0.01, 4))).toBe(false);
    expect(isGridLike(gnp(2000, 0.002, 5))).toBe(false);
  });

  it("over-relaxed sweeps (ω = 1.9, one-pass update) raise the objective every sweep and keep the rows unit", () => {
    // The chord argument of sdp-mixing.ts's header (every 1 ≤ ω < 2 update raises the objective); the
    // one-pass update computes the new row's norm algebraically, so its rows are checked directly.
    const g = gnp(300, 0.02, 6, { weight: (rng) => (rng.nextFloat() < 0.5 ? -1 : 1) });
    let prev = -Infinity;
    let initial: Float64Array | undefined;
    for (let k = 0; k < 40; k++) {
      const s = solveSdp(g, { overRelaxation: 1.9, maxSweeps: 1, gapTolerance: 0, tolerance: 0, rank: 8, ...(initial === undefined ? {} : { initial }) });
      expect(s.value).toBeGreaterThanOrEqual(prev - 1e-9 * Math.abs(s.value));
      prev = s.value;
      initial = s.vectors;
    }
    const s = solveSdp(g, { overRelaxation: 1.9, maxSweeps: 500, gapTolerance: 0, tolerance: 0, rank: 8 });
    for (let i = 0; i < g.n; i++) {
      let q = 0;
      for (let t = 0; t < 8; t++) q += s.vectors[i * 8 + t] ** 2;
      expect(Math.abs(q - 1)).toBeLessThan(1e-12);
    }
  });

  it("records its seed and rank, repeats itself from the seed, and keeps unit rows", () => {
    // Record plumbing, common practice, no source.
    const g = randomGraph(50, 0.2, 5, "real");
    const a = solveSdp(g, { solverSeed: 17, maxSweeps: 30 });
    const b = solveSdp(g, { solverSeed: 17, maxSweeps: 30 });
    expect(a.solverSeed).toBe(17);
    expect(a.rank).toBe(defaultSdpRank(50));
    expect(defaultSdpRank(50)).toBe(11); // ⌈√100⌉ + 1
    expect(Array.from(a.vectors)).toEqual(Array.from(b.vectors));
    for (let i = 0; i < g.n; i++) {
      let s = 0;
      for (let t = 0; t < a.rank; t++) s += a.vectors[i * a.rank + t] ** 2;
      expect(s).toBeCloseTo(1, 12);
    }
    expect(a.value).toBeCloseTo(sdpObjective(g, a.vectors, a.rank), 10);
    // ¼Σy equals the primal value (y_i = ⟨(LV)_i, v_i⟩ sums to ⟨L, VVᵀ⟩).
    expect(a.y.reduce((x, y) => x + y, 0) / 4).toBeCloseTo(a.value, 9);
  });

  it("stops on its budgets and validates options", () => {
    // Input validation, common practice, no source.
    const g = randomGraph(80, 0.2, 6, "none");
    expect(solveSdp(g, { maxSweeps: 3, gapTolerance: 0 }).status).toBe("iteration-limit");
    expect(solveSdp(g, { seconds: 1e-6, gapTolerance: 0 }).status).toBe("time-limit");
    expect(solveSdp(graphFromEdges(4, []), {}).status).toBe("converged");
    expect(() => solveSdp(g, { rank: 0 })).toThrow(/invalid `rank`/);
    expect(() => solveSdp(g, { solverSeed: -1 })).toThrow(/invalid `solverSeed`/);
    expect(() => solveSdp(g, { gapTolerance: 2 })).toThrow(/invalid `gapTolerance`/);
    expect(() => solveSdp(g, { initial: new Float64Array(3) })).toThrow(/invalid `initial`/);
  });
});

describe("SDPA export", () => {
  it("writes F_0 = L/4, F_i = e_i e_iᵀ, c = 1 in SDPA sparse format (SDPA manual: dat-s layout)", () => {
    const g = graphFromEdges(4, [[0, 1, 2], [1, 2, -1], [2, 3, 0.5]]);
    const lines = toSdpa(g, { comment: "test" }).trim().split("\n");
    expect(lines[0]).toBe('"test');
    expect(lines.slice(1, 5)).toEqual(["4 = mDIM", "1 = nBLOCK", "4 = bLOCKsTRUCT", "1 1 1 1"]);
    const entries = lines.slice(5).map((l) => l.split(" ").map(Number));
    const F0 = new Map(entries.filter((e) => e[0] === 0).map((e) => [`${e[2]},${e[3]}`, e[4]]));
    // L/4 upper triangle: degrees 2, 1, −0.5, 0.5; off-diagonal −w/4.
    expect(Object.fromEntries(F0)).toEqual({ "1,1": 0.5, "1,2": -0.5, "2,2": 0.25, "2,3": 0.25, "3,3": -0.125, "3,4": -0.125, "4,4": 0.125 });
    expect(entries.filter((e) => e[0] > 0)).toEqual([1, 2, 3, 4].map((i) => [i, 1, i, i, 1]));
    expect(() => toSdpa(graphFromEdges(0, []))).toThrow(/no vertices/);
    expect(() => toSdpa(g, { comment: "a\nb" })).toThrow(/single line/);
    // An isolated vertex has no F_0 entry but keeps its constraint.
    expect(toSdpa(graphFromEdges(3, [[0, 1]]))).not.toMatch(/^0 1 3 3/m);
  });

  describe("the sdp-export command", () => {
    ensureBuilt();
    it("writes the same file as toSdpa for a family spec, to -o FILE or standard output", () => {
      const out = join(work, "p.dat-s");
      const r = halfplus(["sdp-export", "petersen", "-o", out]);
      expect(r.code, r.stderr).toBe(0);
      const body = (s: string) => s.split("\n").slice(1).join("\n");
      const text = readFileSync(out, "utf8");
      expect(text.split("\n")[0]).toMatch(/^"max-cut SDP relaxation of petersen/);
      // The command adds only the comment line to what toSdpa writes for the same family graph.
      expect(body(text)).toBe(body(toSdpa(family("petersen"))));
      expect(body(text).split("\n").length).toBe(body(toSdpa(petersen())).split("\n").length);
      const s = halfplus(["sdp-export", "petersen"]);
      expect(s.code).toBe(0);
      expect(s.stdout).toBe(text);
    });
    it("fails with exit code 2 and a one-line message on a bad source", () => {
      const r = halfplus(["sdp-export", "no-such-file.txt"]);
      expect(r.code).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(/no-such-file\.txt/);
    });
    itNeeds([tool("dsdp5")], "dsdp5 reads the exported Petersen file and finds 12.5", () => {
      const out = join(work, "q.dat-s");
      expect(halfplus(["sdp-export", "petersen", "--out", out]).code).toBe(0);
      const r = spawnSync("dsdp5", [out], { timeout: 60_000, cwd: dirname(out) });
      const m = /DSDP Solution:\s*(\S+)/.exec(r.stdout.toString());
      expect(m).not.toBeNull();
      expect(-Number(m![1])).toBeCloseTo(12.5, 5);
    });
  });
});
