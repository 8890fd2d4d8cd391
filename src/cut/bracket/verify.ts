// Re-checks a max-cut bracket record against its graph without trusting the record or the solvers
// that made it. The lower end must be the cut of the record's partition (`cutValue`). The upper end
// is accepted only when verify re-derives, from the certificate and the graph alone, a proven bound
// B ≤ upper: B carries every rounding allowance of verify's own arithmetic (the dual bound's
// rounded sum, the exact search's slack), never a tolerance taken from the record. A record whose
// upper end lies below its own witness cut is rejected outright. A Lanczos shift proves nothing:
// such an upper end is reported as an estimate, never as verified. A Chebyshev shift is re-run from
// its recorded seed and reported as probable, with its failure probability. The verdict word and the exit
// status it leads to are decided here, once, for record files and results stores alike.

import { InputError, echo, isInputError, oneLine } from "../../errors.js";
import { cutValue, floorCutBound } from "../../graph/cut-value.js";
import { GRAPH_FORMATS } from "../../graph/formats/types.js";
import type { Graph } from "../../graph/graph.js";
import { graphHash } from "../../graph/hash.js";
import { hasIntegerWeights } from "../../graph/weights.js";
import { exactMaxCut } from "../exact/exact-max-cut.js";
import { closingTolerance } from "../exact/exact-slack.js";
import { MAX_DUAL_ENTRY, SHIFT_PROOFS, verifyCertificate } from "../relaxation/certificate.js";
import { positiveWeightBound } from "../positive-weights.js";
import { verifyTriangleCertificate } from "../relaxation/triangle-dual.js";
import { TREE_RELAXATIONS, verifyTreeCertificate, type TreeRegion } from "../tree/relaxation-tree.js";
import { TREE_PACKING_FORMAT, unpackTreeRegions } from "../tree/tree-codec.js";
import type { UpperKind } from "../types.js";
import { BRACKET_EFFORTS, BRACKET_RECORD_KIND, BRACKET_RECORD_VERSION, type BracketRecord } from "./record.js";
import { BUDGET_KINDS } from "./budget.js";

const UPPER_KINDS: readonly UpperKind[] = ["proven", "probable", "estimate"];

export interface BracketCheck {
  name: string;
  ok: boolean;
  message: string;
}

/**
 * What verify concludes about a record: `verified` (every check passed and verify itself proved
 * the upper end), `estimate` (every check passed, but the upper end rests on a Lanczos shift: not a
 * proof) or `rejected` (a check failed).
 */
export type VerdictWord = "verified" | "probable" | "estimate" | "rejected";

export interface BracketVerdict {
  /** Every check passed. With `upperKind` "estimate" the upper end is still not a proof. */
  ok: boolean;
  verdict: VerdictWord;
  /**
   * How verify itself established the upper end: "proven" (a certificate re-proved from the graph),
   * "estimate" (a Lanczos shift re-estimated, not a proof), or null when it could not re-derive one.
   */
  upperKind: UpperKind | null;
  /** For a probable upper end: the probability that it is wrong, as re-derived (the verdict `probable`). */
  failureProbability?: number;
  checks: BracketCheck[];
}

export interface BracketVerifyOptions {
  /** Budget for re-running an exact search when the certificate is exhaustive (default 60 s). */
  seconds?: number;
}

// EXIT_ESTIMATE lives in ./exit-estimate.ts (the command line's help shows it without loading verify).
import { EXIT_ESTIMATE } from "./exit-estimate.js";
export { EXIT_ESTIMATE };

/**
 * The exit status of a verify run from its verdicts: 1 when any record is rejected, else
 * EXIT_ESTIMATE when any upper end is only an estimate (unless estimates are accepted), else 0.
 */
export function verifyExitStatus(counts: { rejected: number; estimate: number; probable?: number }, acceptEstimates: boolean): number {
  if (counts.rejected > 0) return 1;
  // A probable upper end is not a proof either: the same status as an estimate.
  return counts.estimate + (counts.probable ?? 0) > 0 && !acceptEstimates ? EXIT_ESTIMATE : 0;
}

// ---- record shape -----------------------------------------------------------------------------

const HASH_RE = /^sha256:[0-9a-f]{64}$/;
const CERTIFICATE_KINDS = ["psd-dual", "exhaustive", "unfinished-search", "positive-weights", "triangle-dual", "sdp-tree"];
const EMBEDDED_FORMATS = ["graph6", "sparse6", "edgelist"];

