// The messages between a sweep's main thread and its worker threads. A batch of jobs goes out, and
// its rows come back, as a few typed arrays (moved, not copied) and one table of the batch's
// distinct strings, instead of one structured-clone object per job: on a stream of tiny graphs
// the per-job objects, their property names, repeated strings and one small ArrayBuffer per typed
// array cost both threads about a tenth of the whole job. A worker sends back only the cells it
// computes (WORKER_COLUMNS); the main thread fills the rest from the jobs it sent (identityCells),
// the very values the worker would have written, so a row is the same wherever it was made.

import type { GraphFormat } from "../graph/formats/types.js";
import { isInputError } from "../errors.js";
import { COLUMNS, type CellValue } from "./columns.js";
import { WORKER_COLUMNS, computeCells, identityCells, type BracketSettings, type JobContext, type JobInput, type WorkerJob } from "./job.js";

/** A batch of jobs on its way to a worker. */
export interface JobsMessage {
  batch: number;
  /** The sweep's shared context: with a worker's first batch (and when it changes), else null; the worker keeps the last one. */
  context: JobContext | null;
  count: number;
  /** The batch's distinct strings (specs, hashes, file paths, formats), referred to by position. */
  strings: string[];
  /** The batch's distinct bracket settings, referred to by position. */
  settings: BracketSettings[];
  /** JOB_FIELDS numbers per job (see the F_ constants). */
  meta: Float64Array;
  /** Offsets, then neighbours, of every file graph in turn. */
  ints: Int32Array;
  /** Edge weights of the weighted file graphs in turn. */
  weights: Float64Array;
}

/** A finished batch on its way back: the worker-computed cells of the first `rows` jobs, then at most one failure. */
export interface RowsMessage {
  batch: number;
  /** Seconds the batch took inside the worker. */
  seconds: number;
  /** Jobs that gave a row: the batch's first `rows` (a batch stops at its first failure). */
  rows: number;
  failure: { error: string; inputError: boolean; stack?: string } | null;
  /** WORKER_COLUMNS.length cells per row: what each cell holds (the K_ constants). */
  kinds: Uint8Array;
  /** Per cell: the number, or the position of its string in `strings` or of its bytes in `ends`. */
  numbers: Float64Array;
  strings: string[];
  /** Every byte-array cell in turn; the k-th ends at ends[k]. */
  bytes: Uint8Array;
  ends: Int32Array;
  solverSeconds: Float64Array;
  jobSeconds: Float64Array;
}

// Fields of a job in JobsMessage.meta.
const F_KIND = 0; // 0: family spec, 1: file graph
const F_TEXT = 1; // spec, or the graph's hash (string position)
const F_PATH = 2;
const F_POSITION = 3;
const F_FORMAT = 4;
const F_SOLVER_SEED = 5;
const F_SETTINGS = 6;
const F_N = 7;
const F_INTS_AT = 8; // offsets start here (n + 1 of them), neighbours right after
const F_NEIGHBORS = 9;
const F_WEIGHTS_AT = 10; // −1: unweighted
const JOB_FIELDS = 11;

// What a row cell holds in RowsMessage.
const K_NUMBER = 0;
const K_NULL = 1;
const K_STRING = 2;
const K_BYTES = 3;
/** The graph hash the job itself carried (file graphs): the main thread has it. */
const K_JOB_HASH = 4;

const W = WORKER_COLUMNS.length;
const GRAPH_HASH = COLUMNS.findIndex((c) => c.name === "graphHash");

/** Distinct values numbered in order of first use. */
class Table<T> {
  readonly items: T[] = [];
  private readonly at = new Map<T, number>();
  of(item: T): number {
    let i = this.at.get(item);
    if (i === undefined) {
      i = this.items.length;
      this.items.push(item);
      this.at.set(item, i);
    }
    return i;
  }
}

/** A job's thrown error as the sweep reports it (message, whether it is bad input, stack). */
export function jobFailure(e: unknown): { error: string; inputError: boolean; stack?: string } {
  return { error: e instanceof Error ? e.message : String(e), inputError: isInputError(e), stack: e instanceof Error ? e.stack : undefined };
}

