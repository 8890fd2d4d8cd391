// The one place the experiment layer touches the records of other layers: family specs and their
// parameters, bracket() and its record, describeGraph(), the lower-bound evaluators, graph hashes
// and the bracket verifier. Everything else in src/experiment works with stored rows only, so a
// change of field names in those records (e.g. `method` → `effort`, `seed` → `solverSeed`) is
// absorbed here.

import { InputError } from "../errors.js";
import type { Graph, GraphParts } from "../graph/graph.js";
import { graphFromPartsWithHash, graphHash } from "../graph/hash.js";
import { describeGraph } from "../graph/structure/describe.js";
import type { GraphFormat } from "../graph/formats/types.js";
import { EMBED_MAX_CHARS, embedGraph } from "../graph/record/embed.js";
import type { EmbeddedGraph, GraphSource } from "../graph/record/source.js";
import { familyWithInfo, getFamily, predictedSizeOf } from "../families/registry.js";
import { checkEdgeLimit } from "../families/limits.js";
import { allParams, formatSpec, parseRawSpec, resolveParams } from "../families/spec.js";
import type { ParamSpec, ParamValue, Params } from "../families/types.js";
import { BRACKET_EFFORTS, BRACKET_RECORD_KIND, BRACKET_RECORD_VERSION, DEFAULT_BRACKET_SECONDS, bracket, type BracketEffort, type BracketRecord } from "../cut/bracket/index.js";
import { verifyBracket, type BracketVerdict } from "../cut/bracket/verify.js";
import { edwardsEdgeBound, edwardsVertexBound } from "../bounds/edwards.js";
import { triangleFreeBound } from "../bounds/triangle-free.js";
import { vectorMethodGuarantee } from "../bounds/vector-guarantee.js";
import { vectorOptimisedBound } from "../bounds/vector-choice.js";
import { fewTrianglesBound } from "../bounds/few-triangles.js";
import { decompositionBounds } from "../cut/decomposition/index.js";
import type { LowerBoundRecord } from "../bounds/types.js";
import { SourceResolver } from "../sources/index.js";
import { COLUMNS, type CellValue, type StoredRow } from "./columns.js";
import { packJson, packPartition, unpackJson, unpackPartition } from "./witness.js";

// ---------------------------------------------------------------------------------------------
// Bracket settings

export type Effort = BracketEffort;
export const EFFORTS: readonly Effort[] = BRACKET_EFFORTS;

/** bracket() accepts a deterministic work budget (`work`, units of src/cut/bracket/work-units.ts). */
export const WORK_BUDGETS_AVAILABLE = true;

/** A job's bracket settings: exactly one of `seconds` (wall clock) and `work` (deterministic) is set. */
export interface BracketSettings {
  effort: Effort;
  /** Wall-clock budget per graph, or null under a work budget. */
  seconds: number | null;
  /** Deterministic work budget per graph (units), or null under a time budget. */
  work: number | null;
}

/** The settings part of a row key: `effort=auto,work=20000000` or `effort=auto,seconds=10`. */
export function settingsKey(s: BracketSettings): string {
  return s.work !== null ? `effort=${s.effort},work=${s.work}` : `effort=${s.effort},seconds=${s.seconds}`;
}

/** The bracket() budget option of these settings. */
export function budgetOption(s: BracketSettings): { work: number } | { seconds: number } {
  return s.work !== null ? { work: s.work } : { seconds: s.seconds ?? DEFAULT_BRACKET_SECONDS };
}

// ---------------------------------------------------------------------------------------------
// Lower-bound evaluators and degree measures a plan can ask for

export interface Evaluator {
  /** The name a plan uses (the bound's own name in src/bounds or src/cut). */
  name: string;
  /** Columns holding its surplus bounds, one per record `run` returns (in order). */
  columns: readonly string[];
  /** One run gives every column: an argument with several stages (the decomposition) runs once. */
  run: (g: Graph) => readonly LowerBoundRecord[];
}

export const EVALUATORS: readonly Evaluator[] = [
  { name: "edwards-edges", columns: ["edwardsEdges"], run: (g) => [edwardsEdgeBound(g)] },
  { name: "edwards-vertices", columns: ["edwardsVertices"], run: (g) => [edwardsVertexBound(g)] },
  { name: "triangle-free", columns: ["triangleFree"], run: (g) => [triangleFreeBound(g)] },
  { name: "vector-method", columns: ["vectorMethod"], run: (g) => [vectorMethodGuarantee(g)] },
  { name: "vector-optimised", columns: ["vectorOptimised"], run: (g) => [vectorOptimisedBound(g)] },
  { name: "few-triangles", columns: ["fewTriangles"], run: (g) => [fewTrianglesBound(g)] },
  {
    name: "decomposition",
    columns: ["decompositionCut", "decompositionGuarantee"],
    run: (g) => {
      const d = decompositionBounds(g);
      return [d.cut, d.guarantee];
    },
  },
];
export const EVALUATOR_NAMES: readonly string[] = EVALUATORS.map((e) => e.name);

