// Exact max cut (Gray code, branch and bound, the component-splitting front end) checked against
// known values, brute force, and the max-cut MILP solved by a Debian solver (cbc or glpsol).

import { describe, expect, it } from "vitest";
import { buildGraph } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { family } from "../src/families/registry.js";
import { cutValue } from "../src/graph/cut-value.js";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { branchAndBoundMaxCut } from "../src/cut/exact/branch-and-bound.js";
import { grayCodeMaxCut } from "../src/cut/exact/gray-code.js";
import { InputError } from "../src/errors.js";
import { Rng } from "../src/random/prng.js";
import { randomGraph } from "./helpers/graphs.js";
import { cutOfPartition } from "./helpers/maxcut.js";
import { check, itNeeds } from "./helpers/requirements.js";
import { milpSolver, solveMilp } from "./helpers/milp.js";

/**
 * Every bipartition with vertex 0 on side 0, each valued edge by edge with the test folder's own
 * evaluator (test/helpers/maxcut.ts), not with the cutValue under test: the plainest possible oracle.
 */
function bruteForce(g: Graph): number {
  if (g.n <= 1) return 0;
  const side = new Uint8Array(g.n);
  let best = -Infinity;
  for (let mask = 0; mask < 2 ** (g.n - 1); mask++) {
    for (let i = 1; i < g.n; i++) side[i] = (mask >>> (i - 1)) & 1;
    best = Math.max(best, cutOfPartition(g, side));
  }
  return best;
}

function expectConsistent(g: Graph, r: ReturnType<typeof exactMaxCut>): void {
  expect(r.value).toBe(cutValue(g, r.partition));
  expect(r.upper).toBeGreaterThanOrEqual(r.value);
}

describe("exact max cut: known values", () => {
  it("Petersen graph: 12", () => {
    // The Petersen graph has max cut 12 of its 15 edges (from memory; it has odd girth 5 and needs 3 uncut edges).
    const g = family("petersen");
    for (const r of [grayCodeMaxCut(g), branchAndBoundMaxCut(g), exactMaxCut(g)]) {
      expectConsistent(g, r);
      expect(r.status).toBe("optimal");
      expect(r.value).toBe(12);
      expect(r.upper).toBe(12);
    }
  });

  it("complete graphs K_n: ⌊n²/4⌋", () => {
    // Max cut of K_n is ⌊n/2⌋·⌈n/2⌉ = ⌊n²/4⌋ (common knowledge, from memory).
    for (let n = 1; n <= 26; n++) {
      const g = family(`complete:n=${n}`);
      const want = Math.floor((n * n) / 4);
      const gray = grayCodeMaxCut(g);
      expect(gray.value).toBe(want);
      if (n <= 22) expect(branchAndBoundMaxCut(g).value).toBe(want);
    }
  });

  it("odd cycles C_{2k+1}: 2k; even cycles: all edges", () => {
    // An odd cycle is not bipartite, so one edge stays uncut; even cycles are bipartite (common knowledge).
    for (let n = 3; n <= 41; n++) {
      const g = family(`cycle:n=${n}`);
      const want = n % 2 === 1 ? n - 1 : n;
      expect(exactMaxCut(g).value).toBe(want);
      expect(branchAndBoundMaxCut(g).upper).toBe(want);
    }
  });

  it("hypercubes Q_d: every edge (bipartite)", () => {
    // Q_d is bipartite by parity of weight, so all d·2^(d−1) edges are cut (common knowledge).
    for (let d = 1; d <= 6; d++) {
      const g = family(`hypercube:dim=${d}`);
      const r = exactMaxCut(g);
      expect(r.value).toBe(d * 2 ** (d - 1));
      expect(r.upper).toBe(r.value);
    }
  });

  it("trivial graphs and disconnected unions", () => {
    expect(exactMaxCut(buildGraph(0, [], []).graph).value).toBe(0);
    expect(exactMaxCut(buildGraph(5, [], []).graph).upper).toBe(0);
    // K_5 ∪ C_7 ∪ K_1: 6 + 6 + 0 (values above).
    const us = [], vs = [];
    for (let i = 0; i < 5; i++) for (let j = i + 1; j < 5; j++) us.push(i), vs.push(j);
    for (let i = 0; i < 7; i++) us.push(5 + i), vs.push(5 + ((i + 1) % 7));
    const g = buildGraph(13, us, vs).graph;
    const r = exactMaxCut(g);
    expectConsistent(g, r);
    expect(r.value).toBe(12);
    expect(r.details?.components).toBe(3);
  });
});

describe("exact max cut: methods agree", () => {
  it("Gray code, branch and bound and brute force agree on random graphs, weighted and not", () => {
    // Oracle: exhaustive enumeration through cutValue (common practice, no source).
    const rng = new Rng(20240611);
    for (let t = 0; t < 300; t++) {
      const n = 1 + rng.nextInt(12);
      const kind = t % 3;
      const weight = kind === 0 ? undefined : kind === 1 ? (r: Rng) => r.nextInt(9) - 4 || 1 : (r: Rng) => Math.round(r.nextNormal() * 1000) / 100;
      const g = randomGraph(n, rng.nextFloat(), rng, { weight });
      const want = bruteForce(g);
      const gray = grayCodeMaxCut(g, { blockSize: rng.nextInt(n) });
      const bnb = branchAndBoundMaxCut(g, { blockSize: rng.nextInt(n), order: t % 2 === 0 ? "degree" : "tail-greedy" });
      const front = exactMaxCut(g, { method: t % 2 === 0 ? "auto" : "bnb" });
      for (const r of [gray, bnb, front]) {
        expectConsistent(g, r);
        expect(r.status).toBe("optimal");
        expect(r.value).toBeCloseTo(want, 9);
        expect(r.upper).toBeLessThanOrEqual(want + 1e-6);
      }
    }
  });

  it("Gray code and branch and bound agree for n = 18..26", () => {
    // Cross-check of two independent searches (common practice, no source).
    const rng = new Rng(77);
    for (let t = 0; t < 12; t++) {
      const n = 18 + rng.nextInt(9);
      const g = randomGraph(n, 0.15 + 0.7 * rng.nextFloat(), rng, { weight: t % 3 === 2 ? (r) => (r.nextInt(2) ? 1 : -1) : undefined });
      const a = grayCodeMaxCut(g);
      const b = branchAndBoundMaxCut(g);
      expect(b.value).toBe(a.value);
      expect(b.upper).toBe(a.value);
    }
  });
});

