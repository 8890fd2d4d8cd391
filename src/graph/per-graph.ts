// Results derived from a graph, kept per Graph object. Graphs are immutable, so a derived result
// stays valid for as long as its graph lives; a sweep job asks for the same triangle count,
// degeneracy or vector choice in the structure summary and in several evaluators.

import type { Graph } from "./graph.js";

/**
 * Largest graph (n + 2m) whose derived results are kept: a small graph's results cost little to
 * keep, while a huge graph's would hold hundreds of megabytes for as long as the graph lives.
 * Larger graphs compute afresh each time.
 */
export const SHARED_RESULTS_MAX_SIZE = 1 << 20;

/**
 * `compute` wrapped so that each Graph object (up to SHARED_RESULTS_MAX_SIZE) computes it once.
 * Callers must treat the returned value as read-only: every later caller gets the same object.
 */
export function perGraph<T>(compute: (g: Graph) => T): (g: Graph) => T {
  const kept = new WeakMap<Graph, T>();
  return (g: Graph): T => {
    if (g.n + g.neighbors.length > SHARED_RESULTS_MAX_SIZE) return compute(g);
    let r = kept.get(g);
    if (r === undefined) {
      r = compute(g);
      kept.set(g, r);
    }
    return r;
  };
}
