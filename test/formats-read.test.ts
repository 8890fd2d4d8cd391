// Format detection and the streaming reader: which format a name and content select, that
// ambiguous input is refused, and that streams are read lazily and identically whatever the
// chunking, with each graph's index and line recorded.

import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { PassThrough, Readable } from "node:stream";
import { afterAll, describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import type { Graph } from "../src/graph/graph.js";
import {
  detectFormat,
  encodeSparse6,
  formatFromExtension,
  parseGraph6,
  readGraphFile,
  readGraphs,
  writeDimacs,
  writeEdgeList,
  writeGset,
  type LoadedGraph,
  type ReadOptions,
} from "../src/graph/formats/index.js";
import { itNeeds, tool } from "./helpers/requirements.js";

const tmp = mkdtempSync(join(tmpdir(), "halfplus-formats-read-"));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

const edgesOf = (g: Graph) => {
  const { us, vs } = g.edgeArrays();
  return Array.from(us, (u, i) => `${u}-${vs[i]}`).join(" ");
};

async function collect(input: Parameters<typeof readGraphs>[0], options: ReadOptions = {}): Promise<LoadedGraph[]> {
  const out: LoadedGraph[] = [];
  for await (const g of readGraphs(input, options)) out.push(g);
  return out;
}

/** A stream that delivers `text` in pieces of `size` bytes. */
function chunked(text: string, size: number): Readable {
  const buf = Buffer.from(text, "latin1");
  const parts: Buffer[] = [];
  for (let i = 0; i < buf.length; i += size) parts.push(buf.subarray(i, i + size));
  return Readable.from(parts);
}

describe("detectFormat", () => {
  // The rule is the one documented in src/graph/formats/detect.ts (our own; common practice, no source).
  it("a known extension decides", () => {
    const cases: [string, string][] = [
      ["a.g6", "graph6"], ["dir.x/a.G6", "graph6"], ["a.graph6", "graph6"], ["a.s6", "sparse6"], ["a.sparse6", "sparse6"],
      ["a.edges", "edgelist"], ["a.el", "edgelist"], ["a.edgelist", "edgelist"], ["a.dimacs", "dimacs"], ["a.col", "dimacs"],
      ["a.clq", "dimacs"], ["a.gset", "gset"],
    ];
    for (const [name, f] of cases) expect(detectFormat(name, "whatever")).toBe(f);
    for (const name of ["a.txt", "stdin", "graphs", ".g6", "a.g6.txt"]) expect(formatFromExtension(name)).toBeUndefined();
  });

  it("otherwise the first non-blank line decides", () => {
    const cases: [string, string][] = [
      [">>graph6<<DQc\n", "graph6"],
      [">>sparse6<<:Fa@x^\n", "sparse6"],
      ["\n\nDQc\nDQc\n", "graph6"],
      [":Fa@x^\n", "sparse6"],
      ["# comment\n0 1\n", "edgelist"],
      ["% comment\n1 2\n", "edgelist"],
      ["c comment\np edge 2 1\ne 1 2\n", "dimacs"],
      ["p edge 2 1\ne 1 2\n", "dimacs"],
      ["0 1\n1 2\n", "edgelist"],
      ["0 1 2.5\n", "edgelist"],
      ["3 2\n1 2 1\n2 3 1\n", "gset"],
      ["3 2\r\n1 2 1\r\n", "gset"],
      ["3 2\n\n1 2 -1\n", "gset"],
    ];
    for (const [head, f] of cases) expect(detectFormat("data.txt", head)).toBe(f);
  });

  it("ambiguous or unknown content is an error asking for a format, never a guess", () => {
    // Input validation, common practice, no source.
    // "5 0" alone: a gset header of 5 isolated vertices, or a one-edge edge list {0, 5}.
    expect(() => detectFormat("x.txt", "5 0\n")).toThrow(/x\.txt: a single line "a b" could be a gset header/);
    expect(() => detectFormat("x.txt", "5 0\n1 2 3 4\n")).toThrow(/cannot tell the format: line 1 has 2 columns and line 2 has 4/);
    expect(() => detectFormat("x.txt", "hello world\n")).toThrow(/cannot tell the graph format from the first line "hello world"/);
    expect(() => detectFormat("x.txt", "&DI?AO?\n")).toThrow(/digraph6 is not supported/);
    expect(() => detectFormat("x.txt", "  \n")).toThrow(/empty input/);
  });

  itNeeds([tool("nauty-geng"), tool("nauty-copyg")], "detects what nauty writes", () => {
    // Source: nauty-geng (graph6) and nauty-copyg -s (sparse6) output.
    const g6 = execFileSync("nauty-geng", ["-q", "5"]).toString();
    expect(detectFormat("stdin", g6)).toBe("graph6");
    expect(detectFormat("stdin", execFileSync("nauty-copyg", ["-q", "-s"], { input: g6 }).toString())).toBe("sparse6");
  });
});

describe("readGraphs", () => {
  itNeeds([tool("nauty-geng")], "gives the same graphs, positions and lines however the stream is chunked", async () => {
    // Source: nauty-geng 6 writes the 156 graphs on 6 vertices (OEIS A000088), one per line.
    const text = execFileSync("nauty-geng", ["-q", "6"]).toString("latin1");
    const lines = text.trim().split("\n");
    for (const size of [1, 3, 7, 1 << 16]) {
      const got = await collect({ stream: chunked(text, size), name: "geng" });
      expect(got.length).toBe(156);
      got.forEach((g, i) => {
        expect([g.position, g.line, g.file, g.format]).toEqual([i + 1, i + 1, "geng", "graph6"]);
        expect(edgesOf(g.graph)).toBe(edgesOf(parseGraph6(lines[i])));
      });
    }
  });

  it("reads lazily: the first graph arrives before the stream ends", async () => {
    // Requirement of the task (a pipe of many graphs must not accumulate); common practice, no source.
    const pipe = new PassThrough();
    const it = readGraphs({ stream: pipe, name: "pipe" }, { format: "graph6" })[Symbol.asyncIterator]();
    pipe.write("DQc\nD?");
    const first = await it.next();
    expect(first.done).toBe(false);
    expect((first.value as LoadedGraph).graph.m).toBe(4);
    pipe.write("?\n");
    const second = await it.next();
    expect((second.value as LoadedGraph).graph.m).toBe(0);
    pipe.end();
    expect((await it.next()).done).toBe(true);
  });

  it("handles headers, blank lines, CRLF, a missing final newline and mixed graph6/sparse6 lines", async () => {
    // formats.txt: optional >>graph6<< / >>sparse6<< headers; nauty's tools read graph6 and sparse6 lines mixed.
    const text = ">>graph6<<DQc\r\n\r\n:Fa@x^\r\n>>sparse6<<\n>>sparse6<<:Fa@x^\nDQc";
    const got = await collect({ stream: chunked(text, 5), name: "mixed" });
    expect(got.map((g) => [g.position, g.line, g.format, g.graph.m])).toEqual([
      [1, 1, "graph6", 4],
      [2, 3, "sparse6", 4],
      [3, 5, "sparse6", 4],
      [4, 6, "graph6", 4],
    ]);
  });

  it("reads whole-file formats from files and streams, with detection, extension and explicit format", async () => {
    const g = parseGraph6("DQc");
    const files: [string, string, string][] = [
      ["g.edges", writeEdgeList(g), "edgelist"],
      ["g.txt", writeGset(g), "gset"],
      ["g.col", writeDimacs(g), "dimacs"],
      ["g", writeDimacs(g), "dimacs"],
      ["g2.txt", encodeSparse6(g) + "\n", "sparse6"],
    ];
    for (const [name, text, format] of files) {
      const path = join(tmp, name);
      writeFileSync(path, text);
      const loaded = await readGraphFile(path);
      expect([loaded.format, loaded.position, loaded.line, loaded.file]).toEqual([format, 1, 1, path]);
      expect(edgesOf(loaded.graph)).toBe(edgesOf(g));
      const viaStream = await collect({ stream: chunked(text, 4), name: "stdin" });
      expect(viaStream.map((x) => [x.format, edgesOf(x.graph)])).toEqual([[format, edgesOf(g)]]);
    }
    // An explicit format settles what content alone cannot.
    const amb = join(tmp, "amb.txt");
    writeFileSync(amb, "5 0\n");
    await expect(readGraphFile(amb)).rejects.toThrow(InputError);
    const asGset = await readGraphFile(amb, { format: "gset" });
    expect([asGset.graph.n, asGset.graph.m]).toEqual([5, 0]);
    const asList = await readGraphFile(amb, { format: "edgelist" });
    expect([asList.graph.n, asList.graph.m]).toEqual([6, 1]);
    const oneBased = await readGraphFile(amb, { format: "edgelist", base: 1 }).catch((e: Error) => e);
    expect((oneBased as Error).message).toMatch(/amb\.txt:1: vertex id 0 in a 1-based edge list/);
  });

  it("an empty stream holds no graphs; the build report travels with each graph", async () => {
    // Record plumbing, common practice, no source.
    expect(await collect({ stream: chunked("", 1), name: "stdin" })).toEqual([]);
    expect(await collect({ stream: chunked("\n\n", 1), name: "stdin" })).toEqual([]);
    const got = await collect({ stream: chunked("0 1\n1 0\n2 2\n", 2), name: "stdin" }, { build: { duplicates: "merge", loops: "drop" } });
    expect(got[0].report).toEqual({ mergedDuplicates: 1, droppedLoops: 1 });
    expect([got[0].graph.n, got[0].graph.m]).toEqual([3, 1]);
  });

  it("stops cleanly when the consumer stops early", async () => {
    // Record plumbing, common practice, no source.
    const path = join(tmp, "many.g6");
    writeFileSync(path, "DQc\n".repeat(10000));
    let seen = 0;
    for await (const g of readGraphs({ path })) {
      seen++;
      if (g.position === 3) break;
    }
    expect(seen).toBe(3);
  });
});