// ---------------------------------------------------------------------------------------------
// Families

export interface FamilyFacts {
  name: string;
  random: boolean;
  /** Parameters a plan may set (the seed of a random family comes from graphSeeds instead). */
  params: readonly ParamSpec[];
}

export function familyFacts(name: string): FamilyFacts | undefined {
  const def = getFamily(name);
  if (def === undefined) return undefined;
  return { name: def.name, random: def.random, params: allParams(def).filter((p) => !(def.random && p.name === "seed")) };
}

export interface ResolvedSpec {
  /** Canonical spec: every parameter written out, the seed included. */
  spec: string;
  family: string;
  params: Params;
  graphSeed: number | null;
  /** Predicted size (for progress and the memory guard), without building. */
  n: number;
  m: number;
}

/** Validate, canonicalise and size a family member without building it (InputError when invalid or too big). */
export function resolveFamily(name: string, values: Params): ResolvedSpec {
  const def = getFamily(name);
  if (def === undefined) throw new InputError(`unknown family ${JSON.stringify(name)} (run halfplus families for the list)`);
  const { params } = resolveParams(def, values);
  const spec = formatSpec(def, params);
  const shape = predictedSizeOf(spec);
  checkEdgeLimit(spec, shape.m, shape.n);
  return { spec, family: def.name, params, graphSeed: def.random ? (params.seed as number) : null, n: shape.n, m: shape.m };
}

/**
 * One grid point of a random family, resolved seed after seed: the first seed by resolveFamily, each
 * further one by its parameters alone (checked, canonicalised and written out the same way), since
 * a random family's predicted size never depends on its graph seed (FamilyDefinition.predictedSize).
 * Same results as resolveFamily per seed; a plan of 1000 seeds of one point spent most of its
 * check re-parsing each spec only to size it again.
 */
export function seedResolver(name: string, point: Params): (seed: number) => ResolvedSpec {
  let first: ResolvedSpec | null = null;
  return (seed) => {
    if (first === null) return (first = resolveFamily(name, { ...point, seed }));
    const def = getFamily(name)!;
    const { params } = resolveParams(def, { ...point, seed });
    return { spec: formatSpec(def, params), family: def.name, params, graphSeed: params.seed as number, n: first.n, m: first.m };
  };
}

/** Same, from a spec string such as `kneser:n=7,k=2`. */
export function resolveSpecString(spec: string): ResolvedSpec {
  const raw = parseRawSpec(spec);
  const def = getFamily(raw.name);
  if (def === undefined) throw new InputError(`${spec}: no family called ${JSON.stringify(raw.name)} (run halfplus families)`);
  const { params } = resolveParams(def, raw.values);
  return resolveFamily(def.name, params);
}

// ---------------------------------------------------------------------------------------------
// Graphs read from files

export interface FileSource {
  path: string;
  /** Position in the file, from 1. */
  position: number;
  format: GraphFormat;
}

export function hashGraph(g: Graph): string {
  return graphHash(g);
}

/** Largest graph text stored inside its row (file graphs), so verify needs no file: 1 MiB. */
const EMBED_LIMIT = 1 << 20;

/**
 * The graph as the row's `embedded` text (graph6 or sparse6, whichever is shorter; an edge list
 * when weighted), or null when longer than EMBED_LIMIT. The format is told by the text itself.
 */
export function embeddedText(g: Graph): string | null {
  return embedGraph(g, EMBED_LIMIT)?.text ?? null;
}

/** The embedded text back as a graph: sparse6 starts with ':', an edge list has spaces, graph6 has neither. */
function embeddedOfText(text: string): EmbeddedGraph {
  return { format: text.startsWith(":") ? "sparse6" : /\s/.test(text) ? "edgelist" : "graph6", text };
}

// ---------------------------------------------------------------------------------------------
// Running one job

export type JobGraph = { kind: "spec"; spec: string } | { kind: "parts"; parts: GraphParts; hash: string; source: FileSource };

/** What a worker needs to compute a job's cells; the rest of JobInput is filled in on the main thread. */
export interface WorkerJob {
  graph: JobGraph;
  solverSeed: number;
  settings: BracketSettings;
}

