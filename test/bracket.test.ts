// The combined max-cut bracket and its verifier: brackets never cross the exact optimum, every
// certificate we write verifies, and tampered records are rejected.

import { describe, expect, it } from "vitest";
import { buildGraph } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { family } from "../src/families/registry.js";
import { bracket, bracketSnapshot, recordFromSnapshot, recordJson, type BracketProgress, type BracketRecord } from "../src/cut/bracket/index.js";
import { graphHash } from "../src/graph/hash.js";
import { parseBracketRecord, verifyBracket } from "../src/cut/bracket/verify.js";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { cutValue } from "../src/graph/cut-value.js";
import { InputError } from "../src/errors.js";
import { Rng } from "../src/random/prng.js";
import { randomGraph } from "./helpers/graphs.js";

/** A record as `verify` would read it back from disk. */
const roundTrip = (r: BracketRecord): BracketRecord => parseBracketRecord(JSON.parse(JSON.stringify(r)), "test");
const failed = (g: Graph, r: BracketRecord): string[] => verifyBracket(g, r).checks.filter((c) => !c.ok).map((c) => c.name);

/** Every kind of tampering we promise to catch; each must make verify fail. */
function tamperings(g: Graph, r: BracketRecord): [string, BracketRecord][] {
  const out: [string, BracketRecord][] = [];
  const copy = (): BracketRecord => JSON.parse(JSON.stringify(r));
  // A changed partition: move a vertex whose move changes the cut.
  for (let v = 0; v < g.n; v++) {
    const t = copy();
    t.partition[v] ^= 1;
    if (cutValue(g, t.partition) !== r.lower) {
      out.push(["partition changed", t]);
      break;
    }
  }
  const raised = copy();
  raised.lower += 1;
  raised.surplusLower += 1;
  out.push(["lower raised", raised]);
  const cheaper = copy();
  cheaper.upper -= 1;
  cheaper.surplusUpper -= 1;
  if (cheaper.upper >= cheaper.lower) out.push(["upper lowered", cheaper]);
  if (r.certificate.kind === "psd-dual") {
    const up = copy();
    if (up.certificate.kind === "psd-dual") up.certificate.y[0] += 8; // raises the proven bound by 2
    out.push(["y raised", up]);
    const down = copy();
    if (down.certificate.kind === "psd-dual") down.certificate.y = down.certificate.y.map((x) => x - 1); // shift no longer covers λmax
    out.push(["y lowered", down]);
    const shift = copy();
    if (shift.certificate.kind === "psd-dual") shift.certificate.shift -= Math.max(1, Math.abs(shift.certificate.shift) / 2);
    out.push(["shift lowered", shift]);
  }
  if (!r.exact && r.upper > r.lower) {
    const claim = copy();
    claim.exact = true;
    out.push(["exact claimed", claim]);
  }
  return out;
}

