// Sweep plans: which graphs to bracket, with which seeds and settings, and what to record. A plan
// is a JSON file or the same object in TypeScript; `loadPlan` checks every field (one-line errors
// naming the field, e.g. `plans/x.json: families[2].grid.q: …`), resolves every family member
// up front (so a bad parameter stops the sweep before it starts) and fixes the job order.

import { closeSync, openSync, readFileSync, readSync, statSync } from "node:fs";
import { basename, dirname, isAbsolute, resolve } from "node:path";
import { InputError } from "../errors.js";
import { isPrimePower } from "../families/finite-field.js";
import { GRAPH_FORMATS, type GraphFormat } from "../graph/formats/types.js";
import { detectFromContent, formatFromExtension } from "../graph/formats/detect.js";
import { parseStrictJson } from "../limits/strict-json.js";
import { STORED_DEGREES, type StoredDegree } from "./rows.js";
import {
  EFFORTS,
  EVALUATOR_NAMES,
  familyFacts,
  resolveFamily,
  resolveSpecString,
  seedResolver,
  type BracketSettings,
  type Effort,
  type ParamValue,
  type ResolvedSpec,
} from "./job.js";

// ---------------------------------------------------------------------------------------------
// The plan as written

/** Seeds: a list, `{ from, count }`, or `{ from, to }` (inclusive). */
export type SeedRange = number[] | { from: number; count: number } | { from: number; to: number };

/**
 * One parameter's values in a grid: a single value; a list; `{ values: [...] }` (needed when the
 * parameter itself takes a list); `{ ladder: { from, to, factor } }` or `{ ladder: { from, to, count } }`
 * (geometric, rounded for integer parameters); `{ range: { from, to, step } }`;
 * `{ primePowers: { from, to } }`.
 */
export type GridValue =
  | ParamValue
  | ParamValue[]
  | { values: ParamValue[] }
  | { ladder: { from: number; to: number; factor?: number; count?: number } }
  | { range: { from: number; to: number; step?: number } }
  | { primePowers: { from: number; to: number } };

export interface BracketSettingsInput {
  effort?: Effort;
  seconds?: number;
  /** Deterministic work budget in units (src/cut/bracket/work-units.ts); give this or `seconds`, not both. */
  work?: number;
}

interface EntryCommon {
  /** Shown in the row's `family` column and in progress; defaults to the family name or file name. */
  label?: string;
  solverSeeds?: SeedRange;
  bracket?: BracketSettingsInput;
  notes?: string[];
}

/** A family with a parameter grid (product of the values) and/or explicit cases. */
export interface PlanFamilyEntry extends EntryCommon {
  family: string;
  grid?: Record<string, GridValue>;
  cases?: Record<string, ParamValue>[];
  /** Required for random families. */
  graphSeeds?: SeedRange;
}

/** Explicit family specs, e.g. `["petersen", "kneser:n=7,k=2"]` (random ones with their seed written out). */
export interface PlanSpecsEntry extends EntryCommon {
  specs: string[];
}

/** A graph file (a graph6/sparse6 stream of many graphs, or one graph in any format). */
export interface PlanSourceEntry extends EntryCommon {
  /** Path, relative to the plan file's folder (or the working folder for a plan object). */
  source: string;
  format?: GraphFormat;
  /** Take only the first `limit` graphs. */
  limit?: number;
}

export type PlanEntry = PlanFamilyEntry | PlanSpecsEntry | PlanSourceEntry;

export interface SweepPlan {
  name?: string;
  notes?: string[];
  /** Defaults for every entry: effort auto, a work budget of DEFAULT_SWEEP_WORK units. */
  bracket?: BracketSettingsInput;
  /** Default [0]. */
  solverSeeds?: SeedRange;
  /** Lower-bound evaluators to record (default: all). */
  evaluators?: string[];
  /** Degree measures to keep (default: all); the first is the d of the progress line's surplus/(m/√d). */
  degrees?: StoredDegree[];
  families: PlanEntry[];
}

