// The bracket record: its shape, kind and version, kept apart from the code that makes it
// (bracket.ts) and the code that checks it (verify.ts), so neither imports the other. It shares
// the envelope (kind, version, graphHash, source) with every other result record.

import type { RecordEnvelope } from "../../graph/record/envelope.js";
import type { ProbableShift, ShiftProof, SolverStatus, UpperKind } from "../types.js";
import type { BracketBudget } from "./budget.js";
import type { TreeRegion, TreeRelaxation } from "../tree/relaxation-tree.js";
import type { TreeOrbitalBranch } from "../tree/symmetry.js";
import type { PackedTreeRegions } from "../tree/tree-codec.js";

/** The `kind` every bracket record carries, so verify can refuse other JSON. */
export const BRACKET_RECORD_KIND = "halfplus/bracket";
/**
 * Version 2: the shared envelope, `effort`, `solverSeed`, `upperKind`, `shiftProof`, `roundedDown`,
 * `notes`; optional `interrupted`; run statuses include `work-limit` and `skipped`.
 * Version 3: `budget` (which budget governed, its limits, work and seconds used, per stage); shift
 * proofs `sparse-cholesky` and `chebyshev-probable`; a probable certificate carries
 * `probable` (δ, seed, filter degree and interval) and the record's `upperKind` is then "probable";
 * effort `deep`; certificates `triangle-dual` (the SDP with triangle inequalities) and `sdp-tree`
 * (the regions of a relaxation-bounded branch and bound). An `sdp-tree` certificate carries its
 * regions either `packed` (../tree/tree-codec.ts: what this build writes) or as the JSON array
 * `regions` (what earlier builds wrote, still read: stores and record files may hold it); exactly one.
 */
export const BRACKET_RECORD_VERSION = 3;

/**
 * How much work the bracket puts in. auto: exact search when the graph is small, heuristics and
 * certified bounds otherwise; exact: exact search only (plus the eigenvalue bound if it stops
 * early); heuristic: never exact search; quick: cheap methods only, for large batches of graphs;
 * deep: heuristics, then the SDP with triangle inequalities, then branch and bound bounded by the
 * relaxation (`relaxation` option) for the rest of the budget (graphs of about a hundred vertices).
 */
export type BracketEffort = "auto" | "exact" | "heuristic" | "quick" | "deep";
export const BRACKET_EFFORTS: readonly BracketEffort[] = ["auto", "exact", "heuristic", "quick", "deep"];

/**
 * How `upper` is proven. `roundedDown`: the graph has integer weights, so every cut is an integer
 * and the bound was rounded down to the integer below. `tolerance`: for non-integer weights, how
 * far a closed bracket's `upper` may sit above `lower` (the exact search's rounding slack).
 */
export type BracketCertificate =
  | { kind: "psd-dual"; y: number[]; shift: number; shiftProof: ShiftProof; roundedDown: boolean; tolerance: number; probable?: ProbableShift }
  | { kind: "exhaustive"; search: string; graySteps: number; branchNodes: number; roundedDown: boolean; tolerance: number }
  | { kind: "unfinished-search"; search: string; graySteps: number; branchNodes: number; roundedDown: boolean; tolerance: number }
  | { kind: "positive-weights"; roundedDown: boolean; tolerance: number }
  | { kind: "triangle-dual"; y: number[]; shift: number; shiftProof: "cholesky"; triangles: number[]; mu: number[]; roundedDown: boolean; tolerance: number }
  | { kind: "sdp-tree"; rootVertex: number; relaxation: TreeRelaxation; packed?: PackedTreeRegions; regions?: TreeRegion[]; orbital?: TreeOrbitalBranch[]; automorphisms?: number[][]; nodes: number; roundedDown: boolean; tolerance: number };