describe("exact max cut: stopped searches give valid brackets", () => {
  // Stopped by a work budget, so the outcome is the same on any machine; speed is bench/ (bench/budgets).
  it("branch and bound on K_44 stopped early brackets ⌊44²/4⌋ = 484", () => {
    // K_n max cut ⌊n²/4⌋ (from memory); 20,000 nodes are far too few to finish, so it must report a bracket.
    const g = family("complete:n=44");
    const r = branchAndBoundMaxCut(g, { work: 20_000 });
    expect(r.status).toBe("work-limit");
    expect(r.details?.workUsed).toBeLessThanOrEqual(20_000 + 64);
    expectConsistent(g, r);
    expect(r.value).toBeLessThanOrEqual(484);
    expect(r.upper).toBeGreaterThanOrEqual(484);
    expect(r.upper).toBeLessThanOrEqual(g.m);
  });

  it("Gray code on K_34 stopped early brackets 289", () => {
    const g = family("complete:n=34");
    const r = grayCodeMaxCut(g, { work: 1000 });
    expect(r.status).toBe("work-limit");
    expect(r.graySteps).toBe(1000);
    expectConsistent(g, r);
    expect(r.value).toBeLessThanOrEqual(289);
    expect(r.upper).toBeGreaterThanOrEqual(289);
  });

  it("a late component after the budget runs out still yields a valid sum bracket", () => {
    // Two copies of K_40 (max cut 400 each, from memory): the budget ends inside the first.
    const us: number[] = [], vs: number[] = [];
    for (let c = 0; c < 2; c++) for (let i = 0; i < 40; i++) for (let j = i + 1; j < 40; j++) us.push(40 * c + i), vs.push(40 * c + j);
    const g = buildGraph(80, us, vs).graph;
    const r = exactMaxCut(g, { work: 50_000 });
    expect(r.status).toBe("work-limit");
    expectConsistent(g, r);
    expect(r.value).toBeLessThanOrEqual(800);
    expect(r.upper).toBeGreaterThanOrEqual(800);
  });

  it("a search given almost no time reports status time-limit with a valid bracket", () => {
    // 1 ns cannot hold even the first clock check's 4096 nodes on any machine (common practice, no source).
    const g = family("complete:n=44");
    const r = branchAndBoundMaxCut(g, { seconds: 1e-9 });
    expect(r.status).toBe("time-limit");
    expectConsistent(g, r);
    expect(r.upper).toBeGreaterThanOrEqual(484);
  });
});

describe("exact max cut: bad input", () => {
  it("throws InputError naming the parameter", () => {
    const g = family("petersen");
    expect(() => exactMaxCut(g, { seconds: 0 })).toThrow(InputError);
    expect(() => exactMaxCut(g, { seconds: -1 })).toThrow(/seconds/);
    expect(() => exactMaxCut(g, { solverSeed: 1.5 })).toThrow(/solverSeed/);
    expect(() => grayCodeMaxCut(g, { blockSize: 10 })).toThrow(/blockSize/);
    expect(() => branchAndBoundMaxCut(g, { blockSize: -1 })).toThrow(/blockSize/);
    expect(() => grayCodeMaxCut(family("complete:n=35"))).toThrow(/at most 34/);
    expect(() => exactMaxCut(g, { initial: [0, 1] })).toThrow(/initial/);
    expect(() => exactMaxCut(g, { work: 0 })).toThrow(/work/);
    expect(() => grayCodeMaxCut(g, { work: 1.5 })).toThrow(/work/);
  });
});

// ---- MILP cross-check -------------------------------------------------------------------

describe("exact max cut agrees with a MILP solver", () => {
  itNeeds([check("a MILP solver, cbc (coinor-cbc) or glpsol (glpk-utils)", () => milpSolver !== null)], "50 random graphs with n ≤ 30 (cbc, else glpsol, from the Debian archive)", () => {
    // Source: the MILP optimum from an independent solver (coinor-cbc / glpk-utils).
    const rng = new Rng(5150);
    for (let t = 0; t < 50; t++) {
      const n = t < 44 ? 6 + rng.nextInt(15) : 24 + rng.nextInt(7);
      const avgDegree = 2 + 2 * rng.nextFloat();
      const weight = t % 4 === 1 ? (r: Rng) => r.nextInt(7) - 3 || 2 : t % 4 === 3 ? (r: Rng) => 1 + r.nextInt(5) : undefined;
      const g = randomGraph(n, avgDegree / (n - 1), rng, { weight });
      const r = exactMaxCut(g);
      expect(r.status).toBe("optimal");
      expect(r.value).toBeCloseTo(solveMilp(g, `g${t}`), 6);
    }
  });
});