describe("bracket: never crosses the optimum", () => {
  it("10^4 random graphs with n ≤ 10 (quick methods): lower ≤ optimum ≤ upper, certificates verify, tampering is caught", () => {
    // The optimum comes from the exact search, itself checked against brute force and a MILP solver (cut-exact tests).
    const rng = new Rng(4242);
    let tampered = 0;
    for (let t = 0; t < 10_000; t++) {
      const n = 2 + rng.nextInt(9);
      const weight = t % 5 === 3 ? (r: Rng) => (r.nextInt(2) ? 1 : -1) : t % 5 === 4 ? (r: Rng) => r.nextInt(5) + 1 : undefined;
      const g = randomGraph(n, rng.nextFloat(), rng, { weight });
      const r = bracket(g, { effort: t % 50 === 0 ? "auto" : "quick", solverSeed: t });
      const opt = exactMaxCut(g).value;
      expect(r.lower).toBeLessThanOrEqual(opt);
      expect(r.upper).toBeGreaterThanOrEqual(opt);
      expect(r.lower).toBe(cutValue(g, r.partition));
      const back = roundTrip(r);
      const verdict = verifyBracket(g, back);
      if (!verdict.ok) throw new Error(`graph ${t}: ${JSON.stringify(verdict.checks.filter((c) => !c.ok))}`);
      if (t % 20 === 0) {
        for (const [what, bad] of tamperings(g, back)) {
          expect(failed(g, bad), `${what} (graph ${t})`).not.toEqual([]);
          tampered++;
        }
      }
    }
    expect(tampered).toBeGreaterThan(1000);
  });

  it("weighted graphs with negative and fractional weights, and medium graphs taking each path of `auto`", () => {
    const rng = new Rng(99);
    const cases: Graph[] = [
      randomGraph(12, 0.5, rng, { weight: (r) => Math.round(r.nextNormal() * 100) / 10 }),
      randomGraph(14, 0.6, rng, { weight: (r) => (r.nextInt(2) ? 1 : -1) }),
      randomGraph(40, 0.15, rng), // 30 < n ≤ 50: heuristics, then branch and bound
      randomGraph(28, 0.3, rng), // n ≤ 30: exact search first
    ];
    for (const g of cases) {
      const r = bracket(g, { work: 200_000_000 });
      const opt = exactMaxCut(g);
      expect(r.lower).toBeLessThanOrEqual(opt.value + 1e-9);
      expect(r.upper).toBeGreaterThanOrEqual(opt.value - 1e-9);
      expect(r.exact).toBe(true);
      expect(r.certificate.kind).toBe("exhaustive");
      expect(verifyBracket(g, roundTrip(r)).ok).toBe(true);
    }
  });

  it("heuristic brackets on larger graphs verify, with proven bounds", () => {
    const g = family("gnp:n=150,p=0.05,seed=3");
    const r = bracket(g, { effort: "heuristic", work: 15_000_000, solverSeed: 7 });
    expect(r.lower).toBeLessThanOrEqual(r.upper);
    // Any 1-flip local optimum cuts at least half of every vertex's edges, so ≥ m/2 (common knowledge).
    expect(r.lower).toBeGreaterThanOrEqual(g.m / 2);
    expect(r.certificate.kind).toBe("psd-dual");
    expect(r.upperKind).toBe("proven");
    expect(r.graphHash).toBe(graphHash(g));
    const back = roundTrip(r);
    expect(verifyBracket(g, back).ok).toBe(true);
    for (const [what, bad] of tamperings(g, back)) expect(failed(g, bad), what).not.toEqual([]);
  });
});

describe("bracket: closes by certificate alone where the SDP is integral-tight", () => {
  it("Petersen (SDP 12.5) and C5 (SDP (25 + 5√5)/8 ≈ 4.52) round down to the optimum", () => {
    // Petersen: GW SDP value 12.5 (Delorme & Poljak 1993, vertex-transitive: the eigenvalue bound
    // 10·5/4); C5: (25 + 5√5)/8 (Goemans & Williamson 1995). Max cuts 12 and 4 (from memory).
    for (const [spec, opt] of [["petersen", 12], ["cycle:n=5", 4]] as const) {
      const g = family(spec);
      const r = bracket(g, { effort: "heuristic", work: 20_000_000 });
      expect(r.lower).toBe(opt);
      expect(r.upper).toBe(opt);
      expect(r.exact).toBe(true);
      expect(r.certificate.kind).toBe("psd-dual");
      expect(r.certificate.roundedDown).toBe(true);
      expect(verifyBracket(g, roundTrip(r)).ok).toBe(true);
    }
  });
});