/** One method's contribution, summarised. */
export interface BracketRun {
  /** The algorithm, e.g. "local-search", "sdp-mixing", "exact-bnb". */
  method: string;
  /** lower: produced a cut; upper: produced a bound; exact: both; relaxation: an SDP objective. */
  role: "lower" | "upper" | "exact" | "relaxation";
  value: number;
  /** For exact searches: their proven upper bound. */
  upper?: number;
  /** Why the method stopped; "skipped" when the bracket left it out (details.reason says why, e.g. memory). */
  status: SolverStatus | "skipped";
  seconds: number;
  /** Seed the method's randomness was drawn from (derived from the bracket's solverSeed); null when it uses none. */
  solverSeed: number | null;
  details?: Record<string, number | string | boolean | null>;
}

export interface BracketRecord extends RecordEnvelope<typeof BRACKET_RECORD_KIND> {
  version: typeof BRACKET_RECORD_VERSION;
  n: number;
  m: number;
  totalWeight: number;
  lower: number;
  upper: number;
  /** True when the bracket is closed by proof (for non-integer weights: within certificate.tolerance). */
  exact: boolean;
  /** How far `upper` can be trusted: "probable" when it rests on a Chebyshev shift (holds with probability ≥ 1 − certificate.probable.failureProbability), "estimate" on a Lanczos shift. */
  upperKind: UpperKind;
  surplusLower: number;
  surplusUpper: number;
  /** The algorithm that found the cut `partition`. */
  lowerMethod: string;
  /** The algorithm behind `upper` and its certificate. */
  upperMethod: string;
  seconds: number;
  /** Seed of the randomised solvers; each run's seed is derived from it. */
  solverSeed: number;
  effort: BracketEffort;
  partition: number[];
  certificate: BracketCertificate;
  runs: BracketRun[];
  /** Which budget governed (time or work), its limits, and the work and seconds used, per stage. */
  budget: BracketBudget;
  /** Things the reader should know about the graph or the run (possibly none). */
  notes: string[];
  /** Present (true) when SIGINT/SIGTERM stopped the run: the best record at that moment. */
  interrupted?: true;
}

/**
 * A bracket record whose partition is a typed array: cheap to copy between threads and to write
 * (`recordJson`) even at 10^8 vertices, where a JS array of the partition would fill the heap.
 */
export type BracketSnapshot = Omit<BracketRecord, "partition"> & { partition: Uint8Array };

/** The plain record of a snapshot (the partition as an array of 0/1). */
export function recordFromSnapshot(s: BracketSnapshot): BracketRecord {
  return { ...s, partition: Array.from(s.partition) };
}

/** The record's JSON text (one line), the same as JSON.stringify of its plain form, without building the plain partition. */
export function recordJson(r: BracketSnapshot | BracketRecord): string {
  if (!(r.partition instanceof Uint8Array)) return JSON.stringify(r);
  // A marker no JSON value can contain unescaped, replaced by the partition written natively.
  const marker = "\u0000partition\u0000";
  const text = JSON.stringify({ ...r, partition: marker });
  return text.replace(JSON.stringify(marker), `[${r.partition.join(",")}]`);
}

/**
 * Is this key a timing-only field? By convention every wall-clock field of a bracket record is
 * named `seconds`, starts with `seconds` followed by a capital (`secondsUsed`, `secondsToBest`,
 * `secondsLimit`) or ends in `Seconds` (`sdpSeconds`, `trialSeconds`); nothing else is timing.
 */
export function isTimingKey(key: string): boolean {
  return key === "seconds" || /^seconds[A-Z]/.test(key) || key.endsWith("Seconds");
}

/**
 * The record without its timing-only fields (`isTimingKey`, at any depth): under a work budget
 * this is identical for the same graph, solver seed and settings on any machine, worker count or
 * load. Compare records with it; `interrupted` records are not covered (a signal's moment is timing).
 */
export function withoutTiming<T>(record: T): T {
  const strip = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(strip);
    if (v instanceof Uint8Array) return Array.from(v);
    if (typeof v !== "object" || v === null) return v;
    const out: Record<string, unknown> = {};
    for (const [k, x] of Object.entries(v)) if (!isTimingKey(k)) out[k] = strip(x);
    return out;
  };
  return strip(record) as T;
}
