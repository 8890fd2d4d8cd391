// Random d-regular graphs: exactly simple and d-regular over many (n, d) and seeds, uniform
// over labelled graphs for tiny cases (chi-square), isomorphism-type frequencies checked
// against nauty's list of cubic graphs weighted by automorphism group sizes.
import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { randomRegular, type RegularSampler } from "../src/families/random-regular.js";
import { family } from "../src/families/registry.js";
import { encodeGraph6 } from "../src/graph/formats/graph6.js";
import type { Graph } from "../src/graph/graph.js";
import { expectInputError } from "./helpers/errors.js";
import { gengLines, labelgLines } from "./helpers/nauty.js";
import { chiSquare } from "./helpers/stats.js";
import { itNeeds, tool } from "./helpers/requirements.js";

const NAUTY = [tool("nauty-geng"), tool("nauty-labelg"), tool("nauty-countg")];

/** Number of failures of "simple and d-regular": loops, repeats (lists must be strictly increasing), wrong degree. */
function regularityDefects(g: Graph, d: number): number {
  let bad = 0;
  for (let v = 0; v < g.n; v++) {
    const nb = g.neighborsOf(v);
    if (nb.length !== d) bad++;
    for (let i = 0; i < nb.length; i++) {
      if (nb[i] === v || nb[i] < 0 || nb[i] >= g.n) bad++;
      if (i > 0 && nb[i] <= nb[i - 1]) bad++;
      if (!g.hasEdge(nb[i], v)) bad++;
    }
  }
  return bad;
}

