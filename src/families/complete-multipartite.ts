// Complete multipartite graphs K_{a1,…,ar}: vertices split into consecutive parts, every pair in
// different parts adjacent. Complete bipartite K_{a,b} is the two-part case.

import { invalidParameter } from "../errors.js";
import { EdgeBuffer } from "../graph/builder.js";
import type { Graph } from "../graph/graph.js";
import { bipartiteFreeOf } from "./free-of.js";
import { resolveTyped } from "./typed-build.js";
import { defineFamily, type PredictedSize } from "./types.js";

/** Builds K_{parts}; part i holds the next parts[i] vertex ids. Trusts its arguments. */
export function buildCompleteMultipartite(parts: readonly number[]): Graph {
  const n = parts.reduce((a, b) => a + b, 0);
  const shape = multipartiteShape(parts);
  const buf = new EdgeBuffer({ capacity: Math.max(16, shape.m) });
  let start = 0;
  for (const size of parts) {
    const end = start + size;
    for (let u = start; u < end; u++) for (let v = end; v < n; v++) buf.add(u, v);
    start = end;
  }
  return buf.build(n).graph;
}

function multipartiteShape(parts: readonly number[]): PredictedSize {
  const n = parts.reduce((a, b) => a + b, 0);
  const sq = parts.reduce((a, b) => a + b * b, 0);
  const big = Math.max(...parts), small = Math.min(...parts);
  return { n, m: (n * n - sq) / 2, mExact: true, minDegree: n - big, maxDegree: n - small };
}

/** K_{parts}, validated like the spec `complete-multipartite:parts=…`. */
export function completeMultipartite(parts: readonly number[]): Graph {
  const p = resolveTyped(completeMultipartiteFamily, { parts: [...parts] });
  return buildCompleteMultipartite(p.parts);
}

export const completeMultipartiteFamily = defineFamily({
  name: "complete-multipartite",
  summary: "complete multipartite graph: parts of the given sizes, all pairs across parts adjacent",
  params: [{ name: "parts", type: "integer-list", description: "part sizes joined by +, each at least 1", default: [2, 2, 2] }],
  random: false,
  validate: (p) => {
    const parts = p.parts;
    for (const a of parts) if (a < 1 || a > 100_000_000) throw invalidParameter("complete-multipartite", "parts", "should list sizes between 1 and 100000000", a);
  },
  freeOf: (p) => {
    const r = p.parts.length;
    if (r === 2) return bipartiteFreeOf("two independent parts");
    // A clique meets each independent part at most once (pigeonhole).
    return r + 1 <= 6 ? [{ pattern: `K${r + 1}`, citation: `a clique takes at most one vertex from each of the ${r} parts (pigeonhole)` }] : [];
  },
  predictedSize: (p) => multipartiteShape(p.parts),
  build: (p) => buildCompleteMultipartite(p.parts),
});

/** K_{a,b}. */
export function completeBipartite(a: number, b: number): Graph {
  const p = resolveTyped(completeBipartiteFamily, { a, b });
  return buildCompleteMultipartite([p.a, p.b]);
}

export const completeBipartiteFamily = defineFamily({
  name: "complete-bipartite",
  summary: "complete bipartite graph K_{a,b}",
  params: [
    { name: "a", type: "integer", description: "size of the first side", default: 3, min: 1, max: 100_000_000 },
    { name: "b", type: "integer", description: "size of the second side", default: 3, min: 1, max: 100_000_000 },
  ],
  random: false,
  freeOf: (p) => {
    const a = p.a, b = p.b;
    const out = bipartiteFreeOf("two independent sides");
    // K_{s,t} ⊆ K_{a,b} needs s ≤ a, t ≤ b or the other way round.
    if (Math.min(a, b) < 2) out.push({ pattern: "C4", citation: "a side with one vertex: K_{1,b} is a star" });
    else if (Math.max(a, b) < 3) out.push({ pattern: "K2,3", citation: "both sides have at most 2 vertices" });
    return out;
  },
  predictedSize: (p) => multipartiteShape([p.a, p.b]),
  build: (p) => buildCompleteMultipartite([p.a, p.b]),
});