/** Field checks that throw one InputError naming the record and the field. */
class Fields {
  constructor(private readonly where: string) {}

  bad(field: string, expected: string, got: unknown): never {
    throw new InputError(`${this.where}: field \`${field}\` should be ${expected} (got ${got === undefined ? "nothing" : echo(got, 60)})`);
  }

  object(field: string, v: unknown): Record<string, unknown> {
    if (typeof v !== "object" || v === null || Array.isArray(v)) this.bad(field, "an object", v);
    return v as Record<string, unknown>;
  }

  finite(field: string, v: unknown): number {
    if (typeof v !== "number" || !Number.isFinite(v)) this.bad(field, "a finite number", v);
    return v as number;
  }

  count(field: string, v: unknown): number {
    if (typeof v !== "number" || !Number.isSafeInteger(v) || v < 0) this.bad(field, "a non-negative integer", v);
    return v as number;
  }

  bool(field: string, v: unknown): boolean {
    if (typeof v !== "boolean") this.bad(field, "true or false", v);
    return v as boolean;
  }

  text(field: string, v: unknown): string {
    if (typeof v !== "string" || v === "") this.bad(field, "a non-empty string", v);
    return v as string;
  }

  oneOf(field: string, v: unknown, allowed: readonly string[]): string {
    if (typeof v !== "string" || !allowed.includes(v)) this.bad(field, `one of ${allowed.join(", ")}`, v);
    return v as string;
  }

  optional<T>(r: Record<string, unknown>, key: string, field: string, check: (f: string, v: unknown) => T): void {
    if (Object.prototype.hasOwnProperty.call(r, key)) check.call(this, field, r[key]);
  }
}

/** The record's `budget` section (record.ts, budget.ts): types only; verify re-derives nothing from it. */
function checkBudget(f: Fields, v: unknown): void {
  const b = f.object("budget", v);
  f.oneOf("budget.governing", b.governing, BUDGET_KINDS);
  if (b.secondsLimit !== null) f.finite("budget.secondsLimit", b.secondsLimit);
  if (b.workLimit !== null) f.count("budget.workLimit", b.workLimit);
  f.count("budget.workUsed", b.workUsed);
  f.finite("budget.secondsUsed", b.secondsUsed);
  if (!Array.isArray(b.stages)) f.bad("budget.stages", "an array", b.stages);
  (b.stages as unknown[]).forEach((x, i) => {
    const s = f.object(`budget.stages[${i}]`, x);
    f.text(`budget.stages[${i}].stage`, s.stage);
    f.count(`budget.stages[${i}].workUsed`, s.workUsed);
    f.finite(`budget.stages[${i}].secondsUsed`, s.secondsUsed);
  });
}

/**
 * Check a parsed JSON value has the shape of a bracket record (types and ranges only, not truth):
 * anything malformed is bad input (InputError naming `where` and the field); a well-formed record
 * whose claims fail gets a verdict from `verifyBracket`. `where` names the record, e.g. "r.json:3".
 */
