// The best explicit-vector choice (block coordinate ascent over V_i and ε_i) and the few-triangles
// closed form, against nauty-geng's complete lists of small graphs, exact and brute-force max cuts,
// a direct O(n³) evaluation of the guarantee, and Edwards' bound on complete graphs.
import { describe, expect, it } from "vitest";
import { edwardsEdgeBound } from "../src/bounds/edwards.js";
import { fewTrianglesBound, fewTrianglesValue } from "../src/bounds/few-triangles.js";
import { optimiseVectorChoice, vectorChoiceOptions, vectorOptimisedBound } from "../src/bounds/vector-choice.js";
import { vectorMethodGuarantee } from "../src/bounds/vector-guarantee.js";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { vectorMethodExpectedCut, vectorMethodRound } from "../src/cut/heuristic/vector-rounding.js";
import { InputError } from "../src/errors.js";
import { family } from "../src/families/registry.js";
import { graphFromEdges } from "../src/graph/builder.js";
import { parseGraph6 } from "../src/graph/formats/graph6.js";
import type { Graph } from "../src/graph/graph.js";
import { complete } from "./helpers/graphs.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";
import { gengLines } from "./helpers/nauty.js";
import { itNeeds, tool } from "./helpers/requirements.js";
import { directVectorGuarantee, neighbourhoodSets } from "./helpers/vector.js";

const geng = (args: string[]): Graph[] => gengLines(args).map((l) => parseGraph6(l));

/** Triangles by brute force over vertex triples (common practice, no source). */
function trianglesByTriples(g: Graph): number {
  let t = 0;
  for (let a = 0; a < g.n; a++)
    for (let b = a + 1; b < g.n; b++)
      for (let c = b + 1; c < g.n; c++) if (g.hasEdge(a, b) && g.hasEdge(b, c) && g.hasEdge(a, c)) t++;
  return t;
}

describe("best explicit-vector choice on triangle-free graphs", () => {
  itNeeds([tool("nauty-geng")], "every triangle-free graph with n ≤ 9 (nauty-geng -t): default ≤ optimised ≤ exact surplus, and the rounded mean reaches the guarantee", () => {
    // Triangle-free graphs on 1..9 vertices: 1, 2, 3, 7, 14, 38, 107, 410, 1897 (OEIS A006785, from memory).
    const counts = [1, 2, 3, 7, 14, 38, 107, 410, 1897];
    let seed = 0;
    let strictlyAbove = 0;
    for (let n = 1; n <= 9; n++) {
      const graphs = geng(["-t", String(n)]);
      expect(graphs.length).toBe(counts[n - 1]);
      for (const g of graphs) {
        const def = vectorMethodGuarantee(g).surplus as number;
        const best = optimiseVectorChoice(g);
        const opt = best.guarantee.surplus as number;
        expect(best.status).toBe("converged");
        expect(opt).toBeGreaterThanOrEqual(def - 1e-12);
        // The exact search against the suites' independent brute force (common practice, no source).
        const exact = exactMaxCut(g);
        expect(exact.value).toBe(bruteForceMaxCut(g));
        // The guarantee is an expectation of random cuts, so it cannot exceed the max cut (vector method).
        expect(opt).toBeLessThanOrEqual(exact.value - g.m / 2 + 1e-9);
        // Triangle-free: ε_i|V_i| ≤ √|V_i| ≤ √d_i, so nothing beats the default (1/2π)Σ√d_i (Shearer 1992's order).
        expect(opt).toBeCloseTo(def, 12);
        const choice = vectorChoiceOptions(best.choice);
        expect(opt).toBeCloseTo(directVectorGuarantee(g, choice.sets, choice.eps), 10);
        // Exact expectation Σ arccos/π ≥ guarantee (the guarantee's proof), no tolerance needed.
        expect(vectorMethodExpectedCut(g, choice) - g.m / 2).toBeGreaterThanOrEqual(opt - 1e-12);
        // Statistical check of the rounding itself: the mean of 400 rounded cuts lies above the guarantee
        // within 6 standard errors (normal approximation: a miss rate near 1e-9 per graph, so about
        // 2.5e-6 over all 2479 graphs; seeded, so the outcome is fixed).
        const rec = vectorMethodRound(g, { ...choice, trials: 400, solverSeed: seed++ });
        const mean = rec.details!.meanSurplus as number;
        expect(mean).toBeGreaterThanOrEqual(opt - 6 * (rec.details!.stdErr as number) - 1e-9);
        if (mean > opt) strictlyAbove++;
      }
    }
    // Almost every graph's mean sits strictly above its guarantee: the check is not vacuous.
    expect(strictlyAbove).toBeGreaterThan(2400);
  });
});

