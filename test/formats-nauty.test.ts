// graph6/sparse6 against nauty itself: counts of what geng emits, byte-identical round trips
// with copyg and genspecialg, edge lists from showg, and larger random graphs through both formats.

import { execFileSync, spawn } from "node:child_process";
import { describe, expect, it } from "vitest";
import { graphFromEdges } from "../src/graph/builder.js";
import type { Graph } from "../src/graph/graph.js";
import {
  decodeGraphSize,
  encodeGraph6,
  encodeGraphSize,
  encodeSparse6,
  parseGraph6,
  parseSparse6,
  readGraphs,
} from "../src/graph/formats/index.js";
import { Rng } from "../src/random/prng.js";
import { edgeStrings, randomGraph as gnp } from "./helpers/graphs.js";


// For each sparse6 line on stdin: networkx's decoding (n, edges) and networkx's own sparse6 of it.
const NX_SPARSE6 = `
import sys, json, networkx as nx
for line in sys.stdin.read().split():
    g = nx.from_sparse6_bytes(line.encode())
    edges = sorted((min(u, v), max(u, v)) for u, v in g.edges())
    s6 = nx.to_sparse6_bytes(g, header=False).decode().strip()
    print(json.dumps({"n": g.number_of_nodes(), "edges": ["%d-%d" % e for e in edges], "s6": s6}))
`;
import { itNeeds, python, tool } from "./helpers/requirements.js";

function run(tool: string, args: string[], input?: string): string {
  return execFileSync(tool, args, { input, maxBuffer: 1 << 30, stdio: ["pipe", "pipe", "ignore"] }).toString("latin1");
}
const lines = (text: string) => text.split("\n").filter((l) => l.length > 0);

/** Count the graphs geng writes, read as a stream through readGraphs. */
async function countGeng(args: string[]): Promise<number> {
  const child = spawn("nauty-geng", ["-q", ...args], { stdio: ["ignore", "pipe", "ignore"] });
  let count = 0;
  for await (const g of readGraphs({ stream: child.stdout, name: "geng" })) {
    expect(g.format).toBe("graph6");
    count++;
    expect(g.position).toBe(count);
  }
  return count;
}

/** Seeded G(n, p), pairs visited column by column (v outer). */
const randomGraph = (n: number, p: number, seed: number): Graph => gnp(n, p, seed, { order: "columns" });

describe("N(n), the size field", () => {
  it("matches the worked examples of nauty's formats.txt", () => {
    // formats.txt examples (from memory): N(30) = 93; N(12345) = 126 66 63 120;
    // N(460175067) = 126 126 63 90 90 90 90 90.
    const codes = (s: string) => Array.from(s, (c) => c.charCodeAt(0));
    expect(codes(encodeGraphSize(30))).toEqual([93]);
    expect(codes(encodeGraphSize(12345))).toEqual([126, 66, 63, 120]);
    expect(codes(encodeGraphSize(460175067))).toEqual([126, 126, 63, 90, 90, 90, 90, 90]);
    // Form boundaries from the definition in formats.txt: 62 | 63, 258047 | 258048, and 2^36 − 1 (all groups 63).
    expect(encodeGraphSize(62).length).toBe(1);
    expect(encodeGraphSize(63).length).toBe(4);
    expect(encodeGraphSize(258047).length).toBe(4);
    expect(encodeGraphSize(258048).length).toBe(8);
    expect(encodeGraphSize(2 ** 36 - 1)).toBe("~~~~~~~~");
    for (const n of [0, 62, 63, 258047, 258048, 2 ** 31, 2 ** 36 - 1]) expect(decodeGraphSize(encodeGraphSize(n))).toBe(n);
    expect(() => encodeGraphSize(2 ** 36)).toThrow(/2\^36/);
  });

  itNeeds([tool("nauty-genspecialg")], "agrees with genspecialg's empty graphs in all three forms", () => {
    // Source: nauty-genspecialg -e (empty graph), sparse6 output ":" N(n) with no edge bits.
    for (const n of [1, 62, 63, 258047, 258048, 300000]) {
      const out = run("nauty-genspecialg", ["-q", "-s", `-e${n}`]).trimEnd();
      expect(out).toBe(":" + encodeGraphSize(n));
    }
  });
});