/** The buffers a message can hand over rather than copy. */
export function transferables(m: JobsMessage | RowsMessage): ArrayBuffer[] {
  const arrays = "meta" in m ? [m.meta, m.ints, m.weights] : [m.kinds, m.numbers, m.bytes, m.ends, m.solverSeconds, m.jobSeconds];
  return arrays.map((a) => a.buffer as ArrayBuffer);
}

/** Pack a batch of jobs (main thread). */
export function encodeJobs(batch: number, jobs: readonly JobInput[], context: JobContext | null): JobsMessage {
  const strings = new Table<string>();
  const settings = new Table<BracketSettings>();
  const meta = new Float64Array(jobs.length * JOB_FIELDS);
  let ints = 0;
  let weights = 0;
  for (const j of jobs) {
    if (j.graph.kind !== "parts") continue;
    const p = j.graph.parts;
    ints += p.n + 1 + (p.offsets[p.n] - p.offsets[0]);
    if (p.weights !== null) weights += p.offsets[p.n] - p.offsets[0];
  }
  const intArr = new Int32Array(ints);
  const weightArr = new Float64Array(weights);
  let ip = 0;
  let wp = 0;
  for (let k = 0; k < jobs.length; k++) {
    const j = jobs[k];
    const o = k * JOB_FIELDS;
    meta[o + F_SOLVER_SEED] = j.solverSeed;
    meta[o + F_SETTINGS] = settings.of(j.settings);
    if (j.graph.kind === "spec") {
      meta[o + F_KIND] = 0;
      meta[o + F_TEXT] = strings.of(j.graph.spec);
      continue;
    }
    const { parts, hash, source } = j.graph;
    const from = parts.offsets[0];
    const to = parts.offsets[parts.n];
    meta[o + F_KIND] = 1;
    meta[o + F_TEXT] = strings.of(hash);
    meta[o + F_PATH] = strings.of(source.path);
    meta[o + F_POSITION] = source.position;
    meta[o + F_FORMAT] = strings.of(source.format);
    meta[o + F_N] = parts.n;
    meta[o + F_INTS_AT] = ip;
    meta[o + F_NEIGHBORS] = to - from;
    // Offsets written from 0 (a graph's own arrays may start further in).
    if (from === 0) intArr.set(parts.offsets.subarray(0, parts.n + 1), ip);
    else for (let u = 0; u <= parts.n; u++) intArr[ip + u] = parts.offsets[u] - from;
    ip += parts.n + 1;
    intArr.set(parts.neighbors.subarray(from, to), ip);
    ip += to - from;
    if (parts.weights === null) meta[o + F_WEIGHTS_AT] = -1;
    else {
      meta[o + F_WEIGHTS_AT] = wp;
      weightArr.set(parts.weights.subarray(from, to), wp);
      wp += to - from;
    }
  }
  return { batch, context, count: jobs.length, strings: strings.items, settings: settings.items, meta, ints: intArr, weights: weightArr };
}

/** The jobs of a message (worker): file graphs are views into the message's arrays. */
export function decodeJobs(m: JobsMessage): WorkerJob[] {
  const jobs: WorkerJob[] = new Array(m.count);
  for (let k = 0; k < m.count; k++) {
    const o = k * JOB_FIELDS;
    const solverSeed = m.meta[o + F_SOLVER_SEED];
    const settings = m.settings[m.meta[o + F_SETTINGS]];
    if (m.meta[o + F_KIND] === 0) {
      jobs[k] = { graph: { kind: "spec", spec: m.strings[m.meta[o + F_TEXT]] }, solverSeed, settings };
      continue;
    }
    const n = m.meta[o + F_N];
    const at = m.meta[o + F_INTS_AT];
    const len = m.meta[o + F_NEIGHBORS];
    const offsets = m.ints.subarray(at, at + n + 1);
    const neighbors = m.ints.subarray(at + n + 1, at + n + 1 + len);
    const wAt = m.meta[o + F_WEIGHTS_AT];
    const weights = wAt < 0 ? null : m.weights.subarray(wAt, wAt + len);
    jobs[k] = {
      graph: {
        kind: "parts",
        parts: { n, offsets, neighbors, weights },
        hash: m.strings[m.meta[o + F_TEXT]],
        source: { path: m.strings[m.meta[o + F_PATH]], position: m.meta[o + F_POSITION], format: m.strings[m.meta[o + F_FORMAT]] as GraphFormat },
      },
      solverSeed,
      settings,
    };
  }
  return jobs;
}

