// Recognises patterns with a dedicated search (complete, cycle, complete bipartite), so
// `findSubgraph` can hand them to the faster specialised routine.

import type { Graph } from "../graph.js";

export type PatternShape =
  | { kind: "complete"; r: number }
  /** order: the pattern's vertices in cyclic order. */
  | { kind: "cycle"; order: number[] }
  | { kind: "complete-bipartite"; left: number[]; right: number[] }
  | { kind: "general" };

export function patternShape(p: Graph): PatternShape {
  const k = p.n;
  if (k === 0) return { kind: "general" };
  if (p.m === (k * (k - 1)) / 2) return { kind: "complete", r: k };
  // Connected and 2-colourable with every cross pair adjacent ⇒ complete bipartite; 2-regular connected ⇒ cycle.
  const side = new Int8Array(k).fill(-1);
  side[0] = 0;
  const stack = [0];
  let bipartite = true, seen = 1;
  while (stack.length > 0) {
    const u = stack.pop()!;
    for (const w of p.neighborsOf(u)) {
      if (side[w] < 0) {
        side[w] = 1 - side[u];
        seen++;
        stack.push(w);
      } else if (side[w] === side[u]) bipartite = false;
    }
  }
  if (seen < k) return { kind: "general" };
  let twoRegular = true;
  for (let v = 0; v < k; v++) if (p.degree(v) !== 2) twoRegular = false;
  if (twoRegular && k >= 3) {
    const order = [0];
    let prev = -1, cur = 0;
    while (order.length < k) {
      const nb = p.neighborsOf(cur);
      const next = nb[0] !== prev ? nb[0] : nb[1];
      prev = cur;
      cur = next;
      order.push(cur);
    }
    return { kind: "cycle", order };
  }
  if (bipartite) {
    const left: number[] = [], right: number[] = [];
    for (let v = 0; v < k; v++) (side[v] === 0 ? left : right).push(v);
    if (left.length * right.length === p.m) return { kind: "complete-bipartite", left, right };
  }
  return { kind: "general" };
}
