// `verify` never accepts a false bound: the forgeries reported against earlier versions, one test
// each, and a property test that edits valid records at random and checks every accepted record
// against brute force. Oracle throughout: test/helpers/maxcut.ts (brute-force max cut and an edge-walk
// cut evaluator written apart from src/cut; common practice, no source).

import { describe, expect, it } from "vitest";
import { buildGraph } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { bracket, type BracketRecord } from "../src/cut/bracket/index.js";
import { parseBracketRecord, verifyBracket } from "../src/cut/bracket/verify.js";
import { closingTolerance } from "../src/cut/exact/exact-slack.js";
import { eigenvalueUpperBound } from "../src/cut/relaxation/eigenvalue-bound.js";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { InputError } from "../src/errors.js";
import { Rng } from "../src/random/prng.js";
import { randomGraph } from "./helpers/graphs.js";
import { bruteForceMaxCut, cutOfPartition } from "./helpers/maxcut.js";

const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;
const roundTrip = (r: BracketRecord): BracketRecord => parseBracketRecord(clone(r), "test");
const failedChecks = (g: Graph, r: BracketRecord): string[] => verifyBracket(g, r, { seconds: 5 }).checks.filter((c) => !c.ok).map((c) => c.name);

/** Set `upper` and keep the surplus field consistent, as a careful forger would. */
function withUpper(r: BracketRecord, upper: number): BracketRecord {
  const t = clone(r);
  t.upper = upper;
  t.surplusUpper = upper - t.totalWeight / 2;
  return t;
}

/** Two edges of weight 10^9 + 0.5 among 3000 vertices (the reported benchmark-format file). */
function twoHeavyEdges(): Graph {
  return buildGraph(3000, [0, 2], [1, 3], [1000000000.5, 1000000000.5]).graph;
}

