// `halfplus bounds` and the boundsAccount API behind it: the record's envelope and evaluators, the
// loss steps adding up to each gap, reuse of a bracket, streams from nauty-geng, and bad input.
import { spawnSync } from "node:child_process";
import { beforeAll, describe, expect, it } from "vitest";
import { ACCOUNT_EVALUATORS, boundsAccount, type BoundsAccountRecord } from "../src/cut/account/bounds-account.js";
import { bracket } from "../src/cut/bracket/bracket.js";
import { family } from "../src/families/registry.js";
import { graphFromEdges } from "../src/graph/builder.js";
import { cutValue } from "../src/graph/cut-value.js";
import { parseGraph6 } from "../src/graph/formats/graph6.js";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { bruteForceMaxCut } from "./helpers/maxcut.js";
import { itNeeds, tool } from "./helpers/requirements.js";
import { directVectorGuarantee } from "./helpers/vector.js";

beforeAll(ensureBuilt);

/** Each applying row's steps add up to the gap between the bracket's lower end and its surplus. */
function checkSteps(a: BoundsAccountRecord): void {
  const L = a.bracket.surplusLower;
  for (const r of a.evaluators) {
    if (!r.applies) {
      expect(r.surplus).toBeNull();
      expect(r.largestLoss).toBeNull();
      continue;
    }
    const total = r.steps.reduce((s, x) => s + x.loss, 0);
    expect(total).toBeCloseTo(L - (r.surplus as number), 9);
    expect(r.largestLoss!.loss).toBe(Math.max(...r.steps.map((s) => s.loss)));
    if (L > 0) expect(r.fractionOfLower).toBeCloseTo((r.surplus as number) / L, 12);
  }
}

describe("boundsAccount", () => {
  it("Petersen: exact bracket, Edwards' values, the vector rows, the decomposition; losses add up", () => {
    const g = family("petersen");
    const a = boundsAccount(g, { solverSeed: 1, trials: 300 });
    // Max cut of the Petersen graph is 12 (from memory), checked by brute force.
    expect(bruteForceMaxCut(g)).toBe(12);
    expect(a.bracket).toMatchObject({ lower: 12, upper: 12, exact: true, surplusLower: 4.5 });
    expect(a.evaluators.map((r) => r.name)).toEqual([...ACCOUNT_EVALUATORS]);
    const by = new Map(a.evaluators.map((r) => [r.name, r]));
    // m = 15: (√121 − 1)/8 = 1.25 (Edwards 1973); (n − 1)/4 = 2.25 (Edwards 1975) (arithmetic).
    expect(by.get("edwards-edges")!.surplus).toBe(1.25);
    expect(by.get("edwards-vertices")!.surplus).toBe(2.25);
    // Triangle-free, 3-regular: (1/2π)·10·√3 (Shearer 1992's order; arithmetic).
    for (const name of ["triangle-free", "vector-method", "vector-optimised"] as const) expect(by.get(name)!.surplus).toBeCloseTo((10 * Math.sqrt(3)) / (2 * Math.PI), 12);
    expect(by.get("decomposition-cut")!.surplus).toBeLessThanOrEqual(4.5);
    expect(by.get("decomposition-guarantee")!.surplus as number).toBeLessThanOrEqual(by.get("decomposition-cut")!.surplus as number);
    checkSteps(a);
    expect(a.decomposition!.value).toBe(cutValue(g, a.decomposition!.partition));
    // Rounded cuts beside the guarantee: the mean within 6 standard errors of the exact expectation
    // (normal approximation; seeded), the expectation above the guarantee (the vector method's proof).
    for (const c of [a.vector!.default, a.vector!.optimised]) {
      expect(c.expectedSurplus).toBeGreaterThanOrEqual(c.guarantee - 1e-12);
      expect(Math.abs(c.meanSurplus - c.expectedSurplus)).toBeLessThan(6 * c.stdErr);
      expect(c.bestSurplus).toBeLessThanOrEqual(4.5);
    }
  });

  it("a K4-free process graph: the best choice beats the default, the decomposition has pieces, the envelope names the graph", () => {
    const g = family("hfree-process:n=80,h=K4,seed=7");
    const a = boundsAccount(g, { seconds: 1, solverSeed: 2, decomposition: { pattern: "K4" } });
    expect(a.kind).toBe("halfplus/bounds-account");
    expect(a.version).toBe(1);
    expect(a.graphHash).toMatch(/^sha256:/);
    const by = new Map(a.evaluators.map((r) => [r.name, r]));
    expect(by.get("triangle-free")!.applies).toBe(false);
    expect(by.get("vector-optimised")!.surplus as number).toBeGreaterThan(by.get("vector-method")!.surplus as number);
    expect(by.get("vector-optimised")!.surplus as number).toBeGreaterThanOrEqual((by.get("few-triangles")!.surplus as number) - 1e-12);
    expect(a.decomposition!.pieces.length).toBeGreaterThan(0);
    checkSteps(a);
    // The dropped pairs and ε rebuild the choice: its guarantee matches the row.
    const o = a.vector!.optimised;
    const dropped = new Set(o.dropped.map(([i, k]) => `${i}-${k}`));
    const sets = Array.from({ length: g.n }, (_, i) => (o.eps[i] === 0 ? [] : Array.from(g.neighborsOf(i)).filter((k) => !dropped.has(`${i}-${k}`))));
    const eps = o.eps.map((e, i) => (sets[i].length === 0 ? 0 : e));
    expect(directVectorGuarantee(g, sets, eps)).toBeCloseTo(by.get("vector-optimised")!.surplus as number, 9);
  });

  it("uses a bracket passed in, and refuses one of another graph by name", () => {
    const g = family("kneser:n=7,k=2");
    const br = bracket(g, { seconds: 1, solverSeed: 3 });
    const a = boundsAccount(g, { bracket: br, trials: 50 });
    expect(a.bracket.lower).toBe(br.lower);
    expect(a.bracket.seconds).toBe(br.seconds);
    expect(() => boundsAccount(family("petersen"), { bracket: br })).toThrow(/bounds account: invalid `bracket`: should be a bracket of this graph/);
    expect(() => boundsAccount(g, { bracket: br, trials: 0 })).toThrow(/invalid `trials`/);
  });

  it("weighted graphs: the bracket only, every argument says it does not apply", () => {
    const g = graphFromEdges(3, [[0, 1, 2], [1, 2, 3], [0, 2, 1]]);
    const a = boundsAccount(g);
    expect(a.bracket.lower).toBe(5);
    expect(a.evaluators.every((r) => !r.applies)).toBe(true);
    expect(a.vector).toBeNull();
    expect(a.decomposition).toBeNull();
    expect(a.notes.join(" ")).toMatch(/weighted/);
  });
});