describe("bracket: record and verifier details", () => {
  it("reports monotone progress and keeps surplus = bound − W/2", () => {
    const g = family("gnp:n=60,p=0.2,seed=1");
    const seen: BracketProgress[] = [];
    const r = bracket(g, { effort: "heuristic", work: 10_000_000, onProgress: (p) => seen.push(p) });
    expect(seen.length).toBeGreaterThan(2);
    for (let i = 1; i < seen.length; i++) {
      expect(seen[i].lower).toBeGreaterThanOrEqual(seen[i - 1].lower);
      expect(seen[i].upper).toBeLessThanOrEqual(seen[i - 1].upper);
      expect(seen[i].elapsed).toBeGreaterThanOrEqual(seen[i - 1].elapsed);
    }
    expect(r.surplusLower).toBe(r.lower - g.totalWeight / 2);
    expect(r.surplusUpper).toBe(r.upper - g.totalWeight / 2);
    expect(r.runs.length).toBeGreaterThan(3);
    expect(JSON.parse(JSON.stringify(r))).toEqual(r); // plain data: survives JSON unchanged
  });

  it("a snapshot's JSON (typed partition, written natively) is the plain record's JSON, byte for byte", () => {
    // Common practice, no source: two writers of one format must agree.
    for (const spec of ["petersen", "gnp:n=60,p=0.2,seed=4", "path:n=1"]) {
      const g = family(spec);
      const snap = bracketSnapshot(g, { work: 10_000_000, source: { spec } });
      expect(snap.partition).toBeInstanceOf(Uint8Array);
      const plain = recordFromSnapshot(snap);
      expect(recordJson(snap)).toBe(JSON.stringify(plain));
      expect(recordJson(plain)).toBe(JSON.stringify(plain));
      expect(verifyBracket(g, roundTrip(plain)).ok).toBe(true);
    }
  });

  it("rejects a record checked against a different graph", () => {
    // Input validation, common practice, no source.
    const g = family("petersen");
    const r = roundTrip(bracket(g));
    const other = family("dodecahedron");
    expect(failed(other, r)).toContain("graph");
    const relabelled = buildGraph(10, [0], [1]).graph;
    expect(failed(relabelled, r)).toContain("graph");
  });

  it("the graph hash depends on edges and weights, not on how the graph was built", () => {
    const a = buildGraph(4, [0, 1, 2], [1, 2, 3]).graph;
    const b = buildGraph(4, [2, 1, 0], [3, 2, 1]).graph;
    const c = buildGraph(4, [0, 1, 2], [1, 2, 3], [1, 1, 2]).graph;
    expect(graphHash(a)).toBe(graphHash(b));
    expect(graphHash(a)).not.toBe(graphHash(c));
    expect(graphHash(a)).toMatch(/^sha256:[0-9a-f]{64}$/);
  });

  it("malformed records and bad options are input errors", () => {
    // Input validation, common practice, no source.
    expect(() => parseBracketRecord({ kind: "something-else" }, "x.json")).toThrow(InputError);
    expect(() => parseBracketRecord([], "x.json")).toThrow(/x\.json/);
    const good = JSON.parse(JSON.stringify(bracket(family("cycle:n=7"))));
    delete good.certificate;
    expect(() => parseBracketRecord(good, "x.json")).toThrow(/certificate/);
    expect(() => bracket(family("petersen"), { seconds: 0 })).toThrow(/seconds/);
    expect(() => bracket(family("petersen"), { effort: "fast" as never })).toThrow(/effort/);
    expect(() => bracket(family("petersen"), { solverSeed: -1 })).toThrow(/solverSeed/);
  });
});

