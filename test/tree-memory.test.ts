// The tree search under a warm-start memory allowance (src/cut/tree/relaxation-tree.ts, option
// `warmMemory`): dropping warm starts may change which nodes are cheap, never what is proved.
import { describe, expect, it } from "vitest";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { TRIANGLE_SIGNS } from "../src/cut/relaxation/triangle-dual.js";
import { solveTriangleSdp } from "../src/cut/relaxation/triangle-sdp.js";
import { trianglesAtRoot } from "../src/cut/tree/reduced-graph.js";
import { relaxationTreeSearch, verifyTreeCertificate, type TreeCertificate } from "../src/cut/tree/relaxation-tree.js";
import { family } from "../src/families/registry.js";
import { Rng } from "../src/random/prng.js";
import { randomGraph } from "./helpers/graphs.js";
import { cutOfPartition } from "./helpers/maxcut.js";
import { milpSolver, solveMilp } from "./helpers/milp.js";

describe("the tree search under a warm-start memory allowance", () => {
  it("closes 8 random graphs with 30–38 vertices at the same value with no warm allowance or no heap room as with the defaults (exact search; MILP when installed)", () => {
    // Sources: exactMaxCut (src/cut/exact, Gray-code / bitmask search) and, when installed, the MILP
    // optimum of Debian's coinor-cbc or glpk-utils (test/helpers/milp.ts).
    const rng = new Rng(4242);
    for (let t = 0; t < 8; t++) {
      const n = 30 + rng.nextInt(9);
      const g = randomGraph(n, (2.4 + 2 * rng.nextFloat()) / (n - 1), rng);
      const base = {
        relaxation: t % 2 === 0 ? ("triangles" as const) : ("plain" as const), branching: t % 4 < 2 ? ("most-decided" as const) : ("least-decided" as const),
        work: 20_000, seconds: 1e6, solverSeed: t, roundsPerNode: 8,
      };
      const free = relaxationTreeSearch(g, base);
      const tight = relaxationTreeSearch(g, { ...base, warmMemory: 0 });
      // Depth-first dives from the first branching on (no room in the heap), with and without warm data.
      const deep = relaxationTreeSearch(g, { ...base, maxOpen: 0, warmMemory: t % 2 === 0 ? 0 : undefined });
      // The same from an empty cut (the incumbent then comes from the nodes' rounding).
      const low = relaxationTreeSearch(g, { ...base, maxOpen: 0, initial: new Uint8Array(n) });
      expect([free.status, tight.status, deep.status, low.status], `graph ${t}`).toEqual(["optimal", "optimal", "optimal", "optimal"]);
      expect([tight.value, deep.value, low.value], `graph ${t}`).toEqual([free.value, free.value, free.value]);
      expect([tight.upper, deep.upper, low.upper], `graph ${t}`).toEqual([free.upper, free.upper, free.upper]);
      if (free.nodes > 3) expect(deep.details?.dives as number, `graph ${t}`).toBeGreaterThan(0);
      expect(free.value, `graph ${t}`).toBe(exactMaxCut(g, { work: 10_000_000, seconds: 1e6 }).value);
      if (milpSolver !== null) expect(free.value, `graph ${t}`).toBe(solveMilp(g, `mem${t}`));
      expect(cutOfPartition(g, tight.partition)).toBe(tight.value);
      // The allowance was really exceeded (every branching node's children lost their warm data),
      // and the default never was on graphs this small.
      if (free.nodes > 1) expect(tight.details?.warmDropped as number, `graph ${t}`).toBeGreaterThan(0);
      expect(free.details?.warmDropped, `graph ${t}`).toBe(0);
      for (const r of [free, tight, deep, low]) {
        const v = verifyTreeCertificate(g, r.certificate);
        expect(v.ok, `graph ${t}: ${v.message}`).toBe(true);
        expect(v.bound).toBeLessThanOrEqual(r.upper);
      }
    }
  });

  it("gives identical records for a seed and node budget under a small allowance; verify accepts them and refuses tampered ones", () => {
    // A small allowance (40 kB: some open nodes keep their warm start, others lose it) on
    // unfinished searches, whose evidence includes the parents of open nodes.
    const cases = [
      { spec: "gnp:n=45,p=0.25,seed=6", relaxation: "triangles" as const, branching: "least-decided" as const, works: [3, 5, 8] },
      { spec: "polarity:q=7,loops=drop", relaxation: "plain" as const, branching: "most-decided" as const, works: [25, 70] },
      { spec: "polarity:q=7,loops=drop", relaxation: "plain" as const, branching: "most-decided" as const, works: [40, 90], maxOpen: 6 },
    ];
    let dropped = 0;
    let dives = 0;
    for (const { spec, relaxation, branching, works, maxOpen } of cases) {
      const g = family(spec);
      for (const work of works) {
        const opts = { relaxation, branching, strengthenWithin: Infinity, work, seconds: 1e6, solverSeed: 5, roundsPerNode: 10, warmMemory: 40_000, maxOpen };
        const a = relaxationTreeSearch(g, opts);
        const b = relaxationTreeSearch(g, opts);
        const strip = (r: typeof a): unknown => ({ ...r, seconds: 0 });
        expect(JSON.stringify(strip(a)), `${spec} work ${work}`).toBe(JSON.stringify(strip(b)));
        dropped += a.details?.warmDropped as number;
        dives += a.details?.dives as number;
        if (maxOpen !== undefined) expect(a.details?.openNodes as number).toBeLessThanOrEqual(maxOpen + 2 * 73);
        const v = verifyTreeCertificate(g, a.certificate);
        expect(v.ok, `${spec} work ${work}: ${v.message}`).toBe(true);
        expect(v.bound).toBeLessThanOrEqual(a.upper);
        // A region removed: the rest no longer covers every cut.
        if (a.certificate.regions.length > 1) {
          const fewer = JSON.parse(JSON.stringify(a.certificate)) as TreeCertificate;
          fewer.regions.pop();
          expect(verifyTreeCertificate(g, fewer).ok, `${spec} work ${work}`).toBe(false);
        }
        const idx = a.certificate.regions.findIndex((x) => x.certificate.kind === "triangle-dual");
        expect(idx).toBeGreaterThanOrEqual(0);
        // A region claiming one less than its certificate proves.
        const lowered = JSON.parse(JSON.stringify(a.certificate)) as TreeCertificate;
        lowered.regions[idx].bound -= 1;
        expect(verifyTreeCertificate(g, lowered).ok, `${spec} work ${work}`).toBe(false);
        // A dual vector lowered: the shift's Cholesky proof fails.
        const bent = JSON.parse(JSON.stringify(a.certificate)) as TreeCertificate;
        (bent.regions[idx].certificate as { y: number[] }).y[0] -= 1;
        expect(verifyTreeCertificate(g, bent).ok, `${spec} work ${work}`).toBe(false);
      }
    }
    // The allowance was really exceeded.
    expect(dropped).toBeGreaterThan(0);
    expect(dives).toBeGreaterThan(0);
  });

  it("refuses a negative allowance and a fractional heap size", () => {
    expect(() => relaxationTreeSearch(family("cycle:n=5"), { warmMemory: -1 })).toThrow(/warmMemory/);
    expect(() => relaxationTreeSearch(family("cycle:n=5"), { maxOpen: 1.5 })).toThrow(/maxOpen/);
  });
});

