// Exact max cut of a small graph: splits it into connected components (the max cut is the sum),
// then solves each by Gray-code enumeration or branch and bound under one shared time budget.

import { InputError } from "../../errors.js";
import { checkPartition, cutValue } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { inducedSubgraph } from "../../graph/induced.js";
import { connectedComponents } from "../../graph/structure/components.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import { branchAndBoundMaxCut } from "./branch-and-bound.js";
import { DEFAULT_EXACT_SECONDS, nowSeconds, type ExactCutRecord, type ExactOptions, type ExactProgress } from "./common.js";
import { GRAY_MAX_VERTICES, grayCodeMaxCut } from "./gray-code.js";

export type ExactMethod = "auto" | "gray" | "bnb";

export interface ExactMaxCutOptions extends ExactOptions {
  /** "auto" (default): Gray code for components up to `grayUpTo` vertices, branch and bound above. */
  method?: ExactMethod;
  /**
   * Largest component solved by Gray code under "auto" (default 24). Measured: at n = 30 branch
   * and bound is 2–10× faster than full enumeration on random and structured graphs, while
   * Gray code is the simpler, unconditional method for the small cases.
   */
  grayUpTo?: number;
  /** A known good partition (0/1 per vertex), passed to branch and bound as its first incumbent. */
  initial?: ArrayLike<number>;
}

export function exactMaxCut(graph: Graph, options: ExactMaxCutOptions = {}): ExactCutRecord {
  const t0 = nowSeconds();
  const owner = "exactMaxCut";
  const seconds = checkSeconds(owner, options.seconds, DEFAULT_EXACT_SECONDS);
  const seed = checkSeed(owner, "solverSeed", options.solverSeed);
  const method = options.method ?? "auto";
  if (method !== "auto" && method !== "gray" && method !== "bnb") {
    throw new InputError(`${owner}: invalid \`method\`: should be one of auto, gray, bnb (got ${JSON.stringify(method)})`);
  }
  const grayUpTo = options.grayUpTo ?? 24;
  if (!Number.isInteger(grayUpTo) || grayUpTo < 0 || grayUpTo > GRAY_MAX_VERTICES) {
    throw new InputError(`${owner}: invalid \`grayUpTo\`: should be an integer between 0 and ${GRAY_MAX_VERTICES} (got ${JSON.stringify(grayUpTo)})`);
  }
  if (options.initial !== undefined) checkPartition(graph, options.initial, `${owner}: initial`);

  const comps = connectedComponents(graph);
  const members: number[][] = Array.from({ length: comps.count }, () => []);
  for (let v = 0; v < graph.n; v++) members[comps.label[v]].push(v);

  const partition = new Uint8Array(graph.n);
  let upper = 0;
  let graySteps = 0;
  let branchNodes = 0;
  let finishedValue = 0;
  let status: "optimal" | "time-limit" = "optimal";
  let largest = 0;
  let tolerance = 0;
  const used = new Set<string>();
  const deadline = t0 + seconds;
  for (const list of members) {
    if (list.length <= 1) continue; // an isolated vertex contributes nothing
    largest = Math.max(largest, list.length);
    const verts = Int32Array.from(list);
    const sub = list.length === graph.n ? graph : inducedSubgraph(graph, verts);
    // Every component gets what is left of the budget; a late one may get almost nothing and
    // then reports a (valid, weak) bracket instead of an optimum.
    const left = Math.max(1e-3, deadline - nowSeconds());
    const useGray = method === "gray" || (method === "auto" && sub.n <= grayUpTo);
    if (method === "gray" && sub.n > GRAY_MAX_VERTICES) {
      throw new InputError(`${owner}: method gray supports components of at most ${GRAY_MAX_VERTICES} vertices (this one has ${sub.n})`);
    }
    let initial: Uint8Array | undefined;
    if (options.initial !== undefined && !useGray) {
      initial = new Uint8Array(sub.n);
      for (let i = 0; i < sub.n; i++) initial[i] = options.initial[verts[i]];
    }
    // Progress of a component search, reported as a cut of the whole graph: finished components' values plus its own.
    const done = finishedValue;
    const onProgress = options.onProgress === undefined ? undefined : (p: ExactProgress) => options.onProgress!({ lower: done + p.lower, graySteps: graySteps + p.graySteps, branchNodes: branchNodes + p.branchNodes, seconds: nowSeconds() - t0 });
    const r = useGray ? grayCodeMaxCut(sub, { seconds: left, solverSeed: seed, onProgress }) : branchAndBoundMaxCut(sub, { seconds: left, solverSeed: seed, initial, onProgress });
    used.add(r.method);
    for (let i = 0; i < sub.n; i++) partition[verts[i]] = r.partition[i];
    upper += r.upper;
    graySteps += r.graySteps;
    branchNodes += r.branchNodes;
    finishedValue += r.value;
    tolerance += Number(r.details?.tolerance ?? 0);
    if (r.status === "time-limit") status = "time-limit";
  }
  const value = cutValue(graph, partition);
  return {
    method: used.size === 1 ? [...used][0] : used.size === 0 ? "exact-trivial" : "exact-mixed",
    value,
    // Sums of component bounds can differ from the sum of values by rounding; never report upper < value.
    upper: Math.max(upper, value),
    partition,
    status,
    graySteps,
    branchNodes,
    seconds: nowSeconds() - t0,
    solverSeed: seed,
    details: { components: comps.count, largestComponent: largest, methods: [...used].sort().join("+") || "none", tolerance },
  };
}
