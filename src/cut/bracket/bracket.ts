// The max-cut bracket: runs several methods under one time budget and keeps the best cut (lower)
// and the best certified upper bound, in a plain JSON-ready record that `verify` can re-check
// from the graph alone (partition for the lower bound, certificate for the upper bound).

import { InputError, invalidParameter } from "../../errors.js";
import { cutValue, floorCutBound, surplusOf } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { hasIntegerWeights } from "../../graph/weights.js";
import { roundUp } from "../../linalg/float-rounding.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import { nowSeconds, type ExactCutRecord, type ExactProgress } from "../exact/common.js";
import { exactMaxCut } from "../exact/exact-max-cut.js";
import { closingTolerance, exactSearchSlack } from "../exact/exact-slack.js";
import { BreakoutSearcher } from "../heuristic/breakout.js";
import { hyperplaneRound } from "../heuristic/hyperplane-rounding.js";
import { localSearch } from "../heuristic/local-search.js";
import { vectorMethodRound } from "../heuristic/vector-rounding.js";
import { DENSE_PROOF_LIMIT, upperKindOf } from "../relaxation/certificate.js";
import { eigenvalueUpperBound } from "../relaxation/eigenvalue-bound.js";
import { certifySdpDual } from "../relaxation/sdp-bound.js";
import { solveSdp, type SdpRecord } from "../relaxation/sdp-mixing.js";
import { positiveWeightBound } from "../positive-weights.js";
import { solveTriangleSdp, type TriangleSdpRecord } from "../relaxation/triangle-sdp.js";
import { TREE_RELAXATIONS, relaxationTreeSearch, type TreeRelaxation, type TreeSearchRecord } from "../tree/relaxation-tree.js";
import type { CutRecord, DualCertificate, UpperBoundRecord, UpperKind } from "../types.js";
import { recordEnvelope } from "../../graph/record/envelope.js";
import type { GraphSource } from "../../graph/record/source.js";
import {
  BRACKET_EFFORTS,
  BRACKET_RECORD_KIND,
  BRACKET_RECORD_VERSION,
  recordFromSnapshot,
  type BracketCertificate,
  type BracketEffort,
  type BracketRecord,
  type BracketRun,
  type BracketSnapshot,
} from "./record.js";

export const DEFAULT_BRACKET_SECONDS = 10;

/** Largest n that "auto" always hands to exact search first (measured: < 2 s worst case at n = 30). */
export const AUTO_EXACT_VERTICES = 30;

export interface BracketProgress {
  method: string;
  lower: number;
  upper: number;
  elapsed: number;
  /** The record as it stands now (a verifiable partial result), built only when called. */
  snapshot: () => BracketSnapshot;
}

export interface BracketOptions {
  /** Time budget in seconds (default 10). Certification steps may run a little past it. */
  seconds?: number;
  /** Seed of every randomised solver the bracket runs (default 0); each run gets a seed derived from it. */
  solverSeed?: number;
  /** How much work to put in (default "auto"); see BracketEffort. */
  effort?: BracketEffort;
  /** Called after each method, and every half second during long searches. */
  onProgress?: (p: BracketProgress) => void;
  /** Where the graph came from, copied into the record so `verify` can rebuild it. */
  source?: GraphSource;
  /** Notes to carry into the record (e.g. what the reader merged or dropped). */
  notes?: readonly string[];
  /** Effort "deep": the node bound of its branch and bound (default "triangles"). */
  relaxation?: TreeRelaxation;
  /** Effort "deep": a deterministic budget of branch-and-bound nodes (default: time only). */
  treeNodes?: number;
}

/** A seed per method, derived from the bracket's solverSeed so every run is reproducible. */
function methodSeed(seed: number, k: number): number {
  return (seed + Math.imul(k + 1, 0x9e3779b9)) >>> 0;
}

function plainDetails(d: CutRecord["details"]): BracketRun["details"] {
  if (d === undefined) return undefined;
  const out: Record<string, number | string | boolean | null> = {};
  for (const [k, v] of Object.entries(d)) if (v === null || ["number", "string", "boolean"].includes(typeof v)) out[k] = v;
  return out;
}

