// Automorphisms (src/graph/structure/automorphisms.ts) and orbital branching in the exact max-cut
// tree (src/cut/tree/symmetry.ts): group orders against nauty's dreadnaut (Debian nauty), exact
// values against the existing exact search and the MILP solver, and forged certificates.

import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { bracket } from "../src/cut/bracket/bracket.js";
import { verifyBracket } from "../src/cut/bracket/verify.js";
import { exactMaxCut } from "../src/cut/exact/exact-max-cut.js";
import { relaxationTreeSearch, verifyTreeCertificate, type TreeCertificate } from "../src/cut/tree/relaxation-tree.js";
import { family } from "../src/families/registry.js";
import type { Graph } from "../src/graph/graph.js";
import { isAutomorphism, listAutomorphisms } from "../src/graph/structure/automorphisms.js";
import { Rng } from "../src/random/prng.js";
import { petersen, randomGraph } from "./helpers/graphs.js";
import { milpSolver, solveMilp } from "./helpers/milp.js";
import { check, itNeeds, tool } from "./helpers/requirements.js";

/** The automorphism group order nauty's dreadnaut reports (its `grpsize=` field). */
function dreadnautGroupSize(g: Graph): number {
  const lists: string[] = [];
  for (let v = 0; v < g.n; v++) lists.push(`${v}: ${Array.from(g.neighborsOf(v)).join(" ")}`);
  const r = spawnSync("dreadnaut", [], { input: `n=${g.n} g ${lists.join("; ")}. x\nq\n`, encoding: "utf8" });
  const m = /grpsize=([0-9.e+]+)/.exec(r.stdout);
  if (m === null) throw new Error(`dreadnaut printed no group size: ${r.stdout} ${r.stderr}`);
  return Number(m[1]);
}

describe("listing automorphisms", () => {
  itNeeds([tool("dreadnaut")], "finds the whole group, of the order nauty's dreadnaut reports, on structured and random graphs", () => {
    // Source: dreadnaut (Debian nauty) for every order. Also, from memory: Aut(Petersen) = S5 (120);
    // the polarity graphs' groups are PGL(2,7) (336), PΓL(2,8) (1512), PΓL(2,9) (1440).
    const graphs: [string, Graph][] = [
      ["petersen", petersen()],
      ...["polarity:q=5,loops=drop", "polarity:q=7,loops=drop", "polarity:q=8,loops=drop", "polarity:q=9,loops=drop", "kneser:n=6,k=2", "circulant:n=20,s=1+4", "generalized-petersen:n=15,k=4"].map((s): [string, Graph] => [s, family(s)]),
    ];
    const rng = new Rng(11);
    for (let t = 0; t < 6; t++) graphs.push([`random ${t}`, randomGraph(7 + rng.nextInt(6), 0.2 + 0.5 * rng.nextFloat(), rng)]);
    for (const [name, g] of graphs) {
      const a = listAutomorphisms(g);
      expect(a.complete, name).toBe(true);
      expect(a.elements.length, name).toBe(dreadnautGroupSize(g));
      const keys = new Set(a.elements.map((p) => p.join(",")));
      expect(keys.size, `${name}: distinct`).toBe(a.elements.length);
      for (const p of a.elements.slice(0, 50)) expect(isAutomorphism(g, p), name).toBe(true);
    }
  });

  it("stops at its caps with a list that still holds only automorphisms", () => {
    // Aut(KG(8,3)) = S8, 40320 elements (Kneser graphs: common practice, no source): more than the cap.
    const g = family("kneser:n=8,k=3");
    const a = listAutomorphisms(g, { maxElements: 200 });
    expect(a.complete).toBe(false);
    expect(a.elements.length).toBe(200);
    for (const p of a.elements) expect(isAutomorphism(g, p)).toBe(true);
    const b = listAutomorphisms(g, { maxNodes: 50 });
    expect(b.complete).toBe(false);
    expect(b.nodes).toBeLessThanOrEqual(51);
  });

  it("isAutomorphism refuses non-permutations and maps that move an edge onto a non-edge", () => {
    const g = petersen();
    const id = Array.from({ length: 10 }, (_, i) => i);
    expect(isAutomorphism(g, id)).toBe(true);
    expect(isAutomorphism(g, [1, ...id.slice(1)])).toBe(false); // 1 twice
    expect(isAutomorphism(g, id.slice(1))).toBe(false);
    // No two vertices of the Petersen graph share a neighbourhood (common practice, no source), so no transposition is an automorphism.
    const swapped = id.slice();
    [swapped[0], swapped[1]] = [1, 0];
    expect(isAutomorphism(g, swapped)).toBe(false);
  });
});