// ---------------------------------------------------------------------------------------------
// The checked plan

export interface SpecItem extends ResolvedSpec {
  /** The row's family label. */
  label: string;
  /** Parameters as canonical JSON text (stored with the row). */
  paramsJson: string;
}

export interface CheckedFamilyEntry {
  kind: "specs";
  where: string;
  items: SpecItem[];
  solverSeeds: number[];
  settings: BracketSettings;
}

export interface CheckedSourceEntry {
  kind: "source";
  where: string;
  /** As written in the plan (stored in rows, so stores made on different machines agree). */
  source: string;
  /** Where it is read from. */
  path: string;
  format: GraphFormat;
  label: string;
  limit: number | null;
  solverSeeds: number[];
  settings: BracketSettings;
  /** Graphs the file holds (after `limit`), counted when the plan is loaded. */
  count: number;
}

export type CheckedEntry = CheckedFamilyEntry | CheckedSourceEntry;

export interface Plan {
  name: string;
  /** The plan file, or "plan" for an object. */
  where: string;
  notes: string[];
  evaluators: string[];
  degrees: StoredDegree[];
  entries: CheckedEntry[];
  /** Jobs in the whole plan (before sharding and before skipping stored rows). */
  total: number;
  /** The plan as JSON text, kept with the sweep's log entry in the store. */
  text: string;
}

/**
 * Work budget of a plan that names none (units of src/cut/bracket/work-units.ts): about one
 * CPU-second of solver time (10^8 units per CPU-second; bench/budgets.bench.mjs prints the rates).
 */
export const DEFAULT_SWEEP_WORK = 100_000_000;
/** A plan larger than this is almost certainly a typo in a range. */
export const MAX_PLAN_JOBS = 50_000_000;
const MAX_GRID_VALUES = 100_000;

// ---------------------------------------------------------------------------------------------
// Field checks: every error names its field

type Json = unknown;

class Fields {
  constructor(readonly where: string) {}

  fail(path: string, problem: string): never {
    throw new InputError(`${this.where}: ${path}: ${problem}`);
  }

  object(path: string, v: Json, allowed: readonly string[]): Record<string, Json> {
    if (typeof v !== "object" || v === null || Array.isArray(v)) this.fail(path, "should be an object");
    const o = v as Record<string, Json>;
    for (const k of Object.keys(o)) {
      if (!allowed.includes(k)) this.fail(join(path, k), `unknown field (fields here: ${allowed.join(", ")})`);
    }
    return o;
  }

  /** An object whose keys are free (grid parameters, a case): only its shape is checked. */
  record(path: string, v: Json): Record<string, Json> {
    if (typeof v !== "object" || v === null || Array.isArray(v)) this.fail(path, "should be an object");
    return v as Record<string, Json>;
  }

  string(path: string, v: Json): string {
    if (typeof v !== "string" || v === "") this.fail(path, "should be a non-empty string");
    return v as string;
  }

  number(path: string, v: Json, min: number, max: number, integer = false): number {
    if (typeof v !== "number" || !Number.isFinite(v)) this.fail(path, `should be a number (got ${JSON.stringify(v)})`);
    const x = v as number;
    if (integer && !Number.isInteger(x)) this.fail(path, `should be an integer (got ${x})`);
    if (x < min || x > max) this.fail(path, `should lie between ${min} and ${max} (got ${x})`);
    return x;
  }

  strings(path: string, v: Json, choices?: readonly string[]): string[] {
    if (!Array.isArray(v)) this.fail(path, "should be a list of strings");
    return (v as Json[]).map((x, i) => {
      const s = this.string(`${path}[${i}]`, x);
      if (choices !== undefined && !choices.includes(s)) this.fail(`${path}[${i}]`, `should be one of ${choices.join(", ")} (got ${JSON.stringify(s)})`);
      return s;
    });
  }

