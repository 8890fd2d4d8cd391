// Small pattern graphs named the way the project writes "free of H": K_r (complete),
// C_k (cycle), K_{s,t} (complete bipartite), P_k (path on k vertices).

import { InputError } from "../../errors.js";
import { EdgeBuffer } from "../builder.js";
import type { Graph } from "../graph.js";
import { MAX_PATTERN_VERTICES } from "./subgraph.js";

export type PatternKind = "complete" | "cycle" | "complete-bipartite" | "path";

export interface PatternName {
  kind: PatternKind;
  /** Canonical spelling: "K4", "C5", "K2,3", "P4". */
  name: string;
  /** Vertex count(s): [r] for K_r / C_k / P_k, [s, t] for K_{s,t}. */
  sizes: number[];
}

const SYNTAX = "expected K<r>, C<k>, K<s>,<t> or P<k>, e.g. K3, C5, K2,3, P4";

/** Parse a pattern name; accepts `K_{2,3}`-style underscores and braces and either case. */
export function parsePatternName(name: string): PatternName {
  const m = /^([KkCcPp])_?(\{)?(\d+)(?:,(\d+))?(\})?$/.exec(name.trim());
  if (m === null || (m[2] === undefined) !== (m[5] === undefined)) {
    throw new InputError(`pattern ${JSON.stringify(name)}: unknown name (${SYNTAX})`);
  }
  const letter = m[1].toUpperCase();
  const a = Number(m[3]);
  const b = m[4] === undefined ? undefined : Number(m[4]);
  const max = MAX_PATTERN_VERTICES;
  const bad = (range: string) => new InputError(`pattern ${JSON.stringify(name)}: ${range} (${SYNTAX})`);
  if (b !== undefined) {
    if (letter !== "K") throw bad("only K takes two sizes");
    if (a < 1 || b < 1 || a + b > max) throw bad(`K<s>,<t> needs s, t ≥ 1 and s + t ≤ ${max}`);
    return { kind: "complete-bipartite", name: `K${a},${b}`, sizes: [a, b] };
  }
  if (letter === "K") {
    if (a < 1 || a > max) throw bad(`K<r> needs 1 ≤ r ≤ ${max}`);
    return { kind: "complete", name: `K${a}`, sizes: [a] };
  }
  if (letter === "C") {
    if (a < 3 || a > max) throw bad(`C<k> needs 3 ≤ k ≤ ${max}`);
    return { kind: "cycle", name: `C${a}`, sizes: [a] };
  }
  if (a < 1 || a > max) throw bad(`P<k> (path on k vertices) needs 1 ≤ k ≤ ${max}`);
  return { kind: "path", name: `P${a}`, sizes: [a] };
}

/** The pattern graph for a name: K_r on 0..r-1; C_k as 0–1–…–(k-1)–0; K_{s,t} with sides 0..s-1 and s..s+t-1; P_k as 0–1–…–(k-1). */
export function patternGraph(name: string): Graph {
  const p = parsePatternName(name);
  const buf = new EdgeBuffer();
  const [a, b] = p.sizes;
  let n = a;
  switch (p.kind) {
    case "complete":
      for (let u = 0; u < a; u++) for (let v = u + 1; v < a; v++) buf.add(u, v);
      break;
    case "cycle":
      for (let u = 0; u < a; u++) buf.add(u, (u + 1) % a);
      break;
    case "path":
      for (let u = 0; u + 1 < a; u++) buf.add(u, u + 1);
      break;
    case "complete-bipartite":
      n = a + b;
      for (let u = 0; u < a; u++) for (let v = a; v < a + b; v++) buf.add(u, v);
      break;
  }
  return buf.build(n).graph;
}