/** Mutable state of one bracket run: best cut, best certified bound, the run log. */
class BracketState {
  readonly graph: Graph;
  readonly integral: boolean;
  /** Non-integer weights: how far `upper` may sit above `lower` in a closed bracket (closingTolerance). */
  readonly tolerance: number;
  /** Non-integer weights: the exact search's slack (src/cut/exact/exact-slack.ts), 0 otherwise. */
  readonly slack: number;
  readonly t0: number;
  readonly deadline: number;
  lower = -Infinity;
  lowerMethod = "none";
  partition: Uint8Array;
  upper: number;
  upperMethod = "positive-weights";
  upperKind: UpperKind = "proven";
  certificate: BracketCertificate;
  exact = false;
  readonly runs: BracketRun[] = [];
  private readonly onProgress?: (p: BracketProgress) => void;

  constructor(
    graph: Graph,
    seconds: number,
    onProgress: ((p: BracketProgress) => void) | undefined,
    readonly meta: { solverSeed: number; effort: BracketEffort; source: GraphSource | undefined; notes: readonly string[] },
  ) {
    this.graph = graph;
    this.integral = hasIntegerWeights(graph);
    this.slack = this.integral ? 0 : exactSearchSlack(graph);
    this.tolerance = closingTolerance(graph);
    this.t0 = nowSeconds();
    this.deadline = this.t0 + seconds;
    this.onProgress = onProgress;
    this.partition = new Uint8Array(graph.n);
    this.lower = cutValue(graph, this.partition);
    this.lowerMethod = "all-on-one-side";
    // Proven as computed (rounded up for non-integer weights): nothing to round down.
    this.upper = positiveWeightBound(graph);
    this.certificate = { kind: "positive-weights", roundedDown: false, tolerance: this.tolerance };
  }

  private envelope_: { kind: typeof BRACKET_RECORD_KIND; graphHash: string; source: GraphSource } | null = null;

  /** The record's envelope (the graph's hash, the source with its embedded copy), made once: snapshots ask again. */
  envelope(): { kind: typeof BRACKET_RECORD_KIND; graphHash: string; source: GraphSource } {
    if (this.envelope_ === null) this.envelope_ = recordEnvelope(BRACKET_RECORD_KIND, BRACKET_RECORD_VERSION, this.graph, this.meta.source);
    return this.envelope_;
  }

  left(): number {
    return this.deadline - nowSeconds();
  }

  elapsed(): number {
    return nowSeconds() - this.t0;
  }

  /** Exact integer weights: every cut is an integer, so a proven bound may be rounded down (as verify does). */
  round(bound: number): number {
    return this.integral ? floorCutBound(bound) : bound;
  }

  /**
   * What to publish for an exact search's proven bound: for non-integer weights the bound plus twice
   * the search's slack, so that verify's own re-run (whose cut may differ by up to the slack) proves
   * a bound no higher than the published one.
   */
  searchBound(upper: number): number {
    return this.integral ? floorCutBound(upper) : roundUp(upper + 2 * this.slack, 2);
  }

  closed(): boolean {
    // An unproven (Lanczos) upper bound never closes the bracket: `exact` claims a proof.
    // Fixes the K_400 case in test/bracket.test.ts ("an unproven bound never closes the bracket").
    return this.exact || (this.integral && this.upperKind === "proven" && this.lower >= this.upper);
  }

  progress(method: string): void {
    this.onProgress?.({ method, lower: this.lower, upper: this.upper, elapsed: this.elapsed(), snapshot: () => snapshotOf(this) });
  }

  offerCut(r: CutRecord, role: BracketRun["role"] = "lower"): void {
    this.runs.push({ method: r.method, role, value: r.value, status: r.status, seconds: r.seconds, solverSeed: r.solverSeed, details: plainDetails(r.details) });
    if (r.value > this.lower) {
      // The record's value is the solver's claim; the bracket keeps only what cutValue confirms.
      const v = cutValue(this.graph, r.partition);
      if (v > this.lower) {
        this.lower = v;
        this.lowerMethod = r.method;
        this.partition = Uint8Array.from(r.partition);
      }
    }
    this.progress(r.method);
  }