describe("the tree's root continuing from an earlier strengthened bound", () => {
  const lhs = (tri: ArrayLike<number>, t: number, x: number[]): number => {
    const [i, j, k] = [tri[4 * t], tri[4 * t + 1], tri[4 * t + 2]];
    const s = TRIANGLE_SIGNS[tri[4 * t + 3]];
    return s[0] * x[i] * x[j] + s[1] * x[i] * x[k] + s[2] * x[j] * x[k];
  };

  it("relabels inequalities so that each has the same value on every cut (brute force over 7 vertices)", () => {
    const rng = new Rng(77);
    const n = 7;
    for (let trial = 0; trial < 40; trial++) {
      const root = rng.nextInt(n);
      const tri: number[] = [], mu: number[] = [];
      for (let t = 0; t < 6; t++) {
        const set = new Set<number>();
        while (set.size < 3) set.add(rng.nextInt(n));
        const [i, j, k] = [...set].sort((a, b) => a - b);
        tri.push(i, j, k, rng.nextInt(4));
        mu.push(rng.nextFloat());
      }
      const at = trianglesAtRoot(n, root, tri, mu);
      expect(Array.from(at.mu)).toEqual(mu);
      const label = (v: number): number => (v === root ? 0 : v < root ? v + 1 : v);
      for (let mask = 0; mask < 1 << n; mask++) {
        const x = Array.from({ length: n }, (_, v) => ((mask >> v) & 1 ? -1 : 1));
        const xr = new Array<number>(n);
        for (let v = 0; v < n; v++) xr[label(v)] = x[v];
        for (let t = 0; t < mu.length; t++) expect(lhs(at.triangles, t, xr)).toBe(lhs(tri, t, x));
      }
    }
  });

  it("gives the same exact value from a strengthened bound's inequalities as without (exact search), and refuses a malformed list", () => {
    // Source: exactMaxCut (src/cut/exact); the certificates are re-proved by verify.
    const g = family("gnp:n=45,p=0.25,seed=6");
    const stage = solveTriangleSdp(g, { solverSeed: 2, iterations: 30 });
    expect(stage.certificate.mu.length).toBeGreaterThan(0);
    const opts = { relaxation: "triangles" as const, work: 2000, seconds: 1e6, solverSeed: 3, roundsPerNode: 10 };
    const cold = relaxationTreeSearch(g, opts);
    const warm = relaxationTreeSearch(g, { ...opts, rootTriangles: stage.certificate });
    expect([cold.status, warm.status]).toEqual(["optimal", "optimal"]);
    expect(warm.value).toBe(cold.value);
    expect(warm.value).toBe(exactMaxCut(g, { work: 10_000_000, seconds: 1e6 }).value);
    const v = verifyTreeCertificate(g, warm.certificate);
    expect(v.ok, v.message).toBe(true);
    expect(() => relaxationTreeSearch(g, { ...opts, rootTriangles: { triangles: [0, 1, 1, 0], mu: [1] } })).toThrow(/rootTriangles/);
  });
});
