// Sweep plans: field checks (one line naming the field), grid expansion, seeds, keys and shards.
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import { jobKey, parseShard, planJobs, shardSize } from "../src/experiment/jobs.js";
import { planSlices } from "../src/experiment/shards.js";
import { loadPlan, type SweepPlan } from "../src/experiment/plan.js";
import { resolveFamily } from "../src/experiment/job.js";
import { listFamilies, predictedSizeOf } from "../src/families/registry.js";
import { parseStrictJson } from "../src/limits/strict-json.js";
import { encodeGraph6 } from "../src/graph/formats/graph6.js";
import { cycle, petersen } from "./helpers/graphs.js";

const dir = mkdtempSync(join(tmpdir(), "halfplus-plan-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function planError(plan: unknown): string {
  try {
    loadPlan(plan as SweepPlan);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    const msg = (e as Error).message;
    expect(msg.split("\n")).toHaveLength(1);
    return msg;
  }
  throw new Error("plan was accepted");
}

async function keys(plan: SweepPlan, shard: { index: number; count: number } | null = null): Promise<string[]> {
  const out: string[] = [];
  for await (const j of planJobs(loadPlan(plan, { base: dir }), "0.0.0", shard)) out.push(j.input.key);
  return out;
}

describe("plan checks", () => {
  it("refuses bad fields with one line naming the field", () => {
    expect(planError({})).toMatch(/^plan: families: /);
    expect(planError({ families: [], extra: 1 })).toMatch(/^plan: extra: unknown field/);
    expect(planError({ families: [{ family: "nonesuch" }] })).toMatch(/families\[0\]\.family: no family called "nonesuch"/);
    expect(planError({ families: [{ family: "kneser", grid: { q: 3 } }] })).toMatch(/families\[0\]\.grid\.q: kneser has no parameter `q` \(parameters: n, k\)/);
    expect(planError({ families: [{ family: "andrasfai" }, { family: "kneser", grid: { n: [7, "x"] } }] })).toMatch(/families\[1\]\.grid\.n\[1\]|families\[1\]\.grid\.n: value 2 should be an integer/);
    expect(planError({ families: [{ family: "gnp", grid: { n: 10, p: 0.5 } }] })).toMatch(/families\[0\]\.graphSeeds: required for the random family gnp/);
    expect(planError({ families: [{ family: "gnp", grid: { n: 10, p: 0.5, seed: 3 }, graphSeeds: [1] }] })).toMatch(/families\[0\]\.grid\.seed: give a random family's seeds with `graphSeeds`/);
    expect(planError({ families: [{ family: "andrasfai", graphSeeds: [1] }] })).toMatch(/families\[0\]\.graphSeeds: andrasfai is not a random family/);
    expect(planError({ bracket: { effort: "fast" }, families: [{ family: "andrasfai" }] })).toMatch(/^plan: bracket\.effort: should be one of auto, exact, heuristic, quick/);
    expect(planError({ bracket: { seconds: 0 }, families: [{ family: "andrasfai" }] })).toMatch(/^plan: bracket\.seconds: should lie between/);
    expect(planError({ bracket: { work: 1000, seconds: 2 }, families: [{ family: "andrasfai" }] })).toMatch(/^plan: bracket: give either `seconds` or `work` as the budget, not both$/);
    expect(planError({ bracket: { work: 1.5 }, families: [{ family: "andrasfai" }] })).toMatch(/^plan: bracket\.work: /);
    expect(planError({ bracket: { work: 0 }, families: [{ family: "andrasfai" }] })).toMatch(/^plan: bracket\.work: /);
    expect(planError({ solverSeeds: { from: 3 }, families: [{ family: "andrasfai" }] })).toMatch(/^plan: solverSeeds: give either `count` or `to`/);
    expect(planError({ evaluators: ["edwards"], families: [{ family: "andrasfai" }] })).toMatch(/^plan: evaluators\[0\]: should be one of edwards-edges/);
    expect(planError({ families: [{ family: "kneser", grid: { n: { ladder: { from: 5, to: 9 } } } }] })).toMatch(/families\[0\]\.grid\.n\.ladder: give either `factor` or `count`/);
    expect(planError({ families: [{ family: "kneser", grid: { n: 7, k: 5 } }] })).toMatch(/^plan: families\[0\]: kneser \{"n":7,"k":5\}: /);
    expect(planError({ families: [{ source: "no-such.g6" }] })).toMatch(/families\[0\]\.source: no-such\.g6: no such file/);
    expect(planError({ families: [{ specs: ["gnp:n=5,p=0.5"] }] })).toMatch(/families\[0\]\.specs\[0\]: "gnp:n=5,p=0.5" is random: write its seed/);
    expect(planError({ families: [{ family: "andrasfai", specs: ["petersen"] }] })).toMatch(/families\[0\]: give exactly one of `family`, `specs`, `source`/);
  });

  it("a plan file: JSON syntax errors name the line; relative sources are read beside the plan", () => {
    const bad = join(dir, "bad.json");
    writeFileSync(bad, '{\n  "families": [\n    { "family": "andrasfai" },\n  ]\n}\n');
    expect(() => loadPlan(bad)).toThrow(new RegExp(`^${bad.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}:4:3: not valid JSON: a comma before \\] \\(trailing commas are not JSON\\)$`));
    writeFileSync(join(dir, "two.g6"), `${encodeGraph6(petersen())}\n${encodeGraph6(cycle(5))}\n`);
    const good = join(dir, "good.json");
    writeFileSync(good, JSON.stringify({ families: [{ source: "two.g6" }] }));
    const p = loadPlan(good);
    expect(p.name).toBe("good");
    expect(p.total).toBe(2);
    expect(p.entries[0]).toMatchObject({ kind: "source", source: "two.g6", label: "two", format: "graph6", count: 2 });
  });
});

describe("the plans shipped in plans/", () => {
  it("every plan loads: its families exist under their current names and every member resolves", () => {
    // The shipped plans are examples users copy; a renamed family or parameter must not break them
    // (common practice, no source).
    const root = join(__dirname, "..", "plans");
    const names = readdirSync(root).filter((f) => f.endsWith(".json"));
    expect(names.length).toBeGreaterThanOrEqual(4);
    for (const name of names) {
      const plan = loadPlan(join(root, name));
      expect(plan.total, name).toBeGreaterThan(0);
    }
  });
});

describe("grids, seeds and keys", () => {
  it("a product grid varies the last parameter fastest; random families add graph seeds, then solver seeds", async () => {
    const k = await keys({
      solverSeeds: [0, 1],
      bracket: { seconds: 3 },
      families: [{ family: "gnp", grid: { n: [4, 5], p: [0.5, 1] }, graphSeeds: { from: 7, to: 8 } }],
    });
    expect(k).toHaveLength(2 * 2 * 2 * 2);
    expect(k[0]).toBe("gnp:n=4,p=0.5,seed=7|solverSeed=0|effort=auto,seconds=3|halfplus@0.0.0");
    expect(k[1]).toBe("gnp:n=4,p=0.5,seed=7|solverSeed=1|effort=auto,seconds=3|halfplus@0.0.0");
    expect(k[2]).toBe("gnp:n=4,p=0.5,seed=8|solverSeed=0|effort=auto,seconds=3|halfplus@0.0.0");
    expect(k[4]).toBe("gnp:n=4,p=1,seed=7|solverSeed=0|effort=auto,seconds=3|halfplus@0.0.0");
    expect(k[8]).toBe("gnp:n=5,p=0.5,seed=7|solverSeed=0|effort=auto,seconds=3|halfplus@0.0.0");
    expect(new Set(k).size).toBe(k.length);
  });

  it("ladders, ranges, prime powers and explicit cases", () => {
    // Geometric ladder 10, 20, 40, 80, 160 (common practice, no source).
    const lad = loadPlan({ families: [{ family: "generalized-petersen", grid: { n: { ladder: { from: 10, to: 160, factor: 2 } }, k: 3 } }] });
    expect(lad.entries[0].kind === "specs" && lad.entries[0].items.map((i) => i.params.n)).toEqual([10, 20, 40, 80, 160]);
    // count form: 5 values from 8 to 128 → 8, 16, 32, 64, 128 (exact powers of 2).
    const cnt = loadPlan({ families: [{ family: "cycle", grid: { n: { ladder: { from: 8, to: 128, count: 5 } } } }] });
    expect(cnt.entries[0].kind === "specs" && cnt.entries[0].items.map((i) => i.params.n)).toEqual([8, 16, 32, 64, 128]);
    // Rounding can merge steps: 3, 3.9 → 4, 5.07 → 5, 6.59 → 7 ... each size once.
    const dup = loadPlan({ families: [{ family: "cycle", grid: { n: { ladder: { from: 3, to: 9, factor: 1.1 } } } }] });
    const ns = dup.entries[0].kind === "specs" ? dup.entries[0].items.map((i) => i.params.n) : [];
    expect(ns).toEqual([3, 4, 5, 6, 7, 8, 9]);
    // Prime powers up to 30: 2 3 4 5 7 8 9 11 13 16 17 19 23 25 27 29 (OEIS A246655).
    const pp = loadPlan({ families: [{ family: "polarity", grid: { q: { primePowers: { from: 2, to: 30 } } } }] });
    expect(pp.entries[0].kind === "specs" && pp.entries[0].items.map((i) => i.params.q)).toEqual([2, 3, 4, 5, 7, 8, 9, 11, 13, 16, 17, 19, 23, 25, 27, 29]);
    const cases = loadPlan({ families: [{ family: "kneser", cases: [{ n: 5, k: 2 }, { n: 8, k: 3 }] }] });
    expect(cases.entries[0].kind === "specs" && cases.entries[0].items.map((i) => i.spec)).toEqual(["kneser:n=5,k=2", "kneser:n=8,k=3"]);
    const rng = loadPlan({ families: [{ family: "andrasfai", grid: { k: { range: { from: 2, to: 8, step: 3 } } } }] });
    expect(rng.entries[0].kind === "specs" && rng.entries[0].items.map((i) => i.params.k)).toEqual([2, 5, 8]);
  });

  it("per-entry settings and labels; specs entries", async () => {
    const p = loadPlan({
      bracket: { effort: "exact", seconds: 1 },
      families: [
        { specs: ["petersen", "kneser:n=7,k=2"], label: "named" },
        { family: "cycle", grid: { n: 5 }, bracket: { seconds: 4 }, solverSeeds: [3] },
      ],
    });
    const jobs: string[] = [];
    for await (const j of planJobs(p, "9.9.9")) jobs.push(`${j.input.family} ${j.input.key}`);
    expect(jobs).toEqual([
      "named petersen|solverSeed=0|effort=exact,seconds=1|halfplus@9.9.9",
      "named kneser:n=7,k=2|solverSeed=0|effort=exact,seconds=1|halfplus@9.9.9",
      "cycle cycle:n=5|solverSeed=3|effort=exact,seconds=4|halfplus@9.9.9",
    ]);
    expect(jobKey("petersen", 0, { effort: "auto", seconds: 10, work: null }, "1.0.0")).toBe("petersen|solverSeed=0|effort=auto,seconds=10|halfplus@1.0.0");
  });
});

describe("random families: one grid point over many seeds", () => {
  // One point of every random family (common practice, no source: the slow path, resolveFamily
  // per seed, is the reference). A new random family fails the first check until it is listed.
  const POINTS: Record<string, Record<string, string | number>> = {
    gnp: { n: 26, p: 0.3 },
    gnm: { n: 20, m: 31 },
    "random-regular": { n: 20, d: 3 },
    "bipartite-gnp": { a: 7, b: 9, p: 0.4 },
    "hfree-process": { n: 15, h: "K4" },
    "delete-random-edges": { of: "kneser:n=7,k=2", p: 0.25 },
  };
  const SEEDS = [0, 1, 2, 17, 4_000_000_000];

  it("a random family's predicted size does not depend on its graph seed", () => {
    expect(listFamilies().filter((d) => d.random).map((d) => d.name).sort()).toEqual(Object.keys(POINTS).sort());
    for (const [name, point] of Object.entries(POINTS)) {
      const spec = (seed: number): string => resolveFamily(name, { ...point, seed }).spec;
      const sizes = SEEDS.map((s) => predictedSizeOf(spec(s)));
      for (const size of sizes) expect(size, name).toEqual(sizes[0]);
    }
  });

  it("the plan's members equal resolveFamily seed by seed (spec, parameters, graph seed, size)", () => {
    for (const [name, point] of Object.entries(POINTS)) {
      const grid = Object.fromEntries(Object.entries(point).map(([k, v]) => [k, typeof v === "string" && k === "of" ? { values: [v] } : v]));
      const p = loadPlan({ families: [{ family: name, grid, graphSeeds: SEEDS }] } as SweepPlan);
      const entry = p.entries[0];
      if (entry.kind !== "specs") throw new Error("expected family members");
      expect(entry.items).toHaveLength(SEEDS.length);
      entry.items.forEach((item, i) => {
        const one = resolveFamily(name, { ...point, seed: SEEDS[i] });
        expect({ spec: item.spec, family: item.family, params: item.params, graphSeed: item.graphSeed, n: item.n, m: item.m }, `${name} seed ${SEEDS[i]}`).toEqual(one);
        expect(Object.keys(item.params)).toEqual(Object.keys(one.params));
        expect(item.paramsJson).toBe(JSON.stringify(one.params));
      });
    }
  });

  it("a point that fails is named with its first seed, in one line", () => {
    expect(planError({ families: [{ family: "gnm", grid: { n: 5, m: 11 }, graphSeeds: { from: 3, count: 1000 } }] })).toMatch(
      /^plan: families\[0\]: gnm \{"n":5,"m":11,"seed":3\}: .*`m`/,
    );
  });
});

describe("shards", () => {
  it("parses i/N with 0 ≤ i < N, one-line errors otherwise", () => {
    expect(parseShard("0/4")).toEqual({ index: 0, count: 4 });
    expect(parseShard("3/4")).toEqual({ index: 3, count: 4 });
    for (const bad of ["4/4", "1/0", "x", "1-4", "-1/4"]) expect(() => parseShard(bad)).toThrow(InputError);
    expect(() => parseShard("4/4")).toThrow(/i counts from 0/);
  });

  it("the shards of a plan are disjoint, cover it, and take every N-th job", async () => {
    const plan: SweepPlan = { solverSeeds: [0, 1, 2], families: [{ family: "gnp", grid: { n: [5, 6, 7], p: 0.5 }, graphSeeds: { from: 0, count: 3 } }, { source: "two.g6" }] };
    writeFileSync(join(dir, "two.g6"), `${encodeGraph6(petersen())}\n${encodeGraph6(cycle(5))}\n`);
    const all = await keys(plan);
    expect(all).toHaveLength(3 * 3 * 3 + 2 * 3);
    const parts = await Promise.all([0, 1, 2, 3].map((i) => keys(plan, { index: i, count: 4 })));
    const slices = await planSlices(loadPlan(plan, { base: dir }), 4);
    // Graphs this small all get the same predicted cost, and equal costs slice by position modulo N
    // (cost-balanced slicing itself: test/cluster-shards.test.ts).
    parts.forEach((p, i) => {
      expect(p).toHaveLength(shardSize(slices, { index: i, count: 4 }, all.length));
      expect(p).toEqual(all.filter((_, j) => j % 4 === i));
    });
  });
});

describe("JSON positions", () => {
  it("finds the first fault the way the JSON grammar (RFC 8259) defines it, and accepts valid JSON", () => {
    // The grammar of RFC 8259 §2–7; messages name line:column (common practice, no source).
    const fault = (t: string): string => {
      try {
        parseStrictJson(t, "p.json");
      } catch (e) {
        expect(e).toBeInstanceOf(InputError);
        return (e as Error).message;
      }
      return "valid";
    };
    const valid = ['{"a": [1, -2.5e3, true, null, "x\\u00e9"]}', "[]", " 7 "];
    for (const t of valid) expect(fault(t), t).toBe("valid");
    expect(fault('{"a": 1,}')).toBe("p.json:1:9: not valid JSON: a comma before } (trailing commas are not JSON)");
    expect(fault('{"a" 1}')).toMatch(/^p\.json:1:6: not valid JSON: expected : after the key/);
    expect(fault("{'a': 1}")).toMatch(/expected a quoted key/);
    expect(fault('{"a": 01}')).toMatch(/expected , or \}/);
    expect(fault('{"a": 1}\n{"b": 2}')).toMatch(/^p\.json:2:1: not valid JSON: unexpected "\{" after the JSON value$/);
    expect(fault('["abc')).toMatch(/not closed/);
    // A key given twice is refused, not resolved by the last one (RFC 8259 §4 leaves it undefined).
    expect(fault('{"name": "a",\n "name": "b"}')).toMatch(/^p\.json:2:\d+: not valid JSON: duplicate key "name"$/);
  });
});