describe("halfplus bounds", () => {
  it("prints the bracket, a table of arguments and the vector rounding for Petersen", () => {
    const r = halfplus(["bounds", "petersen", "--trials", "50"]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^petersen\n/);
    expect(r.stdout).toMatch(/surplus\s+4\.5\s+\(exact; max cut 12/);
    expect(r.stdout).toMatch(/Edwards, from m\s+1\.25\s+0\.2778\s+reads only m \(3\.25\)/);
    expect(r.stdout).toMatch(/vector rounding, 50 trials/);
    expect(r.stdout).toMatch(/decomposition: H = K3/);
  });

  it("--json: one record per graph, joining the graph summary by hash", () => {
    const r = halfplus(["bounds", "kneser:n=6,k=2", "--json", "--trials", "20"]);
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split("\n");
    expect(lines).toHaveLength(1);
    const a = JSON.parse(lines[0]) as BoundsAccountRecord;
    const s = JSON.parse(halfplus(["graph", "kneser:n=6,k=2", "--json"]).stdout);
    expect(a.graphHash).toBe(s.graphHash);
    expect(a.source.spec).toBe("kneser:n=6,k=2");
    expect(a.evaluators.map((e) => e.name)).toEqual([...ACCOUNT_EVALUATORS]);
    checkSteps(a);
  });

  itNeeds([tool("nauty-geng")], "reads a graph6 stream: one record per graph, each with its position and an exact bracket", () => {
    // nauty-geng -c 5: the 21 connected graphs on 5 vertices (OEIS A001349).
    const geng = spawnSync("nauty-geng", ["-q", "-c", "5"]);
    const r = halfplus(["bounds", "-", "--json", "--trials", "20"], geng.stdout);
    expect(r.code).toBe(0);
    const recs = r.stdout.trim().split("\n").map((l) => JSON.parse(l) as BoundsAccountRecord);
    expect(recs).toHaveLength(21);
    const g6 = geng.stdout.toString().trim().split("\n");
    recs.forEach((a, i) => {
      expect(a.source.position).toBe(i + 1);
      const g = parseGraph6(g6[i]);
      expect(a.bracket.exact).toBe(true);
      expect(a.bracket.lower).toBe(bruteForceMaxCut(g));
      checkSteps(a);
      for (const e of a.evaluators) if (e.applies && e.name !== "decomposition-cut") expect(e.surplus as number).toBeLessThanOrEqual(a.bracket.surplusLower + 1e-9);
    });
  });

  it("bad input: one line naming the option or parameter, exit 2", () => {
    for (const [args, re] of [
      [["bounds", "petersen", "--seed", "3"], /--seed: ambiguous/],
      [["bounds", "petersen", "--pattern", "Q5"], /pattern "Q5": unknown name/],
      [["bounds", "petersen", "--trials", "0"], /--trials must lie in/],
      [["bounds", "petersen", "--triangle-factor", "-1"], /--triangle-factor must lie in/],
      [["bounds", "nosuchfamily:q=3"], /no family called "nosuchfamily"/],
    ] as const) {
      const r = halfplus([...args]);
      expect(r.code).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(re);
    }
  });
});
