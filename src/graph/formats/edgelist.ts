// Plain edge lists: one edge `u v` or `u v w` per line, blank-separated; `#` or `%` starts a
// comment (whole line or rest of line); blank lines are skipped. Every edge line must have
// the same number of columns (2, or 3 with a weight).
//
// Numbering rule (no guessing): ids are 0-based unless the reader is told `base: 1` or the
// file carries a header comment before its first edge, `# edgelist n=<N> [m=<M>] [base=0|1]`
// (what `writeEdgeList` writes). Without a header, n = largest id + 1 (0-based) or the largest
// id (1-based); with one, ids must lie in range and the edge count must equal m. An id 0 in a
// 1-based list is an error. A weight column of all ones gives an unweighted graph.

import { inputErrorAt } from "../../errors.js";
import { EdgeBuffer, type BuildResult } from "../builder.js";
import type { Graph } from "../graph.js";
import { buildPlaced } from "./build-placed.js";
import {
  asBytes,
  badUintMessage,
  badWeightMessage,
  LineCursor,
  LineTokens,
  quoteToken,
  readDecimal,
  readUint,
  skipBlanks,
  tokenEnd,
} from "./scan.js";
import { DEFAULT_FILE_NAME, type TextParseOptions } from "./types.js";

export interface EdgeListOptions extends TextParseOptions {
  /** Vertex numbering; when omitted: the header's `base`, else 0. */
  base?: 0 | 1;
  /**
   * Refuse a 2-column file whose first line reads like a count header `n m` (m edge lines follow,
   * no id above n): a guess either way could build a wrong graph (default true; the reader turns it
   * off when the user named the format explicitly).
   */
  refuseCountHeader?: boolean;
}

export interface EdgeListHeader {
  n?: number;
  m?: number;
  base?: 0 | 1;
  line: number;
}

export const EDGELIST_HEADER_WORD = "edgelist";

/** The header in a comment at buf[s, e) (s just past '#' or '%'), or null if it is a plain comment. */
function readHeader(buf: Uint8Array, s: number, e: number, source: string, line: number): EdgeListHeader | null {
  let p = skipBlanks(buf, s, e);
  const t = tokenEnd(buf, p, e);
  if (t - p !== EDGELIST_HEADER_WORD.length) return null;
  for (let i = 0; i < EDGELIST_HEADER_WORD.length; i++) if (buf[p + i] !== EDGELIST_HEADER_WORD.charCodeAt(i)) return null;
  const header: EdgeListHeader = { line };
  p = skipBlanks(buf, t, e);
  while (p < e) {
    const te = tokenEnd(buf, p, e);
    let eq = p;
    while (eq < te && buf[eq] !== 61) eq++;
    const key = Buffer.from(buf.buffer, buf.byteOffset + p, eq - p).toString("latin1");
    if (eq === te || (key !== "n" && key !== "m" && key !== "base")) {
      throw inputErrorAt(source, line, `edge-list header: expected n=<N>, m=<M> or base=<0|1>, got ${quoteToken(buf, p, te)}`);
    }
    if (header[key] !== undefined) throw inputErrorAt(source, line, `edge-list header: ${key} given twice`);
    const value = readUint(buf, eq + 1, te);
    if (value < 0) throw inputErrorAt(source, line, `edge-list header: ${badUintMessage(buf, eq + 1, te, value, key)}`);
    if (key === "base") {
      if (value > 1) throw inputErrorAt(source, line, `edge-list header: base must be 0 or 1 (got ${value})`);
      header.base = value as 0 | 1;
    } else header[key] = value;
    p = skipBlanks(buf, te, e);
  }
  return header;
}

