// Runs batches of sweep jobs on worker threads (one per core by default), or in the calling
// thread when asked for 0 workers. Jobs cross the thread boundary as plain data: a family spec
// (the worker builds the graph) or graphToParts arrays (graphs read from files), packed per batch
// by wire.ts, which also packs the rows coming back.

import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { runJob, type JobContext, type JobInput } from "./job.js";
import { decodeRows, encodeJobs, jobFailure, transferables, type DecodedResult, type RowsMessage } from "./wire.js";

export interface BatchRequest {
  batch: number;
  jobs: JobInput[];
  /** What every job shares: evaluators, degree measures, version, provenance. */
  context: JobContext;
}

/** A finished job's row as values in COLUMNS order, or its failure (one type with wire.ts's decoded rows). */
export type JobResult = DecodedResult;

export interface BatchResult {
  batch: number;
  results: JobResult[];
  /** Seconds the batch took inside the worker. */
  seconds: number;
}

export interface JobRunner {
  /** Batches that can run at once. */
  readonly size: number;
  submit(jobs: JobInput[], context: JobContext): Promise<BatchResult>;
  /** Seconds the workers have waited for work so far, summed (0 in the calling thread). */
  idleSeconds(): number;
  close(): Promise<void>;
}

/**
 * The worker script: worker.js and every module it imports joined into one file by the build's
 * second step (scripts/bundle-worker.mjs), since loading ~150 modules one by one was most of a
 * worker's start-up. Under the TypeScript sources (the test runner) there is no build beside
 * this file, and Node 20 cannot start a worker from .ts: use the one in dist/.
 */
function workerScript(): URL {
  const built = import.meta.url.endsWith(".js") ? new URL("./worker-bundle.js", import.meta.url) : new URL("../../dist/experiment/worker-bundle.js", import.meta.url);
  if (!existsSync(fileURLToPath(built))) throw new Error(`sweep workers need the build: run npm run build (missing ${fileURLToPath(built)})`);
  return built;
}

/** Run a batch's jobs in this thread (a worker's, or the main one for 0 workers); stops at the first failure. */
export function runBatch(request: BatchRequest): BatchResult {
  const t0 = performance.now();
  const results: JobResult[] = [];
  for (const job of request.jobs) {
    try {
      const t = performance.now();
      const out = runJob(job, request.context);
      results.push({ key: job.key, values: out.values, solverSeconds: out.solverSeconds, jobSeconds: (performance.now() - t) / 1000 });
    } catch (e) {
      results.push({ key: job.key, ...jobFailure(e) });
      break;
    }
  }
  return { batch: request.batch, results, seconds: (performance.now() - t0) / 1000 };
}

class InlineRunner implements JobRunner {
  readonly size = 1;
  private next = 0;

  submit(jobs: JobInput[], context: JobContext): Promise<BatchResult> {
    // Yield to the event loop first, so progress, signals and writes keep flowing.
    return new Promise((resolve) => setImmediate(() => resolve(runBatch({ batch: this.next++, jobs, context }))));
  }

  idleSeconds(): number {
    return 0;
  }

  async close(): Promise<void> {}
}

interface Slot {
  worker: Worker;
  /** Each batch in flight with the jobs and context it was sent with (its rows are completed from them). */
  pending: Map<number, { resolve: (r: BatchResult) => void; reject: (e: Error) => void; jobs: JobInput[]; context: JobContext }>;
  dead: Error | null;
  /** The context this worker holds: sent with its first batch and again only when it changes. */
  context: JobContext | null;
}

class ThreadRunner implements JobRunner {
  private readonly slots: Slot[] = [];
  private next = 0;
  private closing = false;

  constructor(readonly size: number) {
    const script = workerScript();
    for (let i = 0; i < size; i++) {
      const slot: Slot = { worker: new Worker(script), pending: new Map(), dead: null, context: null };
      slot.worker.on("message", (r: RowsMessage) => {
        const p = slot.pending.get(r.batch);
        slot.pending.delete(r.batch);
        if (p === undefined) return;
        try {
          p.resolve({ batch: r.batch, results: decodeRows(r, p.jobs, p.context), seconds: r.seconds });
        } catch (e) {
          p.reject(e instanceof Error ? e : new Error(String(e)));
        }
      });
      const fail = (e: Error): void => {
        slot.dead = e;
        for (const p of slot.pending.values()) p.reject(e);
        slot.pending.clear();
      };
      slot.worker.on("error", (e) => fail(e instanceof Error ? e : new Error(String(e))));
      slot.worker.on("exit", (code) => {
        if (!this.closing) fail(new Error(`a sweep worker stopped unexpectedly (exit code ${code})`));
      });
      this.slots.push(slot);
    }
  }

  submit(jobs: JobInput[], context: JobContext): Promise<BatchResult> {
    const alive = this.slots.filter((s) => s.dead === null);
    if (alive.length === 0) return Promise.reject(this.slots[0].dead ?? new Error("no sweep workers"));
    // The least busy worker takes the batch.
    let slot = alive[0];
    for (const s of alive) if (s.pending.size < slot.pending.size) slot = s;
    const batch = this.next++;
    return new Promise((resolve, reject) => {
      slot.pending.set(batch, { resolve, reject, jobs, context });
      const message = encodeJobs(batch, jobs, slot.context === context ? null : context);
      slot.context = context;
      slot.worker.postMessage(message, transferables(message));
    });
  }

  idleSeconds(): number {
    let idle = 0;
    for (const s of this.slots) if (s.dead === null) idle += s.worker.performance.eventLoopUtilization().idle / 1000;
    return idle;
  }

  async close(): Promise<void> {
    this.closing = true;
    await Promise.all(this.slots.map((s) => s.worker.terminate()));
  }
}

/** `workers` threads, or the calling thread for 0. */
export function createRunner(workers: number): JobRunner {
  return workers === 0 ? new InlineRunner() : new ThreadRunner(workers);
}
