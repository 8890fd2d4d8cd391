// Re-checks a max-cut bracket record against its graph without trusting the solvers that made it:
// the lower bound by re-evaluating the partition with `cutValue`, the upper bound by re-deriving
// it from the certificate (dual certificate, exhaustive search, or the positive-weight sum).

import { InputError } from "../../errors.js";
import { cutValue, floorCutBound } from "../../graph/cut-value.js";
import type { Graph } from "../../graph/graph.js";
import { graphHash } from "../../graph/hash.js";
import { connectedComponents } from "../../graph/structure/components.js";
import { hasIntegerWeights, positiveWeightSum } from "../../graph/weights.js";
import { improvementMargin } from "../exact/common.js";
import { exactMaxCut } from "../exact/exact-max-cut.js";
import { verifyCertificate } from "../relaxation/certificate.js";
import type { UpperKind } from "../types.js";
import { BRACKET_RECORD_KIND, BRACKET_RECORD_VERSION, type BracketCertificate, type BracketRecord } from "./record.js";

const UPPER_KINDS: readonly UpperKind[] = ["proven", "probable", "estimate"];

export interface BracketCheck {
  name: string;
  ok: boolean;
  message: string;
}

export interface BracketVerdict {
  ok: boolean;
  checks: BracketCheck[];
}

export interface BracketVerifyOptions {
  /** Budget for re-running an exact search when the certificate is exhaustive (default 60 s). */
  seconds?: number;
}

function isNumber(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x);
}

/**
 * Check a parsed JSON value has the shape of a bracket record (types only, not truth);
 * a malformed record is bad input (InputError), a record whose claims fail is a verdict.
 */
export function parseBracketRecord(value: unknown, where: string): BracketRecord {
  const bad = (what: string): never => {
    throw new InputError(`${where}: not a max-cut bracket record: ${what}`);
  };
  if (typeof value !== "object" || value === null || Array.isArray(value)) bad("expected a JSON object");
  const r = value as Record<string, unknown>;
  if (r.kind !== BRACKET_RECORD_KIND) bad(`field \`kind\` should be ${JSON.stringify(BRACKET_RECORD_KIND)}`);
  if (r.version !== BRACKET_RECORD_VERSION) bad(`unsupported \`version\` ${JSON.stringify(r.version)} (this build reads ${BRACKET_RECORD_VERSION})`);
  for (const f of ["n", "m", "totalWeight", "lower", "upper", "surplusLower", "surplusUpper"]) {
    if (!isNumber(r[f])) bad(`field \`${f}\` should be a finite number`);
  }
  if (typeof r.exact !== "boolean") bad("field `exact` should be true or false");
  if (!UPPER_KINDS.includes(r.upperKind as UpperKind)) bad(`field \`upperKind\` should be one of ${UPPER_KINDS.join(", ")}`);
  if (typeof r.graphHash !== "string") bad("field `graphHash` should be a string");
  if (!Array.isArray(r.partition)) bad("field `partition` should be an array of 0/1");
  // Missing or non-object `source` used to crash verify with a TypeError (test/cli-cut.test.ts "malformed `source`").
  if (typeof r.source !== "object" || r.source === null || Array.isArray(r.source)) bad("field `source` should be an object");
  const c = r.certificate as Record<string, unknown> | undefined;
  if (typeof c !== "object" || c === null) bad("field `certificate` should be an object");
  const kind = c!.kind;
  if (kind === "psd-dual") {
    if (!Array.isArray(c!.y) || !isNumber(c!.shift) || typeof c!.shiftProof !== "string") bad("psd-dual certificate needs `y` (array), `shift` and `shiftProof`");
  } else if (kind === "exhaustive" || kind === "unfinished-search") {
    if (typeof c!.search !== "string") bad(`${kind} certificate needs \`search\``);
  } else if (kind !== "positive-weights") {
    bad(`unknown certificate kind ${JSON.stringify(kind)}`);
  }
  if (typeof c!.roundedDown !== "boolean" || !isNumber(c!.tolerance)) bad("certificate needs `roundedDown` (boolean) and `tolerance` (number)");
  return value as BracketRecord;
}

/** The bound a certificate proves, after the integer rounding it declares. */
function applyRounding(graph: Graph, cert: BracketCertificate, bound: number): { bound: number; problem: string | null } {
  if (!cert.roundedDown) return { bound, problem: null };
  if (!hasIntegerWeights(graph)) return { bound, problem: "certificate rounds down to an integer but the graph has non-integer weights" };
  return { bound: floorCutBound(bound), problem: null };
}

/**
 * The largest tolerance an honest record can carry: 0 for integer weights; otherwise the exact
 * search's slack, at most one margin per component, which is ≤ (components + 1) × the whole
 * graph's margin (each component margin is max(1e-12, 1e-11·Σ|w| of the component)).
 */
function toleranceLimit(graph: Graph): number {
  if (hasIntegerWeights(graph)) return 0;
  return (connectedComponents(graph).count + 1) * improvementMargin(graph);
}