  seeds(path: string, v: Json): number[] {
    const MAX = 0xffffffff;
    if (Array.isArray(v)) {
      if (v.length === 0) this.fail(path, "should list at least one seed");
      const out = v.map((x, i) => this.number(`${path}[${i}]`, x, 0, MAX, true));
      if (new Set(out).size !== out.length) this.fail(path, "lists a seed twice");
      return out;
    }
    const o = this.object(path, v, ["from", "count", "to"]);
    const from = this.number(`${path}.from`, o.from, 0, MAX, true);
    if ((o.count === undefined) === (o.to === undefined)) this.fail(path, "give either `count` or `to` besides `from`");
    const count = o.count !== undefined ? this.number(`${path}.count`, o.count, 1, MAX_PLAN_JOBS, true) : this.number(`${path}.to`, o.to, from, MAX, true) - from + 1;
    if (from + count - 1 > MAX) this.fail(path, `runs past the largest seed ${MAX}`);
    if (count > MAX_PLAN_JOBS) this.fail(path, `has ${count} seeds, more than ${MAX_PLAN_JOBS}`);
    return Array.from({ length: count }, (_, i) => from + i);
  }

  bracket(path: string, v: Json, base: BracketSettings): BracketSettings {
    if (v === undefined) return base;
    const o = this.object(path, v, ["effort", "seconds", "work"]);
    const effort = o.effort === undefined ? base.effort : (this.string(`${path}.effort`, o.effort) as Effort);
    if (!EFFORTS.includes(effort)) this.fail(`${path}.effort`, `should be one of ${EFFORTS.join(", ")} (got ${JSON.stringify(effort)})`);
    // One budget per entry: naming `seconds` switches an entry to the wall clock, `work` to work units.
    if (o.seconds !== undefined && o.work !== undefined) this.fail(path, "give either `seconds` or `work` as the budget, not both");
    if (o.seconds !== undefined) return { effort, seconds: this.number(`${path}.seconds`, o.seconds, 0.001, 1e7), work: null };
    if (o.work !== undefined) return { effort, seconds: null, work: this.number(`${path}.work`, o.work, 1, Number.MAX_SAFE_INTEGER, true) };
    return { effort, seconds: base.seconds, work: base.work };
  }
}

function join(path: string, key: string): string {
  return path === "" ? key : `${path}.${key}`;
}

// ---------------------------------------------------------------------------------------------
// Grids

function isScalar(v: Json): v is number | string | boolean {
  return typeof v === "number" || typeof v === "string" || typeof v === "boolean";
}

/** Round a geometric value: integers for integer parameters, 12 significant digits otherwise. */
function roundFor(integer: boolean, x: number): number {
  return integer ? Math.round(x) : Number(x.toPrecision(12));
}