  offerDual(r: UpperBoundRecord): void {
    this.runs.push({ method: r.method, role: "upper", value: r.value, status: r.status, seconds: r.seconds, solverSeed: null, details: plainDetails(r.details) });
    const cert = r.certificate;
    if (cert !== null && Number.isFinite(r.value)) {
      const bound = this.round(r.value);
      const kind = upperKindOf(cert.shiftProof);
      // An estimated bound below a cut we hold is refuted by that cut: never adopt it.
      if (bound < this.upper && (kind === "proven" || bound >= this.lower)) {
        this.upper = bound;
        this.upperMethod = r.method;
        this.upperKind = kind;
        this.certificate = toPlainDual(cert, this.integral, this.tolerance);
      }
    }
    this.progress(r.method);
  }

  /** Progress callback for an exact search: shows it is alive, and its incumbent when that is better. */
  exactProgress(method: string): (p: ExactProgress) => void {
    return (p) => this.onProgress?.({ method, lower: Math.max(this.lower, p.lower), upper: this.upper, elapsed: this.elapsed(), snapshot: () => snapshotOf(this) });
  }

  offerExact(r: ExactCutRecord): void {
    this.runs.push({ method: r.method, role: "exact", value: r.value, upper: r.upper, status: r.status, seconds: r.seconds, solverSeed: r.solverSeed, details: plainDetails(r.details) });
    this.takeCut(r);
    if (r.status === "optimal") {
      this.exact = true;
      // Non-integer weights: the search proves value + slack, which an earlier certificate may beat.
      const bound = this.searchBound(r.upper);
      if (bound <= this.upper || this.upperKind !== "proven") {
        this.upper = bound;
        this.upperMethod = r.method;
        this.upperKind = "proven";
        this.certificate = { kind: "exhaustive", search: r.method, graySteps: r.graySteps, branchNodes: r.branchNodes, roundedDown: false, tolerance: this.tolerance };
      }
    } else {
      const bound = this.searchBound(r.upper);
      if (bound < this.upper) {
        this.upper = bound;
        this.upperMethod = r.method;
        this.upperKind = "proven";
        this.certificate = { kind: "unfinished-search", search: r.method, graySteps: r.graySteps, branchNodes: r.branchNodes, roundedDown: this.integral, tolerance: this.tolerance };
      }
    }
    this.progress(r.method);
  }

  /** The SDP with triangle inequalities: its certified bound (effort "deep"). */
  offerTriangle(r: TriangleSdpRecord): void {
    this.runs.push({ method: r.method, role: "upper", value: r.value, status: r.status, seconds: r.seconds, solverSeed: r.solverSeed, details: { plainValue: r.plainValue, rounds: r.rounds, inequalities: r.inequalities } });
    const bound = this.round(r.value);
    if (Number.isFinite(bound) && bound < this.upper) {
      const c = r.certificate;
      this.upper = bound;
      this.upperMethod = r.method;
      this.upperKind = "proven";
      this.certificate = { kind: "triangle-dual", y: Array.from(c.y), shift: c.shift, shiftProof: c.shiftProof, triangles: Array.from(c.triangles), mu: Array.from(c.mu), roundedDown: this.integral, tolerance: this.tolerance };
    }
    this.progress(r.method);
  }

  /** Relaxation-bounded branch and bound (effort "deep"): its cut, and its regions when they prove a better bound. */
  offerTree(r: TreeSearchRecord): void {
    this.runs.push({ method: r.method, role: "exact", value: r.value, upper: r.upper, status: r.status, seconds: r.seconds, solverSeed: r.solverSeed, details: plainDetails(r.details) });
    this.takeCut(r);
    if (r.certificate.regions.length > 0 && r.upper < this.upper) {
      this.upper = r.upper;
      this.upperMethod = r.method;
      this.upperKind = "proven";
      this.certificate = { kind: "sdp-tree", rootVertex: r.certificate.rootVertex, relaxation: r.relaxation, regions: r.certificate.regions, nodes: r.nodes, roundedDown: true, tolerance: this.tolerance };
    }
    this.progress(r.method);
  }

  /** Progress of the tree search: its incumbent and its running upper end (certified at the end). */
  treeProgress(method: string): (p: { lower: number; upper: number }) => void {
    return (p) => this.onProgress?.({ method, lower: Math.max(this.lower, p.lower), upper: Math.min(this.upper, p.upper), elapsed: this.elapsed(), snapshot: () => snapshotOf(this) });
  }