export function parseBracketRecord(value: unknown, where: string): BracketRecord {
  const f = new Fields(where);
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    throw new InputError(`${where}: not a max-cut bracket record: expected a JSON object`);
  }
  const r = value as Record<string, unknown>;
  if (r.kind !== BRACKET_RECORD_KIND) throw new InputError(`${where}: not a max-cut bracket record: field \`kind\` should be ${JSON.stringify(BRACKET_RECORD_KIND)}`);
  if (r.version !== BRACKET_RECORD_VERSION) {
    throw new InputError(`${where}: unsupported \`version\` ${echo(r.version, 20)} (this build reads ${BRACKET_RECORD_VERSION})`);
  }
  f.count("n", r.n);
  f.count("m", r.m);
  for (const k of ["totalWeight", "lower", "upper", "surplusLower", "surplusUpper"]) f.finite(k, r[k]);
  f.bool("exact", r.exact);
  f.oneOf("upperKind", r.upperKind, UPPER_KINDS);
  if (typeof r.graphHash !== "string" || !HASH_RE.test(r.graphHash)) f.bad("graphHash", 'a hash "sha256:" followed by 64 hex digits', r.graphHash);
  if (!Array.isArray(r.partition)) f.bad("partition", "an array of 0/1", r.partition);
  const part = r.partition as unknown[];
  for (let i = 0; i < part.length; i++) if (part[i] !== 0 && part[i] !== 1) f.bad(`partition[${i}]`, "0 or 1", part[i]);
  f.optional(r, "lowerMethod", "lowerMethod", f.text);
  f.optional(r, "upperMethod", "upperMethod", f.text);
  f.optional(r, "seconds", "seconds", f.finite);
  f.optional(r, "solverSeed", "solverSeed", f.count);
  f.optional(r, "effort", "effort", (k, v) => f.oneOf(k, v, BRACKET_EFFORTS));
  f.optional(r, "interrupted", "interrupted", f.bool);
  if (Object.prototype.hasOwnProperty.call(r, "runs") && !Array.isArray(r.runs)) f.bad("runs", "an array", r.runs);
  if (Object.prototype.hasOwnProperty.call(r, "notes") && !(Array.isArray(r.notes) && r.notes.every((x) => typeof x === "string"))) f.bad("notes", "an array of strings", r.notes);

  if (Object.prototype.hasOwnProperty.call(r, "budget")) checkBudget(f, r.budget);

  // Missing or non-object `source` used to crash verify with a TypeError (test/cli-cut.test.ts "malformed `source`").
  const src = f.object("source", r.source);
  f.optional(src, "spec", "source.spec", f.text);
  f.optional(src, "path", "source.path", f.text);
  f.optional(src, "position", "source.position", (k, v) => {
    if (f.count(k, v) < 1) f.bad(k, "a position counted from 1", v);
  });
  if (Object.prototype.hasOwnProperty.call(src, "graphSeed") && src.graphSeed !== null) f.count("source.graphSeed", src.graphSeed);
  f.optional(src, "format", "source.format", (k, v) => f.oneOf(k, v, GRAPH_FORMATS));
  if (Object.prototype.hasOwnProperty.call(src, "embedded")) {
    const e = f.object("source.embedded", src.embedded);
    f.oneOf("source.embedded.format", e.format, EMBEDDED_FORMATS);
    if (typeof e.text !== "string") f.bad("source.embedded.text", "a string", e.text);
  }

  const c = f.object("certificate", r.certificate);
  f.oneOf("certificate.kind", c.kind, CERTIFICATE_KINDS);
  f.bool("certificate.roundedDown", c.roundedDown);
  const tol = f.finite("certificate.tolerance", c.tolerance);
  if (tol < 0) f.bad("certificate.tolerance", "a number ≥ 0", tol);
  if (c.kind === "psd-dual") {
    if (!Array.isArray(c.y)) f.bad("certificate.y", "an array of numbers", c.y);
    const y = c.y as unknown[];
    for (let i = 0; i < y.length; i++) {
      const v = y[i];
      if (typeof v !== "number" || !(Math.abs(v) <= MAX_DUAL_ENTRY)) f.bad(`certificate.y[${i}]`, `a number with |y| ≤ ${MAX_DUAL_ENTRY}`, v);
    }
    const shift = f.finite("certificate.shift", c.shift);
    if (!(Math.abs(shift) <= MAX_DUAL_ENTRY)) f.bad("certificate.shift", `a number with |shift| ≤ ${MAX_DUAL_ENTRY}`, shift);
    f.oneOf("certificate.shiftProof", c.shiftProof, SHIFT_PROOFS);
    if (c.shiftProof === "chebyshev-probable" || Object.prototype.hasOwnProperty.call(c, "probable")) {
      const p = f.object("certificate.probable", c.probable);
      for (const k of ["failureProbability", "top", "bottom"]) f.finite(`certificate.probable.${k}`, p[k]);
      f.count("certificate.probable.solverSeed", p.solverSeed);
      f.count("certificate.probable.degree", p.degree);
    }
  } else if (c.kind === "triangle-dual" || c.kind === "sdp-tree") {
    parseStrengthened(f, c);
  } else if (c.kind === "exhaustive" || c.kind === "unfinished-search") {
    f.text("certificate.search", c.search);
    f.optional(c, "graySteps", "certificate.graySteps", f.count);
    f.optional(c, "branchNodes", "certificate.branchNodes", f.count);
  }
  return value as BracketRecord;
}

