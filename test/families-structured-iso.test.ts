// Structured families compared up to isomorphism with graphs made outside the project: nauty's
// genspecialg, networkx's named generators, and independent constructions written here from the
// definitions. Equality is decided by nauty-labelg's canonical graph6 (same canonical form ⇔ isomorphic).
import { spawnSync } from "node:child_process";
import { expect, it } from "vitest";
import { EdgeBuffer } from "../src/graph/builder.js";
import { encodeGraph6 } from "../src/graph/formats/graph6.js";
import type { Graph } from "../src/graph/graph.js";
import { cayleyGf2, hypercube } from "../src/families/cayley-gf2.js";
import { andrasfai, circulant, cycle } from "../src/families/circulant.js";
import { completeBipartite } from "../src/families/complete-multipartite.js";
import { generalizedPetersen } from "../src/families/generalized-petersen.js";
import { kneser } from "../src/families/kneser.js";
import { mycielskiChain, mycielskiOf } from "../src/families/mycielski.js";
import { chvatal } from "../src/families/named/chvatal.js";
import { heawood } from "../src/families/named/heawood.js";
import { hoffmanSingleton } from "../src/families/named/hoffman-singleton.js";
import { dodecahedron, petersen } from "../src/families/named/petersen.js";
import { grotzsch } from "../src/families/named/grotzsch.js";
import { normGraph } from "../src/families/norm-graph.js";
import { paley } from "../src/families/paley.js";
import { path } from "../src/families/path.js";
import { polarity } from "../src/families/polarity.js";
import { family } from "../src/families/registry.js";
import { genspecialLines, labelgLines } from "./helpers/nauty.js";
import { describeNeeds, python, tool } from "./helpers/requirements.js";



const NAUTY = [tool("nauty-labelg"), tool("nauty-genspecialg")];

/** Canonical graph6 of each input line (graph6 or sparse6), via nauty-labelg. */
function canonical(lines: string[]): string[] {
  const out = labelgLines(lines);
  expect(out.length).toBe(lines.length);
  return out;
}

/** Pairs [ours, theirs(graph6)] → indices of pairs whose canonical forms differ (empty when all isomorphic). */
function mismatches(pairs: { label: string; ours: Graph; theirs: string }[]): string[] {
  const can = canonical(pairs.flatMap((p) => [encodeGraph6(p.ours), p.theirs]));
  return pairs.filter((_, i) => can[2 * i] !== can[2 * i + 1]).map((p) => p.label);
}

function edgeGraph(n: number, adjacent: (u: number, v: number) => boolean): Graph {
  const buf = new EdgeBuffer();
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) if (adjacent(u, v)) buf.add(u, v);
  return buf.build(n).graph;
}

