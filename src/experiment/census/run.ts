// runCensus: a graph6/sparse6 stream, cut into batches in the main thread, solved exactly on
// worker threads, and folded in stream order into per-(n, m) cells kept in the results store.
// The stored state names how many graphs of the stream are counted and a sha256 of that prefix:
// a killed census fed the same stream again skips (and checks) that prefix and goes on, so no
// graph is counted twice or missed.

import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { InputError, invalidParameter } from "../../errors.js";
import { halfplusVersion } from "../provenance.js";
import { DEFAULT_STORE, openStore } from "../sqlite-store.js";
import type { ResultStore } from "../store.js";
import { runCensusBatch, type CensusBatchRequest, type CensusBatchResult } from "./batch.js";
import { cellKey, fromPlainCell, mergeCell, type CensusCell } from "./cells.js";
import type { CensusState } from "./census-store.js";
import { StreamBatcher, type LineBatch } from "./stream-batches.js";

import { DEFAULT_BATCH_GRAPHS, DEFAULT_CENSUS, DEFAULT_WITNESS_LIMIT } from "./defaults.js";
export { DEFAULT_BATCH_GRAPHS, DEFAULT_CENSUS, DEFAULT_WITNESS_LIMIT };
/** Seconds between commits; the last batch is always committed. */
const COMMIT_EVERY = 0.25;
const SKIP_BATCH = 1 << 20;

export interface CensusOptions {
  /** The stream: `-` for standard input (or `stdin`), else a file path. */
  input: string;
  stdin?: NodeJS.ReadableStream;
  /** A store path (default results/halfplus.db) or an open store (left open). */
  store?: string | ResultStore;
  /** Which census of the store (default "census"): one store may hold several. */
  name?: string;
  /** Worker threads (default: one per core); 0 runs batches in the calling thread. */
  workers?: number;
  /** Witnesses kept per (n, m) (default 8); fixed when the census starts. */
  witnessLimit?: number;
  batchGraphs?: number;
  /** Read at most this many graphs in this run (past any prefix already counted), then stop. */
  atMost?: number;
  /** Stop reading; the batches in flight are finished and committed. */
  signal?: AbortSignal;
  onProgress?: (p: CensusProgress) => void;
}

export interface CensusLowest {
  ratio: number;
  n: number;
  m: number;
  graph: string;
}

export interface CensusProgress {
  name: string;
  /** "skipping": checking the prefix counted by an earlier run; "counting": solving graphs. */
  phase: "skipping" | "counting";
  /** Graphs of the stream counted in the store (the resume position), or skipped so far. */
  consumed: number;
  /** Graphs solved in this run. */
  counted: number;
  elapsed: number;
  /** Graphs solved per second in this run, null before the first batch. */
  rate: number | null;
  cells: number;
  lowest: CensusLowest | null;
  finished: boolean;
}

export interface CensusSummary {
  name: string;
  store: string;
  source: string;
  /** Graphs counted in the store now. */
  consumed: number;
  /** Graphs skipped because an earlier run had counted them. */
  resumedFrom: number;
  /** Graphs solved in this run. */
  counted: number;
  cells: number;
  workers: number;
  seconds: number;
  /** The stream was read to its end. */
  finished: boolean;
  /** Stopped by the signal or by `atMost` before the end of the stream. */
  stopped: boolean;
  lowest: CensusLowest | null;
}

function nowIso(): string {
  return new Date().toISOString();
}

/**
 * Worker threads for census batches. They start from one file, the build's bundle of census-worker.js
 * and everything it imports (scripts/bundle-worker.mjs), which comes from dist/ under the test runner.
 */
class CensusPool {
  private readonly workers: Worker[] = [];
  private readonly waiting = new Map<number, { resolve: (r: CensusBatchResult) => void; reject: (e: Error) => void; worker: number }>();
  private readonly load: number[] = [];
  private closing = false;