function gridValues(f: Fields, path: string, v: Json, paramType: string): ParamValue[] {
  const integer = paramType === "integer";
  const listParam = paramType === "integer-list" || paramType === "spec-list";
  const numeric = (p: string, x: Json): number => f.number(p, x, -Number.MAX_VALUE, Number.MAX_VALUE);
  let out: ParamValue[];
  if (isScalar(v)) out = [v];
  else if (Array.isArray(v)) {
    if (listParam) out = [v as ParamValue];
    else {
      if (v.length === 0) f.fail(path, "should list at least one value");
      out = v.map((x, i) => {
        if (!isScalar(x)) f.fail(`${path}[${i}]`, "should be a number, string or boolean (for a list-valued parameter use { \"values\": [[...], ...] })");
        return x as ParamValue;
      });
    }
  } else {
    const o = f.object(path, v, ["values", "ladder", "range", "primePowers"]);
    const forms = Object.keys(o);
    if (forms.length !== 1) f.fail(path, "give exactly one of values, ladder, range, primePowers");
    const form = forms[0];
    const p = `${path}.${form}`;
    if (form === "values") {
      if (!Array.isArray(o.values) || o.values.length === 0) f.fail(p, "should be a non-empty list");
      out = o.values as ParamValue[];
    } else if (form === "ladder") {
      const l = f.object(p, o.ladder, ["from", "to", "factor", "count"]);
      const from = numeric(`${p}.from`, l.from);
      const to = numeric(`${p}.to`, l.to);
      if (!(from > 0)) f.fail(`${p}.from`, "should be positive (a geometric ladder)");
      if (!(to >= from)) f.fail(`${p}.to`, `should be at least from (${from})`);
      if ((l.factor === undefined) === (l.count === undefined)) f.fail(p, "give either `factor` or `count`");
      const raw: number[] = [];
      if (l.factor !== undefined) {
        const factor = f.number(`${p}.factor`, l.factor, 1.000001, 1e6);
        for (let x = from, k = 0; x <= to * (1 + 1e-12); k++, x = from * factor ** k) {
          raw.push(x);
          if (raw.length > MAX_GRID_VALUES) f.fail(p, `has more than ${MAX_GRID_VALUES} steps`);
        }
      } else {
        const count = f.number(`${p}.count`, l.count, 1, MAX_GRID_VALUES, true);
        for (let k = 0; k < count; k++) raw.push(count === 1 ? from : from * (to / from) ** (k / (count - 1)));
      }
      out = [...new Set(raw.map((x) => roundFor(integer, x)))];
    } else if (form === "range") {
      const r = f.object(p, o.range, ["from", "to", "step"]);
      const from = numeric(`${p}.from`, r.from);
      const to = numeric(`${p}.to`, r.to);
      const step = r.step === undefined ? 1 : numeric(`${p}.step`, r.step);
      if (!(step > 0)) f.fail(`${p}.step`, "should be positive");
      if (!(to >= from)) f.fail(`${p}.to`, `should be at least from (${from})`);
      const count = Math.floor((to - from) / step + 1e-9) + 1;
      if (count > MAX_GRID_VALUES) f.fail(p, `has ${count} values, more than ${MAX_GRID_VALUES}`);
      out = Array.from({ length: count }, (_, k) => roundFor(integer, from + k * step));
    } else {
      const r = f.object(p, o.primePowers, ["from", "to"]);
      const from = f.number(`${p}.from`, r.from, 2, 1e6, true);
      const to = f.number(`${p}.to`, r.to, from, 1e6, true);
      out = [];
      for (let q = from; q <= to; q++) if (isPrimePower(q) !== null) out.push(q);
      if (out.length === 0) f.fail(p, `holds no prime power`);
    }
  }
  if (integer) {
    out.forEach((x, i) => {
      if (typeof x !== "number" || !Number.isInteger(x)) f.fail(`${path}`, `value ${i + 1} should be an integer (got ${JSON.stringify(x)})`);
    });
  }
  return out;
}

/** All combinations, the last key varying fastest. */
function product(keys: string[], values: ParamValue[][]): Record<string, ParamValue>[] {
  let out: Record<string, ParamValue>[] = [{}];
  keys.forEach((k, i) => {
    const next: Record<string, ParamValue>[] = [];
    for (const base of out) for (const v of values[i]) next.push({ ...base, [k]: v });
    out = next;
  });
  return out;
}

// ---------------------------------------------------------------------------------------------
// Loading

function readPlanFile(path: string): Json {
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new InputError(`${path}: cannot read plan (${code === "ENOENT" ? "no such file" : code === "EISDIR" ? "is a directory" : (code ?? String(e))})`);
  }
  // Strict JSON (src/limits/strict-json.ts): syntax errors name line and column, and a key given
  // twice is an error rather than the last one silently winning.
  return parseStrictJson(text, path) as Json;
}

