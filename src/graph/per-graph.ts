// Results derived from a graph, kept per Graph object. Graphs are immutable, so a derived result
// stays valid for as long as its graph lives; a sweep job asks for the same triangle count,
// degeneracy or vector choice in the structure summary and in several evaluators. They live in
// the graph's own `derived` list (one slot per kind), so they go with the graph.

import type { Graph } from "./graph.js";

/**
 * Largest graph (n + 2m) whose derived results are kept: a small graph's results cost little to
 * keep, while a huge graph's would hold hundreds of megabytes for as long as the graph lives.
 * Larger graphs compute afresh each time.
 */
export const SHARED_RESULTS_MAX_SIZE = 1 << 20;

let slots = 0;

/** A slot of its own in every graph's `derived` list: get and set one kind of derived result. */
export function graphSlot<T>(): { get: (g: Graph) => T | undefined; set: (g: Graph, value: T) => void } {
  const slot = slots++;
  return {
    get: (g) => g.derived[slot] as T | undefined,
    set: (g, value) => {
      g.derived[slot] = value;
    },
  };
}

/**
 * `compute` wrapped so that each Graph object (up to SHARED_RESULTS_MAX_SIZE) computes it once.
 * Callers must treat the returned value as read-only: every later caller gets the same object.
 */
export function perGraph<T>(compute: (g: Graph) => T): (g: Graph) => T {
  const slot = slots++;
  return (g: Graph): T => {
    if (g.n + g.neighbors.length > SHARED_RESULTS_MAX_SIZE) return compute(g);
    const kept = g.derived;
    let r = kept[slot] as T | undefined;
    if (r === undefined) {
      r = compute(g);
      kept[slot] = r;
    }
    return r;
  };
}
