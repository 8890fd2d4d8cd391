// Re-checks a max-cut bracket record against its graph without trusting the record or the solvers
// that made it. The lower end must be the cut of the record's partition (`cutValue`). The upper end
// is accepted only when verify re-derives, from the certificate and the graph alone, a proven bound
// B ≤ upper: B carries every rounding allowance of verify's own arithmetic (the dual bound's
// rounded sum, the exact search's slack), never a tolerance taken from the record. A record whose
// upper end lies below its own witness cut is rejected outright. A Lanczos shift proves nothing:
// such an upper end is reported as an estimate, never as verified.

import { createHash } from "node:crypto";
import { InputError } from "../errors.js";
import type { Graph } from "../graph/graph.js";
import { GRAPH_FORMATS } from "../graph/formats/types.js";
import type { BracketRecord } from "./bracket.js";
import { MAX_DUAL_ENTRY, verifyCertificate } from "./certificate.js";
import { cutValue } from "./evaluate.js";
import { integerWeights, positiveWeightBound } from "./exact-common.js";
import { exactSearchSlack } from "./exact-slack.js";
import { exactMaxCut } from "./exact.js";

/** Format tag written into every bracket record, so verify can refuse other JSON. */
export const BRACKET_RECORD_KIND = "halfplus-maxcut-bracket";
export const BRACKET_RECORD_VERSION = 1;

/**
 * SHA-256 over n, m and the sorted edge list (u < v, u32 little-endian each, weight as f64
 * little-endian; unweighted edges hash with weight 1), hex-encoded with a "sha256:" prefix.
 * Vertex labels matter: a relabelled graph is a different input to a partition.
 */
export function graphHash(graph: Graph): string {
  const h = createHash("sha256");
  const head = Buffer.alloc(24);
  head.write("hpg1", 0, "latin1");
  head.writeUInt32LE(0, 4);
  head.writeDoubleLE(graph.n, 8);
  head.writeDoubleLE(graph.m, 16);
  h.update(head);
  const CHUNK = Math.max(1, Math.min(4096, graph.m));
  const buf = Buffer.allocUnsafe(CHUNK * 16);
  let k = 0;
  const { offsets, neighbors, weights } = graph;
  for (let u = 0; u < graph.n; u++) {
    for (let i = offsets[u]; i < offsets[u + 1]; i++) {
      const v = neighbors[i];
      if (v <= u) continue;
      const o = k * 16;
      buf.writeUInt32LE(u, o);
      buf.writeUInt32LE(v, o + 4);
      buf.writeDoubleLE(weights === null ? 1 : weights[i], o + 8);
      if (++k === CHUNK) {
        h.update(buf);
        k = 0;
      }
    }
  }
  if (k > 0) h.update(buf.subarray(0, k * 16));
  return `sha256:${h.digest("hex")}`;
}

export interface BracketCheck {
  name: string;
  ok: boolean;
  message: string;
}

export interface BracketVerdict {
  /** Every check passed. With `upperKind` "estimate" the upper end is still not a proof. */
  ok: boolean;
  /**
   * How verify itself established the upper end: "proven" (a certificate re-proved from the graph),
   * "estimate" (a Lanczos shift re-estimated, not a proof), or null when it could not re-derive one.
   */
  upperKind: "proven" | "estimate" | null;
  checks: BracketCheck[];
}

export interface BracketVerifyOptions {
  /** Budget for re-running an exact search when the certificate is exhaustive (default 60 s). */
  seconds?: number;
}

/** The closing tolerance of a bracket: how far `upper` may sit above `lower` when `exact` is claimed. */
export function closingTolerance(graph: Graph): number {
  // The bracket publishes an exact search's bound (cut + slack) plus twice the slack (src/cut/bracket.ts),
  // so that verify's own re-run (whose cut may differ by the slack) stays below it: 3 slacks and a
  // few roundings in all, inside 4 slacks.
  return integerWeights(graph) ? 0 : 4 * exactSearchSlack(graph);
}

// ---- record shape -----------------------------------------------------------------------------

const HASH_RE = /^sha256:[0-9a-f]{64}$/;
const CERTIFICATE_KINDS = ["psd-dual", "exhaustive", "search-bound", "positive-weights"];

/** Field checks that throw one InputError naming the record and the field. */
class Fields {
  constructor(private readonly where: string) {}

  bad(field: string, expected: string, got: unknown): never {
    let shown: string;
    try {
      shown = JSON.stringify(got) ?? String(got);
    } catch {
      shown = String(got);
    }
    if (shown.length > 60) shown = `${shown.slice(0, 60)}...`;
    throw new InputError(`${this.where}: field \`${field}\` should be ${expected} (got ${got === undefined ? "nothing" : shown})`);
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

  optional<T>(r: Record<string, unknown>, key: string, field: string, check: (f: string, v: unknown) => T): void {
    if (Object.prototype.hasOwnProperty.call(r, key)) check.call(this, field, r[key]);
  }
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
    throw new InputError(`${where}: unsupported \`version\` ${String(JSON.stringify(r.version)).slice(0, 20)} (this build reads ${BRACKET_RECORD_VERSION})`);
  }
  f.count("n", r.n);
  f.count("m", r.m);
  for (const k of ["totalWeight", "lower", "upper", "surplusLower", "surplusUpper"]) f.finite(k, r[k]);
  f.bool("exact", r.exact);
  f.bool("upperProven", r.upperProven);
  if (typeof r.graphHash !== "string" || !HASH_RE.test(r.graphHash)) f.bad("graphHash", 'a hash "sha256:" followed by 64 hex digits', r.graphHash);
  if (!Array.isArray(r.partition)) f.bad("partition", "an array of 0/1", r.partition);
  const part = r.partition as unknown[];
  for (let i = 0; i < part.length; i++) if (part[i] !== 0 && part[i] !== 1) f.bad(`partition[${i}]`, "0 or 1", part[i]);
  f.optional(r, "lowerMethod", "lowerMethod", f.text);
  f.optional(r, "upperMethod", "upperMethod", f.text);
  f.optional(r, "seconds", "seconds", f.finite);
  f.optional(r, "seed", "seed", f.count);
  f.optional(r, "method", "method", f.text);
  f.optional(r, "interrupted", "interrupted", f.bool);
  if (Object.prototype.hasOwnProperty.call(r, "runs") && !Array.isArray(r.runs)) f.bad("runs", "an array", r.runs);

