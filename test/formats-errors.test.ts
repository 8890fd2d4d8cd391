// Bad input in every format is an InputError whose one-line message names the file and line:
// truncated or corrupt graph6/sparse6, bad tokens, counts that disagree with a header,
// duplicate edges and self-loops. Nothing is silently repaired or dropped.

import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { spawnSync } from "node:child_process";
import { afterAll, describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import { graphFromEdges } from "../src/graph/builder.js";
import {
  encodeGraph6,
  encodeSparse6,
  parseDimacs,
  parseEdgeList,
  parseGraph6,
  parseGset,
  parseSparse6,
  readGraphFile,
  readGraphs,
  writeGraph,
  type ReadOptions,
} from "../src/graph/formats/index.js";
import { itNeeds, tool } from "./helpers/requirements.js";

const tmp = mkdtempSync(join(tmpdir(), "halfplus-formats-errors-"));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

/** Write `text` to a temp file, read it through readGraphs, and return the error (or fail). */
async function errorOf(name: string, text: string, options: ReadOptions = {}): Promise<InputError> {
  const path = join(tmp, name);
  writeFileSync(path, text);
  try {
    for await (const _ of readGraphs({ path }, options)) void _;
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    const msg = (e as Error).message;
    expect(msg).not.toContain("\n");
    return e as InputError;
  }
  throw new Error(`${name}: expected an InputError`);
}

const at = (name: string, line: number) => join(tmp, name) + `:${line}: `;

describe("graph6 and sparse6 lines", () => {
  // DQc is formats.txt's graph6 example (5 vertices, edges 0-2 0-4 1-3 3-4; from memory);
  // each check below breaks one rule of formats.txt's graph6/sparse6 definitions.
  it("a truncated graph6 line is an error naming file and line, not a smaller graph", async () => {
    // Input validation, common practice, no source.
    const e = await errorOf("trunc.g6", "DQc\nDQ\nDQc\n");
    expect(e.message.startsWith(at("trunc.g6", 2))).toBe(true);
    expect(e.message).toMatch(/truncated graph6 line: n = 5 needs 2 data characters/);
    // Only the size field of a long form: cut inside N(n).
    expect((await errorOf("trunc2.g6", "~?@\n")).message).toMatch(/trunc2\.g6:1: truncated graph6 line: the size field/);
    // A 70-vertex graph6 line with its last character missing.
    const g = graphFromEdges(70, [[0, 69], [3, 4]]);
    const line = encodeGraph6(g);
    expect((await errorOf("trunc3.g6", `${line}\n${line.slice(0, -1)}\n`)).message).toMatch(/trunc3\.g6:2: truncated graph6 line: n = 70/);
  });

  it("bad characters, a wrong length and non-zero padding are errors", async () => {
    expect((await errorOf("bad.g6", "DQc\nD Qc\n")).message).toMatch(/bad\.g6:2: invalid graph6 character " " at column 2/);
    expect((await errorOf("bad2.g6", "DQ\x01c\n")).message).toMatch(/bad2\.g6:1: invalid graph6 character byte 0x01 at column 3/);
    expect((await errorOf("long.g6", "DQcc\n")).message).toMatch(/long\.g6:1: graph6 line too long/);
    // 'd' = 'c' + 1: sets the last of the 2 padding bits of n = 5 (10 bits in 12).
    expect((await errorOf("pad.g6", "DQd\n")).message).toMatch(/pad\.g6:1: corrupt graph6 line: the padding bits/);
    expect(() => parseGraph6("DQé", { file: "s", line: 4 })).toThrow(/^s:4: invalid graph6 character/);
  });

  it("sparse6 garbage, truncation and refused variants are errors", async () => {
    // :Fa@x^ is formats.txt's sparse6 example (n = 7, edges 0-1 0-2 1-2 5-6; from memory).
    expect(parseSparse6(":Fa@x^").m).toBe(4);
    expect((await errorOf("g.s6", ":Fa@x^\n:Fa@x~~~\n")).message).toMatch(/g\.s6:2: corrupt sparse6 line: vertex number out of range/);
    expect((await errorOf("t.s6", ":Fa@x\n")).message).toMatch(/t\.s6:1: truncated or corrupt sparse6 line/);
    expect((await errorOf("p.s6", ":Fa@x^\n:Fa@x_\n")).message).toMatch(/p\.s6:2: /);
    expect((await errorOf("z.s6", ":\n")).message).toMatch(/z\.s6:1: truncated sparse6 line: the size field/);
    expect((await errorOf("i.s6", ";Fa@x^\n")).message).toMatch(/i\.s6:1: incremental sparse6 .* not supported/);
    expect((await errorOf("d.g6", "&DI?AO?\n")).message).toMatch(/d\.g6:1: digraph6 .* not supported/);
    expect((await errorOf("h.g6", ">>graph6<<:Fa@x^\n")).message).toMatch(/h\.g6:1: a sparse6 line follows a >>graph6<< header/);
  });

  // n = 2 (k = 1), bits 00 10 00 11 | 11: the pair (0,0) is the loop {0,0}; (1,0) and (0,0)
  // are the edge {0,1} twice; then 1-padding (formats.txt decoding rule, worked by hand).
  const MULTI = ":AGN";

  it("sparse6 loops and repeated edges follow the build policy: errors by default, with a count when allowed", () => {
    expect(() => parseSparse6(MULTI, { file: "m.s6", line: 9 })).toThrow(/^m\.s6:9: sparse6 edge 1: self-loop at vertex 0$/);
    expect(() => parseSparse6(MULTI, { file: "m.s6", line: 9 }, { loops: "drop" })).toThrow(/^m\.s6:9: sparse6 edge 3: duplicate edge \{0, 1\}$/);
    const g = parseSparse6(MULTI, {}, { loops: "drop", duplicates: "merge" });
    expect([g.n, g.m]).toEqual([2, 1]);
  });

  itNeeds([tool("nauty-showg")], "nauty decodes the hand-made multigraph line to the same loop and edge", () => {
    // Source: nauty-showg -e lists the (set of) edges nauty reads from the line: "0 0  0 1".
    const r = spawnSync("nauty-showg", ["-q", "-e"], { input: MULTI + "\n" });
    expect(r.status).toBe(0);
    expect(r.stdout.toString().trim().split("\n")).toEqual(["2 2", "0 0  0 1"]);
  });

  it("a weighted graph cannot be written to graph6 or sparse6", () => {
    const g = graphFromEdges(3, [[0, 1, 2], [1, 2, 1]]);
    expect(() => encodeGraph6(g)).toThrow(InputError);
    expect(() => encodeSparse6(g)).toThrow(/cannot store edge weights/);
    expect(() => writeGraph(g, "dimacs")).toThrow(/cannot store edge weights/);
    expect(writeGraph(g, "gset")).toBe("3 2\n1 2 2\n2 3 1\n");
  });
});

describe("text formats", () => {
  // Each rule checked here is stated in the module header of its parser (our own reading of
  // the format; common practice, no source).
  it("edge list: a non-integer token, a missing column, mixed columns, id 0 when 1-based", async () => {
    expect((await errorOf("a.edges", "0 1\n1 x\n")).message).toBe(`${at("a.edges", 2)}expected vertex id (a non-negative integer), got "x"`);
    expect((await errorOf("b.edges", "0 1\n1.5 2\n")).message).toMatch(/b\.edges:2: expected vertex id .* got "1\.5"/);
    expect((await errorOf("c.edges", "0 1\n2\n")).message).toMatch(/c\.edges:2: expected an edge .* one column/);
    expect((await errorOf("d.edges", "0 1\n1 2 3\n")).message).toMatch(/d\.edges:2: this line has 3 columns but the first edge \(line 1\) has 2/);
    expect((await errorOf("e.edges", "1 2\n0 2\n", { base: 1 })).message).toMatch(/e\.edges:2: vertex id 0 in a 1-based edge list/);
    expect((await errorOf("f.edges", "0 1 abc\n")).message).toMatch(/f\.edges:1: expected a number as edge weight, got "abc"/);
    expect((await errorOf("g.edges", "0 99999999999\n")).message).toMatch(/g\.edges:1: vertex id "99999999999" is too large/);
    expect((await errorOf("h.edges", "0 1 1e999\n")).message).toMatch(/h\.edges:1: edge weight "1e999" is out of the floating-point range/);
  });

  it("edge list header: ids beyond n, edge count beyond m, malformed fields, a conflicting base", async () => {
    // Input validation, common practice, no source.
    expect((await errorOf("h1.edges", "# edgelist n=3\n0 1\n2 3\n")).message).toMatch(/h1\.edges:3: vertex id 3 out of range: the header says n = 3/);
    expect((await errorOf("h2.edges", "# edgelist n=3 m=1\n0 1\n1 2\n")).message).toMatch(/h2\.edges:1: edge-list header says m = 1 but the file has 2/);
    expect((await errorOf("h3.edges", "# edgelist n=x\n")).message).toMatch(/h3\.edges:1: edge-list header: expected n/);
    expect((await errorOf("h4.edges", "# edgelist base=1\n1 2\n", { base: 0 })).message).toMatch(/h4\.edges:1: edge-list header says base=1 but the reader was asked for base 0/);
    expect((await errorOf("h5.edges", "0 1\n# edgelist n=3\n")).message).toMatch(/h5\.edges:2: edge-list header must come before the first edge/);
  });

  it("duplicate edges and self-loops name the line; the policy options allow them explicitly", async () => {
    expect((await errorOf("dup.edges", "0 1\n1 2\n2 1\n")).message).toBe(`${at("dup.edges", 3)}duplicate edge {1, 2}`);
    expect((await errorOf("loop.edges", "0 1\n\n# c\n2 2\n")).message).toBe(`${at("loop.edges", 4)}self-loop at vertex 2`);
    expect((await errorOf("loop.txt", "3 2\n1 2 1\n3 3 1\n")).message).toMatch(/loop\.txt:3: self-loop at vertex 2 \(vertex ids counted from 0; the file counts from 1\)/);
    expect((await errorOf("dup.dimacs", "p edge 3 2\ne 1 2\ne 2 1\n")).message).toMatch(/dup\.dimacs:3: duplicate edge \{0, 1\}/);
    const merged = parseEdgeList("0 1 2\n1 0 3\n2 2 1\n", { build: { duplicates: "merge", loops: "drop" } });
    expect(merged.report).toEqual({ mergedDuplicates: 1, droppedLoops: 1 });
    expect(merged.graph.edgeWeight(0, 1)).toBe(5);
  });

  it("gset: line count against the header (too few, too many), bad header, ids out of range", async () => {
    expect((await errorOf("few.txt", "3 3\n1 2 1\n2 3 1\n")).message).toBe(`${at("few.txt", 1)}gset header declares m = 3 edges but the file has 2 edge lines`);
    expect((await errorOf("many.txt", "3 1\n1 2 1\n2 3 1\n")).message).toMatch(/many\.txt:3: more edge lines than the header's m = 1/);
    expect((await errorOf("cols.gset", "3 2\n1 2 1\n2 3\n")).message).toMatch(/cols\.gset:3: expected a gset edge "u v w", found 2 columns/);
    expect((await errorOf("range.txt", "3 2\n1 2 1\n2 4 1\n")).message).toMatch(/range\.txt:3: vertex id 4 out of range 1\.\.3/);
    expect((await errorOf("zero.txt", "3 2\n1 2 1\n0 3 1\n")).message).toMatch(/zero\.txt:3: vertex id 0 out of range 1\.\.3/);
    expect(() => parseGset("3 x\n", { file: "hdr" })).toThrow(/^hdr:1: gset header: expected edge count m/);
    expect(() => parseGset("", { file: "empty" })).toThrow(/^empty: gset file is empty/);
  });

  it("DIMACS: edge count against the p line, lines out of place, unknown line types", async () => {
    expect((await errorOf("few.dimacs", "c x\np edge 4 3\ne 1 2\ne 2 3\n")).message).toBe(
      `${at("few.dimacs", 2)}DIMACS problem line declares m = 3 edges but the file has 2 "e" lines`,
    );
    expect((await errorOf("early.col", "e 1 2\np edge 2 1\n")).message).toMatch(/early\.col:1: DIMACS edge line before the problem line/);
    expect((await errorOf("kind.col", "p cut 2 1\ne 1 2\n")).message).toMatch(/kind\.col:1: DIMACS problem type must be "edge" or "col"/);
    expect((await errorOf("two.col", "p edge 2 1\np edge 2 1\n")).message).toMatch(/two\.col:2: second DIMACS problem line/);
    expect((await errorOf("n.col", "p edge 2 1\nn 1 5\ne 1 2\n")).message).toMatch(/n\.col:2: unknown DIMACS line "n 1 5"/);
    expect((await errorOf("r.col", "p edge 2 1\ne 1 3\n")).message).toMatch(/r\.col:2: vertex id 3 out of range 1\.\.2/);
    expect(() => parseDimacs("c only comments\n", { file: "nop" })).toThrow(/^nop: DIMACS file has no problem line/);
  });
});

describe("reading files", () => {
  it("readGraphFile wants exactly one graph; a missing file is an InputError", async () => {
    // Input validation, common practice, no source.
    const two = join(tmp, "two.g6");
    writeFileSync(two, "DQc\nDQc\n");
    await expect(readGraphFile(two)).rejects.toThrow(/two\.g6: holds more than one graph \(the second starts on line 2\)/);
    const none = join(tmp, "none.g6");
    writeFileSync(none, "\n");
    await expect(readGraphFile(none)).rejects.toThrow(/none\.g6: holds no graph/);
    await expect(readGraphFile(join(tmp, "absent.g6"))).rejects.toThrow(/absent\.g6: cannot read \(no such file\)/);
    await expect(readGraphFile(tmp + "/")).rejects.toThrow(InputError);
  });

  it("invalid reader options are named", async () => {
    // Input validation, common practice, no source.
    await expect(readGraphFile(join(tmp, "two.g6"), { format: "csv" as never })).rejects.toThrow(/readGraphs: invalid `format`/);
    await expect(readGraphFile(join(tmp, "two.g6"), { base: 2 as never })).rejects.toThrow(/readGraphs: invalid `base`/);
  });
});