/** Graphs in a file: non-blank lines of a graph6/sparse6 stream, 1 for the whole-file formats. */
function countGraphs(path: string, format: GraphFormat): number {
  if (format !== "graph6" && format !== "sparse6") return 1;
  const fd = openSync(path, "r");
  const buf = Buffer.allocUnsafe(1 << 20);
  let count = 0;
  let lineHasData = false;
  try {
    for (;;) {
      const got = readSync(fd, buf, 0, buf.length, null);
      if (got === 0) break;
      for (let i = 0; i < got; i++) {
        const c = buf[i];
        if (c === 10) {
          if (lineHasData) count++;
          lineHasData = false;
        } else if (c !== 13 && c !== 32 && c !== 9) lineHasData = true;
      }
    }
  } finally {
    closeSync(fd);
  }
  return count + (lineHasData ? 1 : 0);
}

function sourceFormat(f: Fields, path: string, file: string, given: GraphFormat | undefined): GraphFormat {
  if (given !== undefined) return given;
  const ext = formatFromExtension(file);
  if (ext !== undefined) return ext;
  const fd = openSync(file, "r");
  try {
    const head = Buffer.alloc(1 << 16);
    const got = readSync(fd, head, 0, head.length, 0);
    const text = head.subarray(0, got);
    const cut = text.lastIndexOf(10);
    return detectFromContent(file, cut > 0 ? text.subarray(0, cut + 1) : text);
  } catch (e) {
    if (e instanceof InputError) f.fail(path, e.message);
    throw e;
  } finally {
    closeSync(fd);
  }
}

function stableJson(params: Record<string, ParamValue>): string {
  return JSON.stringify(params);
}

/**
 * Check a plan (a JSON file's path, or the object) and fix its jobs. Relative source paths are
 * read from the plan file's folder (`base` for objects, default the working folder).
 */
export function loadPlan(input: string | SweepPlan, options: { base?: string; where?: string } = {}): Plan {
  const fromFile = typeof input === "string";
  const where = options.where ?? (fromFile ? input : "plan");
  const raw = fromFile ? readPlanFile(input) : (input as Json);
  const base = options.base ?? (fromFile ? dirname(input) : process.cwd());
  const f = new Fields(where);
  const top = f.object("", raw, ["name", "notes", "bracket", "solverSeeds", "evaluators", "degrees", "families"]);
  // Top-level messages name the field alone (`plans/x.json: families: …`).
  const name = top.name === undefined ? (fromFile ? basename(input).replace(/\.json$/i, "") : "plan") : f.string("name", top.name);
  const notes = top.notes === undefined ? [] : f.strings("notes", top.notes);
  const defaults = f.bracket("bracket", top.bracket, { effort: "auto", seconds: null, work: DEFAULT_SWEEP_WORK });
  const solverSeeds = top.solverSeeds === undefined ? [0] : f.seeds("solverSeeds", top.solverSeeds);
  const evaluators = top.evaluators === undefined ? [...EVALUATOR_NAMES] : f.strings("evaluators", top.evaluators, EVALUATOR_NAMES);
  const degrees = (top.degrees === undefined ? [...STORED_DEGREES] : f.strings("degrees", top.degrees, STORED_DEGREES)) as StoredDegree[];
  if (degrees.length === 0) f.fail("degrees", "should keep at least one degree measure");
  if (!Array.isArray(top.families) || top.families.length === 0) f.fail("families", "should be a non-empty list of families, specs or sources");

  const entries: CheckedEntry[] = [];
  let total = 0;
  (top.families as Json[]).forEach((e, i) => {
    const path = `families[${i}]`;
    if (typeof e !== "object" || e === null || Array.isArray(e)) f.fail(path, "should be an object with `family`, `specs` or `source`");
    const o = e as Record<string, Json>;
    const kinds = ["family", "specs", "source"].filter((k) => o[k] !== undefined);
    if (kinds.length !== 1) f.fail(path, "give exactly one of `family`, `specs`, `source`");
    const common = ["label", "solverSeeds", "bracket", "notes"];
    let entry: CheckedEntry;
    if (kinds[0] === "family") {
      f.object(path, o, ["family", "grid", "cases", "graphSeeds", ...common]);
      entry = familyEntry(f, path, o, defaults, solverSeeds);
    } else if (kinds[0] === "specs") {
      f.object(path, o, ["specs", ...common]);
      entry = specsEntry(f, path, o, defaults, solverSeeds);
    } else {
      f.object(path, o, ["source", "format", "limit", ...common]);
      entry = sourceEntry(f, path, o, base, defaults, solverSeeds);
    }
    if (o.notes !== undefined) f.strings(`${path}.notes`, o.notes);
    const jobs = (entry.kind === "specs" ? entry.items.length : entry.count) * entry.solverSeeds.length;
    total += jobs;
    if (total > MAX_PLAN_JOBS) f.fail(path, `brings the plan to more than ${MAX_PLAN_JOBS} jobs`);
    entries.push(entry);
  });
  return { name, where, notes, evaluators, degrees, entries, total, text: JSON.stringify(raw) };
}