describe("orbital branching in the tree", () => {
  // Graphs where the tree branches (the others close at the root), each with automorphisms.
  const symmetric = ["polarity:q=5,loops=drop", "kneser:n=7,k=2", "generalized-petersen:n=15,k=4"];

  it("gives the exact values of the existing exact search with and without symmetry, and verify accepts the orbital certificates", () => {
    // Source: exactMaxCut (src/cut/exact, a combinatorial branch and bound sharing no code with this search).
    let branches = 0;
    for (const spec of symmetric) {
      const g = family(spec);
      const exact = exactMaxCut(g, { work: 50_000_000, seconds: 1e6 });
      expect(exact.status, spec).toBe("optimal");
      for (const symmetry of [true, false]) {
        const r = relaxationTreeSearch(g, { relaxation: "plain", branching: "most-decided", work: 20_000, seconds: 1e6, solverSeed: 1, symmetry });
        expect(r.status, spec).toBe("optimal");
        expect(r.value, spec).toBe(exact.value);
        const v = verifyTreeCertificate(g, r.certificate);
        expect(v.ok, `${spec}: ${v.message}`).toBe(true);
        if (!symmetry) expect(r.certificate.orbital, spec).toBeUndefined();
        else branches += r.certificate.orbital?.length ?? 0;
      }
    }
    // The test must exercise the orbital rule, or it proves nothing about it.
    expect(branches).toBeGreaterThan(0);
  });

  itNeeds([check("a MILP solver, cbc (coinor-cbc) or glpsol (glpk-utils)", () => milpSolver !== null)], "agrees with the MILP (cbc, else glpsol) on the symmetric graphs", () => {
    // Source: the MILP optimum from an independent solver (Debian coinor-cbc / glpk-utils).
    for (const spec of symmetric) {
      const g = family(spec);
      const r = relaxationTreeSearch(g, { relaxation: "plain", branching: "most-decided", work: 20_000, seconds: 1e6, solverSeed: 2 });
      expect(r.value, spec).toBe(solveMilp(g, spec.replace(/[^a-z0-9]/gi, "_")));
    }
  });

  /** A finished search on GP(15, 4) with orbital branches, and its certificate as plain JSON. */
  const finished = (): { g: Graph; cert: TreeCertificate } => {
    const g = family("generalized-petersen:n=15,k=4");
    const r = relaxationTreeSearch(g, { relaxation: "plain", branching: "most-decided", work: 20_000, seconds: 1e6, solverSeed: 1 });
    expect(r.status).toBe("optimal");
    return { g, cert: JSON.parse(JSON.stringify(r.certificate)) as TreeCertificate };
  };

  it("verify refuses a forged automorphism, a wrong map, a missing branch, a moved side and an orbit vertex no map reaches", () => {
    const { g, cert } = finished();
    expect(cert.orbital!.length).toBeGreaterThan(0);
    expect(verifyTreeCertificate(g, cert).ok).toBe(true);
    const edit = (f: (c: TreeCertificate) => void): boolean => {
      const c = JSON.parse(JSON.stringify(cert)) as TreeCertificate;
      f(c);
      return verifyTreeCertificate(g, c).ok;
    };
    // A used automorphism with two images swapped is no automorphism (no two vertices of GP(15, 4) share a neighbourhood).
    expect(edit((c) => {
      const p = c.automorphisms![0];
      [p[0], p[1]] = [p[1], p[0]];
    })).toBe(false);
    // The identity instead of a map that moves an orbit vertex.
    expect(edit((c) => {
      const b = c.orbital!.find((x) => x.orbit.length > 1)!;
      c.automorphisms!.push(Array.from({ length: g.n }, (_, i) => i));
      b.maps[1] = c.automorphisms!.length - 1;
    })).toBe(false);
    expect(edit((c) => (c.orbital = c.orbital!.slice(1)))).toBe(false);
    expect(edit((c) => (c.orbital![0].side = 1 - c.orbital![0].side))).toBe(false);
    // An extra orbit vertex (not in the orbit) with the identity as its map.
    expect(edit((c) => {
      const b = c.orbital![0];
      const fixed = new Set([c.rootVertex, ...b.vertices, ...b.orbit]);
      const extra = Array.from({ length: g.n }, (_, i) => i).find((x) => !fixed.has(x))!;
      c.automorphisms!.push(Array.from({ length: g.n }, (_, i) => i));
      b.orbit.push(extra);
      b.maps.push(c.automorphisms!.length - 1);
    })).toBe(false);
    expect(edit((c) => (c.orbital![0].maps[0] = 0))).toBe(false);
    expect(edit((c) => delete c.automorphisms)).toBe(false);
  });

  it("carries its orbital branches through the bracket record, which verify re-checks from JSON", () => {
    const g = family("generalized-petersen:n=15,k=4");
    const rec = bracket(g, { effort: "deep", relaxation: "plain", branching: "most-decided", treeNodes: 20_000, work: 200_000_000, solverSeed: 1 });
    expect(rec.exact).toBe(true);
    expect(rec.certificate.kind).toBe("sdp-tree");
    // Source: the existing exact search.
    expect(rec.lower).toBe(exactMaxCut(g, { work: 50_000_000, seconds: 1e6 }).value);
    const json = JSON.parse(JSON.stringify(rec));
    expect(verifyBracket(g, json).verdict).toBe("verified");
    expect(json.certificate.orbital.length).toBeGreaterThan(0);
    // The identity in place of a used map: it sends no orbit vertex to the branching vertex.
    json.certificate.automorphisms[0] = json.certificate.automorphisms[0].map((_: number, i: number) => i);
    expect(verifyBracket(g, json).verdict).not.toBe("verified");
  });

  it("is deterministic for a seed and node budget", () => {
    const g = family("polarity:q=7,loops=drop");
    const a = relaxationTreeSearch(g, { relaxation: "plain", branching: "most-decided", work: 30, seconds: 1e6, solverSeed: 4 });
    const b = relaxationTreeSearch(g, { relaxation: "plain", branching: "most-decided", work: 30, seconds: 1e6, solverSeed: 4 });
    expect(JSON.stringify(a.certificate)).toBe(JSON.stringify(b.certificate));
    expect(a.certificate.orbital!.length).toBeGreaterThan(0);
    expect(verifyTreeCertificate(g, a.certificate).ok).toBe(true);
  });
});