export interface JobInput extends WorkerJob {
  key: string;
  family: string;
  /** Family parameters as JSON text, or null for file graphs. */
  params: string | null;
  graphSeed: number | null;
}

/** What every job of a sweep shares (sent once per worker, not once per job). */
export interface JobContext {
  evaluators: readonly string[];
  degrees: readonly string[];
  version: string;
  /** Values set on every row (the sweep's provenance). */
  shared: StoredRow;
}

export interface JobOutput {
  /** The row's values in COLUMNS order. */
  values: CellValue[];
  /** Seconds inside bracket() (the solver), for the overhead benchmark. */
  solverSeconds: number;
}

/** Node budget for the K4 and C5 searches of describeGraph: an unfinished search leaves the flag null. */
const STRUCTURE_SEARCH_NODES = 10_000_000;

/** Column positions by name: rows are filled as value arrays (a tiny job's row costs about as much as its solver). */
const I: Readonly<Record<string, number>> = Object.fromEntries(COLUMNS.map((c, i) => [c.name, i]));

/**
 * Columns identityCells fills from the job and the context alone: the main thread has them, so a
 * worker computes (and sends back) only the others (WORKER_COLUMNS). The context's `shared` columns
 * are filled there too.
 */
const IDENTITY_COLUMNS: readonly string[] = ["key", "origin", "family", "graph", "spec", "params", "graphSeed", "sourcePath", "sourcePosition", "sourceFormat", "budgetSeconds", "workLimit", "version"];

/** Positions (in COLUMNS) of the cells computeCells may set: every column but IDENTITY_COLUMNS. */
export const WORKER_COLUMNS: readonly number[] = COLUMNS.map((_, i) => i).filter((i) => !IDENTITY_COLUMNS.includes(COLUMNS[i].name));

const bool = (b: boolean | null): number | null => (b === null ? null : b ? 1 : 0);

/** A context's evaluators and degree measures as flags, worked out once per context rather than once per row. */
interface Selection {
  evaluators: readonly Evaluator[];
  minDegree: boolean;
  maxDegree: boolean;
  averageDegree: boolean;
  degeneracy: boolean;
  shared: readonly (readonly [number, CellValue])[];
}
const selections = new WeakMap<JobContext, Selection>();
function selectionOf(context: JobContext): Selection {
  let s = selections.get(context);
  if (s === undefined) {
    const keep = context.degrees;
    s = {
      evaluators: EVALUATORS.filter((e) => context.evaluators.includes(e.name)),
      minDegree: keep.includes("minDegree"),
      maxDegree: keep.includes("maxDegree"),
      averageDegree: keep.includes("averageDegree"),
      degeneracy: keep.includes("degeneracy"),
      shared: Object.keys(context.shared).map((k) => [I[k], context.shared[k]] as const),
    };
    selections.set(context, s);
  }
  return s;
}

/** Build the graph, bracket it, measure it: one row. */
export function runJob(job: JobInput, context: JobContext): JobOutput {
  const v = new Array<CellValue>(COLUMNS.length).fill(null);
  const solverSeconds = computeCells(job, context, v);
  identityCells(job, context, v);
  return { values: v, solverSeconds };
}

/**
 * The row cells that need the job run (WORKER_COLUMNS), written into `v` (COLUMNS order; cells it
 * leaves alone must hold null already). Returns the seconds inside bracket().
 */