describe("best explicit-vector choice on graphs with triangles", () => {
  itNeeds([tool("nauty-geng")], "every connected graph with n ≤ 7 (nauty-geng -c): ε-only ascent against all ε ∈ {0, cap}ⁿ, both starts, the exact expectation and the max cut", () => {
    // Connected graphs on 2..7 vertices: 1, 2, 6, 21, 112, 853 (OEIS A001349).
    const counts = [1, 2, 6, 21, 112, 853];
    let improved = 0;
    for (let n = 2; n <= 7; n++) {
      const graphs = geng(["-c", String(n)]);
      expect(graphs.length).toBe(counts[n - 2]);
      for (const g of graphs) {
        const sets = neighbourhoodSets(g);
        const cap = sets.map((s) => 1 / Math.sqrt(s.length));
        // The guarantee is linear in each ε_i (no |V_i ∩ V_i| term), so its box maximum is at a corner.
        let corner = -Infinity;
        for (let mask = 0; mask < 1 << n; mask++) {
          const eps = cap.map((c, i) => ((mask >> i) & 1 ? c : 0));
          corner = Math.max(corner, directVectorGuarantee(g, sets, eps));
        }
        const epsOnly = optimiseVectorChoice(g, { optimiseSets: false });
        const both = optimiseVectorChoice(g);
        const a = epsOnly.guarantee.surplus as number;
        const b = both.guarantee.surplus as number;
        expect(a).toBeLessThanOrEqual(corner + 1e-12);
        expect(a).toBeGreaterThanOrEqual(Math.max(epsOnly.defaultSurplus, epsOnly.uniformSurplus) - 1e-12);
        // Optimising the sets too starts from the same points and can only add moves.
        expect(b).toBeGreaterThanOrEqual(Math.max(both.defaultSurplus, both.uniformSurplus) - 1e-12);
        expect(epsOnly.defaultSurplus).toBeCloseTo(directVectorGuarantee(g, sets, cap), 12);
        expect(epsOnly.uniformSurplus).toBeCloseTo(fewTrianglesBound(g).surplus as number, 12);
        // The ascent's running value never falls and ends on the one evaluator's value.
        for (const r of [epsOnly, both]) {
          for (let k = 1; k < r.trace.length; k++) expect(r.trace[k]).toBeGreaterThanOrEqual(r.trace[k - 1]);
          expect(r.trace[r.trace.length - 1]).toBeCloseTo(r.guarantee.surplus as number, 10);
          const choice = vectorChoiceOptions(r.choice);
          expect(r.guarantee.surplus as number).toBeCloseTo(directVectorGuarantee(g, choice.sets, choice.eps), 10);
          const expected = vectorMethodExpectedCut(g, choice) - g.m / 2;
          // Proof steps in order: expectation ≥ normed form ≥ guarantee (src/bounds/vector-guarantee.ts).
          expect(expected).toBeGreaterThanOrEqual(r.guarantee.normedTerm - 1e-12);
          expect(r.guarantee.normedTerm).toBeGreaterThanOrEqual((r.guarantee.surplus as number) - 1e-12);
          expect(r.guarantee.surplus as number).toBeLessThanOrEqual(bruteForceMaxCut(g) - g.m / 2 + 1e-9);
        }
        if (b > epsOnly.defaultSurplus + 1e-9) improved++;
      }
    }
    expect(improved).toBeGreaterThan(700);
  });

  itNeeds([tool("nauty-geng")], "every connected graph with n ≤ 6: no single vertex's (V_i, ε_i) can be changed for the better (each block is solved exactly)", () => {
    for (let n = 3; n <= 6; n++) {
      for (const g of geng(["-c", String(n)])) {
        const best = optimiseVectorChoice(g);
        const { sets, eps } = vectorChoiceOptions(best.choice);
        const f = directVectorGuarantee(g, sets, eps);
        for (let i = 0; i < n; i++) {
          const nb = Array.from(g.neighborsOf(i));
          for (let mask = 0; mask < 1 << nb.length; mask++) {
            const sub = nb.filter((_, t) => (mask >> t) & 1);
            const trySets = sets.map((s, k) => (k === i ? sub : s));
            for (const e of sub.length === 0 ? [0] : [0, 1 / Math.sqrt(sub.length)]) {
              const tryEps = eps.map((x, k) => (k === i ? e : x));
              expect(directVectorGuarantee(g, trySets, tryEps)).toBeLessThanOrEqual(f + 1e-12);
            }
          }
        }
      }
    }
  });

  it("dense random graphs: the best choice lifts a negative default guarantee well above zero", () => {
    const g = family("gnp:n=60,p=0.3,seed=1");
    const best = optimiseVectorChoice(g);
    expect(best.defaultSurplus).toBeLessThan(0);
    expect(best.guarantee.surplus as number).toBeGreaterThan(best.uniformSurplus);
    expect(best.droppedMembers).toBeGreaterThan(0);
    const r = vectorMethodRound(g, { ...vectorChoiceOptions(best.choice), trials: 300, solverSeed: 5 });
    expect(r.details!.expectedSurplus as number).toBeGreaterThanOrEqual((best.guarantee.surplus as number) - 1e-12);
  });

  it("a sweep limit stops the ascent and says so; bad options and weighted graphs are refused by name", () => {
    const g = family("gnp:n=40,p=0.5,seed=2");
    const one = optimiseVectorChoice(g, { maxSweeps: 1 });
    expect(one.sweeps).toBe(1);
    expect(one.status).toBe("iteration-limit");
    expect(one.trace).toHaveLength(2);
    expect(() => optimiseVectorChoice(g, { maxSweeps: 0 })).toThrow(/vector choice: invalid `maxSweeps`/);
    const w = graphFromEdges(3, [[0, 1, 2], [1, 2, 1]]);
    expect(() => optimiseVectorChoice(w)).toThrow(InputError);
    expect(vectorOptimisedBound(w).applies).toBe(false);
    expect(vectorOptimisedBound(g).surplus).toBeCloseTo(optimiseVectorChoice(g).guarantee.surplus as number, 12);
  });
});