/**
 * Run a message's jobs in this (worker) thread and pack their cells; stops at the first failure,
 * as runBatch does.
 */
export function runJobsMessage(m: JobsMessage, context: JobContext): RowsMessage {
  const t0 = performance.now();
  const jobs = decodeJobs(m);
  const kinds = new Uint8Array(jobs.length * W);
  const numbers = new Float64Array(jobs.length * W);
  const solverSeconds = new Float64Array(jobs.length);
  const jobSeconds = new Float64Array(jobs.length);
  const strings = new Table<string>();
  const blobs: Uint8Array[] = [];
  const v = new Array<CellValue>(COLUMNS.length).fill(null);
  let rows = 0;
  let failure: RowsMessage["failure"] = null;
  for (const job of jobs) {
    const t = performance.now();
    try {
      for (let c = 0; c < W; c++) v[WORKER_COLUMNS[c]] = null;
      solverSeconds[rows] = computeCells(job, context, v);
    } catch (e) {
      failure = jobFailure(e);
      break;
    }
    const base = rows * W;
    const ownHash = job.graph.kind === "parts" ? job.graph.hash : null;
    for (let c = 0; c < W; c++) {
      const col = WORKER_COLUMNS[c];
      const x = v[col];
      if (typeof x === "number") {
        numbers[base + c] = x;
      } else if (x === null) {
        kinds[base + c] = K_NULL;
      } else if (typeof x === "string") {
        if (col === GRAPH_HASH && x === ownHash) kinds[base + c] = K_JOB_HASH;
        else {
          kinds[base + c] = K_STRING;
          numbers[base + c] = strings.of(x);
        }
      } else {
        kinds[base + c] = K_BYTES;
        numbers[base + c] = blobs.length;
        blobs.push(x);
      }
    }
    jobSeconds[rows] = (performance.now() - t) / 1000;
    rows++;
  }
  let size = 0;
  for (const b of blobs) size += b.length;
  const bytes = new Uint8Array(size);
  const ends = new Int32Array(blobs.length);
  let at = 0;
  for (let k = 0; k < blobs.length; k++) {
    bytes.set(blobs[k], at);
    at += blobs[k].length;
    ends[k] = at;
  }
  return { batch: m.batch, seconds: (performance.now() - t0) / 1000, rows, failure, kinds, numbers, strings: strings.items, bytes, ends, solverSeconds, jobSeconds };
}

/** One job's outcome as the sweep takes it: its row in COLUMNS order, or its failure. */
export type DecodedResult =
  | { key: string; values: CellValue[]; solverSeconds: number; jobSeconds: number; error?: undefined }
  | { key: string; error: string; inputError: boolean; stack?: string };

/** The rows of a message (main thread): the worker's cells, then identityCells from the jobs sent. */
export function decodeRows(m: RowsMessage, jobs: readonly JobInput[], context: JobContext): DecodedResult[] {
  const out: DecodedResult[] = [];
  for (let r = 0; r < m.rows; r++) {
    const job = jobs[r];
    const v = new Array<CellValue>(COLUMNS.length).fill(null);
    const base = r * W;
    for (let c = 0; c < W; c++) {
      const kind = m.kinds[base + c];
      const col = WORKER_COLUMNS[c];
      if (kind === K_NUMBER) v[col] = m.numbers[base + c];
      else if (kind === K_STRING) v[col] = m.strings[m.numbers[base + c]];
      else if (kind === K_BYTES) {
        const k = m.numbers[base + c];
        v[col] = m.bytes.subarray(k === 0 ? 0 : m.ends[k - 1], m.ends[k]);
      } else if (kind === K_JOB_HASH && job.graph.kind === "parts") v[col] = job.graph.hash;
    }
    identityCells(job, context, v);
    out.push({ key: job.key, values: v, solverSeconds: m.solverSeconds[r], jobSeconds: m.jobSeconds[r] });
  }
  if (m.failure !== null) out.push({ key: jobs[m.rows].key, ...m.failure });
  return out;
}
