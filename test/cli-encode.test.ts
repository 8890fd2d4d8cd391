// `halfplus encode`: any source written as graph6, sparse6 or an edge list, composing in pipes with
// nauty's tools and with `halfplus cut -`; checked against nauty's own generators and counters.
import { spawnSync } from "node:child_process";
import { beforeAll, describe, expect, it } from "vitest";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { genspecialLines, labelgLines } from "./helpers/nauty.js";
import { describeNeeds, itNeeds, tool } from "./helpers/requirements.js";

beforeAll(ensureBuilt);

const lines = (text: string): string[] => text.split("\n").filter((l) => l !== "");

describeNeeds([tool("nauty-labelg"), tool("nauty-genspecialg")], "halfplus encode against nauty", () => {
  it("family specs come out as the graphs nauty-genspecialg builds (same canonical form)", () => {
    // Outside source: nauty-genspecialg -P7,2 (generalized Petersen GP(7,2)) and -Q4 (hypercube Q4),
    // compared by nauty-labelg canonical labelling.
    for (const [spec, as, sw] of [
      ["generalized-petersen:n=7,k=2", "graph6", "-P7,2"],
      ["hypercube:dim=4", "sparse6", "-Q4"],
    ] as const) {
      const r = halfplus(["encode", spec, "--as", as]);
      expect(r.code, spec).toBe(0);
      expect(r.stdout.startsWith(as === "sparse6" ? ":" : "")).toBe(true);
      expect(labelgLines(lines(r.stdout))).toEqual(labelgLines(genspecialLines([sw])));
    }
  });

  itNeeds([tool("nauty-geng"), tool("nauty-countg")], "a graph6 stream passes through as sparse6, graph for graph, and nauty-countg counts it", () => {
    // nauty-geng -c 5 emits the 21 connected graphs on 5 vertices (OEIS A001349).
    const g6 = spawnSync("nauty-geng", ["-cq", "5"]).stdout.toString();
    const r = halfplus(["encode", "-", "--as", "sparse6"], g6);
    expect(r.code).toBe(0);
    const out = lines(r.stdout);
    expect(out).toHaveLength(21);
    expect(out.every((l) => l.startsWith(":"))).toBe(true);
    expect(labelgLines(out)).toEqual(labelgLines(lines(g6)));
    const counted = spawnSync("nauty-countg", ["-q"], { input: r.stdout }).stdout.toString();
    expect(counted).toMatch(/\b21 graphs\b/);
  });
});

describe("halfplus encode", () => {
  it("feeds halfplus cut through a pipe: the bracket of the encoded graph is the bracket of the spec", () => {
    // Oracle: the graph hash of the record made from the spec itself (same graph, same hash).
    const enc = halfplus(["encode", "gnp:n=24,p=0.3", "--graph-seed", "4"]);
    expect(enc.code).toBe(0);
    const viaPipe = JSON.parse(halfplus(["cut", "-", "--json", "--seconds", "1"], enc.stdout).stdout);
    const direct = JSON.parse(halfplus(["cut", "gnp:n=24,p=0.3,seed=4", "--json", "--seconds", "1"]).stdout);
    expect(viaPipe.graphHash).toBe(direct.graphHash);
    expect(viaPipe.lower).toBe(direct.lower);
  });

  it("writes an edge list that reads back as the same graph, and refuses what a format cannot hold", () => {
    // Petersen as KG(5,2): 10 vertices, 15 edges (common knowledge).
    const el = halfplus(["encode", "kneser:n=5,k=2", "--as", "edgelist"]);
    expect(el.code).toBe(0);
    expect(el.stdout).toMatch(/^# edgelist n=10 m=15 base=0\n/);
    const back = JSON.parse(halfplus(["graph", "-", "--json", "--format", "edgelist"], el.stdout).stdout);
    expect([back.n, back.m, back.girth]).toEqual([10, 15, 5]);
    for (const [args, input, re] of [
      [["encode", "-", "--as", "edgelist"], "DQc\nDQc\n", /holds one graph per file/],
      [["encode", "-", "--as", "graph6", "--format", "edgelist"], "0 1 2.5\n1 2 1\n", /graph6 cannot store edge weights/],
      [["encode", "petersen", "--as", "xml"], undefined, /--as must be one of/],
    ] as const) {
      const r = halfplus([...args], input);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.stderr.trim().split("\n")).toHaveLength(1);
      expect(r.stderr).toMatch(re);
    }
  });
});