  constructor(size: number) {
    const script = import.meta.url.endsWith(".js")
      ? new URL("./census-worker-bundle.js", import.meta.url)
      : new URL("../../../dist/experiment/census/census-worker-bundle.js", import.meta.url);
    if (!existsSync(fileURLToPath(script))) throw new Error(`census workers need the build: run npm run build (missing ${fileURLToPath(script)})`);
    for (let i = 0; i < size; i++) {
      const w = new Worker(script);
      this.load.push(0);
      w.on("message", (r: CensusBatchResult) => {
        const p = this.waiting.get(r.seq);
        this.waiting.delete(r.seq);
        this.load[i]--;
        p?.resolve(r);
      });
      const fail = (e: Error): void => {
        for (const [seq, p] of this.waiting) {
          if (p.worker !== i) continue;
          this.waiting.delete(seq);
          p.reject(e);
        }
      };
      w.on("error", (e) => fail(e instanceof Error ? e : new Error(String(e))));
      w.on("exit", (code) => {
        if (!this.closing) fail(new Error(`a census worker stopped unexpectedly (exit code ${code})`));
      });
      this.workers.push(w);
    }
  }

  submit(req: CensusBatchRequest): Promise<CensusBatchResult> {
    let i = 0;
    for (let k = 1; k < this.workers.length; k++) if (this.load[k] < this.load[i]) i = k;
    this.load[i]++;
    return new Promise((resolve, reject) => {
      this.waiting.set(req.seq, { resolve, reject, worker: i });
      this.workers[i].postMessage(req, [req.bytes.buffer as ArrayBuffer]);
    });
  }