/** Parse an edge list (see the module header for the rules). */
export function parseEdgeList(text: string | Uint8Array, options: EdgeListOptions = {}): BuildResult {
  const buf = asBytes(text);
  const source = options.file ?? DEFAULT_FILE_NAME;
  const cur = new LineCursor(buf);
  const tok = new LineTokens(3);
  let header: EdgeListHeader | null = null;
  let base: 0 | 1 | -1 = -1; // fixed at the first edge line
  let cols = 0;
  let firstEdgeLine = 0;
  let edges: EdgeBuffer | null = null;
  let maxId = -1;
  // The first edge line as written, and the largest id written after it (count-header check).
  let firstA = -1, firstB = -1, laterMax = -1;
  const resolveBase = (): 0 | 1 => {
    if (options.base !== undefined && header?.base !== undefined && options.base !== header.base) {
      throw inputErrorAt(source, header.line, `edge-list header says base=${header.base} but the reader was asked for base ${options.base}`);
    }
    return options.base ?? header?.base ?? 0;
  };
  while (cur.advance()) {
    const line = cur.line;
    const s = skipBlanks(buf, cur.start, cur.end);
    const e = cur.end;
    if (s === e) continue;
    if (buf[s] === 35 || buf[s] === 37) {
      const h = readHeader(buf, s + 1, e, source, line);
      if (h !== null) {
        if (edges !== null) throw inputErrorAt(source, line, `edge-list header must come before the first edge (line ${firstEdgeLine})`);
        if (header !== null) throw inputErrorAt(source, line, `second edge-list header (the first is on line ${header.line})`);
        header = h;
      }
      continue;
    }
    const count = tok.split(buf, s, e, true);
    if (count < 2 || count > 3) {
      throw inputErrorAt(source, line, count < 2 ? "expected an edge \"u v\" or \"u v w\", found one column" : `expected an edge "u v" or "u v w", found ${count} columns`);
    }
    if (edges === null) {
      base = resolveBase();
      cols = count;
      firstEdgeLine = line;
      edges = new EdgeBuffer({ weighted: cols === 3, tagged: true, capacity: Math.min(1 << 20, buf.length >>> 3) });
    } else if (count !== cols) {
      throw inputErrorAt(source, line, `this line has ${count} columns but the first edge (line ${firstEdgeLine}) has ${cols}; all lines must agree`);
    }
    const us = tok.starts[0], ue = tok.ends[0], vs = tok.starts[1], ve = tok.ends[1];
    let u = readUint(buf, us, ue);
    if (u < 0) throw inputErrorAt(source, line, badUintMessage(buf, us, ue, u, "vertex id"));
    let v = readUint(buf, vs, ve);
    if (v < 0) throw inputErrorAt(source, line, badUintMessage(buf, vs, ve, v, "vertex id"));
    if (edges.length === 0) {
      firstA = u;
      firstB = v;
    } else laterMax = Math.max(laterMax, u, v);
    if (base === 1) {
      if (u === 0 || v === 0) throw inputErrorAt(source, line, "vertex id 0 in a 1-based edge list (ids start at 1)");
      u--;
      v--;
    }
    if (header?.n !== undefined && (u >= header.n || v >= header.n)) {
      const bad = (u >= header.n ? u : v) + base;
      throw inputErrorAt(source, line, `vertex id ${bad} out of range: the header says n = ${header.n} (ids ${base}..${header.n - 1 + base})`);
    }
    let w = 1;
    if (cols === 3) {
      const ws = tok.starts[2], we = tok.ends[2];
      w = readDecimal(buf, ws, we);
      if (!Number.isFinite(w)) throw inputErrorAt(source, line, badWeightMessage(buf, ws, we, w));
    }
    edges.add(u, v, w, line);
    if (u > maxId) maxId = u;
    if (v > maxId) maxId = v;
  }
  if (edges === null) {
    base = resolveBase();
    edges = new EdgeBuffer({ tagged: true, capacity: 16 });
  }
  if (options.refuseCountHeader !== false && header === null && cols === 2 && edges.length >= 2 && firstB === edges.length - 1 && laterMax <= firstA) {
    throw inputErrorAt(
      source,
      firstEdgeLine,
      `the first line "${firstA} ${firstB}" reads like a header "n m" (${firstB} edge lines follow, no id above ${firstA}); ` +
        `halfplus will not guess: remove it, write it as "# edgelist n=${firstA} m=${firstB}", or pass --format edgelist to read it as an edge`,
    );
  }
  if (header?.m !== undefined && header.m !== edges.length) {
    throw inputErrorAt(source, header.line, `edge-list header says m = ${header.m} but the file has ${edges.length} edge lines`);
  }
  const n = header?.n ?? maxId + 1;
  return buildPlaced(edges, n, source, base === 1 ? 1 : 0, options.build);
}

/** Edge list text of g with a header line, so n (isolated vertices too) survives a round trip. */
export function writeEdgeList(g: Graph, options: { base?: 0 | 1 } = {}): string {
  const base = options.base ?? 0;
  const parts: string[] = [`# ${EDGELIST_HEADER_WORD} n=${g.n} m=${g.m} base=${base}`];
  const { offsets, neighbors, weights } = g;
  for (let u = 0; u < g.n; u++) {
    for (let a = offsets[u]; a < offsets[u + 1]; a++) {
      const v = neighbors[a];
      if (v <= u) continue;
      parts.push(weights === null ? `${u + base} ${v + base}` : `${u + base} ${v + base} ${weights[a]}`);
    }
  }
  parts.push("");
  return parts.join("\n");
}