describe("bracket: review fixes", () => {
  it("tolerance: a record cannot buy a low upper bound with a large tolerance", () => {
    // Petersen max cut 12 (from memory; also the exact search). A record claiming upper 11 must fail.
    const g = family("petersen");
    const r = roundTrip(bracket(g, { work: 20_000_000 }));
    expect(r.certificate.kind).toBe("exhaustive");
    const bad: BracketRecord = JSON.parse(JSON.stringify(r));
    bad.upper = 11;
    bad.surplusUpper = bad.upper - g.totalWeight / 2;
    bad.certificate.tolerance = 2;
    expect(failed(g, bad)).not.toEqual([]);
    const weighted = buildGraph(3, [0, 1, 0], [1, 2, 2], [0.5, 0.5, 0.5]).graph; // triangle: max cut 1 (common practice, no source)
    const w = roundTrip(bracket(weighted, { work: 20_000_000 }));
    expect(verifyBracket(weighted, w).ok).toBe(true);
    const wb: BracketRecord = JSON.parse(JSON.stringify(w));
    wb.upper = 0.9;
    wb.surplusUpper = wb.upper - weighted.totalWeight / 2;
    wb.certificate.tolerance = 1;
    expect(failed(weighted, wb)).not.toEqual([]);
  });

  it("ten triangles of weight 0.001: the closed bracket of a disconnected graph verifies", () => {
    // Max cut of a triangle is 2 of its 3 edges (common practice, no source): 10 × 0.002.
    const us: number[] = [], vs: number[] = [], ws: number[] = [];
    for (let i = 0; i < 10; i++) {
      const a = 3 * i;
      us.push(a, a + 1, a);
      vs.push(a + 1, a + 2, a + 2);
      ws.push(0.001, 0.001, 0.001);
    }
    const g = buildGraph(30, us, vs, ws).graph;
    const r = roundTrip(bracket(g, { work: 20_000_000 }));
    expect(r.exact).toBe(true);
    expect(r.lower).toBeCloseTo(0.02, 12);
    const verdict = verifyBracket(g, r);
    expect(verdict.checks.filter((c) => !c.ok)).toEqual([]);
  });

  it("an unproven bound never closes the bracket: K_400 with a Lanczos eigenvalue bound", () => {
    // Max cut of K_n, n even, is n²/4 (common practice, no source). With 2·10^7 work units the
    // eigenvalue bound is a Lanczos estimate (the dense proof, 400³/6 units, does not fit 5 % of the budget).
    const g = family("complete:n=400");
    const r = bracket(g, { effort: "quick", work: 20_000_000 });
    expect(r.lower).toBeLessThanOrEqual(40000);
    expect(r.upper).toBeGreaterThanOrEqual(r.lower);
    // Asserted whichever way the budget fell (the dense proof may or may not fit): the record's
    // upperKind follows its certificate, and an estimate never closes the bracket.
    const estimated = r.certificate.kind === "psd-dual" && r.certificate.shiftProof === "lanczos-estimate";
    expect(r.upperKind).toBe(estimated ? "estimate" : "proven");
    expect(r.exact && r.upperKind !== "proven").toBe(false);
    const v = verifyBracket(g, roundTrip(r));
    expect(v.ok).toBe(true);
    expect(v.upperKind).toBe(estimated ? "estimate" : "proven");
  });

  it("unproven: verify rejects an exact claim resting on an estimated shift", () => {
    // Input validation, common practice, no source.
    const g = family("petersen");
    const r = roundTrip(bracket(g, { effort: "heuristic", work: 20_000_000 }));
    expect(r.certificate.kind).toBe("psd-dual");
    expect(r.exact).toBe(true);
    const bad: BracketRecord = JSON.parse(JSON.stringify(r));
    if (bad.certificate.kind === "psd-dual") bad.certificate.shiftProof = "lanczos-estimate";
    bad.upperKind = "estimate";
    expect(failed(g, bad)).toContain("proof");
  });
});

describe("bracket: a stopped exact search is re-proven by verify", () => {
  it("an unfinished-search record (bound rounded down, integer weights) verifies with a larger budget", () => {
    // Oracle: verify's own exact search from the record's partition (common practice, no source).
    const g = family("gnp:n=70,p=0.3,seed=1");
    const base = bracket(g, { effort: "heuristic", work: 5_000_000, solverSeed: 3 });
    // A work budget stops it the same way on any machine.
    const stopped = exactMaxCut(g, { work: 200_000, solverSeed: 3, initial: base.partition });
    expect(stopped.status).toBe("work-limit");
    const upper = Math.floor(stopped.upper + 1e-9);
    const W = g.totalWeight;
    const record: BracketRecord = {
      ...base,
      upper,
      surplusUpper: upper - W / 2,
      exact: false,
      upperKind: "proven",
      upperMethod: stopped.method,
      certificate: { kind: "unfinished-search", search: stopped.method, graySteps: stopped.graySteps, branchNodes: stopped.branchNodes, roundedDown: true, tolerance: 0 },
    };
    const v = verifyBracket(g, roundTrip(record), { seconds: 5 });
    expect(v.checks.filter((c) => !c.ok)).toEqual([]);
  });
});