  async close(): Promise<void> {
    this.closing = true;
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}

function checkCount(name: string, value: unknown, min: number, max: number): void {
  if (typeof value !== "number" || !Number.isInteger(value) || value < min || value > max) throw invalidParameter("runCensus", name, `an integer between ${min} and ${max}`, value);
}

/** Run (or resume) a census of a graph6/sparse6 stream into a results store. */
export async function runCensus(options: CensusOptions): Promise<CensusSummary> {
  const t0 = performance.now() / 1000;
  const name = options.name ?? DEFAULT_CENSUS;
  if (typeof name !== "string" || name === "" || name.length > 200) throw invalidParameter("runCensus", "name", "a non-empty name of at most 200 characters", name);
  const workers = options.workers ?? availableParallelism();
  checkCount("workers", workers, 0, 1024);
  const batchGraphs = options.batchGraphs ?? DEFAULT_BATCH_GRAPHS;
  checkCount("batchGraphs", batchGraphs, 1, 1_000_000);
  if (options.witnessLimit !== undefined) checkCount("witnessLimit", options.witnessLimit, 0, 10_000);
  const atMost = options.atMost ?? Infinity;
  if (atMost !== Infinity) checkCount("atMost", atMost, 1, Number.MAX_SAFE_INTEGER);
  const input = options.input === "stdin" ? "-" : options.input;

  const ownStore = typeof options.store !== "object";
  const store = typeof options.store === "object" ? options.store : openStore(options.store ?? DEFAULT_STORE);
  const batcher = new StreamBatcher(input, options.stdin);
  let pool: CensusPool | null = null;
  try {
    const tables = store.census();
    const stored = tables.state(name);
    const witnessLimit = options.witnessLimit ?? stored?.witnessLimit ?? DEFAULT_WITNESS_LIMIT;
    if (stored !== undefined && stored.witnessLimit !== witnessLimit) {
      throw new InputError(`witnessLimit: census ${JSON.stringify(name)} in ${store.path} keeps ${stored.witnessLimit} witnesses per (n, m); it cannot change to ${witnessLimit} (leave it out, or start another census with --name)`);
    }
    const startedAt = nowIso();
    const state: CensusState = stored ?? { name, consumed: 0, fingerprint: "", witnessLimit, source: batcher.source, startedAt, updatedAt: startedAt, finishedAt: null, version: halfplusVersion() };
    const cells = new Map<number, CensusCell>();
    for (const c of tables.cells(name)) cells.set(cellKey(c.n, c.m), c);
    let lowest: CensusLowest | null = null;
    const noteLowest = (c: CensusCell): void => {
      if (c.minRatio !== null && c.ratioWitness !== null && (lowest === null || c.minRatio < lowest.ratio)) lowest = { ratio: c.minRatio, n: c.n, m: c.m, graph: c.ratioWitness };
    };
    for (const c of cells.values()) noteLowest(c);

    let counted = 0;
    const report = (phase: CensusProgress["phase"], consumed: number, finished: boolean): void => {
      if (options.onProgress === undefined) return;
      const elapsed = performance.now() / 1000 - t0;
      options.onProgress({ name, phase, consumed, counted, elapsed, rate: counted > 0 && elapsed > 0 ? counted / elapsed : null, cells: cells.size, lowest, finished });
    };

    // Skip (and check) the prefix an earlier run counted.
    const resumedFrom = state.consumed;
    if (resumedFrom > 0) {
      let skipped = 0;
      let fingerprint = "";
      while (skipped < resumedFrom) {
        const b = await batcher.next(Math.min(SKIP_BATCH, resumedFrom - skipped));
        if (b === null) {
          throw new InputError(`${batcher.source}: holds ${skipped} graphs, but census ${JSON.stringify(name)} in ${store.path} has already counted ${resumedFrom}; feed it the stream it was started with`);
        }
        skipped += b.graphs;
        fingerprint = b.fingerprint;
        report("skipping", skipped, false);
      }
      if (fingerprint !== state.fingerprint) {
        throw new InputError(`${batcher.source}: its first ${resumedFrom} graphs differ from those census ${JSON.stringify(name)} in ${store.path} counted (sha256 of the prefix differs); feed it the same stream, or start another census with --name`);
      }
    }

    pool = workers > 0 ? new CensusPool(workers) : null;
    const run = (req: CensusBatchRequest): Promise<CensusBatchResult> => (pool === null ? new Promise((resolve) => setImmediate(() => resolve(runCensusBatch(req)))) : pool.submit(req));
    const inFlight: { batch: LineBatch; result: Promise<CensusBatchResult> }[] = [];
    const limit = 2 * Math.max(1, workers);
    let seq = 0;
    let read = 0;
    let eof = false;
    let stopped = false;
    const changed = new Map<number, CensusCell>();
    let lastCommit = performance.now() / 1000;
    const commit = (): void => {
      state.updatedAt = nowIso();
      state.version = halfplusVersion();
      tables.commit(state, changed.values());
      changed.clear();
      lastCommit = performance.now() / 1000;
    };
    let failure: Error | null = null;
    for (;;) {
      while (!eof && !stopped && inFlight.length < limit) {
        if (options.signal?.aborted === true || read >= atMost) {
          stopped = true;
          break;
        }
        const b = await batcher.next(Math.min(batchGraphs, atMost - read));
        if (b === null) {
          eof = true;
          break;
        }
        read += b.graphs;
        const bytes = new Uint8Array(b.bytes); // its own buffer, handed over to the worker
        const result = run({ seq: seq++, bytes, file: batcher.source, firstLine: b.firstLine, witnessLimit });
        // A batch still in flight when another fails is never awaited: its rejection must not end the process.
        result.catch(() => undefined);
        inFlight.push({ batch: b, result });
      }
      if (inFlight.length === 0) break;
      const { batch, result } = inFlight.shift()!;
      const r = await result;
      if (r.error !== undefined) {
        failure = r.inputError ? new InputError(r.error) : new Error(r.error);
        break;
      }
      if (r.graphs !== batch.graphs) {
        failure = new Error(`census batch from line ${batch.firstLine}: the worker read ${r.graphs} graphs, the reader ${batch.graphs}`);
        break;
      }
      for (const plain of r.cells) {
        const later = fromPlainCell(plain);
        const key = cellKey(later.n, later.m);
        let cell = cells.get(key);
        if (cell === undefined) {
          cell = later;
          cell.witnesses = cell.witnesses.slice(0, witnessLimit);
          cells.set(key, cell);
        } else mergeCell(cell, later, witnessLimit);
        changed.set(key, cell);
        noteLowest(cell);
      }
      state.consumed += r.graphs;
      state.fingerprint = batch.fingerprint;
      counted += r.graphs;
      if (performance.now() / 1000 - lastCommit >= COMMIT_EVERY) commit();
      report("counting", state.consumed, false);
    }
    // A failed batch leaves the batches after it unmerged: what was merged before it is committed.
    if (eof && failure === null && !stopped) state.finishedAt = nowIso();
    commit();
    if (failure !== null) throw failure;
    report("counting", state.consumed, true);
    return {
      name,
      store: store.path,
      source: batcher.source,
      consumed: state.consumed,
      resumedFrom,
      counted,
      cells: cells.size,
      workers,
      seconds: performance.now() / 1000 - t0,
      finished: eof && !stopped,
      stopped,
      lowest,
    };
  } finally {
    await pool?.close();
    await batcher.close();
    if (ownStore) store.close();
  }
}