/** Every check of a record against its graph. `ok` is true only when all pass. */
export function verifyBracket(graph: Graph, record: BracketRecord, options: BracketVerifyOptions = {}): BracketVerdict {
  const checks: BracketCheck[] = [];
  const add = (name: string, ok: boolean, message: string): void => {
    checks.push({ name, ok, message });
  };

  const hash = graphHash(graph);
  add("graph", hash === record.graphHash && graph.n === record.n && graph.m === record.m,
    hash === record.graphHash ? `same graph (n = ${graph.n}, m = ${graph.m})` : `graph hash differs: record ${record.graphHash}, graph ${hash} (n = ${graph.n}, m = ${graph.m})`);
  add("totalWeight", graph.totalWeight === record.totalWeight, `W = ${graph.totalWeight}${graph.totalWeight === record.totalWeight ? "" : `, record says ${record.totalWeight}`}`);

  // Lower bound: the partition must be a 0/1 vector whose cut is exactly `lower`.
  const p = record.partition;
  const wellFormed = Array.isArray(p) && p.length === graph.n && p.every((s) => s === 0 || s === 1);
  if (!wellFormed) {
    add("lower", false, `partition should hold ${graph.n} entries of 0 or 1`);
  } else {
    const value = cutValue(graph, p);
    add("lower", value === record.lower, value === record.lower ? `cut of the partition = ${value}` : `cut of the partition is ${value}, record claims ${record.lower}`);
  }

  // Upper bound: re-derived from the certificate alone.
  const cert = record.certificate;
  // The tolerance is the record's claim, so it is bounded from the graph before any check uses it
  // (a large tolerance used to let `upper` sit below the max cut; test/bracket.test.ts "tolerance").
  const tolLimit = toleranceLimit(graph);
  const tolOk = cert.tolerance >= 0 && cert.tolerance <= tolLimit;
  if (!tolOk) add("tolerance", false, `certificate tolerance ${cert.tolerance} is outside [0, ${tolLimit}] for this graph`);
  const tol = tolOk ? cert.tolerance : 0;
  switch (cert.kind) {
    case "psd-dual": {
      if (cert.y.length !== graph.n || !cert.y.every(isNumber)) {
        add("upper", false, `dual vector y should hold ${graph.n} finite numbers`);
        break;
      }
      const v = verifyCertificate(graph, { kind: "psd-dual", y: Float64Array.from(cert.y), shift: cert.shift, shiftProof: cert.shiftProof });
      if (!v.ok) {
        add("upper", false, `dual certificate rejected: ${v.message}`);
        break;
      }
      const r = applyRounding(graph, cert, v.value);
      if (record.upperKind === "proven" && !v.proven) add("proof", false, `record claims a proven bound but shift proof ${cert.shiftProof} is an estimate`);
      // `exact` claims a proof: an estimated shift cannot close the bracket (test/bracket.test.ts "unproven").
      if (record.exact && !v.proven) add("proof", false, `record claims exact but shift proof ${cert.shiftProof} is an estimate, not a proof`);
      if (r.problem !== null) add("upper", false, r.problem);
      else add("upper", r.bound <= record.upper, `dual certificate (${cert.shiftProof}${v.proven ? "" : ": an estimate, not a proof"}) gives max cut ≤ ${r.bound}${r.bound <= record.upper ? "" : `, more than the claimed upper ${record.upper}`}`);
      break;
    }
    case "positive-weights": {
      const s = positiveWeightSum(graph);
      add("upper", s <= record.upper, `sum of positive weights = ${s}${s <= record.upper ? "" : ` exceeds the claimed ${record.upper}`}`);
      break;
    }
    case "exhaustive":
    case "unfinished-search": {
      const seconds = options.seconds ?? 60;
      // Starting from the record's own cut (when it is a valid partition) prunes as the original run did.
      const valid = record.partition.length === graph.n && record.partition.every((x) => x === 0 || x === 1);
      const r = exactMaxCut(graph, { seconds, initial: valid ? record.partition : undefined });
      if (r.status === "optimal") {
        add("upper", r.value <= record.upper + tol, `exact search (${r.method}, ${r.seconds.toFixed(2)} s) finds max cut ${r.value}${r.value <= record.upper + tol ? "" : `, above the claimed upper ${record.upper}`}`);
      } else {
        // The stopped search proves max cut ≤ r.upper; with integer weights that rounds down, as `cut` did.
        const rounded = applyRounding(graph, cert, r.upper);
        const bound = rounded.problem === null ? rounded.bound : r.upper;
        if (rounded.problem !== null) add("upper", false, rounded.problem);
        else add("upper", bound <= record.upper + tol, bound <= record.upper + tol
          ? `exact search stopped after ${seconds} s with bound ${bound} ≤ claimed ${record.upper}`
          : `exact search did not finish within ${seconds} s (bound ${bound} > claimed ${record.upper}); rerun with more --seconds`);
      }
      break;
    }
  }

  // The derived fields must agree with lower, upper and W.
  const W = graph.totalWeight;
  const consistent = record.lower <= record.upper + tol && record.surplusLower === record.lower - W / 2 && record.surplusUpper === record.upper - W / 2;
  add("consistency", consistent, consistent ? "lower ≤ upper, surpluses = bounds − W/2" : "lower > upper or surplus fields do not match the bounds");
  if (record.exact) {
    // upper = lower + tolerance was itself rounded: allow a few ulps on top.
    const closed = record.upper - record.lower <= tol + 8 * Number.EPSILON * Math.max(1, Math.abs(record.upper));
    add("exact", closed, closed ? "bracket closed: the cut is optimal" : `record claims exact but upper − lower = ${record.upper - record.lower}`);
  }
  return { ok: checks.every((c) => c.ok), checks };
}