  /**
   * Run an optional method; when it refuses this graph (it would not fit in memory, or the graph is
   * too large for it: an InputError), log it as skipped with the reason and go on without it.
   */
  attempt(method: string, role: BracketRun["role"], run: () => void): boolean {
    try {
      run();
      return true;
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      this.runs.push({ method, role, value: 0, status: "skipped", seconds: 0, solverSeed: null, details: { reason: e.message } });
      this.progress(method);
      return false;
    }
  }

  /** Keep r's partition if it beats the best cut (re-evaluated with cutValue), without logging a run. */
  takeCut(r: CutRecord): void {
    const v = cutValue(this.graph, r.partition);
    if (v > this.lower) {
      this.lower = v;
      this.lowerMethod = r.method;
      this.partition = Uint8Array.from(r.partition);
    }
  }
}

function toPlainDual(c: DualCertificate, roundedDown: boolean, tolerance: number): BracketCertificate {
  return { kind: "psd-dual", y: Array.from(c.y), shift: c.shift, shiftProof: c.shiftProof, roundedDown, tolerance };
}

/** Run breakout search in slices, reporting progress, until `seconds` or `rounds` run out or the bracket closes. */
function runBreakout(state: BracketState, seconds: number, rounds: number, seed: number): void {
  if (seconds <= 0 || state.closed()) return;
  const searcher = new BreakoutSearcher(state.graph, {
    solverSeed: seed,
    initial: state.partition,
    upperBound: state.upper,
  });
  const stop = nowSeconds() + seconds;
  let done = 0;
  for (;;) {
    const left = stop - nowSeconds();
    if (left <= 0 || done >= rounds) break;
    // Half-second slices keep the progress display alive on long runs.
    const status = searcher.run({ seconds: Math.min(left, 0.5), iterations: rounds - done });
    const best = searcher.best();
    done = Number(best.details?.rounds ?? rounds);
    if (best.value > state.lower) {
      state.takeCut(best);
      state.progress("breakout");
    }
    if (status !== "time-limit") break; // "optimal": reached the upper bound; "iteration-limit": rounds used up
  }
  const best = searcher.best();
  state.runs.push({ method: best.method, role: "lower", value: best.value, status: best.status, seconds: best.seconds, solverSeed: best.solverSeed, details: plainDetails(best.details) });
  state.takeCut(best);
}

/**
 * Seconds for the dense Cholesky proof of a shift at n vertices: ≈ 1.1e-9·n³ (measured in
 * bench/bracket on the development machine: 0.7 s at n = 800, 11 s at 2000, 29 s at 3000).
 */
function denseProofSeconds(n: number): number {
  return 1.1e-9 * n * n * n;
}