function entryCommon(f: Fields, path: string, o: Record<string, Json>, defaults: BracketSettings, seeds: number[]): { label?: string; solverSeeds: number[]; settings: BracketSettings } {
  return {
    label: o.label === undefined ? undefined : f.string(`${path}.label`, o.label),
    solverSeeds: o.solverSeeds === undefined ? seeds : f.seeds(`${path}.solverSeeds`, o.solverSeeds),
    settings: f.bracket(`${path}.bracket`, o.bracket, defaults),
  };
}

/** `what` is only written out for the message (a plan can have 10^5 members). */
function resolveOrFail(f: Fields, path: string, what: () => string, run: () => ResolvedSpec): ResolvedSpec {
  try {
    return run();
  } catch (e) {
    if (e instanceof InputError) f.fail(path, `${what()}: ${e.message}`);
    throw e;
  }
}

function familyEntry(f: Fields, path: string, o: Record<string, Json>, defaults: BracketSettings, seeds: number[]): CheckedFamilyEntry {
  const name = f.string(`${path}.family`, o.family);
  const facts = familyFacts(name);
  if (facts === undefined) f.fail(`${path}.family`, `no family called ${JSON.stringify(name)} (run halfplus families)`);
  const common = entryCommon(f, path, o, defaults, seeds);
  const byName = new Map(facts!.params.map((p) => [p.name, p]));
  const paramNames = facts!.params.map((p) => p.name).join(", ") || "none";
  const checkKey = (p: string, k: string): void => {
    if (k === "seed" && facts!.random) f.fail(p, "give a random family's seeds with `graphSeeds`");
    if (!byName.has(k)) f.fail(p, `${name} has no parameter \`${k}\` (parameters: ${paramNames})`);
  };

  const grid = o.grid === undefined ? {} : f.record(`${path}.grid`, o.grid);
  const keys = Object.keys(grid);
  for (const k of keys) checkKey(`${path}.grid.${k}`, k);
  const values = keys.map((k) => gridValues(f, `${path}.grid.${k}`, grid[k], byName.get(k)!.type));
  let points = product(keys, values);
  if (o.cases !== undefined) {
    if (!Array.isArray(o.cases) || o.cases.length === 0) f.fail(`${path}.cases`, "should be a non-empty list of parameter objects");
    const cases = (o.cases as Json[]).map((c, j) => {
      const p = `${path}.cases[${j}]`;
      const obj = f.record(p, c);
      for (const k of Object.keys(obj)) {
        checkKey(`${p}.${k}`, k);
        if (keys.includes(k)) f.fail(`${p}.${k}`, "is also in the grid");
      }
      return obj as Record<string, ParamValue>;
    });
    points = cases.flatMap((c) => points.map((g) => ({ ...c, ...g })));
  }
  if (points.length > MAX_PLAN_JOBS) f.fail(`${path}.grid`, `has ${points.length} points, more than ${MAX_PLAN_JOBS}`);

  let graphSeeds: (number | null)[] = [null];
  if (facts!.random) {
    if (o.graphSeeds === undefined) f.fail(`${path}.graphSeeds`, `required for the random family ${name} (e.g. {"from": 0, "count": 10})`);
    graphSeeds = f.seeds(`${path}.graphSeeds`, o.graphSeeds);
  } else if (o.graphSeeds !== undefined) f.fail(`${path}.graphSeeds`, `${name} is not a random family`);

  const label = common.label ?? name;
  const items: SpecItem[] = [];
  const seen = new Set<string>();
  for (const point of points) {
    const bySeed = facts!.random ? seedResolver(name, point) : null;
    for (const seed of graphSeeds) {
      const r = resolveOrFail(
        f,
        path,
        () => `${name} ${JSON.stringify(seed === null ? point : { ...point, seed })}`,
        () => (seed === null ? resolveFamily(name, point) : bySeed!(seed)),
      );
      if (seen.has(r.spec)) continue; // a ladder rounded two steps to the same size
      seen.add(r.spec);
      items.push({ ...r, label, paramsJson: stableJson(r.params) });
    }
  }
  return { kind: "specs", where: path, items, solverSeeds: common.solverSeeds, settings: common.settings };
}

