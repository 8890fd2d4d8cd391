// `halfplus families`: the catalogue as printed by the built command, checked against the registry's
// names and against the graphs actually built (sizes, degrees, forbidden patterns searched for).
import { beforeAll, describe, expect, it } from "vitest";
import { family, listFamilies } from "../src/families/registry.js";
import { findSubgraph, patternGraph } from "../src/graph/structure/index.js";
import { ensureBuilt, halfplus } from "./helpers/cli.js";

beforeAll(ensureBuilt);

describe("halfplus families", () => {
  it("--json prints one object per registered family, in registry order, with params, freeOf and predicted size", () => {
    const r = halfplus(["families", "--json"]);
    expect(r.stderr).toBe("");
    expect(r.code).toBe(0);
    const rows = r.stdout.trim().split("\n").map((l) => JSON.parse(l));
    const defs = listFamilies();
    let withDefaults = 0, checkedClaims = 0;
    expect(rows.map((x) => x.name)).toEqual(defs.map((d) => d.name));
    for (const [i, row] of rows.entries()) {
      const def = defs[i];
      expect(row.params.map((p: { name: string }) => p.name)).toEqual([...def.params.map((p) => p.name), ...(def.random ? ["seed"] : [])]);
      if (def.params.every((p) => p.default !== undefined)) {
        // Independent of the `predictedSize`/`freeOf` functions the command prints: the graph actually
        // built at the defaults, its sizes and degrees, and an exhaustive search for each pattern
        // it is printed to be free of (common practice, no source; the cited theorems are in freeOf).
        const g = family(def.name);
        let minDeg = g.n === 0 ? 0 : Infinity, maxDeg = 0;
        for (let v = 0; v < g.n; v++) {
          minDeg = Math.min(minDeg, g.degree(v));
          maxDeg = Math.max(maxDeg, g.degree(v));
        }
        if (!def.random) expect(row.predictedSize, def.name).toEqual({ n: g.n, m: g.m, mExact: true, minDegree: minDeg, maxDegree: maxDeg });
        else {
          // A random family predicts n exactly, m exactly or in expectation, and a range its degrees fall in.
          const p = row.predictedSize;
          expect(p.n, def.name).toBe(g.n);
          if (p.mExact) expect(p.m, def.name).toBe(g.m);
          if (p.minDegree !== undefined) expect(minDeg, def.name).toBeGreaterThanOrEqual(p.minDegree);
          if (p.maxDegree !== undefined) expect(maxDeg, def.name).toBeLessThanOrEqual(p.maxDegree);
        }
        for (const f of row.freeOf as { pattern: string; citation: string }[]) {
          expect(f.citation.length, `${def.name} ${f.pattern}`).toBeGreaterThan(10);
          const r = findSubgraph(g, patternGraph(f.pattern));
          expect(r.exhaustive || r.found, `${def.name} ${f.pattern}: search incomplete`).toBe(true);
          expect(r.found, `${def.name} printed as ${f.pattern}-free`).toBe(false);
          checkedClaims++;
        }
        withDefaults++;
        expect(row.problem).toBeNull();
      } else {
        expect(row.predictedSize).toBeNull();
        expect(row.problem).toMatch(/missing parameter/);
      }
    }
    // The loop must have checked something (25 families have defaults; 40 freeOf claims at the time of writing).
    expect(withDefaults).toBeGreaterThan(20);
    expect(checkedClaims).toBeGreaterThan(30);
  });

  it("evaluates a spec: KG(9,4) has C(9,4) = 126 vertices of degree C(5,4) = 5", () => {
    // Kneser graph sizes from the definition (Lovász 1978).
    const r = halfplus(["families", "kneser:n=9,k=4", "--json"]);
    expect(r.code).toBe(0);
    const row = JSON.parse(r.stdout);
    expect(row.spec).toBe("kneser:n=9,k=4");
    expect(row.predictedSize).toMatchObject({ n: 126, m: 315, minDegree: 5, maxDegree: 5 });
    expect(row.freeOf.map((f: { pattern: string }) => f.pattern)).toEqual(["K3"]);
  });

  it("an alias shows its family and says so: cayley-zn is circulant, generalised-petersen is generalized-petersen", () => {
    // Z_n-Cayley graphs are the circulants (definition; common practice, no source).
    for (const [alias, name] of [["cayley-zn", "circulant"], ["generalised-petersen", "generalized-petersen"]] as const) {
      const r = halfplus(["families", alias, "--json"]);
      expect(r.code).toBe(0);
      const row = JSON.parse(r.stdout);
      expect(row.name).toBe(name);
      expect(row.aliases).toContain(alias);
      const g = halfplus(["graph", `${alias}:n=9,${alias === "cayley-zn" ? "s=1+3" : "k=2"}`, "--json"]);
      expect(JSON.parse(g.stdout).notes).toContain(`${alias} is another name for ${name}`);
    }
  });

  it("shows one family in detail with its sources, and the list as readable text", () => {
    const one = halfplus(["families", "polarity"]);
    expect(one.code).toBe(0);
    // ER_5: 5² + 5 + 1 = 31 points, 5·6²/2 = 90 edges (Erdős–Rényi 1962).
    expect(one.stdout).toMatch(/31 vertices, 90 edges, degrees 5 to 6/);
    expect(one.stdout).toMatch(/C4 {2}\(.*Erdős–Rényi 1962/);
    const all = halfplus(["families"]);
    expect(all.code).toBe(0);
    for (const d of listFamilies()) expect(all.stdout).toMatch(new RegExp(`^${d.name}( \\(random\\))? — `, "m"));
  });

  it("reports unknown families and invalid specs in one line with exit 2", () => {
    // Input validation, common practice, no source.
    for (const [args, re] of [
      [["families", "nosuch"], /no family called "nosuch"/],
      [["families", "paley:q=7"], /paley: invalid `q`: should be ≡ 1 \(mod 4\)/],
      [["families", "kneser:n=9,k=5"], /kneser: invalid `k`/],
      [["families", "a", "b"], /too many arguments/],
      // Retired names point to the new one (our own renames; common practice, no source).
      [["families", "regular"], /no family called "regular" \(it is now called random-regular\)/],
    ] as const) {
      const r = halfplus([...args]);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe("");
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(re);
    }
  });
});
