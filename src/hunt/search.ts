// The extremal search: simulated annealing (Kirkpatrick, Gelatt & Vecchi 1983) over H-free graphs
// on n vertices. Every move keeps the graph H-free (an added edge passes the rooted test of
// pattern-through-edge.ts), the SDP of each new graph is warm-started from the vectors of the
// graph it came from, every graph is screened cheaply, and only those that could enter the
// frontier (the best certified graph per m) are certified. Chains start from known constructions,
// H-free process outputs or the empty graph, and later from frontier graphs; all randomness comes
// from one seeded Rng, so under a work budget (iterations) the search is deterministic.

import { invalidParameter } from "../errors.js";
import type { BracketRecord } from "../cut/bracket/record.js";
import type { Graph } from "../graph/graph.js";
import { encodeGraph6 } from "../graph/formats/graph6.js";
import { Rng } from "../random/prng.js";
import { checkSeed } from "../random/seed.js";
import { checkSeconds } from "../validate.js";
import { greedyFill, processOutputs, provedFree, referenceConstructions, type Construction } from "./constructions.js";
import { certifyScreen, screenGraph, type Screen } from "./evaluate.js";
import { MutableGraph } from "./mutable-graph.js";
import { checkObjective, type HuntObjective } from "./objective.js";
import { RootedSearch, rootedPattern, type RootedPattern } from "./pattern-through-edge.js";

import { HUNT_STARTS, type HuntStarts } from "./starts.js";
export { HUNT_STARTS, type HuntStarts };

export interface HuntOptions {
  /** H, as a graph (at least one edge). */
  pattern: Graph;
  /** H's preset name when it is one the H-free process family knows (K3, C4, C5, K4, K2,3), for labels and the family's process. */
  patternName?: string | null;
  n: number;
  objective: HuntObjective;
  /** Work budget: moves in all (each screens one graph). Deterministic. */
  iterations?: number;
  /** Wall-clock budget in seconds (the search stops at whichever budget runs out first). */
  seconds?: number;
  solverSeed?: number;
  starts?: HuntStarts;
  /** H-free process outputs among the starts (default 4). */
  processRuns?: number;
  /** Moves per chain before the next chain starts (default 1500). */
  chainLength?: number;
  /** Mixing-method sweeps per screened graph (default 60). */
  sweeps?: number;
  /** Start and end temperature relative to the first screened value (default 0.04 and 0.001). */
  temperature?: readonly [number, number];
  /** Called every `progressEvery` moves (default 25) and at the end. */
  onProgress?: (p: HuntProgress) => void;
  progressEvery?: number;
  /** Called when a graph enters the frontier (a new m, or a better graph for its m). */
  onFrontier?: (e: FrontierEntry) => void;
}

export interface FrontierEntry {
  n: number;
  m: number;
  /** The certified objective: computed from `record.surplusUpper`. */
  value: number;
  degeneracy: number;
  graph6: string;
  graphHash: string;
  /** Where the chain that found it started (a family spec or a description). */
  start: string;
  /** The move at which it was found (0: a chain's starting graph). */
  iteration: number;
  record: BracketRecord;
}

export interface ReferencePoint {
  label: string;
  m: number;
  degeneracy: number;
  value: number;
  record: BracketRecord;
}

export interface HuntProgress {
  iterations: number;
  /** The work budget, or null under a time budget only. */
  totalIterations: number | null;
  elapsedSeconds: number;
  accepted: number;
  certified: number;
  chains: number;
  frontierSize: number;
  /** The smallest certified value on the frontier, and its m. */
  best: number | null;
  bestM: number | null;
  currentM: number;
  start: string;
}

export interface HuntResult {
  n: number;
  objective: HuntObjective;
  /** Best certified graph per m, ascending m. */
  frontier: FrontierEntry[];
  /** The known constructions on n vertices and the H-free process outputs, certified the same way (reference values). */
  references: ReferencePoint[];
  best: FrontierEntry | null;
  iterations: number;
  accepted: number;
  certified: number;
  chains: number;
  status: "iteration-limit" | "time-limit";
  seconds: number;
  solverSeed: number;
  starts: HuntStarts;
}

