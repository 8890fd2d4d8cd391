// The max-cut bracket: runs several methods under one budget (wall-clock seconds, or deterministic
// work units: src/cut/bracket/work-units.ts) and keeps the best cut (lower) and the best certified
// upper bound, in a plain JSON-ready record that `verify` can re-check from the graph alone
// (partition for the lower bound, certificate for the upper bound). While the bracket is open it
// keeps improving both ends until the budget is spent; the record's `budget` says where it went.

import { InputError, invalidParameter } from "../../errors.js";
import { cutValue, floorCutBound, surplusOf } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { hasIntegerWeights } from "../../graph/weights.js";
import { roundUp } from "../../linalg/float-rounding.js";
import { checkSeed } from "../../random/seed.js";
import { checkSeconds } from "../../validate.js";
import { nowSeconds, type ExactCutRecord, type ExactProgress } from "../exact/common.js";
import { BudgetMeter } from "./budget.js";
import { unitsOf, workCosts, type WorkCosts } from "./work-units.js";
import { exactMaxCut } from "../exact/exact-max-cut.js";
import { closingTolerance, exactSearchSlack } from "../exact/exact-slack.js";
import { BreakoutSearcher } from "../heuristic/breakout.js";
import { hyperplaneRound } from "../heuristic/hyperplane-rounding.js";
import { localSearch } from "../heuristic/local-search.js";
import { MEMETIC_MIN_VERTICES, memeticSearch } from "../heuristic/memetic.js";
import { vectorMethodRound } from "../heuristic/vector-rounding.js";
import { DEFAULT_FAILURE_PROBABILITY, DENSE_PROOF_LIMIT, upperKindOf } from "../relaxation/certificate.js";
import { eigenvalueUpperBound } from "../relaxation/eigenvalue-bound.js";
import { certifySdpDual } from "../relaxation/sdp-bound.js";
import { defaultSdpRank, solveSdp, type SdpRecord } from "../relaxation/sdp-mixing.js";
import { positiveWeightBound } from "../positive-weights.js";
import { solveTriangleSdp, type TriangleSdpRecord } from "../relaxation/triangle-sdp.js";
import { TREE_BRANCHINGS, TREE_RELAXATIONS, relaxationTreeSearch, type TreeBranching, type TreeRelaxation, type TreeSearchRecord } from "../tree/relaxation-tree.js";
import { packTreeRegions } from "../tree/tree-codec.js";
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

// The budget defaults live in a module of their own so that the command line can show them
// without loading the solvers.
export { DEFAULT_BRACKET_SECONDS, MAX_BRACKET_WORK } from "./budget-limits.js";
import { DEFAULT_BRACKET_SECONDS, MAX_BRACKET_WORK } from "./budget-limits.js";

/** Seconds given to solvers that take only a time limit when a work budget governs: never reached. */
const NO_DEADLINE_SECONDS = 1e9;

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
  /** Time budget in seconds (default 10, unless `work` is given). Certification steps may run a little past it. */
  seconds?: number;
  /**
   * Deterministic work budget in units (src/cut/bracket/work-units.ts), instead of `seconds`: the
   * same graph, solverSeed and settings then give the same record (timing fields aside) anywhere.
   */
  work?: number;
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
  /**
   * δ of a probable upper end (default 1e-9): above the dense proof's size, when the sparse proof does
   * not fit its work limit, the shift holds with probability ≥ 1 − δ; 0 gives a bare Lanczos estimate instead.
   */
  failureProbability?: number;
  /** Effort "deep": the node bound of its branch and bound (default "triangles"). */
  relaxation?: TreeRelaxation;
  /** Effort "deep": a deterministic budget of branch-and-bound nodes (default: time only). */
  treeNodes?: number;
  /** Effort "deep": the branching rule of its branch and bound (default "auto": a short probe of each rule, src/cut/tree/relaxation-tree.ts). */
  branching?: TreeBranching;
  /** Effort "deep": orbital branching over the graph's automorphisms (default true; src/cut/tree/symmetry.ts). */
  symmetry?: boolean;
  /** Effort "deep": the cut's parity closes nodes that fix every odd-degree vertex (default true; src/cut/tree/parity.ts). */
  parity?: boolean;
}

