// DIMACS graph format (the clique/colouring challenge format): `c` comment lines, one
// problem line `p edge n m` (`p col n m` accepted too), then `e u v` lines with 1-based ids.
// The number of `e` lines must equal m. Any other line type is an error.

import { inputErrorAt } from "../../errors.js";
import { EdgeBuffer, MAX_VERTICES, type BuildResult } from "../builder.js";
import { checkMemory, graphBuildBytes } from "../../limits/memory.js";
import type { Graph } from "../graph.js";
import { buildPlaced } from "./build-placed.js";
import { asBytes, badUintMessage, isBlank, LineCursor, LineTokens, quoteToken, readUint, skipBlanks } from "./scan.js";
import { DEFAULT_FILE_NAME, type TextParseOptions } from "./types.js";
import { assertUnitWeights } from "./unweighted.js";

function tokenIs(buf: Uint8Array, s: number, e: number, word: string): boolean {
  if (e - s !== word.length) return false;
  for (let i = 0; i < word.length; i++) if (buf[s + i] !== word.charCodeAt(i)) return false;
  return true;
}

export function parseDimacs(text: string | Uint8Array, options: TextParseOptions = {}): BuildResult {
  const buf = asBytes(text);
  const source = options.file ?? DEFAULT_FILE_NAME;
  const cur = new LineCursor(buf);
  const tok = new LineTokens(4);
  let pLine = 0;
  let n = 0;
  let m = 0;
  let edges: EdgeBuffer | null = null;
  while (cur.advance()) {
    const line = cur.line;
    const s = skipBlanks(buf, cur.start, cur.end);
    const e = cur.end;
    if (s === e) continue;
    const kind = buf[s];
    const single = s + 1 === e || isBlank(buf[s + 1]);
    if (kind === 99 && single) continue; // c
    const count = tok.split(buf, s, e, false);
    if (kind === 112 && single) {
      // p edge n m
      if (edges !== null) throw inputErrorAt(source, line, `second DIMACS problem line (the first is on line ${pLine})`);
      if (count !== 4) throw inputErrorAt(source, line, `DIMACS problem line must be "p edge n m", found ${count} fields`);
      const ks = tok.starts[1], ke = tok.ends[1];
      if (!tokenIs(buf, ks, ke, "edge") && !tokenIs(buf, ks, ke, "col")) {
        throw inputErrorAt(source, line, `DIMACS problem type must be "edge" or "col", got ${quoteToken(buf, ks, ke)}`);
      }
      n = readUint(buf, tok.starts[2], tok.ends[2]);
      if (n < 0) throw inputErrorAt(source, line, badUintMessage(buf, tok.starts[2], tok.ends[2], n, "vertex count n"));
      m = readUint(buf, tok.starts[3], tok.ends[3]);
      if (m < 0) throw inputErrorAt(source, line, badUintMessage(buf, tok.starts[3], tok.ends[3], m, "edge count m"));
      pLine = line;
      if (n <= MAX_VERTICES) checkMemory(graphBuildBytes(n, Math.min(m, Math.ceil(buf.length / 6)), false), `${source}:${line}: DIMACS problem line n = ${n}, m = ${m}`);
      edges = new EdgeBuffer({ tagged: true, capacity: Math.min(m, Math.ceil(buf.length / 6)) });
      continue;
    }
    if (kind === 101 && single) {
      // e u v
      if (edges === null) throw inputErrorAt(source, line, `DIMACS edge line before the problem line "p edge n m"`);
      if (count !== 3) throw inputErrorAt(source, line, `DIMACS edge line must be "e u v", found ${count} fields`);
      const u = readUint(buf, tok.starts[1], tok.ends[1]);
      if (u < 0) throw inputErrorAt(source, line, badUintMessage(buf, tok.starts[1], tok.ends[1], u, "vertex id"));
      const v = readUint(buf, tok.starts[2], tok.ends[2]);
      if (v < 0) throw inputErrorAt(source, line, badUintMessage(buf, tok.starts[2], tok.ends[2], v, "vertex id"));
      if (u < 1 || u > n || v < 1 || v > n) {
        throw inputErrorAt(source, line, `vertex id ${u < 1 || u > n ? u : v} out of range 1..${n} (problem line ${pLine})`);
      }
      edges.add(u - 1, v - 1, 1, line);
      continue;
    }
    throw inputErrorAt(source, line, `unknown DIMACS line ${quoteToken(buf, s, Math.min(e, s + 20))}: expected "c ...", "p edge n m" or "e u v"`);
  }
  if (edges === null) throw inputErrorAt(source, undefined, `DIMACS file has no problem line "p edge n m"`);
  if (edges.length !== m) {
    throw inputErrorAt(source, pLine, `DIMACS problem line declares m = ${m} edges but the file has ${edges.length} "e" lines`);
  }
  return buildPlaced(edges, n, source, 1, options.build);
}

/** DIMACS text of g: `p edge n m`, then `e u v` (1-based). Weighted graphs are refused. */
export function writeDimacs(g: Graph): string {
  assertUnitWeights(g, "DIMACS edge format");
  const parts: string[] = [`p edge ${g.n} ${g.m}`];
  const { offsets, neighbors } = g;
  for (let u = 0; u < g.n; u++) {
    for (let a = offsets[u]; a < offsets[u + 1]; a++) {
      const v = neighbors[a];
      if (v > u) parts.push(`e ${u + 1} ${v + 1}`);
    }
  }
  parts.push("");
  return parts.join("\n");
}
