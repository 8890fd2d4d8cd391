// Which format a graph file is in. Rule: an explicit `format` wins (handled by the reader);
// then a known extension (.g6/.graph6, .s6/.sparse6, .edges/.el/.edgelist, .dimacs/.col/.clq,
// .gset); otherwise the content decides, by the first non-blank line:
//   `>>graph6<<` → graph6; `>>sparse6<<` or ':' (or ';') → sparse6; '#' or '%' → edge list;
//   a line starting with the word `c`, `p` or `e` → DIMACS; one blank-free word of bytes
//   63..126 → graph6; numbers: 3 columns → edge list; 2 columns followed by a 3-column line
//   → gset (an edge list needs equal columns); 2 followed by 2 → edge list.
// A lone 2-column line (gset header of an edgeless graph, or a one-edge edge list) and
// anything else are errors asking for an explicit format: no guess can make a wrong graph.

import { InputError } from "../../errors.js";
import { asBytes, isBlank, LineCursor, LineTokens, quoteToken, skipBlanks } from "./scan.js";
import { GRAPH_FORMATS, type GraphFormat } from "./types.js";

const BY_EXTENSION: Readonly<Record<string, GraphFormat>> = Object.freeze({
  g6: "graph6",
  graph6: "graph6",
  s6: "sparse6",
  sparse6: "sparse6",
  edges: "edgelist",
  el: "edgelist",
  edgelist: "edgelist",
  dimacs: "dimacs",
  col: "dimacs",
  clq: "dimacs",
  gset: "gset",
});

/** Format implied by the file name's extension, or undefined (e.g. .txt, no extension, "stdin"). */
export function formatFromExtension(name: string): GraphFormat | undefined {
  const base = name.slice(Math.max(name.lastIndexOf("/"), name.lastIndexOf("\\")) + 1);
  const dot = base.lastIndexOf(".");
  if (dot <= 0) return undefined;
  const ext = base.slice(dot + 1).toLowerCase();
  return Object.prototype.hasOwnProperty.call(BY_EXTENSION, ext) ? BY_EXTENSION[ext] : undefined;
}

function startsWith(buf: Uint8Array, s: number, e: number, word: string): boolean {
  if (e - s < word.length) return false;
  for (let i = 0; i < word.length; i++) if (buf[s + i] !== word.charCodeAt(i)) return false;
  return true;
}

/** Every token of buf[s, e) is made of digits, sign, point and exponent characters. */
function numericTokens(buf: Uint8Array, s: number, e: number): boolean {
  for (let p = s; p < e; p++) {
    const c = buf[p];
    if (isBlank(c)) continue;
    if (!((c >= 48 && c <= 57) || c === 43 || c === 45 || c === 46 || c === 101 || c === 69)) return false;
  }
  return true;
}

/** Format from content alone (see the module header). `head` is the start of the input, cut at a line end. */
export function detectFromContent(name: string, head: string | Uint8Array): GraphFormat {
  const buf = asBytes(head);
  const cur = new LineCursor(buf);
  let s = 0;
  let e = 0;
  let found = false;
  while (cur.advance()) {
    s = skipBlanks(buf, cur.start, cur.end);
    e = cur.end;
    if (s < e) {
      found = true;
      break;
    }
  }
  if (!found) throw new InputError(`${name}: empty input, no graph format to detect`);
  while (e > s && isBlank(buf[e - 1])) e--;
  if (startsWith(buf, s, e, ">>graph6<<")) return "graph6";
  if (startsWith(buf, s, e, ">>sparse6<<")) return "sparse6";
  if (startsWith(buf, s, e, ">>digraph6<<") || buf[s] === 38) {
    throw new InputError(`${name}: digraph6 is not supported: halfplus reads undirected graphs`);
  }
  const c = buf[s];
  if (c === 58 || c === 59) return "sparse6";
  if (c === 35 || c === 37) return "edgelist";
  if ((c === 99 || c === 112 || c === 101) && (s + 1 === e || isBlank(buf[s + 1]))) return "dimacs";
  let graph6 = true;
  for (let p = s; p < e; p++) if (buf[p] < 63 || buf[p] > 126) graph6 = false;
  if (graph6) return "graph6";
  const tok = new LineTokens(4);
  const first = tok.split(buf, s, e, false);
  const line1 = cur.line;
  if (numericTokens(buf, s, e)) {
    if (first === 3) return "edgelist";
    if (first === 2) {
      while (cur.advance()) {
        const s2 = skipBlanks(buf, cur.start, cur.end);
        if (s2 === cur.end) continue;
        if (buf[s2] === 35 || buf[s2] === 37) return "edgelist"; // comments: gset has none
        const second = tok.split(buf, s2, cur.end, true);
        if (second === 3) return "gset";
        if (second === 2) return "edgelist";
        throw new InputError(
          `${name}: cannot tell the format: line ${line1} has 2 columns and line ${cur.line} has ${second}; pass the format explicitly`,
        );
      }
      throw new InputError(
        `${name}: a single line "a b" could be a gset header (no edges) or a one-edge edge list; pass the format explicitly`,
      );
    }
  }
  throw new InputError(
    `${name}: cannot tell the graph format from the first line ${quoteToken(buf, s, e)}; pass one of ${GRAPH_FORMATS.join(", ")}`,
  );
}

/** Format of a file: its extension when known, else its content (`head`: the start of the file, cut at a line end). */
export function detectFormat(name: string, head: string | Uint8Array): GraphFormat {
  return formatFromExtension(name) ?? detectFromContent(name, head);
}
