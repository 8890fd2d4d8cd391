// The memetic search for large sparse graphs (src/cut/heuristic/memetic.ts) and its partition
// crossover: values re-checked by the suites' own evaluator, determinism under a work limit, the
// start cut as a floor, and graphs whose max cut is known. Work budgets only, no clock.
import { describe, expect, it } from "vitest";
import { memeticSearch } from "../src/cut/heuristic/memetic.js";
import { PartitionCrossover } from "../src/cut/heuristic/partition-crossover.js";
import { localSearch } from "../src/cut/heuristic/local-search.js";
import { gnm } from "../src/families/gnm.js";
import { InputError } from "../src/errors.js";
import { Rng } from "../src/random/prng.js";
import { cutOfPartition } from "./helpers/maxcut.js";
import { cycle, randomBipartite, randomGraph } from "./helpers/graphs.js";

const WORK = 200_000;

describe("memetic search", () => {
  it("reports the cut of the partition it returns (independent evaluator), and the work it used", () => {
    const plain = gnm(400, 1000, 3);
    const signed = randomGraph(150, 0.05, 4, { weight: (r) => (r.nextU32() & 1 ? 1 : -1) });
    for (const g of [plain, signed]) {
      const r = memeticSearch(g, { solverSeed: 5, work: WORK });
      expect(r.value).toBe(cutOfPartition(g, r.partition));
      expect(r.status).toBe("work-limit");
      expect(r.work).toBeGreaterThanOrEqual(WORK);
      expect(r.details?.workUsed).toBe(r.work);
    }
  });

  it("gives the identical cut for the same seed and work limit, whatever the seconds allowed", () => {
    const g = gnm(600, 1500, 7);
    const a = memeticSearch(g, { solverSeed: 11, work: WORK });
    const b = memeticSearch(g, { solverSeed: 11, work: WORK, seconds: 1e6 });
    expect(b.value).toBe(a.value);
    expect(b.work).toBe(a.work);
    expect(Array.from(b.partition)).toEqual(Array.from(a.partition));
    const two = memeticSearch(g, { solverSeed: 11, work: WORK, walkers: 2 });
    expect(memeticSearch(g, { solverSeed: 11, work: WORK, walkers: 2 }).partition).toEqual(two.partition);
    // A different seed explores differently (the seed is used at all).
    const c = memeticSearch(g, { solverSeed: 12, work: WORK });
    expect(Array.from(c.partition)).not.toEqual(Array.from(a.partition));
  });

  it("is never worse than the local-search cut it starts from", () => {
    for (let seed = 1; seed <= 5; seed++) {
      const g = gnm(300, 750, seed);
      const start = localSearch(g, { iterations: 4, solverSeed: seed });
      // A tiny budget: the floor must hold even when the search barely runs.
      for (const work of [1, 5000]) {
        const r = memeticSearch(g, { solverSeed: seed, work, initial: start.partition });
        expect(r.value).toBeGreaterThanOrEqual(start.value);
        expect(r.value).toBe(cutOfPartition(g, r.partition));
      }
    }
  });

  it("cuts every edge of a bipartite graph (common practice, no source: max cut = m) and stops at the bound", () => {
    const g = randomBipartite(120, 130, 0.04, 9);
    const r = memeticSearch(g, { solverSeed: 1, work: WORK });
    expect(r.value).toBe(g.m);
    const stopped = memeticSearch(g, { solverSeed: 1, work: WORK, upperBound: g.m });
    expect(stopped.value).toBe(g.m);
    expect(stopped.status).toBe("optimal");
    expect(stopped.work).toBeLessThan(WORK);
  });

  it("cuts n − 1 edges of an odd cycle C_n (from memory: an odd cycle is not bipartite, a path is)", () => {
    for (const n of [5, 101, 1001]) {
      const g = cycle(n);
      const r = memeticSearch(g, { solverSeed: 2, work: WORK });
      expect(r.value).toBe(n - 1);
      expect(cutOfPartition(g, r.partition)).toBe(n - 1);
    }
  });

  it("gives 0 on a graph without edges, and refuses a bad work limit naming it", () => {
    const empty = gnm(10, 0, 1);
    expect(memeticSearch(empty, { work: 10 })).toMatchObject({ value: 0, status: "optimal" });
    for (const work of [0, 1.5, -3]) expect(() => memeticSearch(empty, { work })).toThrow(/work/);
    expect(() => memeticSearch(empty, { work: 0 })).toThrow(InputError);
    expect(() => memeticSearch(empty, { work: 10, initial: [0, 1] })).toThrow(InputError);
  });
});

describe("partition crossover", () => {
  it("gives a child at least as good as both parents, by exactly the gain it reports (independent evaluator)", () => {
    const rng = new Rng(21);
    let strict = 0;
    for (let t = 0; t < 300; t++) {
      const n = 5 + rng.nextInt(60);
      const g = t % 3 === 0 ? randomGraph(n, 0.1, rng, { weight: (r) => r.nextInt(7) - 3 }) : randomGraph(n, 0.08, rng);
      const a = Uint8Array.from({ length: n }, () => rng.nextU32() & 1);
      const b = Uint8Array.from({ length: n }, () => rng.nextU32() & 1);
      const child = new Uint8Array(n);
      const gain = new PartitionCrossover(g).cross(a, b, child);
      const [ca, cb, cc] = [cutOfPartition(g, a), cutOfPartition(g, b), cutOfPartition(g, child)];
      expect(cc).toBe(ca + gain);
      expect(cc).toBeGreaterThanOrEqual(Math.max(ca, cb));
      if (cc > Math.max(ca, cb)) strict++;
    }
    // Combining regions of both parents beats each of them on a good share of pairs.
    expect(strict).toBeGreaterThan(30);
  });

  it("treats a cut and its complement as the same cut", () => {
    const g = gnm(50, 120, 2);
    const a = Uint8Array.from({ length: 50 }, (_, i) => (i * 7) % 3 & 1);
    const complement = a.map((s) => s ^ 1);
    const child = new Uint8Array(50);
    const px = new PartitionCrossover(g);
    expect(px.cross(a, complement, child)).toBe(0);
    expect(Array.from(child)).toEqual(Array.from(a));
    expect(px.components).toBe(0);
  });
});