/** Heuristic lower bounds plus certified upper bounds, within `budgetShare` of what is left. */
function heuristicPhase(state: BracketState, seed: number, quick: boolean, budgetShare: number): void {
  const g = state.graph;
  const n = g.n;
  const total = Math.max(0, state.left()) * budgetShare;
  const phaseEnd = nowSeconds() + total;
  const phaseLeft = (): number => Math.max(0, phaseEnd - nowSeconds());
  // A dense proof is used only when it fits in the given share of the time left; otherwise the
  // shift is a Lanczos estimate and the record says so (upperKind = "estimate").
  const denseLimitFor = (share: number): number => (n <= DENSE_PROOF_LIMIT && denseProofSeconds(n) <= share * phaseLeft() ? DENSE_PROOF_LIMIT : 0);
  // Residual tolerance for Lanczos shifts: 1e-7 relative moves the bound by ~1e-7·n·‖L‖/4, far
  // below the gaps of interest, and converges in about half the iterations of the default.
  const tolerance = 1e-7;

  // A first cut in a few milliseconds: multi-start 1-flip local search.
  state.offerCut(localSearch(g, { seconds: Math.max(1e-3, Math.min(0.05 * total, 1)), iterations: quick ? 4 : 16, solverSeed: methodSeed(seed, 1) }));

  // The eigenvalue bound (the dual certificate with y = 0): one Lanczos run, or a small dense proof.
  const tEigen0 = nowSeconds();
  state.attempt("eigenvalue", "upper", () => state.offerDual(eigenvalueUpperBound(g, { tolerance, denseLimit: denseLimitFor(0.05) })));
  const eigenSeconds = nowSeconds() - tEigen0;
  if (state.closed()) return;

  // The SDP: its vectors feed hyperplane rounding, its dual estimate feeds the certificate.
  // Certifying costs about two Lanczos runs (≈ 2.5× the eigenvalue bound) or a dense proof.
  const dense = denseLimitFor(0.3);
  const certifyCost = dense > 0 ? denseProofSeconds(n) + eigenSeconds : 2.5 * eigenSeconds;
  const forSdp = (quick ? 0.3 : 0.45) * phaseLeft() - certifyCost;
  if (forSdp > Math.min(0.5, 0.05 * total) || n <= 64) {
    // Solved and certified as two attempts: when the certificate does not fit in memory, the
    // SDP's vectors still feed hyperplane rounding.
    let solved: SdpRecord | null = null;
    state.attempt("sdp-mixing", "relaxation", () => {
      solved = solveSdp(g, {
        solverSeed: methodSeed(seed, 2),
        seconds: Math.max(1e-3, forSdp),
        maxSweeps: quick ? 300 : undefined,
        // Large graphs: a low rank affords many more sweeps in the same time, which matters more
        // than the rank (bench/bracket: rank 24 beats the default rank 201 at 10^6 edges).
        rank: g.m > 100_000 ? Math.min(24, n) : undefined,
      });
    });
    if (solved !== null) {
      const sdp: SdpRecord = solved;
      state.runs.push({ method: sdp.method, role: "relaxation", value: sdp.value, status: sdp.status, seconds: sdp.seconds, solverSeed: sdp.solverSeed, details: { sweeps: sdp.sweeps, rank: sdp.rank } });
      state.attempt("sdp-certified", "upper", () => state.offerDual(certifySdpDual(g, sdp, { tolerance, denseLimit: dense })));
      if (state.closed()) return;
      const trials = quick ? 8 : n <= 5000 ? 64 : 16;
      state.offerCut(hyperplaneRound(g, sdp.vectors, sdp.rank, { trials, solverSeed: methodSeed(seed, 3), polish: true }));
      if (state.closed()) return;
    }
  }
  if (quick) return;
  // Sparse vector rounding: its set-up (the exact guarantee) costs about one Lanczos run.
  if (phaseLeft() > 3 * eigenSeconds) {
    state.attempt("vector-rounding", "lower", () => state.offerCut(vectorMethodRound(g, { trials: n <= 5000 ? 32 : 8, solverSeed: methodSeed(seed, 4), polish: true })));
    if (state.closed()) return;
  }
  // Breakout gets what is left of the phase; the round cap (≈ 50 n² rounds, a few µs each at
  // n = 200) keeps small graphs, whose bound may never meet the cut, from idling to the deadline.
  runBreakout(state, phaseLeft(), 1000 + 50 * n * n, methodSeed(seed, 5));
}

/**
 * Effort "deep": the SDP with triangle inequalities (a fifth of what is left), then branch and bound
 * bounded by the chosen relaxation, warm-started from the best cut, for the rest. The tree search
 * needs integer weights; other graphs keep the strengthened bound (the search is logged as skipped).
 */
function deepPhase(state: BracketState, seed: number, relaxation: TreeRelaxation, treeNodes: number | undefined): void {
  const g = state.graph;
  state.attempt("sdp-triangles", "upper", () =>
    state.offerTriangle(solveTriangleSdp(g, { solverSeed: methodSeed(seed, 6), seconds: Math.max(1e-3, 0.2 * state.left()), iterations: 60, target: state.lower })),
  );
  if (state.closed()) return;
  state.attempt("exact-sdp-tree", "exact", () =>
    state.offerTree(
      relaxationTreeSearch(g, {
        seconds: Math.max(1e-3, state.left()),
        work: treeNodes,
        solverSeed: methodSeed(seed, 7),
        initial: state.partition,
        relaxation,
        onProgress: state.treeProgress("sdp tree"),
      }),
    ),
  );
}

/** Is branch and bound worth part of the budget? A practical rule from bench/cut-exact: small or sparse graphs. */
function exactLooksFeasible(g: Graph): boolean {
  return g.n <= 50 || (g.n <= 150 && g.m <= 3 * g.n);
}

export function bracket(graph: Graph, options: BracketOptions = {}): BracketRecord {
  return recordFromSnapshot(bracketSnapshot(graph, options));
}