/** Shapes of the strengthened-SDP certificates (effort deep): numbers where numbers belong; truth is checked later. */
function parseStrengthened(f: Fields, c: Record<string, unknown>): void {
  const numbers = (field: string, v: unknown): void => {
    if (!Array.isArray(v) || !v.every((x) => typeof x === "number" && Number.isFinite(x))) f.bad(field, "an array of finite numbers", v);
  };
  const dual = (field: string, d: Record<string, unknown>): void => {
    numbers(`${field}.y`, d.y);
    f.finite(`${field}.shift`, d.shift);
    f.oneOf(`${field}.shiftProof`, d.shiftProof, ["cholesky"]);
    numbers(`${field}.triangles`, d.triangles);
    numbers(`${field}.mu`, d.mu);
  };
  if (c.kind === "triangle-dual") return dual("certificate", c);
  f.count("certificate.rootVertex", c.rootVertex);
  f.count("certificate.nodes", c.nodes);
  f.oneOf("certificate.relaxation", c.relaxation, TREE_RELAXATIONS);
  // The packed form (what this build writes) or the plain array (earlier builds; stores hold it).
  const hasPacked = Object.prototype.hasOwnProperty.call(c, "packed"), hasPlain = Object.prototype.hasOwnProperty.call(c, "regions");
  if (hasPacked === hasPlain) f.bad("certificate", "either `packed` or `regions`, not both or neither", hasPacked ? "both" : "neither");
  if (hasPacked) {
    const p = f.object("certificate.packed", c.packed);
    f.oneOf("certificate.packed.format", p.format, [TREE_PACKING_FORMAT]);
    f.count("certificate.packed.regions", p.regions);
    f.count("certificate.packed.bytes", p.bytes);
    f.text("certificate.packed.data", p.data);
  }
  if (!hasPlain) {
    parseOrbital(f, c);
    return;
  }
  if (!Array.isArray(c.regions)) f.bad("certificate.regions", "an array", c.regions);
  (c.regions as unknown[]).forEach((reg, q) => {
    const r = f.object(`certificate.regions[${q}]`, reg);
    numbers(`certificate.regions[${q}].vertices`, r.vertices);
    numbers(`certificate.regions[${q}].sides`, r.sides);
    f.finite(`certificate.regions[${q}].bound`, r.bound);
    const rc = f.object(`certificate.regions[${q}].certificate`, r.certificate);
    f.oneOf(`certificate.regions[${q}].certificate.kind`, rc.kind, ["triangle-dual", "exhaustive"]);
    if (rc.kind === "triangle-dual") dual(`certificate.regions[${q}].certificate`, rc);
  });
  parseOrbital(f, c);
}

/** Shapes of a tree certificate's orbital branches and automorphisms, when present. */
function parseOrbital(f: Fields, c: Record<string, unknown>): void {
  const numbers = (field: string, v: unknown): void => {
    if (!Array.isArray(v) || !v.every((x) => typeof x === "number" && Number.isFinite(x))) f.bad(field, "an array of finite numbers", v);
  };
  if (c.orbital === undefined && c.automorphisms === undefined) return;
  if (!Array.isArray(c.orbital)) f.bad("certificate.orbital", "an array", c.orbital);
  if (!Array.isArray(c.automorphisms)) f.bad("certificate.automorphisms", "an array", c.automorphisms);
  (c.automorphisms as unknown[]).forEach((p, q) => numbers(`certificate.automorphisms[${q}]`, p));
  (c.orbital as unknown[]).forEach((b, q) => {
    const r = f.object(`certificate.orbital[${q}]`, b);
    for (const k of ["vertices", "sides", "orbit", "maps"]) numbers(`certificate.orbital[${q}].${k}`, r[k]);
    f.count(`certificate.orbital[${q}].vertex`, r.vertex);
    f.count(`certificate.orbital[${q}].side`, r.side);
  });
}

// ---- verdict ----------------------------------------------------------------------------------

/** The proven bound a certificate gives, re-derived from the graph alone. */
interface DerivedUpper {
  /** max cut ≤ bound, or NaN when the certificate fails. */
  bound: number;
  kind: UpperKind;
  failureProbability?: number;
  /** Why the certificate fails, or what it proved. */
  message: string;
  /** An exact search that ran out of time: more --seconds may prove a lower bound. */
  stopped?: boolean;
}