const OWNER = "hunt";

/** One applied move, as the edges it added and removed (undone in reverse). */
interface MoveLog {
  added: number[];
  removed: number[];
}

class Chain {
  readonly log: MoveLog = { added: [], removed: [] };
  constructor(
    readonly g: MutableGraph,
    readonly search: RootedSearch,
    readonly rng: Rng,
  ) {}

  private add(u: number, v: number): void {
    this.g.add(u, v);
    this.log.added.push(u, v);
  }

  private remove(u: number, v: number): void {
    this.g.remove(u, v);
    this.log.removed.push(u, v);
  }

  undo(): void {
    const { added, removed } = this.log;
    for (let i = added.length - 2; i >= 0; i -= 2) this.g.remove(added[i], added[i + 1]);
    for (let i = removed.length - 2; i >= 0; i -= 2) this.g.add(removed[i], removed[i + 1]);
    this.clear();
  }

  clear(): void {
    this.log.added.length = 0;
    this.log.removed.length = 0;
  }

  /** Add a uniformly drawn admissible non-edge (up to `tries` draws); false when none was found. */
  addRandom(tries = 64): boolean {
    const n = this.g.n;
    for (let t = 0; t < tries; t++) {
      const u = this.rng.nextInt(n), v = this.rng.nextInt(n);
      if (u === v || this.g.has(u, v)) continue;
      if (!this.search.createsPattern(u, v)) {
        this.add(u, v);
        return true;
      }
    }
    return false;
  }

  removeRandom(): boolean {
    if (this.g.m === 0) return false;
    const [u, v] = this.g.edgeAt(this.rng.nextInt(this.g.m));
    this.remove(u, v);
    return true;
  }

  /** Re-draw x's neighbourhood: drop its edges, then join it to admissible vertices in random order up to a degree near the old one. */
  switchVertex(): boolean {
    const n = this.g.n;
    const x = this.rng.nextInt(n);
    const old = this.g.neighbours(x);
    for (const y of old) this.remove(x, y);
    const target = Math.max(1, old.length + this.rng.nextInt(3) - 1);
    const order = Array.from({ length: n }, (_, i) => i);
    for (let i = n - 1; i > 0; i--) {
      const j = this.rng.nextInt(i + 1);
      [order[i], order[j]] = [order[j], order[i]];
    }
    let d = 0;
    for (const y of order) {
      if (d >= target) break;
      if (y === x || this.g.has(x, y)) continue;
      if (!this.search.createsPattern(x, y)) {
        this.add(x, y);
        d++;
      }
    }
    return this.log.added.length > 0 || this.log.removed.length > 0;
  }

  /** One random move; `keepM` allows only swaps (a fixed-m hunt). */
  move(keepM: boolean): boolean {
    const r = this.rng.nextFloat();
    if (keepM || (r >= 0.3 && r < 0.65)) {
      if (!this.removeRandom()) return false;
      if (this.addRandom()) return true;
      this.undo();
      return false;
    }
    if (r < 0.15) return this.switchVertex();
    if (r < 0.3) return this.removeRandom();
    return this.addRandom();
  }
}

/** Bring a start to exactly m edges (a fixed-m hunt): drop random edges, or add admissible ones. False when it cannot reach m. */
function fitEdgeCount(chain: Chain, m: number): boolean {
  while (chain.g.m > m) chain.removeRandom();
  let misses = 0;
  while (chain.g.m < m && misses < 20) misses = chain.addRandom(256) ? 0 : misses + 1;
  chain.clear();
  return chain.g.m === m;
}