/** `bracket`, returning the record with its partition as a typed array (see BracketSnapshot). */
export function bracketSnapshot(graph: Graph, options: BracketOptions = {}): BracketSnapshot {
  const owner = "bracket";
  const seconds = checkSeconds(owner, options.seconds, DEFAULT_BRACKET_SECONDS);
  const seed = checkSeed(owner, "solverSeed", options.solverSeed);
  const effort = options.effort ?? "auto";
  if (!BRACKET_EFFORTS.includes(effort)) throw invalidParameter(owner, "effort", `should be one of ${BRACKET_EFFORTS.join(", ")}`, effort);
  if (options.relaxation !== undefined && !TREE_RELAXATIONS.includes(options.relaxation)) throw invalidParameter(owner, "relaxation", `should be one of ${TREE_RELAXATIONS.join(", ")}`, options.relaxation);
  if (options.treeNodes !== undefined && !(Number.isInteger(options.treeNodes) && options.treeNodes > 0)) throw invalidParameter(owner, "treeNodes", "should be a positive integer", options.treeNodes);
  const state = new BracketState(graph, seconds, options.onProgress, { solverSeed: seed, effort, source: options.source, notes: [...(options.notes ?? [])] });
  state.progress("start");

  if (graph.m > 0) {
    if (effort === "exact") {
      state.offerExact(exactMaxCut(graph, { seconds: Math.max(1e-3, state.left()), solverSeed: seed, onProgress: state.exactProgress("exact search") }));
      if (!state.closed()) state.attempt("eigenvalue", "upper", () => state.offerDual(eigenvalueUpperBound(graph, { denseLimit: graph.n <= 1000 ? 3000 : 0 })));
    } else if (effort === "deep") {
      heuristicPhase(state, seed, false, 0.15);
      if (!state.closed()) deepPhase(state, seed, options.relaxation ?? "triangles", options.treeNodes);
    } else if (effort === "auto" && graph.n <= AUTO_EXACT_VERTICES) {
      state.offerExact(exactMaxCut(graph, { seconds: Math.max(1e-3, state.left()), solverSeed: seed, onProgress: state.exactProgress("exact search") }));
      if (!state.closed()) heuristicPhase(state, seed, false, 1);
    } else if (effort === "auto" && exactLooksFeasible(graph)) {
      // Heuristics first (a good incumbent prunes far more), then exact search on the rest.
      heuristicPhase(state, seed, false, 0.3);
      if (!state.closed()) {
        state.offerExact(exactMaxCut(graph, { seconds: Math.max(1e-3, state.left()), solverSeed: seed, initial: state.partition, onProgress: state.exactProgress("exact search") }));
      }
    } else {
      heuristicPhase(state, seed, effort === "quick", 1);
    }
  } else {
    state.exact = true; // no edges: every cut is 0
    state.upper = 0;
    state.upperMethod = "positive-weights";
  }
  return snapshotOf(state);
}

/** The record of a bracket state: at the end of a run, or as a snapshot while it runs. */
function snapshotOf(state: BracketState): BracketSnapshot {
  const graph = state.graph;
  const exact = state.closed();
  const envelope = state.envelope();
  // Never publish upper < lower. With exact integer weights a proven bound rounded down can't fall
  // below a cut; with other weights a rounded-up dual bound may still sit an ulp under a cut value
  // that rounded up, and then the cut's value is itself a bound the certificate proves.
  const upper = Math.max(state.upper, state.lower);
  return {
    kind: envelope.kind,
    version: BRACKET_RECORD_VERSION,
    graphHash: envelope.graphHash,
    n: graph.n,
    m: graph.m,
    totalWeight: graph.totalWeight,
    lower: state.lower,
    upper,
    exact,
    upperKind: state.upperKind,
    surplusLower: surplusOf(graph, state.lower),
    surplusUpper: surplusOf(graph, upper),
    lowerMethod: state.lowerMethod,
    upperMethod: state.upperMethod,
    seconds: state.elapsed(),
    solverSeed: state.meta.solverSeed,
    effort: state.meta.effort,
    partition: state.partition.slice(),
    certificate: state.certificate,
    runs: state.runs.slice(),
    notes: [...state.meta.notes],
    // Last, so the (possibly long) embedded graph does not hide the numbers in a JSON line.
    source: envelope.source,
  };
}