describeNeeds(NAUTY, "against nauty-genspecialg", () => {
  it("hypercube Q_d equals genspecialg -Q d for d = 1..7", () => {
    const ds = [1, 2, 3, 4, 5, 6, 7];
    const theirs = genspecialLines(ds.map((d) => `-Q${d}`));
    expect(mismatches(ds.map((d, i) => ({ label: `Q${d}`, ours: hypercube(d), theirs: theirs[i] })))).toEqual([]);
  });

  it("generalized Petersen GP(n,k) equals genspecialg -P n,k", () => {
    const cases = [[3, 1], [4, 1], [5, 1], [5, 2], [7, 2], [7, 3], [8, 3], [10, 2], [10, 3], [12, 5], [13, 5], [24, 5]];
    const theirs = genspecialLines(cases.map(([n, k]) => `-P${n},${k}`));
    expect(mismatches(cases.map(([n, k], i) => ({ label: `GP(${n},${k})`, ours: generalizedPetersen(n, k), theirs: theirs[i] })))).toEqual([]);
  });

  it("Petersen graph, KG(5,2) and the dodecahedron equal genspecialg -P5,2 and -P10,2", () => {
    // The Petersen graph is GP(5,2) and KG(5,2); the dodecahedral graph is GP(10,2) (common knowledge, from memory).
    const [p52, p102] = genspecialLines(["-P5,2", "-P10,2"]);
    expect(
      mismatches([
        { label: "petersen", ours: petersen(), theirs: p52 },
        { label: "KG(5,2)", ours: kneser(5, 2), theirs: p52 },
        { label: "dodecahedron", ours: dodecahedron(), theirs: p102 },
      ]),
    ).toEqual([]);
  });

  it("cycles, paths and complete bipartite graphs equal genspecialg -c, -p and -b", () => {
    const pairs: { label: string; ours: Graph; theirs: string }[] = [];
    const cyc = genspecialLines([3, 4, 5, 6, 7, 12, 30].map((n) => `-c${n}`));
    [3, 4, 5, 6, 7, 12, 30].forEach((n, i) => pairs.push({ label: `C${n}`, ours: cycle(n), theirs: cyc[i] }));
    const pth = genspecialLines([1, 2, 3, 4, 9].map((n) => `-p${n}`));
    [1, 2, 3, 4, 9].forEach((n, i) => pairs.push({ label: `P${n}`, ours: path(n), theirs: pth[i] }));
    const bip = [[1, 1], [1, 4], [2, 3], [3, 3], [4, 6]];
    const b = genspecialLines(bip.map(([x, y]) => `-b${x},${y}`));
    bip.forEach(([x, y], i) => pairs.push({ label: `K${x},${y}`, ours: completeBipartite(x, y), theirs: b[i] }));
    expect(mismatches(pairs)).toEqual([]);
  });

  it("circulants (and cayley-zn, Andrásfai graphs) equal genspecialg -C n,s1,s2,…", () => {
    const cases: [number, number[]][] = [[7, [1, 2]], [8, [1, 4]], [10, [1, 5]], [12, [1, 5]], [13, [1, 5]], [13, [1, 3, 4]], [16, [1, 2, 8]], [20, [3, 7, 10]], [11, [1, 10]], [9, [2, 7, 3]]];
    // genspecialg wants connections in 1..n/2: s and n − s give the same edges.
    const folded = (n: number, s: number[]) => [...new Set(s.map((x) => Math.min(x, n - x)))].join(",");
    const theirs = genspecialLines(cases.map(([n, s]) => `-C${n},${folded(n, s)}`));
    const pairs = cases.flatMap(([n, s], i) => [
      { label: `circulant ${n} ${s}`, ours: circulant(n, s), theirs: theirs[i] },
      { label: `cayley-zn ${n} ${s}`, ours: family(`cayley-zn:n=${n},s=${s.join("+")}`), theirs: theirs[i] },
    ]);
    // And(k) is the circulant on 3k−1 vertices with the residues ≡ 1 (mod 3) (Andrásfai 1964).
    const ks = [2, 3, 4, 5, 6];
    const and = genspecialLines(ks.map((k) => `-C${3 * k - 1},${folded(3 * k - 1, Array.from({ length: k }, (_, i) => 3 * i + 1))}`));
    ks.forEach((k, i) => pairs.push({ label: `And(${k})`, ours: andrasfai(k), theirs: and[i] }));
    expect(mismatches(pairs)).toEqual([]);
  });

  it("cayley-gf2 with the unit vectors is the hypercube, and C5 = And(2) = mycielski of K2", () => {
    const [q5, c5] = genspecialLines(["-Q5", "-c5"]);
    expect(
      mismatches([
        { label: "cayley-gf2 units", ours: cayleyGf2(5, [1, 2, 4, 8, 16]), theirs: q5 },
        { label: "And(2)", ours: andrasfai(2), theirs: c5 },
        { label: "mycielski-chain 1", ours: mycielskiChain(1), theirs: c5 },
      ]),
    ).toEqual([]);
  });
});

/** graph6 lines printed by networkx for the given Python expressions (nx imported). */
function networkx(exprs: string[]): string[] {
  const script = [
    "import sys, networkx as nx",
    "for e in sys.stdin.read().split('\\n'):",
    "    if e:",
    "        g = nx.Graph(eval(e))",
    "        g = nx.convert_node_labels_to_integers(g)",
    "        sys.stdout.write(nx.to_graph6_bytes(g, header=False).decode())",
  ].join("\n");
  const r = spawnSync("python3", ["-c", script], { input: exprs.join("\n") + "\n" });
  if (r.status !== 0) throw new Error(`python3 failed: ${r.stderr.toString()}`);
  return r.stdout.toString().trim().split("\n");
}

describeNeeds([...NAUTY, python("networkx")], "against networkx's generators", () => {
  it("named graphs: Petersen, dodecahedron, Heawood, Hoffman–Singleton, Chvátal, Grötzsch; Mycielski of a given graph", () => {
    const cases: [string, Graph, string][] = [
      ["petersen", petersen(), "nx.petersen_graph()"],
      ["dodecahedron", dodecahedron(), "nx.dodecahedral_graph()"],
      ["heawood", heawood(), "nx.heawood_graph()"],
      ["hoffman-singleton", hoffmanSingleton(), "nx.hoffman_singleton_graph()"],
      ["chvatal", chvatal(), "nx.chvatal_graph()"],
      // networkx numbers Mycielski graphs from M_1 = K1, M_2 = K2: M_4 is the Grötzsch graph.
      ["grotzsch", grotzsch(), "nx.mycielski_graph(4)"],
      ["mycielski-chain 3", mycielskiChain(3), "nx.mycielski_graph(5)"],
      ["heawood as PG(2,2) incidence", family("projective-plane:q=2"), "nx.heawood_graph()"],
      // networkx's mycielskian(G, iterations) applies the same construction to a given graph.
      ["mycielski-of C7", family("mycielski-of:of=[cycle:n=7]"), "nx.mycielskian(nx.cycle_graph(7))"],
      ["mycielski-of K2, 2 steps", family("mycielski-of:of=[complete:n=2],steps=2"), "nx.mycielskian(nx.complete_graph(2), 2)"],
      ["mycielskiOf(Petersen)", mycielskiOf(petersen()), "nx.mycielskian(nx.petersen_graph())"],
    ];
    const theirs = networkx(cases.map((c) => c[2]));
    expect(mismatches(cases.map(([label, ours], i) => ({ label, ours, theirs: theirs[i] })))).toEqual([]);
  });

  it("Paley graphs for primes q ≡ 1 (mod 4) equal networkx's paley_graph", () => {
    const qs = [5, 13, 17, 29, 37, 41];
    const theirs = networkx(qs.map((q) => `nx.paley_graph(${q}).to_undirected()`));
    expect(mismatches(qs.map((q, i) => ({ label: `P(${q})`, ours: paley(q), theirs: theirs[i] })))).toEqual([]);
  });

  it("hypercubes and circulants agree with networkx too", () => {
    const theirs = networkx(["nx.hypercube_graph(4)", "nx.circulant_graph(13, [1, 5])", "nx.circulant_graph(12, [2, 6])"]);
    expect(
      mismatches([
        { label: "Q4", ours: hypercube(4), theirs: theirs[0] },
        { label: "C13(1,5)", ours: circulant(13, [1, 5]), theirs: theirs[1] },
        { label: "C12(2,6)", ours: circulant(12, [2, 6]), theirs: theirs[2] },
      ]),
    ).toEqual([]);
  });
});