function checkOptions(o: HuntOptions): void {
  if (!(Number.isInteger(o.n) && o.n >= o.pattern.n && o.n <= 256)) throw invalidParameter(OWNER, "n", `should be an integer between |V(H)| = ${o.pattern.n} and 256`, o.n);
  if (o.pattern.weights !== null) throw invalidParameter(OWNER, "pattern", "should be unweighted", "weighted graph");
  checkObjective(OWNER, o.objective, o.n);
  if (o.iterations !== undefined && !(Number.isInteger(o.iterations) && o.iterations >= 0)) throw invalidParameter(OWNER, "iterations", "should be a non-negative integer", o.iterations);
  if (o.iterations === undefined && o.seconds === undefined) throw invalidParameter(OWNER, "iterations", "a work budget (iterations) or a time budget (seconds) is needed", "neither given");
  if (o.seconds !== undefined) checkSeconds(OWNER, o.seconds, 1);
  if (o.starts !== undefined && !HUNT_STARTS.includes(o.starts)) throw invalidParameter(OWNER, "starts", `should be one of ${HUNT_STARTS.join(", ")}`, o.starts);
  for (const [name, v, lo] of [["processRuns", o.processRuns, 0], ["chainLength", o.chainLength, 1], ["sweeps", o.sweeps, 1], ["progressEvery", o.progressEvery, 1]] as const) {
    if (v !== undefined && !(Number.isInteger(v) && v >= lo)) throw invalidParameter(OWNER, name, `should be an integer ≥ ${lo}`, v);
  }
  const t = o.temperature;
  if (t !== undefined && !(t.length === 2 && t[0] > 0 && t[1] > 0 && t[1] <= t[0] && Number.isFinite(t[0]))) {
    throw invalidParameter(OWNER, "temperature", "should be two numbers start ≥ end > 0", JSON.stringify(t));
  }
}

/**
 * Search H-free graphs on n vertices for small certified values of the objective. Returns the
 * frontier (best certified graph per m, each with its bracket record) and the reference
 * constructions certified the same way.
 */