export function computeCells(job: WorkerJob, context: JobContext, v: CellValue[]): number {
  const startedAt = new Date().toISOString();
  let graph: Graph;
  let notes: string[] = [];
  let source: GraphSource;
  let embedded: string | null = null;
  if (job.graph.kind === "spec") {
    const f = familyWithInfo(job.graph.spec);
    graph = f.graph;
    notes = f.notes;
    source = { spec: f.spec, graphSeed: f.graphSeed };
  } else {
    // The main thread hashed this very graph for the row key (jobs.ts): the bracket record reuses it.
    graph = graphFromPartsWithHash(job.graph.parts, job.graph.hash);
    const s = job.graph.source;
    source = { path: s.path, position: s.position, format: s.format, graphSeed: null };
    embedded = embedGraph(graph, EMBED_LIMIT)?.text ?? null;
    // The bracket record embeds the same text when it fits the record's own limit: hand it over
    // rather than encoding the graph twice (the record's source is not stored in the row anyway).
    if (embedded !== null && embedded.length <= EMBED_MAX_CHARS) source.embedded = embeddedOfText(embedded);
  }
  const t0 = performance.now();
  // The options written out (not spread from budgetOption): a tiny job's bracket is a few microseconds.
  const settings = job.settings;
  const rec = bracket(
    graph,
    settings.work !== null
      ? { work: settings.work, solverSeed: job.solverSeed, effort: settings.effort, source }
      : { seconds: settings.seconds ?? DEFAULT_BRACKET_SECONDS, solverSeed: job.solverSeed, effort: settings.effort, source },
  );
  const solverSeconds = (performance.now() - t0) / 1000;
  const s = describeGraph(graph, { maxSearchNodes: STRUCTURE_SEARCH_NODES });
  const sel = selectionOf(context);

  let sdpUpper: number | null = null;
  for (const r of rec.runs) if (r.method === "sdp-certified" && r.role === "upper" && Number.isFinite(r.value)) sdpUpper = r.value;

  if (job.graph.kind === "parts") v[I.embedded] = embedded;
  v[I.graphHash] = rec.graphHash;
  v[I.solverSeed] = rec.solverSeed;
  v[I.effort] = rec.effort;
  v[I.n] = s.n;
  v[I.m] = s.m;
  v[I.totalWeight] = s.totalWeight;
  if (sel.minDegree) v[I.minDegree] = s.minDegree;
  if (sel.maxDegree) v[I.maxDegree] = s.maxDegree;
  if (sel.averageDegree) v[I.averageDegree] = s.avgDegree;
  if (sel.degeneracy) v[I.degeneracy] = s.degeneracy;
  v[I.triangles] = s.triangles;
  v[I.fourCycles] = s.fourCycles;
  v[I.girth] = s.girth;
  v[I.bipartite] = bool(s.bipartite);
  v[I.components] = s.components;
  v[I.freeK3] = bool(s.free.K3);
  v[I.freeK4] = bool(s.free.K4);
  v[I.freeC4] = bool(s.free.C4);
  v[I.freeC5] = bool(s.free.C5);
  v[I.lower] = rec.lower;
  v[I.upper] = rec.upper;
  v[I.surplusLower] = rec.surplusLower;
  v[I.surplusUpper] = rec.surplusUpper;
  v[I.exact] = rec.exact ? 1 : 0;
  v[I.upperKind] = rec.upperKind;
  v[I.lowerMethod] = rec.lowerMethod;
  v[I.upperMethod] = rec.upperMethod;
  v[I.certificateKind] = rec.certificate.kind;
  v[I.sdpUpper] = sdpUpper;
  v[I.budgetKind] = rec.budget.governing;
  // Under a time budget the work done varies run to run: kept out of the compared columns.
  v[I.workUsed] = rec.budget.governing === "work" ? rec.budget.workUsed : null;
  v[I.seconds] = rec.seconds;
  v[I.startedAt] = startedAt;
  v[I.notes] = notes.length === 0 ? "[]" : JSON.stringify(notes);
  v[I.witness] = packPartition(rec.partition);
  v[I.certificate] = packJson(rec.certificate);
  v[I.runs] = packJson(rec.runs);
  v[I.budgetStages] = packJson(rec.budget.stages);
  for (const e of sel.evaluators) {
    // The triangle-free bound does not apply to a graph with a triangle: no need to evaluate it.
    if (e.name === "triangle-free" && s.free.K3 === false) continue;
    const records = e.run(graph);
    for (let k = 0; k < e.columns.length; k++) {
      const b = records[k];
      v[I[e.columns[k]]] = b.applies ? b.surplus : null;
    }
  }
  return solverSeconds;
}

/** The row cells told by the job and the context alone (IDENTITY_COLUMNS and the context's shared columns), written into `v`. */
export function identityCells(job: JobInput, context: JobContext, v: CellValue[]): void {
  const file = job.graph.kind === "parts" ? job.graph.source : null;
  v[I.key] = job.key;
  v[I.origin] = "sweep";
  v[I.family] = job.family;
  v[I.graph] = job.graph.kind === "spec" ? job.graph.spec : job.graph.hash;
  v[I.spec] = job.graph.kind === "spec" ? job.graph.spec : null;
  v[I.params] = job.params;
  v[I.graphSeed] = job.graphSeed;
  if (file !== null) {
    v[I.sourcePath] = file.path;
    v[I.sourcePosition] = file.position;
    v[I.sourceFormat] = file.format;
  }
  v[I.budgetSeconds] = job.settings.seconds;
  v[I.workLimit] = job.settings.work;
  v[I.version] = context.version;
  for (const [i, value] of selectionOf(context).shared) v[i] = value;
}

// ---------------------------------------------------------------------------------------------
// Reading rows back as bracket records (for verify)