function specsEntry(f: Fields, path: string, o: Record<string, Json>, defaults: BracketSettings, seeds: number[]): CheckedFamilyEntry {
  const specs = f.strings(`${path}.specs`, o.specs);
  if (specs.length === 0) f.fail(`${path}.specs`, "should list at least one family spec");
  const common = entryCommon(f, path, o, defaults, seeds);
  const items: SpecItem[] = [];
  const seen = new Set<string>();
  specs.forEach((s, j) => {
    const r = resolveOrFail(f, `${path}.specs[${j}]`, () => JSON.stringify(s), () => resolveSpecString(s));
    if (r.graphSeed !== null && !/(^|[:,])\s*seed\s*=/.test(s)) f.fail(`${path}.specs[${j}]`, `${JSON.stringify(s)} is random: write its seed (e.g. ${s}${s.includes(":") ? "," : ":"}seed=0)`);
    if (seen.has(r.spec)) f.fail(`${path}.specs[${j}]`, `${r.spec} is listed twice`);
    seen.add(r.spec);
    items.push({ ...r, label: common.label ?? r.family, paramsJson: stableJson(r.params) });
  });
  return { kind: "specs", where: path, items, solverSeeds: common.solverSeeds, settings: common.settings };
}

function sourceEntry(f: Fields, path: string, o: Record<string, Json>, base: string, defaults: BracketSettings, seeds: number[]): CheckedSourceEntry {
  const source = f.string(`${path}.source`, o.source);
  const file = isAbsolute(source) ? source : resolve(base, source);
  let isFile = false;
  try {
    isFile = statSync(file).isFile();
  } catch {
    f.fail(`${path}.source`, `${source}: no such file`);
  }
  if (!isFile) f.fail(`${path}.source`, `${source}: not a file`);
  let given: GraphFormat | undefined;
  if (o.format !== undefined) {
    given = f.string(`${path}.format`, o.format) as GraphFormat;
    if (!GRAPH_FORMATS.includes(given)) f.fail(`${path}.format`, `should be one of ${GRAPH_FORMATS.join(", ")} (got ${JSON.stringify(given)})`);
  }
  const format = sourceFormat(f, `${path}.source`, file, given);
  const limit = o.limit === undefined ? null : f.number(`${path}.limit`, o.limit, 1, MAX_PLAN_JOBS, true);
  const common = entryCommon(f, path, o, defaults, seeds);
  const inFile = countGraphs(file, format);
  const label = common.label ?? basename(source).replace(/\.[^.]*$/, "");
  return {
    kind: "source",
    where: path,
    source,
    path: file,
    format,
    label,
    limit,
    solverSeeds: common.solverSeeds,
    settings: common.settings,
    count: limit === null ? inFile : Math.min(limit, inFile),
  };
}