  // Missing or non-object `source` used to crash verify with a TypeError (test/cli-cut.test.ts "malformed `source`").
  if (r.source !== null) {
    const src = f.object("source", r.source);
    f.optional(src, "spec", "source.spec", f.text);
    f.optional(src, "path", "source.path", f.text);
    f.optional(src, "index", "source.index", f.count);
    if (Object.prototype.hasOwnProperty.call(src, "format") && !GRAPH_FORMATS.includes(src.format as never)) {
      f.bad("source.format", `one of ${GRAPH_FORMATS.join(", ")}`, src.format);
    }
  }

  const c = f.object("certificate", r.certificate);
  if (!CERTIFICATE_KINDS.includes(c.kind as string)) f.bad("certificate.kind", `one of ${CERTIFICATE_KINDS.join(", ")}`, c.kind);
  f.bool("certificate.floored", c.floored);
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
    f.text("certificate.shiftMethod", c.shiftMethod);
  } else if (c.kind === "exhaustive" || c.kind === "search-bound") {
    f.text("certificate.search", c.search);
    f.optional(c, "nodes", "certificate.nodes", f.count);
  }
  return value as BracketRecord;
}

// ---- verdict ----------------------------------------------------------------------------------

/** The proven bound a certificate gives, re-derived from the graph alone. */
interface DerivedUpper {
  /** max cut ≤ bound, or NaN when the certificate fails. */
  bound: number;
  kind: "proven" | "estimate";
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
      const v = verifyCertificate(graph, { kind: "psd-dual", y: Float64Array.from(cert.y), shift: cert.shift, shiftMethod: cert.shiftMethod });
      if (!v.ok) return failed(`dual certificate rejected: ${v.message}`);
      // Integer weights: every cut is an integer, so the rounded-up bound may be rounded down.
      const bound = integral ? Math.floor(v.value) : v.value;
      const kind = v.proven ? "proven" : "estimate";
      return { bound, kind, message: `dual certificate (${cert.shiftMethod}${v.proven ? "" : ": an estimate, not a proof"}) gives max cut ≤ ${bound}` };
    }
    case "positive-weights": {
      const bound = positiveWeightBound(graph);
      return { bound, kind: "proven", message: `sum of positive weights gives max cut ≤ ${bound}` };
    }
    case "exhaustive":
    case "search-bound": {
      // Starting from the record's own cut (when it is a valid partition) prunes as the original run did.
      const p = record.partition;
      const valid = p.length === graph.n;
      const r = exactMaxCut(graph, { seconds, initial: valid ? p : undefined });
      // r.upper is proven: for non-integer weights it already includes the search's slack.
      const bound = integral ? Math.floor(r.upper) : r.upper;
      if (r.status === "optimal") return { bound, kind: "proven", message: `exact search (${r.method}) proves max cut ≤ ${bound} (its cut: ${r.value})` };
      return { bound, kind: "proven", message: `exact search stopped after ${seconds} s with max cut ≤ ${bound}`, stopped: true };
    }
  }
}

/** Every check of a record against its graph. `ok` is true only when all pass. */
export function verifyBracket(graph: Graph, record: BracketRecord, options: BracketVerifyOptions = {}): BracketVerdict {
  const seconds = options.seconds ?? 60;
  const checks: BracketCheck[] = [];
  const add = (name: string, ok: boolean, message: string): void => {
    checks.push({ name, ok, message });
  };
  const integral = integerWeights(graph);

  const hash = graphHash(graph);
  const same = hash === record.graphHash && graph.n === record.n && graph.m === record.m;
  add("graph", same, same ? `same graph (n = ${graph.n}, m = ${graph.m})` : `graph differs: record ${record.graphHash} (n = ${record.n}, m = ${record.m}), graph ${hash} (n = ${graph.n}, m = ${graph.m})`);
  add("total weight", graph.totalWeight === record.totalWeight, `W = ${graph.totalWeight}${graph.totalWeight === record.totalWeight ? "" : `, record says ${record.totalWeight}`}`);

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
  if (cert.floored && !integral) {
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
      const ok = record.upper >= d.bound;
      add("upper", ok, ok ? `${d.message} ≤ claimed ${record.upper}` : `${d.message}, above the claimed upper ${record.upper}${d.stopped === true ? "; rerun with more --seconds" : ""}`);
    }
  }
  if (upperKind === "estimate") {
    // `upperProven` and `exact` claim a proof; an estimated shift cannot carry either (test/bracket.test.ts "unproven").
    const claims = [record.upperProven ? "a proven upper bound" : "", record.exact ? "an exact value" : ""].filter(Boolean);
    add("proof", claims.length === 0, claims.length === 0
      ? `upper end is an estimate (shift method ${cert.kind === "psd-dual" ? cert.shiftMethod : cert.kind}), not a proof`
      : `record claims ${claims.join(" and ")} but the shift method ${cert.kind === "psd-dual" ? cert.shiftMethod : cert.kind} is an estimate, not a proof`);
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
  return { ok: checks.every((c) => c.ok), upperKind, checks };
}
