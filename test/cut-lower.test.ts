// Lower-bound heuristics (multi-start local search, breakout search, rank-2): known optima of
// small named graphs, brute-force optima of random small graphs, record integrity, budgets,
// determinism and input errors.
import { describe, expect, it } from "vitest";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import { Rng } from "../src/random/prng.js";
import { cutValue } from "../src/graph/cut-value.js";
import type { CutRecord } from "../src/cut/types.js";
import { FlipState, polishCut } from "../src/cut/heuristic/flip-state.js";
import { localSearch, MultiStartSearcher } from "../src/cut/heuristic/local-search.js";
import { breakoutSearch, BreakoutSearcher } from "../src/cut/heuristic/breakout.js";
import { rank2Search, Rank2Searcher } from "../src/cut/heuristic/rank2.js";
import { InputError } from "../src/errors.js";
import { complete, cycle, hypercube, petersen, randomGraph } from "./helpers/graphs.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";

/** Weights uniform integers in [lo, hi] \ {0}, for randomGraph's `weight`. */
function nonzeroInt(lo: number, hi: number): (r: Rng) => number {
  return (r) => {
    let w: number;
    do w = lo + r.nextInt(hi - lo + 1); while (w === 0);
    return w;
  };
}

function expectSound(g: Graph, r: CutRecord): void {
  expect(r.partition.length).toBe(g.n);
  expect(r.value).toBe(cutValue(g, r.partition));
}

describe("brute-force oracle", () => {
  it("matches hand-known values", () => {
    // Max cuts from memory: C5 → 4, K4 → 4, Petersen → 12.
    expect(bruteForceMaxCut(cycle(5))).toBe(4);
    expect(bruteForceMaxCut(complete(4))).toBe(4);
    expect(bruteForceMaxCut(petersen())).toBe(12);
  });
});

describe("FlipState and polishCut", () => {
  it("keeps gains and the running value equal to a recomputation after random flips (weighted, negative weights)", () => {
    const rng = new Rng(3);
    const g = randomGraph(30, 0.3, rng, { weight: nonzeroInt(-3, 4) });
    const s = new FlipState(g, new Uint8Array(30));
    for (let t = 0; t < 500; t++) s.flip(rng.nextInt(30));
    const fresh = new FlipState(g, s.side);
    expect(s.value).toBe(cutValue(g, s.side));
    expect(Array.from(s.gain)).toEqual(Array.from(fresh.gain));
    // gain[v] is the change of cutValue when v switches (definition; common practice, no source).
    for (let v = 0; v < 30; v++) {
      const p = s.side.slice();
      p[v] ^= 1;
      expect(cutValue(g, p) - s.value).toBe(s.gain[v]);
    }
  });

  it("polishCut climbs in place to a 1-flip local optimum", () => {
    const rng = new Rng(4);
    const g = randomGraph(40, 0.2, rng);
    const p = new Uint8Array(40);
    const r = polishCut(g, p);
    expect(r.value).toBe(cutValue(g, p));
    expect(r.flips).toBeGreaterThan(0);
    const s = new FlipState(g, p);
    expect(s.maxGain()).toBeLessThanOrEqual(0);
  });
});

describe("known optima of named graphs", () => {
  // Optima from memory: Petersen 12; K_n ⌊n²/4⌋; odd cycle C_{2k+1} 2k; the d-cube is bipartite, so all d·2^(d−1) edges.
  const cases: [string, Graph, number][] = [
    ["Petersen", petersen(), 12],
    ["K7", complete(7), 12],
    ["K10", complete(10), 25],
    ["C9", cycle(9), 8],
    ["C15", cycle(15), 14],
    ["Q4", hypercube(4), 32],
    ["Q6", hypercube(6), 192],
  ];
  for (const [name, g, opt] of cases) {
    it(`${name}: breakout, rank-2 and multi-start local search reach ${opt}`, () => {
      const b = breakoutSearch(g, { iterations: 2000, solverSeed: 1 });
      const r = rank2Search(g, { iterations: 30, solverSeed: 1 });
      const l = localSearch(g, { iterations: 300, solverSeed: 1 });
      for (const rec of [b, r, l]) {
        expectSound(g, rec);
        expect(rec.value).toBe(opt);
      }
    });
  }

  it("stops with status optimal when a proven upper bound is reached", () => {
    const g = petersen();
    for (const rec of [
      breakoutSearch(g, { iterations: 100000, upperBound: 12, solverSeed: 2 }),
      rank2Search(g, { iterations: 100000, upperBound: 12.5, solverSeed: 2 }),
      localSearch(g, { iterations: 100000, upperBound: 12, solverSeed: 2 }),
    ]) {
      expect(rec.status).toBe("optimal");
      expect(rec.value).toBe(12);
    }
  });
});

