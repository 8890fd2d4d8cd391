// extremeEigenvalues on graphs with known spectra (dense and Lanczos paths), the L/Q identity for
// bipartite graphs, and a cross-check with networkx's spectra when python3-networkx is installed.
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { graphFromEdges } from "../src/graph/builder.js";
import { extremeEigenvalues } from "../src/linalg/spectrum.js";
import { complete, cycle, petersen, randomBipartite, randomGraph } from "./helpers/graphs.js";
import { describeNeeds, python } from "./helpers/requirements.js";


describe("extremeEigenvalues: standard spectra", () => {
  it("K_n adjacency: n − 1 once and −1 (Brouwer & Haemers, Spectra of Graphs, §1.4.1)", () => {
    for (const [n, threshold] of [[12, 400], [450, 400]] as const) {
      const top = extremeEigenvalues(complete(n), { which: "largest", k: 2, denseThreshold: threshold });
      expect(top.method).toBe(n <= threshold ? "dense" : "lanczos");
      expect(top.values[0]).toBeCloseTo(n - 1, 9);
      expect(top.values[1]).toBeCloseTo(-1, 9);
      const low = extremeEigenvalues(complete(n), { which: "smallest", k: 3, denseThreshold: threshold });
      for (const v of low.values) expect(v).toBeCloseTo(-1, 9);
      expect(Math.max(...top.residuals, ...low.residuals)).toBeLessThan(1e-8);
    }
  });

  it("C_n adjacency: 2cos(2πj/n) (Brouwer & Haemers, §1.4.3), dense and Lanczos", () => {
    for (const n of [9, 600]) {
      const r = extremeEigenvalues(cycle(n), { which: "largest", k: 3, denseThreshold: 400 });
      expect(r.values[0]).toBeCloseTo(2, 9);
      // j = ±1 give the double eigenvalue 2cos(2π/n).
      expect(r.values[1]).toBeCloseTo(2 * Math.cos((2 * Math.PI) / n), 9);
      expect(r.values[2]).toBeCloseTo(2 * Math.cos((2 * Math.PI) / n), 9);
      const s = extremeEigenvalues(cycle(n), { which: "smallest", k: 1, denseThreshold: 400 });
      const jOpp = Math.floor(n / 2);
      expect(s.values[0]).toBeCloseTo(2 * Math.cos((2 * Math.PI * jOpp) / n), 9);
    }
  });

  it("Petersen adjacency: 3, 1 (×5), −2 (×4) (strongly regular (10,3,0,1); Brouwer & Haemers, §1.4)", () => {
    const top = extremeEigenvalues(petersen(), { k: 6 });
    expect(top.values[0]).toBeCloseTo(3, 10);
    for (let t = 1; t < 6; t++) expect(top.values[t]).toBeCloseTo(1, 10);
    const low = extremeEigenvalues(petersen(), { which: "smallest", k: 4 });
    for (const v of low.values) expect(v).toBeCloseTo(-2, 10);
    // Laplacian of a 3-regular graph is 3I − A: largest eigenvalue 5.
    expect(extremeEigenvalues(petersen(), { matrix: "laplacian" }).values[0]).toBeCloseTo(5, 10);
  });

  it("star K_{1,s}: Laplacian λmax = s + 1 (Brouwer & Haemers, §1.4.4)", () => {
    const s = 700;
    const star = graphFromEdges(s + 1, Array.from({ length: s }, (_, i) => [0, i + 1] as [number, number]));
    const r = extremeEigenvalues(star, { matrix: "laplacian" });
    expect(r.method).toBe("lanczos");
    expect(r.values[0]).toBeCloseTo(s + 1, 8);
    expect(r.converged).toBe(true);
  });
});

describe("Laplacian versus signless Laplacian", () => {
  it("coincide on bipartite graphs, and λmax(L) < λmax(Q) on an odd cycle", () => {
    // Bipartite ⇒ L and Q = D + A are similar (via the ±1 diagonal of the parts); for a connected graph
    // λmax(L) = λmax(Q) iff it is bipartite (Cvetković, Rowlinson & Simić, Signless Laplacians of finite
    // graphs, Linear Algebra Appl. 423 (2007) 155–171).
    for (const [a, b, th] of [[20, 30, 400], [300, 350, 400]] as const) {
      const g = randomBipartite(a, b, 0.1, a);
      const l = extremeEigenvalues(g, { matrix: "laplacian", k: 3, denseThreshold: th });
      const q = extremeEigenvalues(g, { matrix: "signless-laplacian", k: 3, denseThreshold: th });
      for (let t = 0; t < 3; t++) expect(l.values[t]).toBeCloseTo(q.values[t], 8);
    }
    const c7l = extremeEigenvalues(cycle(7), { matrix: "laplacian" }).values[0];
    const c7q = extremeEigenvalues(cycle(7), { matrix: "signless-laplacian" }).values[0];
    expect(c7q).toBeCloseTo(4, 10); // Q of a 2-regular graph is 2I + A
    expect(c7l).toBeCloseTo(2 + 2 * Math.cos(Math.PI / 7), 10);
    expect(c7l).toBeLessThan(c7q - 0.01);
  });
});

describe("options", () => {
  it("validates parameters, naming them", () => {
    expect(() => extremeEigenvalues(cycle(5), { k: 6 })).toThrow(/invalid `k`/);
    expect(() => extremeEigenvalues(cycle(5), { matrix: "normal" as never })).toThrow(/invalid `matrix`/);
    expect(() => extremeEigenvalues(cycle(5), { which: "middle" as never })).toThrow(/invalid `which`/);
  });
});

describeNeeds([python("networkx"), python("numpy"), python("scipy")], "against networkx", () => {
  it("Laplacian and adjacency extremes of G(420, 0.03) match nx.laplacian_spectrum / eigvalsh of nx.to_numpy_array", () => {
    const g = randomGraph(420, 0.03, 5);
    const edges: [number, number][] = [];
    g.forEachEdge((u, v) => edges.push([u, v]));
    const script = [
      "import sys, json, networkx as nx, numpy as np",
      "d = json.load(sys.stdin)",
      "G = nx.Graph(); G.add_nodes_from(range(d['n'])); G.add_edges_from(d['e'])",
      "L = np.sort(np.real(nx.laplacian_spectrum(G)))",
      "A = np.linalg.eigvalsh(nx.to_numpy_array(G, nodelist=range(d['n'])))",
      "print(json.dumps({'L': [L[-1], L[-2], L[0]], 'A': [A[-1], A[0]]}))",
    ].join("\n");
    const r = spawnSync("python3", ["-c", script], { input: JSON.stringify({ n: g.n, e: edges }), timeout: 60_000 });
    expect(r.status).toBe(0);
    const ref = JSON.parse(r.stdout.toString()) as { L: number[]; A: number[] };
    const lTop = extremeEigenvalues(g, { matrix: "laplacian", k: 2 });
    const aTop = extremeEigenvalues(g, { k: 1 });
    const aLow = extremeEigenvalues(g, { which: "smallest" });
    expect(lTop.method).toBe("lanczos");
    expect(lTop.values[0]).toBeCloseTo(ref.L[0], 8);
    expect(lTop.values[1]).toBeCloseTo(ref.L[1], 8);
    expect(aTop.values[0]).toBeCloseTo(ref.A[0], 8);
    expect(aLow.values[0]).toBeCloseTo(ref.A[1], 8);
  });
});