describeNeeds(NAUTY, "against constructions written here from the definitions", () => {
  it("ER_p for primes p: brute force over pairs of normalised vectors, x·y ≡ 0 (mod p)", () => {
    // Definition of the orthogonal-polarity graph (Erdős–Rényi 1962; Brown 1966), integer arithmetic mod p.
    const pairs = [2, 3, 5, 7, 11].map((p) => {
      const pts: number[][] = [];
      for (let a = 0; a < p; a++) for (let b = 0; b < p; b++) pts.push([1, a, b]);
      for (let b = 0; b < p; b++) pts.push([0, 1, b]);
      pts.push([0, 0, 1]);
      const oracle = edgeGraph(pts.length, (u, v) => (pts[u][0] * pts[v][0] + pts[u][1] * pts[v][1] + pts[u][2] * pts[v][2]) % p === 0);
      return { label: `ER_${p}`, ours: polarity(p), theirs: encodeGraph6(oracle) };
    });
    expect(mismatches(pairs)).toEqual([]);
  });

  it("norm graphs with t = 2 and t = 3 for primes q: N(A+B) = ab computed with integers", () => {
    // t = 2: N is the identity on GF(q): (A,a) ~ (B,b) iff A + B ≡ ab (mod q).
    // t = 3: GF(q²) = GF(q)[i]/(i² − d) for a non-square d, and N(x + yi) = (x+yi)^(q+1) = x² − d·y²
    // (the norm of a quadratic extension; Lidl–Niederreiter, Finite Fields, §2.3).
    const pairs: { label: string; ours: Graph; theirs: string }[] = [];
    for (const q of [3, 5, 7, 11]) {
      const n = q * (q - 1);
      const oracle = edgeGraph(n, (u, v) => {
        const A = Math.floor(u / (q - 1)), a = (u % (q - 1)) + 1, B = Math.floor(v / (q - 1)), b = (v % (q - 1)) + 1;
        return (A + B) % q === (a * b) % q;
      });
      pairs.push({ label: `H(${q},2)`, ours: normGraph(q, 2), theirs: encodeGraph6(oracle) });
    }
    for (const q of [3, 5, 7]) {
      let d = 1;
      const isSquare = (x: number) => Array.from({ length: q }, (_, y) => (y * y) % q).includes(x % q);
      while (isSquare(d)) d++;
      const n = q * q * (q - 1);
      const oracle = edgeGraph(n, (u, v) => {
        const A = Math.floor(u / (q - 1)), a = (u % (q - 1)) + 1, B = Math.floor(v / (q - 1)), b = (v % (q - 1)) + 1;
        const x = (Math.floor(A / q) + Math.floor(B / q)) % q, y = ((A % q) + (B % q)) % q;
        return (((x * x - d * y * y) % q) + q) % q === (a * b) % q;
      });
      pairs.push({ label: `H(${q},3)`, ours: normGraph(q, 3), theirs: encodeGraph6(oracle) });
    }
    expect(mismatches(pairs)).toEqual([]);
  });

  it("Kneser graphs: brute force over k-subsets, adjacent iff disjoint", () => {
    // Definition of KG(n, k) (Lovász 1978).
    const pairs = [[5, 1], [6, 2], [7, 2], [7, 3], [8, 3], [8, 4]].map(([n, k]) => {
      const sets: number[] = [];
      for (let s = 0; s < 1 << n; s++) {
        let c = 0;
        for (let x = s; x; x &= x - 1) c++;
        if (c === k) sets.push(s);
      }
      return { label: `KG(${n},${k})`, ours: kneser(n, k), theirs: encodeGraph6(edgeGraph(sets.length, (u, v) => (sets[u] & sets[v]) === 0)) };
    });
    expect(mismatches(pairs)).toEqual([]);
  });
});