/** A seed per method, derived from the bracket's solverSeed so every run is reproducible. */
function methodSeed(seed: number, k: number): number {
  return (seed + Math.imul(k + 1, 0x9e3779b9)) >>> 0;
}

function plainDetails(d: CutRecord["details"]): BracketRun["details"] {
  if (d === undefined) return undefined;
  const out: Record<string, number | string | boolean | null> = {};
  // Object.keys: the order Object.entries gives, without an array per entry (a run per tiny job).
  for (const k of Object.keys(d)) {
    const v = d[k];
    const t = typeof v;
    if (v === null || t === "number" || t === "string" || t === "boolean") out[k] = v as number | string | boolean | null;
  }
  return out;
}

/** The δ of probable upper ends: a number in [0, 1), default DEFAULT_FAILURE_PROBABILITY (0: bare estimates instead). */
function checkFailureProbability(owner: string, v: number | undefined): number {
  if (v === undefined) return DEFAULT_FAILURE_PROBABILITY;
  if (!(typeof v === "number" && v >= 0 && v < 1)) throw invalidParameter(owner, "failureProbability", "should be a number in [0, 1) (0: no probable upper ends)", v);
  return v;
}

/** Mutable state of one bracket run: best cut, best certified bound, the run log. */
class BracketState {
  /** δ for probable shifts (BracketOptions.failureProbability). */
  failureProbability = DEFAULT_FAILURE_PROBABILITY;
  readonly graph: Graph;
  readonly integral: boolean;
  /** Non-integer weights: how far `upper` may sit above `lower` in a closed bracket (closingTolerance). */
  readonly tolerance: number;
  /** Non-integer weights: the exact search's slack (src/cut/exact/exact-slack.ts), 0 otherwise. */
  readonly slack: number;
  /** The budget and the account of what each stage spent. */
  readonly meter: BudgetMeter;
  /** Units per step of each stage on this graph. */
  readonly costs: WorkCosts;
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
    meter: BudgetMeter,
    onProgress: ((p: BracketProgress) => void) | undefined,
    readonly meta: { solverSeed: number; effort: BracketEffort; source: GraphSource | undefined; notes: readonly string[] },
  ) {
    this.graph = graph;
    this.integral = hasIntegerWeights(graph);
    this.slack = this.integral ? 0 : exactSearchSlack(graph);
    this.tolerance = closingTolerance(graph);
    this.meter = meter;
    this.costs = workCosts(graph);
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

  /** What is left of the budget, in its own currency (seconds or units). */
  left(): number {
    return this.meter.left();
  }

  elapsed(): number {
    return this.meter.elapsed();
  }

  /** Seconds to hand a solver that takes a time limit: what is left, or no limit under a work budget. */
  solverSeconds(left: number): number {
    return this.meter.isWork ? NO_DEADLINE_SECONDS : Math.max(1e-3, left);
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
      this.certificate = { kind: "sdp-tree", rootVertex: r.certificate.rootVertex, relaxation: r.relaxation, packed: packTreeRegions(this.graph, r.certificate), ...(r.certificate.orbital === undefined ? {} : { orbital: r.certificate.orbital, automorphisms: r.certificate.automorphisms }), nodes: r.nodes, roundedDown: true, tolerance: this.tolerance };
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
  return { kind: "psd-dual", y: Array.from(c.y), shift: c.shift, shiftProof: c.shiftProof, roundedDown, tolerance, ...(c.probable === undefined ? {} : { probable: { ...c.probable } }) };
}

/** Units of a certified bound: its Lanczos products and dense proofs (as certifyDual reports them) plus a pass. */
function certifyUnits(state: BracketState, r: UpperBoundRecord): number {
  const d = r.details ?? {};
  const products = Number(d.lanczosIterations ?? 0);
  const proofs = r.certificate?.shiftProof === "cholesky" ? Number(d.attempts ?? 1) : d.choleskyFailure !== undefined ? 6 : 0;
  // The sparse proof counts its multiply-adds (one unit each) per attempt; the probable bound's
  // Chebyshev filter is one operator product per degree.
  // A bisection (details.bisection) that ended in a Gershgorin shift still did its factorisations.
  const sparse = r.certificate?.shiftProof === "sparse-cholesky" || d.bisection === true ? Number(d.sparseWork ?? 0) * Number(d.attempts ?? 1) : 0;
  const filter = r.certificate?.shiftProof === "chebyshev-probable" ? Number(d.filterDegree ?? 0) : 0;
  return unitsOf(products + filter, state.costs.matvec) + unitsOf(proofs, state.costs.denseProof) + sparse + state.costs.pass;
}

/** Run an upper-bound method as a stage: book its work and seconds, then offer its bound. */
function boundStage(state: BracketState, stage: string, run: () => UpperBoundRecord): void {
  state.attempt(stage, "upper", () => {
    const r = run();
    state.meter.charge(stage, certifyUnits(state, r), Number(r.details?.certifySeconds ?? r.seconds));
    state.offerDual(r);
  });
}

/** Run a rounding or search method that returns one cut as a stage: book it, offer the cut. */
function cutStage(state: BracketState, units: (r: CutRecord) => number, run: () => CutRecord): void {
  const r = run();
  state.meter.charge(r.method, units(r), r.seconds);
  state.offerCut(r);
}

/** All breakout episodes of a bracket, summed into one run entry. */
class BreakoutLog {
  episodes = 0;
  best: CutRecord | null = null;
  firstSeed: number | null = null;
  status: BracketRun["status"] = "iteration-limit";
  seconds = 0;
  private readonly sums: Record<string, number> = { rounds: 0, moves: 0, directedJumps: 0, randomJumps: 0, strongJumps: 0 };
  private bestEpisode = 0;

  add(r: CutRecord, status: BracketRun["status"]): void {
    this.episodes++;
    this.firstSeed ??= r.solverSeed;
    this.status = status;
    this.seconds += r.seconds;
    for (const k of Object.keys(this.sums)) this.sums[k] += Number(r.details?.[k] ?? 0);
    if (this.best === null || r.value > this.best.value) {
      this.best = r;
      this.bestEpisode = this.episodes;
    }
  }

  push(state: BracketState): void {
    if (this.best === null) return;
    state.runs.push({
      method: "breakout",
      role: "lower",
      value: this.best.value,
      status: this.status,
      seconds: this.seconds,
      solverSeed: this.firstSeed,
      details: { episodes: this.episodes, bestEpisode: this.bestEpisode, ...this.sums },
    });
  }
}

/**
 * One breakout episode with its own seed, from `initial` (else a random cut), until it goes
 * `stall` rounds without a better cut, the phase ends, the bracket closes or it reaches the upper
 * bound. Under a work budget it runs in slices of rounds sized from the units a round has cost so
 * far (moves are counted, so the slicing, and with it the whole run, is deterministic).
 */
function breakoutEpisode(state: BracketState, phaseEnd: number, seed: number, initial: Uint8Array | undefined, stall: number, log: BreakoutLog): BracketRun["status"] {
  const { graph: g, meter, costs } = state;
  const searcher = new BreakoutSearcher(g, { solverSeed: seed, initial, upperBound: state.upper });
  let rounds = 0;
  let moves = 0;
  let sinceBest = 0;
  let episodeBest = -Infinity;
  // Units per round before any is counted: a first ascent moves about a quarter of the vertices.
  let perRound = costs.move * Math.max(8, g.n / 4);
  let status: BracketRun["status"] = "iteration-limit";
  for (;;) {
    const left = phaseEnd - meter.position();
    if (left <= 0 || state.closed() || sinceBest >= stall) break;
    const cap = stall - sinceBest;
    const t = nowSeconds();
    if (meter.isWork) {
      // Slices of at least a few million units keep best() (a pass over the graph) cheap beside them.
      const slice = Math.min(left, Math.max(2 ** 22, 8 * costs.pass));
      status = searcher.run({ seconds: Infinity, iterations: Math.max(1, Math.min(cap, Math.floor(slice / perRound))) });
    } else {
      // Half-second slices keep the progress display alive on long runs.
      status = searcher.run({ seconds: Math.min(left, 0.5), iterations: cap });
    }
    const best = searcher.best();
    const r = Number(best.details?.rounds ?? 0);
    const mv = Number(best.details?.moves ?? 0);
    meter.charge("breakout", unitsOf(mv - moves, costs.move), nowSeconds() - t);
    if (r > 0) perRound = Math.max(1, (mv * costs.move) / r);
    if (best.value > episodeBest) {
      episodeBest = best.value;
      sinceBest = 0;
      if (best.value > state.lower) state.takeCut(best);
    } else sinceBest += r - rounds;
    // Every slice, improved or not: a long search with no new best still shows it is alive.
    state.progress("breakout");
    rounds = r;
    moves = mv;
    if (status === "optimal") break;
  }
  log.add(searcher.best(), status);
  return status;
}

/**
 * One run of the memetic search from the best cut until `episodeEnd` (a meter position), booked as
 * the stage `memetic`: under a work budget its moves are counted, so the cut does not depend on load.
 */
function memeticEpisode(state: BracketState, episodeEnd: number, seed: number): BracketRun["status"] {
  const { graph: g, meter, costs } = state;
  const left = episodeEnd - meter.position();
  if (left <= 0 || state.closed()) return "iteration-limit";
  const r = memeticSearch(g, {
    solverSeed: seed,
    ...(meter.isWork ? { seconds: state.solverSeconds(left), work: Math.max(1, Math.floor(left / costs.move)) } : { seconds: left }),
    initial: state.partition,
    upperBound: state.upperKind === "proven" ? state.upper : undefined,
    onProgress: () => state.progress("memetic"),
  });
  meter.charge("memetic", unitsOf(r.work, costs.move), r.seconds);
  state.offerCut(r);
  return r.status;
}

/** An SDP that stopped on its budget rather than converging: more sweeps may lower the bound. */
interface OpenSdp {
  sdp: SdpRecord;
  /** What its last certificate cost, in the budget's currency: kept free when sweeping on. */
  certifyCost: number;
}

/**
 * Seconds for the dense Cholesky proof of a shift at n vertices: ≈ 1.1e-9·n³ (measured in
 * bench/bracket on the development machine: 0.7 s at n = 800, 11 s at 2000, 29 s at 3000).
 */
function denseProofSeconds(n: number): number {
  return 1.1e-9 * n * n * n;
}

// Residual tolerance for Lanczos shifts: 1e-7 relative moves the bound by ~1e-7·n·‖L‖/4, far
// below the gaps of interest, and converges in about half the iterations of the default.
const SHIFT_TOLERANCE = 1e-7;

/** The dense proof's limit when its cost fits in `room` (in the budget's currency), else 0 (a Lanczos shift). */
function denseLimitWithin(state: BracketState, room: number): number {
  const n = state.graph.n;
  return n <= DENSE_PROOF_LIMIT && state.meter.cost(state.costs.denseProof, denseProofSeconds(n)) <= room ? DENSE_PROOF_LIMIT : 0;
}

/** Solve (or continue) the SDP within `amount` of the budget's currency, book it and log it. */
function sdpStage(state: BracketState, seed: number, rank: number, amount: number, extra: { maxSweeps?: number; minSweeps: number; initial?: Float64Array }): SdpRecord | null {
  const { meter, costs } = state;
  const sweepCost = costs.sweep(rank);
  let solved: SdpRecord | null = null;
  // Solved and certified as two attempts: when the certificate does not fit in memory, the
  // SDP's vectors still feed hyperplane rounding.
  state.attempt("sdp-mixing", "relaxation", () => {
    const budget = meter.isWork
      ? { maxSweeps: Math.min(extra.maxSweeps ?? 10000, Math.max(extra.minSweeps, Math.floor(amount / sweepCost))) }
      : { seconds: Math.max(1e-3, amount), maxSweeps: extra.maxSweeps };
    solved = solveSdp(state.graph, { solverSeed: seed, rank, initial: extra.initial, ...budget });
  });
  if (solved === null) return null;
  const sdp: SdpRecord = solved;
  // The duality-gap checks cost about 15% on top of the sweeps (sdp-mixing.ts spaces them so).
  meter.charge("sdp-mixing", unitsOf(sdp.sweeps, 1.15 * sweepCost), sdp.seconds);
  state.runs.push({ method: sdp.method, role: "relaxation", value: sdp.value, status: sdp.status, seconds: sdp.seconds, solverSeed: sdp.solverSeed, details: { sweeps: sdp.sweeps, rank: sdp.rank } });
  return sdp;
}

/**
 * While the bracket is open and the phase has budget left: breakout episodes with fresh derived
 * seeds (from the best cut, and on graphs up to 1000 vertices every other one from a random cut),
 * each followed, while the SDP has not converged, by more SDP sweeps from its last vectors and a
 * new certificate. Stops only when the bracket closes, the phase's budget is spent, or the cut
 * reaches the upper bound (then only a better bound could help, and nothing is left to try).
 */
function improveBothEnds(state: BracketState, phaseEnd: number, seed: number, open: OpenSdp | null): void {
  const g = state.graph;
  const meter = state.meter;
  const phaseLeft = (): number => phaseEnd - meter.position();
  const log = new BreakoutLog();
  // Rounds without a better cut before an episode ends; doubling gives later episodes longer runs.
  let stall = Math.max(5000, 20 * g.n);
  for (let episode = 0; !state.closed() && phaseLeft() > 0; episode++) {
    const before = meter.position();
    const fromBest = episode % 2 === 0 || g.n > 1000;
    const episodeSeed = episode === 0 ? methodSeed(seed, 5) : methodSeed(seed, 100 + episode);
    // Large sparse graphs: the memetic search in place of breakout (issue 11, item 5; bench/cut-large).
    const status =
      g.n >= MEMETIC_MIN_VERTICES
        ? memeticEpisode(state, before + Math.max(phaseLeft() / 2, Math.min(phaseLeft(), meter.cost(2 ** 22, 1))), episodeSeed)
        : breakoutEpisode(state, phaseEnd, episodeSeed, fromBest ? state.partition : undefined, stall, log);
    if (status === "optimal") break;
    stall = Math.min(2 ** 30, 2 * stall);
    // The bound gets as much again as the episode took, keeping its certificate's cost free; when
    // not even 20 sweeps fit beside that, the rest of the phase stays with the search.
    const room = open === null ? 0 : phaseLeft() - open.certifyCost;
    if (open !== null && room > meter.cost(20 * state.costs.sweep(open.sdp.rank), 0) && !state.closed()) {
      const amount = Math.min(room, Math.max(meter.position() - before, 0.05 * phaseLeft()));
      const sdp = sdpStage(state, open.sdp.solverSeed, open.sdp.rank, amount, { minSweeps: 20, initial: open.sdp.vectors });
      if (sdp !== null) {
        const c0 = meter.position();
        const dense = denseLimitWithin(state, 0.5 * phaseLeft());
        boundStage(state, "sdp-certified", () => certifySdpDual(g, sdp, { tolerance: SHIFT_TOLERANCE, denseLimit: dense, failureProbability: state.failureProbability }));
        open = sdp.status === "converged" ? null : { sdp, certifyCost: meter.position() - c0 };
      } else open = null;
    }
  }
  log.push(state);
}

/** Heuristic lower bounds plus certified upper bounds, within `budgetShare` of what is left. */
function heuristicPhase(state: BracketState, seed: number, quick: boolean, budgetShare: number): void {
  const { graph: g, meter, costs } = state;
  const n = g.n;
  const total = Math.max(0, state.left()) * budgetShare;
  const phaseEnd = meter.position() + total;
  const phaseLeft = (): number => Math.max(0, phaseEnd - meter.position());
  // A dense proof is used only when it fits in the given share of the budget left; otherwise the
  // shift is a Lanczos estimate and the record says so (upperKind = "estimate").
  const denseLimitFor = (share: number): number => denseLimitWithin(state, share * phaseLeft());

  // A first cut in a few milliseconds: multi-start 1-flip local search.
  const restarts = quick ? 4 : 16;
  cutStage(
    state,
    (r) => unitsOf(Number(r.details?.starts ?? 0), costs.restart),
    () =>
      localSearch(g, {
        ...(meter.isWork
          ? { seconds: Infinity, iterations: Math.max(1, Math.min(restarts, Math.floor((0.05 * total) / costs.restart))) }
          : { seconds: Math.max(1e-3, Math.min(0.05 * total, 1)), iterations: restarts }),
        solverSeed: methodSeed(seed, 1),
      }),
  );

  // The eigenvalue bound (the dual certificate with y = 0): one Lanczos run, or a small dense proof.
  const eigen0 = meter.position();
  boundStage(state, "eigenvalue", () => eigenvalueUpperBound(g, { tolerance: SHIFT_TOLERANCE, denseLimit: denseLimitFor(0.05), failureProbability: state.failureProbability }));
  const eigenCost = meter.position() - eigen0;
  if (state.closed()) return;

  // The SDP: its vectors feed hyperplane rounding, its dual estimate feeds the certificate.
  // Certifying costs about two Lanczos runs (≈ 2.5× the eigenvalue bound) or a dense proof.
  const dense = denseLimitFor(0.3);
  const certifyCost = dense > 0 ? meter.cost(costs.denseProof, denseProofSeconds(n)) + eigenCost : 2.5 * eigenCost;
  const forSdp = (quick ? 0.3 : 0.45) * phaseLeft() - certifyCost;
  // Large graphs: a low rank affords many more sweeps in the same time, which matters more
  // than the rank (bench/bracket: rank 24 beats the default rank 201 at 10^6 edges).
  const rank = g.m > 100_000 ? Math.min(24, n) : defaultSdpRank(n);
  let open: OpenSdp | null = null;
  if (forSdp > Math.min(meter.cost(50 * costs.sweep(rank), 0.5), 0.05 * total) || n <= 64) {
    const sdp = sdpStage(state, methodSeed(seed, 2), rank, forSdp, { maxSweeps: quick ? 300 : undefined, minSweeps: n <= 64 ? 20 : 1 });
    if (sdp !== null) {
      const c0 = meter.position();
      boundStage(state, "sdp-certified", () => certifySdpDual(g, sdp, { tolerance: SHIFT_TOLERANCE, denseLimit: dense, failureProbability: state.failureProbability }));
      const certified = meter.position() - c0;
      if (state.closed()) return;
      const trials = quick ? 8 : n <= 5000 ? 64 : 16;
      cutStage(
        state,
        (r) => unitsOf(Number(r.details?.trials ?? trials), costs.hyperplaneTrial(sdp.rank)) + unitsOf(g.m, sdp.rank),
        () => hyperplaneRound(g, sdp.vectors, sdp.rank, { trials, solverSeed: methodSeed(seed, 3), polish: true }),
      );
      if (state.closed()) return;
      if (sdp.status !== "converged") open = { sdp, certifyCost: certified };
    }
  }
  if (quick) return;
  // Sparse vector rounding: its set-up (the exact guarantee) costs about one Lanczos run.
  if (phaseLeft() > 3 * eigenCost) {
    const trials = n <= 5000 ? 32 : 8;
    state.attempt("vector-rounding", "lower", () =>
      cutStage(
        state,
        (r) => unitsOf(Number(r.details?.trials ?? trials), costs.vectorTrial) + 20 * costs.pass,
        () => vectorMethodRound(g, { trials, solverSeed: methodSeed(seed, 4), polish: true }),
      ),
    );
    if (state.closed()) return;
  }
  // The rest of the phase: keep improving both ends until it is spent or the bracket closes.
  improveBothEnds(state, phaseEnd, seed, open);
}

/** Exact search on what is left of the budget (from `initial` when given), booked as the stage `exact-search`. */
function exactStage(state: BracketState, seed: number, initial?: Uint8Array): void {
  const { graph, meter, costs } = state;
  const left = state.left();
  const work = meter.isWork ? Math.max(1, Math.floor(left / costs.exactStep)) : undefined;
  const r = exactMaxCut(graph, { seconds: state.solverSeconds(left), work, solverSeed: seed, initial, onProgress: state.exactProgress("exact search") });
  meter.charge("exact-search", unitsOf(Number(r.details?.workUsed ?? 0), costs.exactStep), r.seconds);
  state.offerExact(r);
}

/**
 * Effort "deep": the SDP with triangle inequalities (a fifth of what is left), then branch and bound
 * bounded by the chosen relaxation, warm-started from the best cut, for the rest. The tree search
 * needs integer weights; other graphs keep the strengthened bound (the search is logged as skipped).
 */
function deepPhase(state: BracketState, seed: number, relaxation: TreeRelaxation, treeNodes: number | undefined, branching: TreeBranching | undefined, symmetry: boolean | undefined, parity: boolean | undefined): void {
  const { graph: g, meter, costs } = state;
  // Work per stage (our own estimates, bench/sdp-tree): the strengthened SDP is a first solve of up
  // to 2000 sweeps and 60 rounds of 60 warm-started sweeps with a dense proof each; a tree node is
  // about 500 sweeps with the plain node bound and 20 times that with the triangle bound.
  const rank = defaultSdpRank(g.n);
  const roundCost = 60 * costs.sweep(rank) + costs.denseProof;
  const triangleRounds = 60;
  // The stage's inequalities and multipliers: the tree's root continues from them.
  let stage: { triangles: Int32Array; mu: Float64Array } | undefined;
  state.attempt("sdp-triangles", "upper", () => {
    const r = solveTriangleSdp(g, {
      solverSeed: methodSeed(seed, 6),
      seconds: state.solverSeconds(0.2 * state.left()),
      iterations: meter.isWork ? Math.max(1, Math.min(triangleRounds, Math.floor((0.2 * state.left() - 2000 * costs.sweep(rank)) / roundCost))) : triangleRounds,
      target: state.lower,
    });
    meter.charge("sdp-triangles", 2000 * costs.sweep(rank) + r.rounds * roundCost, r.seconds);
    if (r.certificate.mu.length > 0) stage = { triangles: r.certificate.triangles, mu: r.certificate.mu };
    state.offerTriangle(r);
  });
  if (state.closed()) return;
  const nodeCost = (relaxation === "triangles" ? 20 : 1) * 500 * costs.sweep(rank);
  const nodes = treeNodes ?? (meter.isWork ? Math.max(1, Math.floor(state.left() / nodeCost)) : undefined);
  state.attempt("exact-sdp-tree", "exact", () => {
    const r = relaxationTreeSearch(g, {
      seconds: state.solverSeconds(state.left()),
      work: nodes,
      solverSeed: methodSeed(seed, 7),
      initial: state.partition,
      relaxation,
      branching,
      symmetry,
      parity,
      rootTriangles: stage,
      onProgress: state.treeProgress("sdp tree"),
    });
    meter.charge("exact-sdp-tree", unitsOf(Number(r.details?.workUsed ?? 0), nodeCost), r.seconds);
    state.offerTree(r);
  });
}

/** Is branch and bound worth part of the budget? A practical rule from bench/cut-exact: small or sparse graphs. */
function exactLooksFeasible(g: Graph): boolean {
  return g.n <= 50 || (g.n <= 150 && g.m <= 3 * g.n);
}

export function bracket(graph: Graph, options: BracketOptions = {}): BracketRecord {
  return recordFromSnapshot(bracketSnapshot(graph, options));
}

/** The governing budget of a bracket's options: `work` units, or `seconds` (default 10). One-line errors name the option. */
export function bracketBudgetOf(owner: string, options: Pick<BracketOptions, "seconds" | "work">): BudgetMeter {
  if (options.work !== undefined) {
    if (options.seconds !== undefined) throw new InputError(`${owner}: give either \`seconds\` or \`work\` as the budget, not both`);
    const w = options.work;
    if (typeof w !== "number" || !Number.isSafeInteger(w) || w < 1) throw invalidParameter(owner, "work", `should be a whole number of work units from 1 to ${MAX_BRACKET_WORK}`, w);
    return new BudgetMeter("work", w);
  }
  return new BudgetMeter("time", checkSeconds(owner, options.seconds, DEFAULT_BRACKET_SECONDS));
}

/** `bracket`, returning the record with its partition as a typed array (see BracketSnapshot). */
export function bracketSnapshot(graph: Graph, options: BracketOptions = {}): BracketSnapshot {
  const owner = "bracket";
  const meter = bracketBudgetOf(owner, options);
  const seed = checkSeed(owner, "solverSeed", options.solverSeed);
  const effort = options.effort ?? "auto";
  if (!BRACKET_EFFORTS.includes(effort)) throw invalidParameter(owner, "effort", `should be one of ${BRACKET_EFFORTS.join(", ")}`, effort);
  if (options.relaxation !== undefined && !TREE_RELAXATIONS.includes(options.relaxation)) throw invalidParameter(owner, "relaxation", `should be one of ${TREE_RELAXATIONS.join(", ")}`, options.relaxation);
  if (options.branching !== undefined && !TREE_BRANCHINGS.includes(options.branching)) throw invalidParameter(owner, "branching", `should be one of ${TREE_BRANCHINGS.join(", ")}`, options.branching);
  if (options.symmetry !== undefined && typeof options.symmetry !== "boolean") throw invalidParameter(owner, "symmetry", "should be true or false", options.symmetry);
  if (options.parity !== undefined && typeof options.parity !== "boolean") throw invalidParameter(owner, "parity", "should be true or false", options.parity);
  if (options.treeNodes !== undefined && !(Number.isInteger(options.treeNodes) && options.treeNodes > 0)) throw invalidParameter(owner, "treeNodes", "should be a positive integer", options.treeNodes);
  const state = new BracketState(graph, meter, options.onProgress, { solverSeed: seed, effort, source: options.source, notes: [...(options.notes ?? [])] });
  state.failureProbability = checkFailureProbability(owner, options.failureProbability);
  state.progress("start");

  if (graph.m > 0) {
    if (effort === "exact") {
      exactStage(state, seed);
      if (!state.closed()) boundStage(state, "eigenvalue", () => eigenvalueUpperBound(graph, { denseLimit: graph.n <= 1000 ? 3000 : 0, failureProbability: state.failureProbability }));
    } else if (effort === "deep") {
      heuristicPhase(state, seed, false, 0.15);
      if (!state.closed()) deepPhase(state, seed, options.relaxation ?? "triangles", options.treeNodes, options.branching, options.symmetry, options.parity);
    } else if (effort === "auto" && graph.n <= AUTO_EXACT_VERTICES) {
      exactStage(state, seed);
      if (!state.closed()) heuristicPhase(state, seed, false, 1);
    } else if (effort === "auto" && exactLooksFeasible(graph)) {
      // Heuristics first (a good incumbent prunes far more), then exact search on the rest.
      heuristicPhase(state, seed, false, 0.3);
      if (!state.closed()) exactStage(state, seed, state.partition);
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
    budget: state.meter.record(),
    notes: [...state.meta.notes],
    // Last, so the (possibly long) embedded graph does not hide the numbers in a JSON line.
    source: envelope.source,
  };
}

// ---- A bracket from results already computed (the extremal search, src/hunt) ----

export interface BracketFromResultsOptions {
  /** Cuts found elsewhere (each re-evaluated with cutValue: only the confirmed value counts). */
  cuts: readonly CutRecord[];
  /** Certified upper bounds found elsewhere (dual certificates; rounded down like the bracket's own). */
  bounds: readonly UpperBoundRecord[];
  /** The seed the caller drew its randomness from. */
  solverSeed: number;
  /** The effort word the caller's work corresponds to (default "heuristic": no exact search). */
  effort?: BracketEffort;
  source?: GraphSource;
  notes?: readonly string[];
}

/**
 * The bracket record of cuts and dual certificates computed by a caller (e.g. a search that
 * warm-starts its SDP across many graphs), through the same state as `bracket()`: the same
 * rounding, the same choice of the best end and the same record, so `verifyBracket` treats it
 * like any other. Runs nothing itself.
 */
export function bracketFromResults(graph: Graph, options: BracketFromResultsOptions): BracketRecord {
  const owner = "bracketFromResults";
  const seed = checkSeed(owner, "solverSeed", options.solverSeed);
  const effort = options.effort ?? "heuristic";
  if (!BRACKET_EFFORTS.includes(effort)) throw invalidParameter(owner, "effort", `should be one of ${BRACKET_EFFORTS.join(", ")}`, effort);
  // Runs nothing itself: a work budget of 0 units, so the record is the same on every machine.
  const state = new BracketState(graph, new BudgetMeter("work", 0), undefined, { solverSeed: seed, effort, source: options.source, notes: [...(options.notes ?? [])] });
  if (graph.m === 0) {
    state.exact = true;
    state.upper = 0;
  } else {
    for (const c of options.cuts) state.offerCut(c);
    for (const b of options.bounds) state.offerDual(b);
  }
  return recordFromSnapshot(snapshotOf(state));
}