describe("verify: the reported forgeries are rejected", () => {
  it("an unfinished-search certificate with tolerance 119 and upper = lower − 100 (two edges of weight 10^9 + 0.5)", () => {
    // Max cut: both edges cut, 2000000001 (common practice, no source).
    const g = twoHeavyEdges();
    const honest = roundTrip(bracket(g, { seconds: 2 }));
    expect(verifyBracket(g, honest).ok).toBe(true);
    const forged = withUpper(honest, honest.lower - 100);
    forged.certificate = { kind: "unfinished-search", search: "exact-bnb", graySteps: 0, branchNodes: 1, roundedDown: false, tolerance: 119 };
    forged.exact = false;
    const failed = failedChecks(g, roundTrip(forged));
    expect(failed).toContain("upper");
    expect(failed).toContain("consistency");
  });

  it("the same with an exhaustive certificate and exact: true", () => {
    const g = twoHeavyEdges();
    const forged = withUpper(bracket(g, { seconds: 2 }), 2000000001 - 100);
    forged.certificate = { kind: "exhaustive", search: "exact-bnb", graySteps: 0, branchNodes: 1, roundedDown: false, tolerance: 119 };
    forged.exact = true;
    const v = verifyBracket(g, roundTrip(forged));
    expect(v.ok).toBe(false);
    expect(v.checks.filter((c) => !c.ok).map((c) => c.name)).toEqual(expect.arrayContaining(["upper", "consistency", "exact"]));
  });

  it("40 vertices with non-integer weights: upper = lower − 1.5e-9 is rejected", () => {
    const rng = new Rng(40);
    const g = randomGraph(40, 0.15, rng, { weight: (r) => Math.round(r.nextFloat() * 10000) / 1000 });
    const honest = roundTrip(bracket(g, { seconds: 5 }));
    expect(honest.exact).toBe(true);
    expect(verifyBracket(g, honest).ok).toBe(true);
    for (const kind of ["exhaustive", "psd-dual", "positive-weights"] as const) {
      const forged = withUpper(honest, honest.lower - 1.5e-9);
      if (kind !== "exhaustive") forged.certificate = kind === "psd-dual" ? { kind, y: new Array(40).fill(0), shift: 1e6, shiftProof: "gershgorin", roundedDown: false, tolerance: 1 } : { kind, roundedDown: false, tolerance: 1 };
      const failed = failedChecks(g, roundTrip(forged));
      expect(failed, kind).toContain("consistency");
      expect(failed, kind).toContain("exact");
    }
  });

  it("a tolerance in the record never widens what verify accepts", () => {
    // Petersen max cut 12 (from memory; brute force here): upper 11 fails whatever the record's tolerance.
    const g = buildGraph(10, [0, 1, 2, 3, 4, 0, 1, 2, 3, 4, 5, 6, 7, 8, 9], [1, 2, 3, 4, 0, 5, 6, 7, 8, 9, 7, 8, 9, 5, 6]).graph;
    expect(bruteForceMaxCut(g)).toBe(12);
    const honest = roundTrip(bracket(g, { seconds: 2 }));
    for (const tolerance of [0, 1, 2, 1e9]) {
      const forged = withUpper(honest, 11);
      forged.certificate.tolerance = tolerance;
      // The partition's cut (12) must move too, or the consistency check alone would catch it.
      forged.partition = new Array(10).fill(0);
      forged.lower = 0;
      forged.surplusLower = -7.5;
      forged.exact = false;
      expect(failedChecks(g, roundTrip(forged)), `tolerance ${tolerance}`).toContain("upper");
    }
  });

  it("an estimated (Lanczos) upper end verifies only as an estimate, and never as proven or exact", () => {
    // K_8: max cut 16 (⌊n²/4⌋, common practice, no source); λmax(L) = 8 so the eigenvalue bound is 16.
    const e: [number, number][] = [];
    for (let u = 0; u < 8; u++) for (let v = u + 1; v < 8; v++) e.push([u, v]);
    const g = buildGraph(8, e.map((x) => x[0]), e.map((x) => x[1])).graph;
    const base = bracket(g, { effort: "quick", seconds: 1 });
    const est = eigenvalueUpperBound(g, { shiftProof: "lanczos-estimate" });
    expect(est.certificate!.shiftProof).toBe("lanczos-estimate");
    const rec = withUpper(base, Math.floor(est.value));
    rec.certificate = { kind: "psd-dual", y: Array.from(est.certificate!.y), shift: est.certificate!.shift, shiftProof: est.certificate!.shiftProof, roundedDown: true, tolerance: 0 };
    rec.upperKind = "estimate";
    rec.exact = false;
    const v = verifyBracket(g, roundTrip(rec));
    expect(v.ok).toBe(true);
    expect(v.upperKind).toBe("estimate");
    const claimsProof = clone(rec);
    claimsProof.upperKind = "proven";
    expect(failedChecks(g, roundTrip(claimsProof))).toContain("proof");
  });

  it("malformed records are input errors naming the field, never crashes", () => {
    const g = buildGraph(4, [0, 1, 2], [1, 2, 3]).graph;
    const good = clone(bracket(g)) as unknown as Record<string, unknown>;
    const cases: [string, (r: Record<string, unknown>) => void][] = [
      ["source.spec", (r) => (r.source = { spec: null })],
      ["source.spec", (r) => (r.source = { spec: 42 })],
      ["source.path", (r) => (r.source = { path: 123 })],
      ["source.position", (r) => (r.source = { path: "x.g6", position: -1 })],
      ["source.position", (r) => (r.source = { path: "x.g6", position: 0.5 })],
      ["source.position", (r) => (r.source = { path: "x.g6", position: 0 })],
      ["source.embedded.format", (r) => (r.source = { embedded: { format: "dot", text: "" } })],
      ["certificate.y[1]", (r) => (r.certificate = { kind: "psd-dual", y: [0, 1e200, 0, 0], shift: 4, shiftProof: "gershgorin", roundedDown: true, tolerance: 0 })],
      ["certificate.shift", (r) => (r.certificate = { kind: "psd-dual", y: [0, 0, 0, 0], shift: "4", shiftProof: "gershgorin", roundedDown: true, tolerance: 0 })],
      ["certificate.shiftProof", (r) => (r.certificate = { kind: "psd-dual", y: [0, 0, 0, 0], shift: 4, shiftProof: "lanczos-ritz-residual", roundedDown: true, tolerance: 0 })],
      ["upperKind", (r) => (r.upperKind = true)],
      ["partition[2]", (r) => ((r.partition as number[])[2] = 2)],
      ["graphHash", (r) => (r.graphHash = "sha256:xyz")],
      ["upper", (r) => (r.upper = null)],
      ["certificate.kind", (r) => (r.certificate = { kind: "trust-me", roundedDown: false, tolerance: 0 })],
    ];
    for (const [field, edit] of cases) {
      const bad = clone(good);
      edit(bad);
      let caught: unknown = null;
      try {
        parseBracketRecord(bad, "r.json:1");
      } catch (e) {
        caught = e;
      }
      expect(caught, field).toBeInstanceOf(InputError);
      expect((caught as Error).message, field).toContain(`\`${field}\``);
      expect((caught as Error).message).toMatch(/^r\.json:1: /);
    }
  });
});