export function hunt(options: HuntOptions): HuntResult {
  checkOptions(options);
  const t0 = performance.now();
  const seed = checkSeed(OWNER, "solverSeed", options.solverSeed);
  const { n, objective, pattern } = options;
  const startsMode = options.starts ?? "references";
  const chainLength = options.chainLength ?? 1500;
  const sweeps = options.sweeps ?? 60;
  const [tStart, tEnd] = options.temperature ?? [0.04, 0.001];
  const every = options.progressEvery ?? 25;
  const budget = options.iterations ?? Infinity;
  const deadline = options.seconds === undefined ? Infinity : t0 + options.seconds * 1000;
  const rooted: RootedPattern = rootedPattern(pattern);
  const rng = new Rng(seed, 7);
  const keepM = objective.kind === "surplus";
  const screenOpts = { sweeps, solverSeed: seed };

  const frontier = new Map<number, FrontierEntry>();
  const frontierGraphs = new Map<number, Graph>();
  let certified = 0;
  const offer = (s: Screen, start: string, iteration: number): void => {
    const held = frontier.get(s.graph.m);
    if (!Number.isFinite(s.floorValue) || (held !== undefined && s.floorValue >= held.value)) return;
    certified++;
    const c = certifyScreen(s, objective, seed);
    if (!Number.isFinite(c.value) || (held !== undefined && c.value >= held.value)) return;
    const e: FrontierEntry = {
      n,
      m: s.graph.m,
      value: c.value,
      degeneracy: c.degeneracy,
      graph6: encodeGraph6(s.graph),
      graphHash: c.record.graphHash,
      start,
      iteration,
      record: c.record,
    };
    frontier.set(e.m, e);
    frontierGraphs.set(e.m, s.graph);
    options.onFrontier?.(e);
  };

  // Reference lines: the known constructions, certified like any frontier graph (a long screen first).
  const references: ReferencePoint[] = [];
  const known = referenceConstructions(n, pattern);
  const processed = processOutputs(n, rooted, options.patternName ?? null, options.processRuns ?? 4, seed);
  // The constructions and the process outputs are reference values whatever the chains start from.
  for (const k of [...known, ...processed]) {
    if (k.graph.m === 0) continue;
    const s = screenGraph(k.graph, objective, null, { sweeps: 500, solverSeed: seed });
    const c = certifyScreen(s, objective, seed, [`reference construction ${k.label}`]);
    if (Number.isFinite(c.value)) references.push({ label: k.label, m: k.graph.m, degeneracy: c.degeneracy, value: c.value, record: c.record });
  }

  const starts: Construction[] = [];
  if (startsMode === "references") starts.push(...known);
  if (startsMode !== "empty") starts.push(...processed);
  if (startsMode === "empty" || starts.length === 0) starts.push({ label: "empty graph, filled greedily", graph: new MutableGraph(n).toGraph() });
  for (const s of starts) if (!provedFree(s.graph, pattern)) throw new Error(`hunt: starting graph ${s.label} contains H`);

  let iterations = 0, accepted = 0, chains = 0;
  let status: HuntResult["status"] = "iteration-limit";
  let scale = NaN;
  let label = "";
  let currentM = 0;
  const bestEntry = (): FrontierEntry | null => {
    let b: FrontierEntry | null = null;
    for (const e of frontier.values()) if (b === null || e.value < b.value) b = e;
    return b;
  };
  const report = (): void => {
    const b = bestEntry();
    options.onProgress?.({
      iterations, totalIterations: Number.isFinite(budget) ? budget : null, elapsedSeconds: (performance.now() - t0) / 1000,
      accepted, certified, chains, frontierSize: frontier.size, best: b?.value ?? null, bestM: b?.m ?? null, currentM, start: label,
    });
  };
  const outOfBudget = (): boolean => {
    if (iterations >= budget) return true;
    if (performance.now() > deadline) {
      status = "time-limit";
      return true;
    }
    return false;
  };

  while (!outOfBudget()) {
    // The next chain: the starts in turn, then graphs of the frontier drawn at random.
    let g: MutableGraph;
    if (chains < starts.length) {
      g = MutableGraph.of(starts[chains].graph);
      label = starts[chains].label;
      if (g.m === 0) greedyFill(g, rooted, rng);
    } else {
      const entries = [...frontier.values()];
      if (entries.length === 0) {
        g = greedyFill(new MutableGraph(n), rooted, rng);
        label = "empty graph, filled greedily";
      } else {
        const e = entries[rng.nextInt(entries.length)];
        g = MutableGraph.of(frontierGraphs.get(e.m)!);
        label = `frontier graph at m = ${e.m} (from ${e.start})`;
      }
    }
    chains++;
    const chain = new Chain(g, new RootedSearch(g, rooted), rng);
    if (keepM && !fitEdgeCount(chain, (objective as { m: number }).m)) {
      // A start that cannot reach m edges still costs a move, so an m no H-free graph reaches ends with the budget.
      iterations++;
      continue;
    }
    let cur = screenGraph(g.toGraph(), objective, null, { sweeps: 10 * sweeps, solverSeed: seed });
    currentM = g.m;
    offer(cur, label, 0);
    if (!Number.isFinite(scale) && Number.isFinite(cur.value)) scale = Math.abs(cur.value) || 1;
    const t = Number.isFinite(scale) ? scale : 1;
    for (let step = 0; step < chainLength && !outOfBudget(); step++) {
      iterations++;
      const temp = t * tStart * (tEnd / tStart) ** (step / chainLength);
      if (chain.move(keepM)) {
        const next = screenGraph(g.toGraph(), objective, cur.sdp.vectors, screenOpts);
        offer(next, label, iterations);
        const delta = next.value - cur.value;
        if (Number.isFinite(next.value) && (delta <= 0 || rng.nextFloat() < Math.exp(-delta / temp))) {
          cur = next;
          currentM = g.m;
          accepted++;
          chain.clear();
        } else chain.undo();
      }
      if (iterations % every === 0) report();
    }
  }
  report();
  const list = [...frontier.values()].sort((a, b) => a.m - b.m);
  return {
    n, objective, frontier: list, references, best: bestEntry(), iterations, accepted, certified, chains, status,
    seconds: (performance.now() - t0) / 1000, solverSeed: seed, starts: startsMode,
  };
}
