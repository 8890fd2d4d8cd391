// The text formats (edge list, gset, DIMACS) against outside readers and writers: the Max-Cut
// benchmark files in ../shared/reference, networkx's edge lists, nauty's DIMACS converter, and
// ECMAScript's own decimal conversion for weights.

import { execFileSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import {
  parseDimacs,
  parseEdgeList,
  parseGraph6,
  parseGset,
  parseSparse6,
  readGraphFile,
  writeDimacs,
  writeEdgeList,
  writeGset,
} from "../src/graph/formats/index.js";
import { Rng } from "../src/random/prng.js";
import { edgeStrings, randomGraph as gnp } from "./helpers/graphs.js";

const GSET = join(REFERENCE, "gset");

const tmp = mkdtempSync(join(tmpdir(), "halfplus-formats-text-"));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

/** Seeded G(n, p), pairs visited column by column (v outer). */
const randomGraph = (n: number, p: number, seed: number): Graph => gnp(n, p, seed, { order: "columns" });

/** A deliberately simple reader of `n m` / `u v w` files, independent of the byte scanner. */
function splitReadGset(text: string) {
  const rows = text.split(/\r?\n/).filter((l) => l.trim() !== "").map((l) => l.trim().split(/\s+/));
  const [n, m] = rows[0].map(Number);
  const edges = rows.slice(1).map((r) => [Number(r[0]), Number(r[1]), Number(r[2])] as const);
  return { n, m, edges, total: edges.reduce((s, e) => s + e[2], 0) };
}

describe("the Max-Cut benchmark files (../shared/reference/gset)", () => {
  itNeeds([file(GSET, "the benchmark graphs in ../shared/reference/gset")], "G22: n = 2000, m = 19990 and the weight total of the file's third column", async () => {
    // Source: the G22 file itself (first line "2000 19990"), read here by a split-based reader.
    const path = join(GSET, "G22.txt");
    const ref = splitReadGset(readFileSync(path, "utf8"));
    const { graph, format } = await readGraphFile(path);
    expect(format).toBe("gset");
    expect(graph.n).toBe(2000);
    expect(graph.m).toBe(19990);
    expect(ref.n).toBe(2000);
    expect(ref.edges.length).toBe(19990);
    expect(graph.totalWeight).toBe(ref.total);
  });

  itNeeds([file(GSET, "the benchmark graphs in ../shared/reference/gset")], "every G*.txt file: each edge and weight as the split reader sees it (CRLF and ±1 weights included)", async () => {
    // Source: the reference files; G11 has weights ±1 (README), others weight 1.
    const files = readdirSync(GSET).filter((f) => /^G\d+\.txt$/.test(f));
    expect(files.length).toBeGreaterThan(0);
    for (const f of files) {
      const text = readFileSync(join(GSET, f), "utf8");
      const ref = splitReadGset(text);
      const { graph } = await readGraphFile(join(GSET, f));
      expect([graph.n, graph.m]).toEqual([ref.n, ref.m]);
      expect(graph.totalWeight).toBe(ref.total);
      let mismatches = 0;
      for (const [u, v, w] of ref.edges) if (graph.edgeWeight(u - 1, v - 1) !== w) mismatches++;
      expect(mismatches).toBe(0);
      expect(graph.weighted).toBe(ref.edges.some((e) => e[2] !== 1));
      // Writing back gives the file's own edge lines (as a set; the file's order is its own).
      const back = writeGset(graph).trim().split("\n");
      expect(back[0]).toBe(`${ref.n} ${ref.m}`);
      const own = text.split(/\r?\n/).slice(1).map((l) => l.trim().split(/\s+/).join(" ")).filter(Boolean);
      expect(new Set(back.slice(1))).toEqual(new Set(own.map((l) => {
        const [u, v, w] = l.split(" ").map(Number);
        return `${Math.min(u, v)} ${Math.max(u, v)} ${w}`;
      })));
    }
  });
});

// networkx writes edge lists (with a weight column) and graph6 for the same random graphs.
const NX_EDGELISTS = `
import sys, json, random, networkx as nx
out = []
for seed in range(6):
    rnd = random.Random(seed)
    n = 30 + 7 * seed
    g = nx.gnp_random_graph(n, 0.15, seed=seed)
    g.add_edge(0, n - 1)  # so the largest id is n - 1
    for u, v in g.edges():
        k = rnd.randrange(3)
        g[u][v]["weight"] = rnd.randint(-5, 5) if k == 0 else (round(rnd.uniform(-9, 9), 3) if k == 1 else rnd.uniform(-1e3, 1e3))
    base = seed % 2
    h = nx.relabel_nodes(g, {v: v + base for v in g})
    text = "# written by networkx\\n" + "\\n".join(nx.generate_edgelist(h, data=["weight"])) + "\\n"
    weights = {"%d-%d" % (min(u, v), max(u, v)): d["weight"] for u, v, d in g.edges(data=True)}
    out.append({"base": base, "text": text, "g6": nx.to_graph6_bytes(g, header=False).decode().strip(), "weights": weights})
print(json.dumps(out))
`;
import { file, itNeeds, python, tool, REFERENCE } from "./helpers/requirements.js";

describe("edge lists", () => {
  itNeeds([python("networkx")], "read networkx's weighted edge lists (0- and 1-based) as the same graphs and exact weights", () => {
    // Source: networkx generate_edgelist(data=["weight"]) and to_graph6_bytes (python3-networkx);
    // weights are Python reprs, which round-trip doubles exactly.
    const cases = JSON.parse(execFileSync("python3", ["-c", NX_EDGELISTS]).toString()) as {
      base: 0 | 1;
      text: string;
      g6: string;
      weights: Record<string, number>;
    }[];
    expect(cases.length).toBe(6);
    for (const c of cases) {
      const { graph } = parseEdgeList(c.text, { base: c.base, file: "nx.edges" });
      const plain = parseGraph6(c.g6);
      expect(graph.n).toBe(plain.n);
      expect(edgeStrings(graph)).toEqual(edgeStrings(plain));
      let wrong = 0;
      graph.forEachEdge((u, v, w) => {
        if (c.weights[`${u}-${v}`] !== w) wrong++;
      });
      expect(wrong).toBe(0);
    }
  });

  it("follow the documented numbering rule: header, base option, comments, n from the largest id", () => {
    // Rules from src/graph/formats/edgelist.ts (our own format choices; common practice, no source).
    const a = parseEdgeList("# a comment\n0 1\n\n% another\n1 2  # trailing comment\n2 3\n").graph;
    expect([a.n, a.m]).toEqual([4, 3]);
    const b = parseEdgeList("1 2\n2 3\n", { base: 1 }).graph;
    expect([b.n, edgeStrings(b)]).toEqual([3, ["0-1", "1-2"]]);
    const c = parseEdgeList("# edgelist n=10 m=2 base=1\n1 2\n2 3\n").graph;
    expect([c.n, edgeStrings(c)]).toEqual([10, ["0-1", "1-2"]]);
    const d = parseEdgeList("0 1 1\n1 2 1.0\n").graph;
    expect(d.weighted).toBe(false); // a weight column of all ones is the unweighted graph
    const e = parseEdgeList("0 1 2\n1 2 -0.5\n").graph;
    expect([e.edgeWeight(0, 1), e.edgeWeight(1, 2), e.totalWeight]).toEqual([2, -0.5, 1.5]);
    expect(parseEdgeList("").graph.n).toBe(0);
    expect(parseEdgeList("0 1\r\n1 2\r\n").graph.m).toBe(2);
  });

  it("round-trip through writeEdgeList, isolated vertices and weights included", () => {
    // Oracle: the graph itself (common practice, no source).
    const g = graphFromEdges(9, [[0, 3, 0.1], [3, 5, -2], [1, 2, 1e-12], [2, 5, 123456789.125]]);
    for (const base of [0, 1] as const) {
      const back = parseEdgeList(writeEdgeList(g, { base })).graph;
      expect(back.n).toBe(9);
      expect(edgeStrings(back)).toEqual(edgeStrings(g));
      expect(Array.from(back.weights!)).toEqual(Array.from(g.weights!));
    }
    const h = randomGraph(50, 0.1, 3);
    expect(edgeStrings(parseEdgeList(writeEdgeList(h)).graph)).toEqual(edgeStrings(h));
  });

  it("read decimal weights exactly as ECMAScript Number() does", () => {
    // Source: ECMAScript's StringToNumber, which is correctly rounded; random decimals of every length.
    const rng = new Rng(11);
    const texts: string[] = [];
    for (let i = 0; i < 3000; i++) {
      const digits = 1 + rng.nextInt(25);
      let s = rng.nextInt(2) ? "-" : "";
      for (let k = 0; k < digits; k++) s += String(rng.nextInt(10));
      const point = rng.nextInt(digits + 1);
      if (point < digits && rng.nextInt(3) > 0) s = s.slice(0, s.length - point) + "." + s.slice(s.length - point);
      if (rng.nextInt(4) === 0) s += `e${rng.nextInt(2) ? "-" : ""}${rng.nextInt(40)}`;
      texts.push(s);
    }
    texts.push("1e-320", "2.2250738585072011e-308", "9007199254740993", "0.1", "1e22", "1e23", "+3.5", ".5", "5.");
    const text = texts.map((t, i) => `${i} ${i + 1} ${t}`).join("\n");
    const { graph } = parseEdgeList(text);
    let wrong = 0;
    texts.forEach((t, i) => {
      if (!Object.is(graph.edgeWeight(i, i + 1), Number(t))) wrong++;
    });
    expect(wrong).toBe(0);
  });
});

describe("gset", () => {
  it("parses the format and round-trips through writeGset", () => {
    // Format as described in ../shared/reference/gset/README.md: "n m", then m lines "u v w", 1-based.
    const r = parseGset("4 3\n1 2 1\n2 3 -1\n4 1 2.5\n");
    expect(r.graph.n).toBe(4);
    expect(edgeStrings(r.graph)).toEqual(["0-1", "0-3", "1-2"]);
    expect(r.graph.edgeWeight(0, 3)).toBe(2.5);
    const g = randomGraph(40, 0.2, 5);
    const back = parseGset(writeGset(g)).graph;
    expect(back.weighted).toBe(false);
    expect(edgeStrings(back)).toEqual(edgeStrings(g));
    expect(parseGset("5 0\n").graph.n).toBe(5);
  });
});

describe("DIMACS", () => {
  itNeeds([tool("nauty-dimacs2g")], "reads what nauty-dimacs2g reads, and nauty reads what we write", () => {
    // Source: nauty-dimacs2g converts DIMACS edge files to sparse6.
    const files: [string, string][] = [
      ["hand.dimacs", "c a comment\nc another\np edge 6 5\ne 1 2\ne 2 3\nc mid-file comment\ne 6 1\ne 4 5\ne 3 6\n"],
      ...[0, 1, 2].map((s): [string, string] => [`rand${s}.dimacs`, writeDimacs(randomGraph(20 + 30 * s, 0.1, 20 + s))]),
    ];
    for (const [name, text] of files) {
      const path = join(tmp, name);
      writeFileSync(path, text);
      const s6 = execFileSync("nauty-dimacs2g", ["-c", path], { stdio: ["ignore", "pipe", "ignore"] }).toString().trim();
      const theirs = parseSparse6(s6);
      const ours = parseDimacs(text, { file: name }).graph;
      expect(ours.n).toBe(theirs.n);
      expect(edgeStrings(ours)).toEqual(edgeStrings(theirs));
    }
  });

  it("accepts `p col`, comments anywhere and blank lines", () => {
    // DIMACS colouring format ("p col n m" as used by the colouring benchmarks; from memory).
    const g = parseDimacs("c x\np col 4 2\nc mid\ne 1 2\n\ne 4 3\n").graph;
    expect([g.n, edgeStrings(g)]).toEqual([4, ["0-1", "2-3"]]);
    expect(() => writeDimacs(graphFromEdges(2, [[0, 1, 3]]))).toThrow(/weights/);
  });
});
