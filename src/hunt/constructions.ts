// Known H-free constructions on exactly n vertices, the hunt's reference lines and starting
// points: polarity graphs ER_q (Erdős–Rényi 1962; Brown 1966), projective-plane incidence graphs,
// Kneser graphs, blow-ups of odd cycles and of the Petersen graph, Andrásfai graphs, hypercubes,
// Paley graphs, Mycielski graphs, named graphs; and outputs of the H-free process. Each candidate
// is kept only when an exhaustive subgraph search proves it H-free, whatever its family claims.

import { family } from "../families/registry.js";
import { isPrimePower } from "../families/finite-field.js";
import { hfreeProcess, HFREE_PATTERNS, type HFreePattern } from "../families/hfree-process.js";
import type { Graph } from "../graph/graph.js";
import { findSubgraph } from "../graph/structure/subgraph.js";
import { Rng } from "../random/prng.js";
import { MutableGraph } from "./mutable-graph.js";
import { RootedSearch, type RootedPattern } from "./pattern-through-edge.js";

export interface Construction {
  /** A family spec that rebuilds the graph (or a description for the hunt's own greedy fill). */
  label: string;
  graph: Graph;
}

/** Node budget of the H-freeness proof for a construction (ample for n ≤ 256 and |H| ≤ 6). */
const PROOF_NODES = 50_000_000;

function binomial(a: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (a - k + i)) / i;
  return Math.round(r);
}

/** Family specs of structured graphs with exactly n vertices (H-freeness not yet checked). */
export function structuredSpecs(n: number): string[] {
  const specs: string[] = [];
  for (let q = 2; q * q + q + 1 <= n; q++) {
    if (!isPrimePower(q)) continue;
    if (q * q + q + 1 === n) specs.push(`polarity:q=${q}`);
    if (2 * (q * q + q + 1) === n) specs.push(`projective-plane:q=${q}`);
  }
  for (let a = 4; a <= 30; a++) for (let k = 2; 2 * k < a; k++) if (binomial(a, k) === n) specs.push(`kneser:n=${a},k=${k}`);
  for (let c = 5; c <= n; c += 2) if (n % c === 0 && n / c >= 2) specs.push(`blow-up:of=[cycle:n=${c}],t=${n / c}`);
  if (n % 10 === 0 && n >= 20) specs.push(`blow-up:of=[petersen],t=${n / 10}`);
  if ((n + 1) % 3 === 0 && n >= 5) specs.push(`andrasfai:k=${(n + 1) / 3}`);
  for (let dim = 2; 2 ** dim <= n; dim++) if (2 ** dim === n) specs.push(`hypercube:dim=${dim}`);
  if (n % 4 === 1 && n >= 5 && isPrimePower(n)) specs.push(`paley:q=${n}`);
  const mycielski = [5, 11, 23, 47, 95, 191];
  const steps = mycielski.indexOf(n);
  if (steps >= 0) specs.push(`mycielski-chain:steps=${steps + 1}`);
  const named: Record<number, string[]> = { 10: ["petersen"], 12: ["chvatal"], 14: ["heawood"], 16: ["clebsch"], 20: ["dodecahedron"], 50: ["hoffman-singleton"], 100: ["higman-sims"] };
  specs.push(...(named[n] ?? []));
  if (n % 2 === 0 && n >= 10) specs.push(`generalized-petersen:n=${n / 2},k=2`);
  if (n >= 5) specs.push(`cycle:n=${n}`);
  return specs;
}

/** Is g free of H, proved by an exhaustive search? (A search that runs out of nodes counts as not proved.) */
export function provedFree(g: Graph, pattern: Graph): boolean {
  const r = findSubgraph(g, pattern, { maxNodes: PROOF_NODES });
  return !r.found && r.exhaustive;
}

/** The structured constructions on n vertices that are proved H-free. */
export function referenceConstructions(n: number, pattern: Graph): Construction[] {
  const out: Construction[] = [];
  for (const spec of structuredSpecs(n)) {
    const graph = family(spec);
    if (graph.n === n && graph.m > 0 && provedFree(graph, pattern)) out.push({ label: spec, graph });
  }
  return out;
}

/** The preset name of a pattern the H-free process family knows, or null. */
export function processPreset(name: string | null): HFreePattern | null {
  return name !== null && (HFREE_PATTERNS as readonly string[]).includes(name) ? (name as HFreePattern) : null;
}

/**
 * `count` outputs of the H-free process on n vertices: the family's own process for the presets,
 * otherwise the same process run here with the rooted test (pairs in random order, each added
 * unless it creates a copy of H).
 */
export function processOutputs(n: number, pattern: RootedPattern, presetName: string | null, count: number, graphSeed: number): Construction[] {
  const preset = processPreset(presetName);
  const out: Construction[] = [];
  for (let i = 0; i < count; i++) {
    const seed = (graphSeed + i) >>> 0;
    if (preset !== null) {
      out.push({ label: `hfree-process:n=${n},h=${preset},seed=${seed}`, graph: hfreeProcess(n, preset, seed) });
    } else {
      out.push({ label: `H-free process (rooted test), graph seed ${seed}`, graph: greedyFill(new MutableGraph(n), pattern, new Rng(seed)).toGraph() });
    }
  }
  return out;
}

/** Visit all non-edges in random order and add each unless it creates a copy of H: g becomes maximal H-free. */
export function greedyFill(g: MutableGraph, pattern: RootedPattern, rng: Rng): MutableGraph {
  const n = g.n;
  const pairs: number[] = [];
  for (let u = 0; u < n; u++) for (let v = u + 1; v < n; v++) if (!g.has(u, v)) pairs.push(u * n + v);
  const search = new RootedSearch(g, pattern);
  for (let t = 0; t < pairs.length; t++) {
    const j = t + rng.nextInt(pairs.length - t);
    const p = pairs[j];
    pairs[j] = pairs[t];
    const u = Math.floor(p / n), v = p % n;
    if (!search.createsPattern(u, v)) g.add(u, v);
  }
  return g;
}