function deriveUpper(graph: Graph, record: BracketRecord, integral: boolean, seconds: number): DerivedUpper {
  const cert = record.certificate;
  const failed = (message: string): DerivedUpper => ({ bound: NaN, kind: "proven", message });
  switch (cert.kind) {
    case "psd-dual": {
      if (cert.y.length !== graph.n) return failed(`dual vector y has ${cert.y.length} entries, the graph ${graph.n} vertices`);
      const v = verifyCertificate(graph, { kind: "psd-dual", y: Float64Array.from(cert.y), shift: cert.shift, shiftProof: cert.shiftProof, ...(cert.probable === undefined ? {} : { probable: cert.probable }) });
      if (!v.ok) return failed(`dual certificate rejected: ${v.message}`);
      // Exact integer weights: every cut is an integer, so the rounded-up bound may be rounded down.
      const bound = integral ? floorCutBound(v.value) : v.value;
      const how = v.kind === "proven" ? "" : v.kind === "probable" ? `: holds with probability ≥ 1 − ${v.failureProbability}` : ": an estimate, not a proof";
      return { bound, kind: v.kind, failureProbability: v.failureProbability, message: `dual certificate (${cert.shiftProof}${how}) gives max cut ≤ ${bound}` };
    }
    case "triangle-dual": {
      const v = verifyTriangleCertificate(graph, { kind: "triangle-dual", y: Float64Array.from(cert.y), shift: cert.shift, shiftProof: cert.shiftProof, triangles: Int32Array.from(cert.triangles), mu: Float64Array.from(cert.mu) });
      if (!v.ok) return failed(`triangle certificate rejected: ${v.message}`);
      const bound = integral ? floorCutBound(v.value) : v.value;
      return { bound, kind: "proven", message: `SDP with ${cert.mu.length} triangle inequalities (Cholesky shift) gives max cut ≤ ${bound}` };
    }
    case "sdp-tree": {
      if (!integral) return failed("an SDP tree certificate needs integer weights");
      let regions: TreeRegion[];
      try {
        regions = cert.packed !== undefined ? unpackTreeRegions(cert.packed, graph.n) : (cert.regions ?? []);
      } catch (e) {
        // A forged or truncated byte string: the certificate fails (one line), the record is rejected.
        if (isInputError(e)) return failed(`tree certificate rejected: ${oneLine(e.message)}`);
        throw e;
      }
      const v = verifyTreeCertificate(graph, { rootVertex: cert.rootVertex, relaxation: cert.relaxation, regions, orbital: cert.orbital, automorphisms: cert.automorphisms });
      if (!v.ok) return failed(`tree certificate rejected: ${v.message}`);
      return { bound: v.bound, kind: "proven", message: `branch and bound: ${v.message}` };
    }
    case "positive-weights": {
      const bound = positiveWeightBound(graph);
      return { bound, kind: "proven", message: `sum of positive weights gives max cut ≤ ${bound}` };
    }
    case "exhaustive":
    case "unfinished-search": {
      // Starting from the record's own cut (when it is a valid partition) prunes as the original run did.
      const p = record.partition;
      const valid = p.length === graph.n;
      const r = exactMaxCut(graph, { seconds, initial: valid ? p : undefined });
      // r.upper is proven: for non-integer weights it already includes the search's slack.
      const bound = integral ? floorCutBound(r.upper) : r.upper;
      if (r.status === "optimal") return { bound, kind: "proven", message: `exact search (${r.method}) proves max cut ≤ ${bound} (its cut: ${r.value})` };
      return { bound, kind: "proven", message: `exact search stopped after ${seconds} s with max cut ≤ ${bound}`, stopped: true };
    }
  }
}