const num = (row: StoredRow, k: string): number => {
  const v = row[k];
  if (typeof v !== "number") throw new InputError(`row ${String(row.key)}: field \`${k}\` is not a number`);
  return v;
};

function evidence(row: StoredRow, k: string): Uint8Array | string {
  const v = row[k];
  if (!(v instanceof Uint8Array) && typeof v !== "string") throw new InputError(`row ${String(row.key)}: holds no ${k} (imported rows carry no evidence)`);
  return v;
}

function blob(row: StoredRow, k: string): Uint8Array {
  const v = evidence(row, k);
  if (typeof v === "string") throw new InputError(`row ${String(row.key)}: ${k} should be a blob`);
  return v;
}

/** The row's GraphSource: its spec, or its file and position; the embedded text when it has one. */
function sourceOf(row: StoredRow): GraphSource {
  const source: GraphSource = {};
  if (typeof row.spec === "string") {
    source.spec = row.spec;
    source.graphSeed = typeof row.graphSeed === "number" ? row.graphSeed : null;
  } else if (typeof row.sourcePath === "string") {
    source.path = row.sourcePath;
    source.position = row.sourcePosition as number;
    if (typeof row.sourceFormat === "string") source.format = row.sourceFormat as GraphFormat;
    source.graphSeed = null;
  }
  if (typeof row.embedded === "string") source.embedded = embeddedOfText(row.embedded);
  return source;
}

/** The record's budget section as a row keeps it (rows from before the stages were stored have none). */
function budgetOfRow(row: StoredRow, where: string): BracketRecord["budget"] {
  const work = row.budgetKind === "work";
  const seconds = typeof row.seconds === "number" ? row.seconds : 0;
  return {
    governing: work ? "work" : "time",
    secondsLimit: !work && typeof row.budgetSeconds === "number" ? row.budgetSeconds : null,
    workLimit: work && typeof row.workLimit === "number" ? row.workLimit : null,
    workUsed: typeof row.workUsed === "number" ? row.workUsed : 0,
    secondsUsed: seconds,
    stages: row.budgetStages instanceof Uint8Array || typeof row.budgetStages === "string" ? (unpackJson(row.budgetStages, `${where}: budgetStages`) as BracketRecord["budget"]["stages"]) : [],
  };
}

/** The bracket record a sweep row was made from (partition and certificate included), for verifyBracket. */
export function bracketRecordFromRow(row: StoredRow): BracketRecord {
  const where = `row ${String(row.key)}`;
  const n = num(row, "n");
  return {
    kind: BRACKET_RECORD_KIND,
    version: BRACKET_RECORD_VERSION,
    n,
    m: num(row, "m"),
    totalWeight: num(row, "totalWeight"),
    lower: num(row, "lower"),
    upper: num(row, "upper"),
    exact: row.exact === 1,
    upperKind: String(row.upperKind) as BracketRecord["upperKind"],
    surplusLower: num(row, "surplusLower"),
    surplusUpper: num(row, "surplusUpper"),
    lowerMethod: String(row.lowerMethod),
    upperMethod: String(row.upperMethod),
    seconds: typeof row.seconds === "number" ? row.seconds : 0,
    solverSeed: num(row, "solverSeed"),
    effort: String(row.effort) as Effort,
    partition: unpackPartition(blob(row, "witness"), n, `${where}: witness`),
    certificate: unpackJson(evidence(row, "certificate"), `${where}: certificate`) as BracketRecord["certificate"],
    runs: row.runs === null || row.runs === undefined ? [] : (unpackJson(evidence(row, "runs"), `${where}: runs`) as BracketRecord["runs"]),
    budget: budgetOfRow(row, where),
    notes: typeof row.notes === "string" ? (unpackJson(row.notes, `${where}: notes`) as string[]) : [],
    graphHash: String(row.graphHash),
    source: sourceOf(row),
  };
}

/** The graph of a sweep row: its embedded text, its family spec, or its file and position. */
export async function graphOfRow(row: StoredRow, resolver: SourceResolver = new SourceResolver()): Promise<Graph> {
  const where = `row ${String(row.key)}`;
  const source = sourceOf(row);
  if (source.embedded === undefined && source.spec === undefined && source.path === undefined) {
    throw new InputError(`${where}: records no graph (imported rows cannot be re-checked)`);
  }
  return resolver.resolve(source, where);
}

export type RowVerdict = BracketVerdict;

/** Re-check a row's bracket against its graph (partition by cutValue, upper bound from the certificate). */
export function verifyRowRecord(graph: Graph, record: BracketRecord, seconds: number): RowVerdict {
  return verifyBracket(graph, record, { seconds });
}

export type { ParamValue };
export type { BracketRecord };