describe("random regular graphs", () => {
  it("are simple and exactly d-regular for many n, d, seeds and both samplers", () => {
    // Definition of a simple d-regular graph (common practice, no source). Cases cover odd d
    // with even n, the complement route (d > (n−1)/2, e.g. n = 100, d = 60) and the extremes.
    const cases: [number, number][] = [
      [1, 0], [2, 1], [4, 3], [10, 3], [12, 5], [11, 4], [50, 4], [50, 7], [64, 31], [100, 60], [101, 50], [100, 99], [100, 0], [1000, 10], [200, 150],
    ];
    for (const [n, d] of cases) {
      for (const sampler of ["auto", "steger-wormald"] as RegularSampler[]) {
        for (let seed = 0; seed < 6; seed++) {
          const g = randomRegular(n, d, seed, sampler);
          expect(g.n).toBe(n);
          expect(g.m).toBe((n * d) / 2);
          expect(regularityDefects(g, d)).toBe(0);
        }
      }
    }
    for (const [n, d] of [[10, 3], [30, 5], [30, 24], [9, 6]] as [number, number][]) {
      for (let seed = 0; seed < 6; seed++) expect(regularityDefects(randomRegular(n, d, seed, "pairing"), d)).toBe(0);
    }
  });

  it("is uniform over the 70 labelled 2-regular graphs on 6 vertices", () => {
    // 70 labelled 2-regular graphs on 6 vertices: OEIS A001205 (from memory), and directly
    // 6!/12 = 60 hexagons + C(6,3)/2 = 10 pairs of triangles. The pairing model conditioned on
    // simplicity is uniform (Bollobás 1980). Chi-square with 69 df, upper 0.1% point 111.055
    // (NIST/SEMATECH e-Handbook §1.3.6.7.4; scipy.stats.chi2.ppf(0.999, 69)).
    const S = 7000;
    const counts = new Map<string, number>();
    for (let seed = 0; seed < S; seed++) {
      const g = randomRegular(6, 2, seed);
      const key = Array.from(g.neighbors).join(",");
      counts.set(key, (counts.get(key) ?? 0) + 1);
    }
    expect(counts.size).toBe(70);
    const observed = [...counts.values()];
    expect(chiSquare(observed, observed.map(() => S / 70))).toBeLessThan(111.055);
  });

  itNeeds(NAUTY, "hits each cubic graph on 8 vertices with frequency 8!/|Aut| / 19355 (and the 4-regular complements)", () => {
    // The cubic graphs on 8 vertices up to isomorphism: `nauty-geng -d3 -D3 8`; their automorphism
    // group orders: `nauty-countg --a`. A uniform labelled cubic graph has type T with probability
    // (8!/|Aut T|) / L, where L = 19355 is the number of labelled cubic graphs on 8 vertices
    // (OEIS A002829, from memory; checked here as the sum of 8!/|Aut T|). Complementing gives the
    // same law for 4-regular graphs (geng -d4 -D4 8). Chi-square over the 6 types, 5 df, upper
    // 0.1% point 20.515 (NIST/SEMATECH e-Handbook §1.3.6.7.4; scipy.stats.chi2.ppf(0.999, 5)).
    for (const d of [3, 4]) {
      const types = gengLines([`-d${d}`, `-D${d}`, "8"]);
      expect(types.length).toBe(6);
      const canon = labelgLines(types);
      const weight = types.map((t) => {
        const out = execFileSync("nauty-countg", ["-q", "--a", "-1"], { input: t + "\n", encoding: "utf8" }).trim();
        return 40320 / Number(out.split(/\s+/)[0]);
      });
      const total = weight.reduce((a, b) => a + b, 0);
      expect(total).toBe(19355);
      for (const sampler of ["auto", "pairing"] as RegularSampler[]) {
        const S = 5000;
        const seed0 = sampler === "auto" ? 0 : 1_000_000;
        const samples: string[] = [];
        for (let s = 0; s < S; s++) samples.push(encodeGraph6(randomRegular(8, d, seed0 + s, sampler)));
        const counts = new Map<string, number>();
        for (const c of labelgLines(samples)) counts.set(c, (counts.get(c) ?? 0) + 1);
        expect([...counts.keys()].every((k) => canon.includes(k))).toBe(true);
        const observed = canon.map((c) => counts.get(c) ?? 0);
        const expected = weight.map((w) => (S * w) / total);
        expect(chiSquare(observed, expected)).toBeLessThan(20.515);
      }
    }
  });

  itNeeds(NAUTY, "Steger–Wormald reaches every cubic graph type on 8 vertices", () => {
    // Only asymptotically uniform (Steger & Wormald 1999), so only its support is checked here
    // against nauty's list (geng -d3 -D3 8).
    const types = labelgLines(gengLines(["-d3", "-D3", "8"]));
    const samples: string[] = [];
    for (let s = 0; s < 2000; s++) samples.push(encodeGraph6(randomRegular(8, 3, s, "steger-wormald")));
    expect(new Set(labelgLines(samples))).toEqual(new Set(types));
  });

  it("is reproducible and agrees with the spec string", () => {
    // Determinism (common practice, no source).
    const a = randomRegular(300, 7, 11);
    const b = family("random-regular:n=300,d=7,seed=11");
    expect(Array.from(a.neighbors)).toEqual(Array.from(b.neighbors));
    expect(Array.from(randomRegular(300, 7, 12).neighbors)).not.toEqual(Array.from(a.neighbors));
  });

  it("rejects odd n·d, d ≥ n and pairing at large degree, naming the parameter", () => {
    // Input validation, common practice, no source.
    expectInputError(() => randomRegular(7, 3, 0), "`d`");
    expectInputError(() => randomRegular(7, 3, 0), "even");
    expectInputError(() => randomRegular(10, 10, 0), "`d`");
    expectInputError(() => family("random-regular:n=10,d=12"), "n − 1 = 9");
    expectInputError(() => randomRegular(100, 20, 0, "pairing"), "`sampler`");
    expectInputError(() => family("random-regular:n=10,d=3,sampler=fast"), "`sampler`");
    expectInputError(() => family("random-regular:n=0,d=0"), "`n`");
    expectInputError(() => family("random-regular:n=10000000,d=120"), "would not fit in memory");
  });
});