/** Every check of a record against its graph, and the verdict they add up to. */
export function verifyBracket(graph: Graph, record: BracketRecord, options: BracketVerifyOptions = {}): BracketVerdict {
  const seconds = options.seconds ?? 60;
  const checks: BracketCheck[] = [];
  const add = (name: string, ok: boolean, message: string): void => {
    checks.push({ name, ok, message });
  };
  const integral = hasIntegerWeights(graph);

  const hash = graphHash(graph);
  const same = hash === record.graphHash && graph.n === record.n && graph.m === record.m;
  add("graph", same, same ? `same graph (n = ${graph.n}, m = ${graph.m})` : `graph differs: record ${record.graphHash} (n = ${record.n}, m = ${record.m}), graph ${hash} (n = ${graph.n}, m = ${graph.m})`);
  add("totalWeight", graph.totalWeight === record.totalWeight, `W = ${graph.totalWeight}${graph.totalWeight === record.totalWeight ? "" : `, record says ${record.totalWeight}`}`);

  // Lower end: the partition must be a 0/1 vector whose cut is exactly `lower`.
  const p = record.partition;
  let witness = NaN;
  if (!(Array.isArray(p) && p.length === graph.n && p.every((s) => s === 0 || s === 1))) {
    add("lower", false, `partition should hold ${graph.n} entries of 0 or 1`);
  } else {
    witness = cutValue(graph, p);
    add("lower", witness === record.lower, witness === record.lower ? `cut of the partition = ${witness}` : `cut of the partition is ${witness}, record claims ${record.lower}`);
  }

  // Upper end: re-derived from the certificate and the graph alone.
  const cert = record.certificate;
  let upperKind: BracketVerdict["upperKind"] = null;
  let failureProbability: number | undefined;
  if (cert.roundedDown && !integral) {
    add("upper", false, "certificate says its bound was rounded down to an integer, but the graph's weights are not exact integers");
  } else if (!same) {
    add("upper", false, "not re-derived: the record belongs to another graph");
  } else {
    let d: DerivedUpper;
    try {
      d = deriveUpper(graph, record, integral, seconds);
    } catch (e) {
      // The graph is too large to redo the proof here (memory): the bound stays unverified.
      if (!(e instanceof InputError)) throw e;
      d = { bound: NaN, kind: "proven", message: `could not re-derive the bound: ${e.message}` };
    }
    if (Number.isNaN(d.bound)) add("upper", false, d.message);
    else {
      upperKind = d.kind;
      failureProbability = d.failureProbability;
      const ok = record.upper >= d.bound;
      add("upper", ok, ok ? `${d.message} ≤ claimed ${record.upper}` : `${d.message}, above the claimed upper ${record.upper}${d.stopped === true ? "; rerun with more --seconds" : ""}`);
    }
  }
  if (upperKind === "probable") {
    // A probable shift is no proof: `upperKind: "proven"` and `exact` are refused as for an estimate, and a
    // record must not claim less doubt than verify re-derived (test/certificate-scale.test.ts).
    const claims = [record.upperKind === "proven" ? "a proven upper bound" : "", record.exact ? "an exact value" : ""].filter(Boolean);
    add("proof", claims.length === 0, claims.length === 0
      ? `upper end holds with probability ≥ 1 − ${failureProbability} (re-run from its seed), not a proof`
      : `record claims ${claims.join(" and ")} but the shift is probable (δ = ${failureProbability}), not a proof`);
  }
  if (upperKind === "estimate") {
    // `upperKind: "proven"` and `exact` claim a proof; an estimated shift cannot carry either (test/bracket.test.ts "unproven").
    const how = cert.kind === "psd-dual" ? cert.shiftProof : cert.kind;
    const claims = [record.upperKind === "proven" ? "a proven upper bound" : "", record.exact ? "an exact value" : ""].filter(Boolean);
    add("proof", claims.length === 0, claims.length === 0
      ? `upper end is an estimate (shift proof ${how}), not a proof`
      : `record claims ${claims.join(" and ")} but the shift proof ${how} is an estimate, not a proof`);
  }

  // No record may put its upper end below its own lower end or its own witness cut.
  const W = graph.totalWeight;
  const ordered = record.lower <= record.upper && !(witness > record.upper);
  const surplus = record.surplusLower === record.lower - W / 2 && record.surplusUpper === record.upper - W / 2;
  add("consistency", ordered && surplus, !ordered
    ? `upper ${record.upper} lies below ${witness > record.upper ? `the cut of its own partition (${witness})` : `its lower end ${record.lower}`}`
    : surplus ? "lower ≤ upper, surpluses = bounds − W/2" : "surplus fields do not equal the bounds − W/2");
  if (record.exact) {
    const tol = closingTolerance(graph);
    const gap = record.upper - record.lower;
    const closed = integral ? gap === 0 : gap >= 0 && gap <= tol;
    add("exact", closed, closed ? `bracket closed${gap > 0 ? ` within the search slack ${tol}` : ""}: the cut is optimal` : `record claims exact but upper − lower = ${gap}${integral ? "" : `, outside [0, ${tol}] (the closing tolerance)`}`);
  }
  const ok = checks.every((c) => c.ok);
  const verdict: VerdictWord = !ok ? "rejected" : upperKind === "estimate" ? "estimate" : upperKind === "probable" ? "probable" : "verified";
  return { ok, verdict, upperKind, ...(failureProbability === undefined ? {} : { failureProbability }), checks };
}