// ---- property test ---------------------------------------------------------------------------

/** Valid records of several kinds on small graphs (n ≤ 12, so brute force is the oracle). */
function validRecords(rng: Rng): { g: Graph; r: BracketRecord; opt: number }[] {
  const out: { g: Graph; r: BracketRecord; opt: number }[] = [];
  const weights: (((r: Rng) => number) | undefined)[] = [
    undefined,
    (r) => (r.nextInt(2) ? 1 : -1),
    (r) => 1 + r.nextInt(5),
    (r) => (r.nextInt(16) + 1) / 8, // dyadic: non-integer, yet every sum is exact, so brute force is exact
    (r) => (r.nextInt(2001) - 1000) / 64,
  ];
  for (let t = 0; t < 60; t++) {
    const n = 3 + rng.nextInt(10);
    const g = randomGraph(n, 0.2 + 0.6 * rng.nextFloat(), rng, { weight: weights[t % weights.length] });
    const opt = bruteForceMaxCut(g);
    const effort = (["auto", "quick", "heuristic"] as const)[t % 3];
    const r = roundTrip(bracket(g, { effort, solverSeed: t, seconds: 1 }));
    out.push({ g, r, opt });
    {
      // A weak but honest lower end (a random partition), so forged upper ends can fall between
      // the cut and the optimum, where only the certificate check can catch them.
      const weak = clone(r);
      weak.partition = weak.partition.map(() => rng.nextInt(2));
      weak.lower = cutOfPartition(g, weak.partition);
      weak.surplusLower = weak.lower - g.totalWeight / 2;
      weak.exact = false;
      if (weak.lower <= weak.upper) out.push({ g, r: weak, opt });
    }
    if (t % 4 === 0 && g.m > 0) {
      // A stopped-search record: the search's proven bound, published as the bracket does.
      const s = exactMaxCut(g, { seconds: 5 });
      const rec = withUpper(r, s.upper);
      rec.certificate = { kind: "unfinished-search", search: s.method, graySteps: s.graySteps, branchNodes: s.branchNodes, roundedDown: false, tolerance: 0 };
      rec.exact = false;
      out.push({ g, r: rec, opt });
    }
    if (t % 5 === 1 && g.m > 0) {
      // An estimate: a Lanczos shift, marked unproven.
      const est = eigenvalueUpperBound(g, { shiftProof: "lanczos-estimate" });
      const rec = withUpper(r, Math.max(r.lower, est.value));
      rec.certificate = { kind: "psd-dual", y: Array.from(est.certificate!.y), shift: est.certificate!.shift, shiftProof: est.certificate!.shiftProof, roundedDown: false, tolerance: 0 };
      rec.upperKind = "estimate";
      rec.exact = false;
      out.push({ g, r: rec, opt });
    }
  }
  return out;
}

