// The classic Max-Cut benchmark format ("gset"): a first line `n m`, then exactly m lines
// `u v w` with 1-based ids and integer or real weights. Blank lines are skipped; there are
// no comments. A weight column of all ones gives an unweighted graph.

import { inputErrorAt } from "../../errors.js";
import { EdgeBuffer, MAX_VERTICES, type BuildResult } from "../builder.js";
import { checkMemory, graphBuildBytes } from "../../limits/memory.js";
import type { Graph } from "../graph.js";
import { buildPlaced } from "./build-placed.js";
import { asBytes, badUintMessage, badWeightMessage, LineCursor, LineTokens, readDecimal, readUint, skipBlanks } from "./scan.js";
import { DEFAULT_FILE_NAME, type TextParseOptions } from "./types.js";

export function parseGset(text: string | Uint8Array, options: TextParseOptions = {}): BuildResult {
  const buf = asBytes(text);
  const source = options.file ?? DEFAULT_FILE_NAME;
  const cur = new LineCursor(buf);
  const tok = new LineTokens(3);
  let headerLine = 0;
  let n = 0;
  let m = 0;
  let edges: EdgeBuffer | null = null;
  while (cur.advance()) {
    const line = cur.line;
    const s = skipBlanks(buf, cur.start, cur.end);
    const e = cur.end;
    if (s === e) continue;
    const count = tok.split(buf, s, e, false);
    if (edges === null) {
      if (count !== 2) throw inputErrorAt(source, line, `gset header must be "n m" (two integers), found ${count} columns`);
      n = readUint(buf, tok.starts[0], tok.ends[0]);
      if (n < 0) throw inputErrorAt(source, line, `gset header: ${badUintMessage(buf, tok.starts[0], tok.ends[0], n, "vertex count n")}`);
      m = readUint(buf, tok.starts[1], tok.ends[1]);
      if (m < 0) throw inputErrorAt(source, line, `gset header: ${badUintMessage(buf, tok.starts[1], tok.ends[1], m, "edge count m")}`);
      headerLine = line;
      // A lying header must not allocate: no line is shorter than 6 bytes ("1 2 1\n"). (Above
      // MAX_VERTICES the builder refuses the count itself, naming the file.)
      if (n <= MAX_VERTICES) checkMemory(graphBuildBytes(n, Math.min(m, Math.ceil(buf.length / 6)), true), `${source}:${line}: gset header n = ${n}, m = ${m}`);
      edges = new EdgeBuffer({ weighted: true, tagged: true, capacity: Math.min(m, Math.ceil(buf.length / 6)) });
      continue;
    }
    if (edges.length === m) {
      throw inputErrorAt(source, line, `more edge lines than the header's m = ${m} (header on line ${headerLine})`);
    }
    if (count !== 3) throw inputErrorAt(source, line, `expected a gset edge "u v w", found ${count} column${count === 1 ? "" : "s"}`);
    const u = readUint(buf, tok.starts[0], tok.ends[0]);
    if (u < 0) throw inputErrorAt(source, line, badUintMessage(buf, tok.starts[0], tok.ends[0], u, "vertex id"));
    const v = readUint(buf, tok.starts[1], tok.ends[1]);
    if (v < 0) throw inputErrorAt(source, line, badUintMessage(buf, tok.starts[1], tok.ends[1], v, "vertex id"));
    if (u < 1 || u > n || v < 1 || v > n) {
      throw inputErrorAt(source, line, `vertex id ${u < 1 || u > n ? u : v} out of range 1..${n} (header on line ${headerLine})`);
    }
    const w = readDecimal(buf, tok.starts[2], tok.ends[2]);
    if (!Number.isFinite(w)) throw inputErrorAt(source, line, badWeightMessage(buf, tok.starts[2], tok.ends[2], w));
    edges.add(u - 1, v - 1, w, line);
  }
  if (edges === null) throw inputErrorAt(source, undefined, `gset file is empty: expected a header "n m"`);
  if (edges.length !== m) {
    throw inputErrorAt(source, headerLine, `gset header declares m = ${m} edges but the file has ${edges.length} edge lines`);
  }
  return buildPlaced(edges, n, source, 1, options.build);
}

/** gset text of g: `n m`, then `u v w` (1-based; weight 1 when unweighted). */
export function writeGset(g: Graph): string {
  const parts: string[] = [`${g.n} ${g.m}`];
  const { offsets, neighbors, weights } = g;
  for (let u = 0; u < g.n; u++) {
    for (let a = offsets[u]; a < offsets[u + 1]; a++) {
      const v = neighbors[a];
      if (v > u) parts.push(`${u + 1} ${v + 1} ${weights === null ? 1 : weights[a]}`);
    }
  }
  parts.push("");
  return parts.join("\n");
}