describe("the few-triangles form", () => {
  it("on K_n (n ≤ 80) never exceeds the exact surplus, which Edwards' bound attains for odd n (Edwards 1973)", () => {
    for (let n = 1; n <= 80; n++) {
      const g = complete(n);
      const few = fewTrianglesBound(g);
      const edwards = edwardsEdgeBound(g).surplus as number;
      // Max cut of K_n is ⌊n²/4⌋ (split into halves; common practice, no source), checked by brute force up to 14.
      const exact = Math.floor((n * n) / 4) - g.m / 2;
      if (n <= 14) expect(bruteForceMaxCut(g) - g.m / 2).toBe(exact);
      expect(few.surplus as number).toBeLessThanOrEqual(exact + 1e-12);
      // Edwards (1973): (√(8m+1) − 1)/8 is tight exactly for complete graphs of odd order.
      if (n % 2 === 1) expect(edwards).toBeCloseTo(exact, 12);
      // Below Edwards' bound itself from n = 3 on; K2 (m = 1, no triangle) gets 1/π > 1/4 (arithmetic).
      if (n >= 3) expect(few.surplus as number).toBeLessThanOrEqual(edwards + 1e-12);
      // Arithmetic: m = n(n−1)/2, T = C(n,3) > m√Δ/(3π) from n = 4, so g = m²/(6π²T) = n(n−1)/(4π²(n−2)).
      if (n >= 4) {
        expect(few.regime).toBe("triangle-limited");
        expect(few.surplus as number).toBeCloseTo((n * (n - 1)) / (4 * Math.PI * Math.PI * (n - 2)), 12);
      }
    }
  });

  it("equals the general guarantee at the uniform ε (Σ_{ij∈E}|N(i) ∩ N(j)| = 3T), and counts triangles like brute force", () => {
    for (const spec of ["kneser:n=7,k=2", "paley:q=13", "gnp:n=40,p=0.3,seed=3", "hfree-process:n=60,h=K4,seed=1", "petersen", "complete:n=9"]) {
      const g = family(spec);
      const few = fewTrianglesBound(g);
      expect(few.triangles).toBe(trianglesByTriples(g));
      const eps = Array.from({ length: g.n }, (_, i) => (g.degree(i) > 0 ? few.eps : 0));
      const general = vectorMethodGuarantee(g, { eps });
      expect(few.surplus as number).toBeCloseTo(general.surplus as number, 10);
      expect(few.surplus as number).toBeCloseTo(directVectorGuarantee(g, neighbourhoodSets(g), eps), 10);
      // ε* maximises the parabola on [0, 1/√Δ]: nearby uniform values do no better (arithmetic).
      for (const t of [0.5, 0.9, 0.99]) expect(fewTrianglesValue(g.m, few.triangles, few.eps * t)).toBeLessThanOrEqual((few.surplus as number) + 1e-12);
      expect(few.regime === "degree-capped").toBe(few.triangles <= few.halfValueTriangles);
      if (few.regime === "degree-capped") expect(few.surplus as number).toBeGreaterThanOrEqual(g.m / (2 * Math.PI * Math.sqrt(few.maxDegree)) - 1e-12);
    }
  });

  it("triangle-free graphs: the degree-capped form m/(π√Δ), which the Σ√d_i form can only beat", () => {
    const g = family("petersen");
    const few = fewTrianglesBound(g);
    expect(few.regime).toBe("degree-capped");
    expect(few.surplus as number).toBeCloseTo(15 / (Math.PI * Math.sqrt(3)), 12); // m = 15, Δ = 3 (arithmetic)
    expect(few.surplus as number).toBeLessThanOrEqual((vectorMethodGuarantee(g).surplus as number) + 1e-12);
    expect(fewTrianglesBound(graphFromEdges(3, [])).surplus).toBe(0);
    expect(fewTrianglesBound(graphFromEdges(2, [[0, 1, 2]])).applies).toBe(false);
  });
});