describe("against brute force on random small graphs", () => {
  const rng = new Rng(20240601);
  const graphs: Graph[] = [];
  for (let t = 0; t < 40; t++) {
    const n = 6 + rng.nextInt(11); // 6..16
    const p = 0.2 + 0.6 * rng.nextFloat();
    graphs.push(t % 2 === 0 ? randomGraph(n, p, rng) : randomGraph(n, p, rng, { weight: nonzeroInt(-5, 9) }));
  }
  const optima = graphs.map(bruteForceMaxCut);

  it("breakout finds the optimum on (almost) all of 40 graphs with n ≤ 16, weighted and not", () => {
    let hits = 0;
    graphs.forEach((g, i) => {
      const r = breakoutSearch(g, { iterations: 3000, solverSeed: i });
      expectSound(g, r);
      expect(r.value).toBeLessThanOrEqual(optima[i]);
      if (r.value === optima[i]) hits++;
    });
    expect(hits).toBeGreaterThanOrEqual(39);
  });

  it("rank-2 and multi-start never exceed the optimum and mostly reach it", () => {
    let hits = 0;
    graphs.forEach((g, i) => {
      for (const r of [rank2Search(g, { iterations: 40, solverSeed: i }), localSearch(g, { iterations: 200, solverSeed: i })]) {
        expectSound(g, r);
        expect(r.value).toBeLessThanOrEqual(optima[i]);
        if (r.value === optima[i]) hits++;
      }
    });
    expect(hits).toBeGreaterThanOrEqual(70);
  });

  it("handles real-valued weights (records still equal cutValue)", () => {
    const r0 = new Rng(9);
    const e: [number, number, number][] = [];
    for (let i = 0; i < 14; i++) for (let j = i + 1; j < 14; j++) if (r0.nextFloat() < 0.5) e.push([i, j, r0.nextNormal()]);
    const g = graphFromEdges(14, e);
    const opt = bruteForceMaxCut(g);
    for (const r of [breakoutSearch(g, { iterations: 3000, solverSeed: 1 }), rank2Search(g, { iterations: 40, solverSeed: 1 }), localSearch(g, { iterations: 300, solverSeed: 1 })]) {
      expectSound(g, r);
      expect(r.value).toBeLessThanOrEqual(opt + 1e-9);
      expect(r.value).toBeGreaterThan(opt - 1e-9 - 0.05 * Math.abs(opt));
    }
  });
});

describe("anytime searchers", () => {
  const g = randomGraph(120, 0.08, new Rng(11), { weight: nonzeroInt(-1, 1) });

  it("report improvements through onImprove and keep best() consistent between runs", () => {
    const seen: number[] = [];
    const s = new BreakoutSearcher(g, { solverSeed: 5, onImprove: (v) => seen.push(v) });
    expect(s.run({ iterations: 50 })).toBe("iteration-limit");
    const first = s.best();
    expectSound(g, first);
    expect(seen.at(-1)).toBe(first.value);
    s.run({ iterations: 500 });
    const second = s.best();
    expect(second.value).toBeGreaterThanOrEqual(first.value);
    expect(second.details?.rounds).toBe(550);
    // Improvements strictly increase (common practice, no source).
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThan(seen[i - 1]);
  });

  it("stop on a time budget with status time-limit (how promptly they stop is measured in bench/budgets)", () => {
    // 1 ns is over at the first clock check on any machine, so no speed decides the outcome.
    for (const s of [new BreakoutSearcher(g, { solverSeed: 1 }), new Rank2Searcher(g, { solverSeed: 1 }), new MultiStartSearcher(g, { solverSeed: 1 })]) {
      expect(s.run({ seconds: 1e-9 })).toBe("time-limit");
      expectSound(g, s.best());
      expect(s.best().status).toBe("time-limit");
    }
  });

  it("are deterministic: same seed, same partition", () => {
    // Determinism, common practice, no source.
    const a = breakoutSearch(g, { iterations: 300, solverSeed: 42 });
    const b = breakoutSearch(g, { iterations: 300, solverSeed: 42 });
    expect(Array.from(a.partition)).toEqual(Array.from(b.partition));
    const c = rank2Search(g, { iterations: 5, solverSeed: 42 });
    const d = rank2Search(g, { iterations: 5, solverSeed: 42 });
    expect(Array.from(c.partition)).toEqual(Array.from(d.partition));
    const e = localSearch(g, { iterations: 20, solverSeed: 42 });
    const f = localSearch(g, { iterations: 20, solverSeed: 42 });
    expect(Array.from(e.partition)).toEqual(Array.from(f.partition));
    expect(a.solverSeed).toBe(42);
  });

  it("handle edgeless and empty graphs", () => {
    for (const h of [graphFromEdges(0, []), graphFromEdges(5, [])]) {
      for (const r of [breakoutSearch(h, { iterations: 5 }), rank2Search(h, { iterations: 2 }), localSearch(h, { iterations: 2 })]) {
        expect(r.value).toBe(0);
        expect(r.status).toBe("optimal");
      }
    }
  });
});

describe("input errors", () => {
  const g = cycle(5);
  it("name the option and its range", () => {
    expect(() => breakoutSearch(g, { seconds: -1 })).toThrow(InputError);
    expect(() => breakoutSearch(g, { seconds: -1 })).toThrow(/`seconds`/);
    expect(() => breakoutSearch(g, { iterations: 1.5 })).toThrow(/`iterations`: should be a positive integer/);
    expect(() => breakoutSearch(g, { solverSeed: -3 })).toThrow(/`solverSeed`/);
    expect(() => breakoutSearch(g, { jumpMin: 0 })).toThrow(/`jumpMin`: should be an integer between 1 and 5/);
    expect(() => breakoutSearch(g, { directedFloor: 2 })).toThrow(/`directedFloor`/);
    expect(() => breakoutSearch(g, { initial: [0, 1] })).toThrow(/initial: has 2 entries/);
    expect(() => rank2Search(g, { perturbation: 0 })).toThrow(/`perturbation`/);
    expect(() => localSearch(g, { upperBound: NaN })).toThrow(/`upperBound`/);
    expect(() => polishCut(g, new Uint8Array([0, 1, 2, 0, 0]))).toThrow(/entry 2 is 2/);
  });
});