/** One random edit of a record: the kinds of change a forger (or a corrupted file) would make. */
function forge(r: BracketRecord, rng: Rng): BracketRecord {
  const t = clone(r);
  const deltas = [1, 0.5, 100, 1e-9, 1.5e-9, 2 ** -40, Math.abs(r.upper) * 1e-15, rng.nextFloat() * (Math.abs(r.upper - r.lower) + 1)];
  const d = deltas[rng.nextInt(deltas.length)];
  const edits = 1 + rng.nextInt(3);
  for (let k = 0; k < edits; k++) {
    switch (rng.nextInt(12)) {
      case 0:
        t.upper -= d;
        t.surplusUpper = t.upper - t.totalWeight / 2;
        break;
      case 1:
        t.lower += d;
        t.surplusLower = t.lower - t.totalWeight / 2;
        break;
      case 2:
        t.certificate.tolerance = [1, 119, 1e9, d][rng.nextInt(4)];
        break;
      case 3:
        t.exact = true;
        t.upperKind = "proven";
        break;
      case 4: {
        const kinds = ["exhaustive", "unfinished-search", "positive-weights"] as const;
        const kind = kinds[rng.nextInt(3)];
        t.certificate = kind === "positive-weights" ? { kind, roundedDown: rng.nextInt(2) === 1, tolerance: t.certificate.tolerance } : { kind, search: "exact-bnb", graySteps: 0, branchNodes: 1, roundedDown: rng.nextInt(2) === 1, tolerance: t.certificate.tolerance };
        break;
      }
      case 5:
        if (t.certificate.kind === "psd-dual") t.certificate.y[rng.nextInt(t.certificate.y.length)] -= d * 4;
        else t.upper = t.lower;
        break;
      case 6:
        if (t.certificate.kind === "psd-dual") t.certificate.shift -= d;
        else t.certificate.roundedDown = !t.certificate.roundedDown;
        break;
      case 7:
        if (t.certificate.kind === "psd-dual") (t.certificate as { shiftProof: string }).shiftProof = ["gershgorin", "cholesky", "lanczos-estimate", "trust-me"][rng.nextInt(4)];
        else t.exact = !t.exact;
        break;
      case 8:
        t.certificate.roundedDown = !t.certificate.roundedDown;
        break;
      case 9:
        t.upperKind = t.upperKind === "proven" ? "estimate" : "proven";
        break;
      case 10: {
        // Flip one vertex and claim the new cut honestly or not.
        const v = rng.nextInt(t.partition.length);
        t.partition[v] ^= 1;
        if (rng.nextInt(2) === 0) {
          t.lower = t.lower + d;
          t.surplusLower = t.lower - t.totalWeight / 2;
        }
        break;
      }
      default:
        t.upper = t.lower - d;
        t.surplusUpper = t.upper - t.totalWeight / 2;
        break;
    }
  }
  return t;
}

describe("verify: random forgeries of valid records never pass as true", () => {
  it("every record verify accepts has lower = its partition's cut ≤ max cut ≤ upper (brute force)", () => {
    const rng = new Rng(20250214);
    const bases = validRecords(rng);
    let accepted = 0, rejected = 0, malformed = 0;
    for (const { g, r, opt } of bases) {
      // Honest records verify (estimates as estimates).
      const v = verifyBracket(g, r, { seconds: 5 });
      expect(v.ok, JSON.stringify(v.checks.filter((c) => !c.ok))).toBe(true);
      // Every weight is an integer or a multiple of 2^-6, so brute force and the partition cuts are exact.
      for (let k = 0; k < 40; k++) {
        const f = forge(r, rng);
        let rec: BracketRecord;
        try {
          rec = parseBracketRecord(clone(f), "forged");
        } catch (e) {
          expect(e).toBeInstanceOf(InputError);
          malformed++;
          continue;
        }
        const verdict = verifyBracket(g, rec, { seconds: 5 });
        if (!verdict.ok) {
          rejected++;
          continue;
        }
        accepted++;
        const what = `record on n = ${g.n}: ${JSON.stringify({ lower: rec.lower, upper: rec.upper, exact: rec.exact, cert: rec.certificate.kind, opt })}`;
        expect(rec.lower, what).toBe(cutOfPartition(g, rec.partition));
        expect(rec.lower, what).toBeLessThanOrEqual(opt);
        expect(rec.upper, what).toBeGreaterThanOrEqual(rec.lower);
        if (verdict.upperKind === "proven") {
          expect(rec.upper, what).toBeGreaterThanOrEqual(opt);
          if (rec.exact) expect(rec.upper - rec.lower, what).toBeLessThanOrEqual(closingTolerance(g));
        } else {
          // An estimate is never passed off as a proof.
          expect(verdict.upperKind, what).toBe("estimate");
          expect(rec.upperKind, what).not.toBe("proven");
          expect(rec.exact, what).toBe(false);
        }
      }
    }
    // The edits must have bitten: most forgeries are caught; harmless ones (a raised upper end, a
    // dropped exact claim) pass and were checked above. Measured: about 4400 rejected, 1500 accepted.
    expect(bases.length).toBeGreaterThan(100);
    expect(rejected + malformed).toBeGreaterThan(3000);
    expect(accepted).toBeGreaterThan(300);
  });
});