describe("counting what geng emits, read as a stream", () => {
  itNeeds([tool("nauty-geng")], "all graphs on n = 1..8 vertices (OEIS A000088)", async () => {
    // OEIS A000088: 1, 2, 4, 11, 34, 156, 1044, 12346 for n = 1..8.
    const expected = [1, 2, 4, 11, 34, 156, 1044, 12346];
    for (let n = 1; n <= 8; n++) expect(await countGeng([String(n)])).toBe(expected[n - 1]);
  });

  itNeeds([tool("nauty-geng")], "connected graphs on 7 and 8 vertices (OEIS A001349)", async () => {
    // OEIS A001349: 853 for n = 7, 11117 for n = 8.
    expect(await countGeng(["-c", "7"])).toBe(853);
    expect(await countGeng(["-c", "8"])).toBe(11117);
  });

  itNeeds([tool("nauty-geng")], "triangle-free graphs on 7 and 8 vertices (OEIS A006785)", async () => {
    // OEIS A006785: 107 for n = 7, 410 for n = 8.
    expect(await countGeng(["-t", "7"])).toBe(107);
    expect(await countGeng(["-t", "8"])).toBe(410);
  });
});

describe("round trips with nauty", () => {
  itNeeds([tool("nauty-geng")], "graph6: re-encoding every graph of geng 7 and 8 gives geng's line byte for byte", () => {
    // Source: nauty-geng output lines (graph6).
    for (const n of ["7", "8"]) {
      for (const line of lines(run("nauty-geng", ["-q", n]))) expect(encodeGraph6(parseGraph6(line))).toBe(line);
    }
  });

  itNeeds([tool("nauty-geng"), tool("nauty-copyg")], "sparse6: our encoding equals nauty-copyg -s on every graph of geng 7 and 8", () => {
    // Source: nauty-copyg -s converts graph6 to sparse6; n = 8 = 2^3 exercises the padding special case.
    for (const n of ["7", "8"]) {
      const g6 = run("nauty-geng", ["-q", n]);
      const s6 = lines(run("nauty-copyg", ["-q", "-s"], g6));
      const g6lines = lines(g6);
      expect(s6.length).toBe(g6lines.length);
      g6lines.forEach((line, i) => {
        const g = parseGraph6(line);
        expect(encodeSparse6(g)).toBe(s6[i]);
        expect(edgeStrings(parseSparse6(s6[i]))).toEqual(edgeStrings(g));
      });
    }
  });

  itNeeds([tool("nauty-geng"), tool("nauty-showg")], "parsed edges agree with nauty-showg -e on a sample", () => {
    // Source: nauty-showg -e prints "Graph k, order n." then "n m" then the edge pairs.
    const sample = lines(run("nauty-geng", ["-q", "8"])).filter((_, i) => i % 97 === 0);
    const shown = run("nauty-showg", ["-e"], sample.join("\n") + "\n");
    const blocks = shown.split(/Graph \d+, order \d+\.\n/).slice(1);
    expect(blocks.length).toBe(sample.length);
    blocks.forEach((block, i) => {
      const [head, ...rest] = block.trim().split("\n");
      const [n, m] = head.split(" ").map(Number);
      const nums = rest.join(" ").trim().split(/\s+/).filter(Boolean).map(Number);
      const theirs: string[] = [];
      for (let k = 0; k < nums.length; k += 2) theirs.push(`${Math.min(nums[k], nums[k + 1])}-${Math.max(nums[k], nums[k + 1])}`);
      const g = parseGraph6(sample[i]);
      expect(g.n).toBe(n);
      expect(g.m).toBe(m);
      expect(edgeStrings(g).sort()).toEqual(theirs.sort());
    });
  });

  itNeeds([tool("nauty-copyg")], "larger random graphs (n = 63, 64, 65, 258, 300, 1000) round-trip through both formats and copyg", () => {
    // Source: nauty-copyg -s / -g as the reference encoder of each format (4-byte N(n) from n = 63).
    const cases: [number, number][] = [[63, 0.3], [64, 0.5], [65, 0.1], [258, 0.05], [300, 0.02], [1000, 0.003]];
    cases.forEach(([n, p], t) => {
      const g = randomGraph(n, p, 1000 + t);
      const g6 = encodeGraph6(g);
      const s6 = encodeSparse6(g);
      expect(edgeStrings(parseGraph6(g6))).toEqual(edgeStrings(g));
      expect(edgeStrings(parseSparse6(s6))).toEqual(edgeStrings(g));
      expect(run("nauty-copyg", ["-q", "-s"], g6 + "\n").trimEnd()).toBe(s6);
      expect(run("nauty-copyg", ["-q", "-g"], s6 + "\n").trimEnd()).toBe(g6);
    });
  });

  itNeeds([python("networkx")], "sparse6 with the 8-byte N(n) form (n = 258048) agrees with networkx both ways", () => {
    // Source: networkx from_sparse6_bytes / to_sparse6_bytes (python3-networkx), an independent
    // implementation of formats.txt. (nauty-copyg needs a dense matrix, far too slow at this n.)
    const ours: Graph[] = [];
    for (const [n, seed] of [[258048, 7]]) {
      const rng = new Rng(seed);
      const seen = new Set<string>();
      const edges: [number, number][] = [];
      while (edges.length < 2000) {
        const u = rng.nextInt(n), v = rng.nextInt(n);
        const key = `${Math.min(u, v)},${Math.max(u, v)}`;
        if (u === v || seen.has(key)) continue;
        seen.add(key);
        edges.push([u, v]);
      }
      ours.push(graphFromEdges(n, edges));
    }
    const s6 = ours.map((g) => encodeSparse6(g));
    for (const line of s6) expect(line.slice(1, 3)).toBe("~~");
    const theirs = lines(run("python3", ["-c", NX_SPARSE6], s6.join("\n") + "\n")).map((l) => JSON.parse(l));
    expect(theirs.length).toBe(1);
    theirs.forEach((t: { n: number; edges: string[]; s6: string }, i) => {
      expect(t.n).toBe(ours[i].n);
      expect([...t.edges].sort()).toEqual(edgeStrings(ours[i]).sort());
      expect(edgeStrings(parseSparse6(t.s6))).toEqual(edgeStrings(ours[i]));
      expect(edgeStrings(parseSparse6(s6[i]))).toEqual(edgeStrings(ours[i]));
    });
  });

  itNeeds([python("networkx")], "networkx's sparse6 (its own padding choice) decodes to the same graphs, n = 2^k included", () => {
    // Source: networkx to_sparse6_bytes pads with a leading 0 when n = 2^k (formats.txt rule, its variant).
    const ours = [[16, 0.3, 1], [32, 0.2, 2], [64, 0.1, 3], [64, 0.9, 4], [128, 0.05, 5], [2, 1, 6], [4, 0.7, 7]].map(([n, p, s]) => randomGraph(n, p, s));
    const theirs = lines(run("python3", ["-c", NX_SPARSE6], ours.map((g) => encodeSparse6(g)).join("\n") + "\n")).map((l) => JSON.parse(l));
    theirs.forEach((t: { n: number; edges: string[]; s6: string }, i) => {
      expect([...t.edges].sort()).toEqual(edgeStrings(ours[i]).sort());
      const back = parseSparse6(t.s6);
      expect(back.n).toBe(ours[i].n);
      expect(edgeStrings(back)).toEqual(edgeStrings(ours[i]));
    });
  });

  itNeeds([tool("nauty-genspecialg")], "genspecialg's cycles, paths, cubes and complete graphs decode and re-encode exactly", () => {
    // Source: nauty-genspecialg; structure from the definitions (C_n: n edges, 2-regular;
    // P_n: n−1 edges; Q_d: 2^d vertices, d-regular; K_n: n(n−1)/2 edges).
    const cases: [string[], number, number, number][] = [
      [["-s", "-c300"], 300, 300, 2],
      [["-s", "-c258048"], 258048, 258048, 2], // 8-byte N(n)
      [["-g", "-c70"], 70, 70, 2],
      [["-s", "-Q6"], 64, 192, 6],
      [["-g", "-Q6"], 64, 192, 6],
      [["-s", "-k32"], 32, 496, 31],
      [["-g", "-k9"], 9, 36, 8],
    ];
    for (const [args, n, m, d] of cases) {
      const out = run("nauty-genspecialg", ["-q", ...args]).trimEnd();
      const g = args[0] === "-s" ? parseSparse6(out) : parseGraph6(out);
      expect([g.n, g.m]).toEqual([n, m]);
      let regular = true;
      for (let v = 0; v < n; v++) if (g.degree(v) !== d) regular = false;
      expect(regular).toBe(true);
      expect(args[0] === "-s" ? encodeSparse6(g) : encodeGraph6(g)).toBe(out);
    }
    const path = parseSparse6(run("nauty-genspecialg", ["-q", "-s", "-p64"]).trimEnd());
    expect([path.n, path.m]).toEqual([64, 63]);
  });
});
