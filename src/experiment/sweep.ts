// runSweep: the plan's jobs (in plan order, this shard only), minus the rows already stored, run
// on the worker pool; the main thread only schedules and writes. Each finished batch of jobs is
// written in one transaction as it comes back, so killing the process loses at most the batches
// in flight and the next run computes exactly what is missing.

import { availableParallelism, hostname } from "node:os";
import { InputError } from "../errors.js";
import { COLUMN_INDEX, type CellValue } from "./columns.js";
import type { JobContext, JobInput } from "./job.js";
import { parseShard, planJobs, shardSize, type PlannedJob, type Shard } from "./jobs.js";
import { planSlices, type PlanSlices } from "./shards.js";
import { loadPlan, type Plan, type SweepPlan } from "./plan.js";
import { createRunner, type BatchResult } from "./pool.js";
import type { LowestRatio, SweepProgress } from "./progress.js";
import { existsSync } from "node:fs";
import { halfplusVersion, provenance } from "./provenance.js";
import { DEFAULT_STORE, openStore } from "./sqlite-store.js";
import type { ResultStore } from "./store.js";

export interface SweepOptions {
  /** A store path (default results/halfplus.db) or an open store (left open). */
  store?: string | ResultStore;
  /** Worker threads (default: one per core); 0 runs the jobs in the calling thread. */
  workers?: number;
  /** Run only this slice: `{ index, count }` or "i/N" with 0 ≤ i < N. */
  shard?: Shard | string | null;
  onProgress?: (p: SweepProgress) => void;
  /** Seconds between onProgress calls (default 0.1); the final call always comes. */
  progressEvery?: number;
  /** Stop taking new jobs; the jobs in flight are finished and written. */
  signal?: AbortSignal;
  /** Folder that relative sources of a plan object are read from (default: the working folder). */
  base?: string;
}

export interface SweepSummary {
  plan: string;
  store: string;
  shard: string | null;
  workers: number;
  /** Jobs in this shard. */
  total: number;
  computed: number;
  skipped: number;
  /** True when stopped by the signal before every job ran. */
  stopped: boolean;
  seconds: number;
  /** Seconds spent inside bracket(), summed over jobs. */
  solverSeconds: number;
  /** Seconds spent on whole jobs (building the graph, bracket, structure, bounds, the row), summed. */
  jobSeconds: number;
  /** Seconds the worker threads spent waiting for work, summed (start-up and the last jobs included). */
  workerIdleSeconds: number;
  lowest: LowestRatio | null;
}

/**
 * Batches aim at this many seconds of work, so tiny jobs do not pay one message and one commit
 * each. 50 ms rather than 30: a third fewer commits on the main thread, whose CPU comes out of
 * the workers' share when both cores are busy; a kill still loses at most BATCHES_PER_WORKER of
 * them per worker (DEVELOPERS.md, Benchmarks).
 */
const BATCH_TARGET_SECONDS = 0.05;
/**
 * Batches in flight per worker: one running, two waiting. With one waiting, a worker on a loaded
 * machine often finished both before the main thread was scheduled to send more (1.0–1.7 s idle
 * in a 2-worker sweep of 1000 exact jobs at load 9–10; 0–0.3 s with two waiting).
 */
const BATCHES_PER_WORKER = 3;
const MAX_BATCH = 256;
/** Rows written before the store's background maintenance starts: fewer rows make a log of a few megabytes at most. */
const BACKGROUND_MAINTENANCE_ROWS = 2000;
/** Stores up to this many rows have their keys read into memory at the start of a sweep. */
const KEYS_IN_MEMORY = 250_000;

function nowIso(): string {
  return new Date().toISOString();
}

const AT = (name: string): number => COLUMN_INDEX.get(name)!;
const M = AT("m");
const SURPLUS_UPPER = AT("surplusUpper");
const SURPLUS_LOWER = AT("surplusLower");

function ratioOf(values: readonly CellValue[], degree: number): { upper: number; lower: number } | null {
  const m = values[M] as number;
  const d = values[degree];
  const su = values[SURPLUS_UPPER];
  const sl = values[SURPLUS_LOWER];
  if (typeof d !== "number" || !(d > 0) || !(m > 0) || typeof su !== "number" || typeof sl !== "number") return null;
  const k = Math.sqrt(d) / m;
  return { upper: su * k, lower: sl * k };
}

/** Run a plan (object, file path, or a plan already loaded) into a store. */
export async function runSweep(plan: SweepPlan | Plan | string, options: SweepOptions = {}): Promise<SweepSummary> {
  const shard = options.shard === undefined || options.shard === null ? null : typeof options.shard === "string" ? parseShard(options.shard) : options.shard;
  if (shard !== null && (!Number.isInteger(shard.index) || !Number.isInteger(shard.count) || shard.count < 1 || shard.index < 0 || shard.index >= shard.count)) {
    throw new InputError(`runSweep: invalid \`shard\`: should have 0 ≤ index < count (got ${JSON.stringify(shard)})`);
  }
  const workers = options.workers ?? availableParallelism();
  if (!Number.isInteger(workers) || workers < 0 || workers > 1024) throw new InputError(`runSweep: invalid \`workers\`: should be an integer from 0 to 1024 (got ${JSON.stringify(options.workers)})`);
  // Workers start first, then the git commands of the provenance: loading the workers' code and
  // running git overlap with checking the plan and opening the store.
  const runner = createRunner(workers);
  const provenanceLater = provenance();
  const ownStore = typeof options.store !== "object";
  let p: Plan;
  let store: ResultStore;
  try {
    p = typeof plan === "object" && "entries" in plan ? plan : loadPlan(plan as SweepPlan | string, { base: options.base });
    store = typeof options.store === "object" ? options.store : openStore(options.store ?? DEFAULT_STORE);
  } catch (e) {
    await runner.close();
    throw e;
  }
  if (store.readonly) {
    await runner.close();
    throw new InputError(`${store.path}: opened read-only; a sweep writes to it`);
  }

  let slices: PlanSlices | null = null;
  try {
    if (shard !== null) slices = await planSlices(p, shard.count);
  } catch (e) {
    await runner.close();
    if (ownStore) store.close();
    throw e;
  }
  const prov = await provenanceLater;
  const started = nowIso();
  const shardText = shard === null ? null : `${shard.index}/${shard.count}`;
  const log = {
    id: `${started} ${hostname()} pid ${process.pid}`,
    plan: p.name,
    planText: p.text,
    startedAt: started,
    finishedAt: null as string | null,
    shard: shardText,
    workers,
    version: prov.version,
    gitCommit: prov.gitCommit,
    computed: 0,
    status: "running",
  };
  store.logSweep(log);

  const total = shardSize(slices, shard, p.total);
  const degree = p.degrees[0];
  const degreeAt = AT(degree);
  const t0 = performance.now();
  const elapsed = (): number => (performance.now() - t0) / 1000;
  let computed = 0;
  let skipped = 0;
  let solverSeconds = 0;
  let jobSeconds = 0;
  let workerIdleSeconds = 0;
  let lowest: LowestRatio | null = null;
  let current: SweepProgress["current"] = null;
  let lastReport = -Infinity;
  const every = options.progressEvery ?? 0.1;
  const report = (finished: boolean): void => {
    if (options.onProgress === undefined) return;
    const t = elapsed();
    if (!finished && t - lastReport < every) return;
    lastReport = t;
    const rate = computed > 0 && t > 0 ? computed / t : null;
    const left = total - computed - skipped;
    options.onProgress({ plan: p.name, done: computed + skipped, total, computed, skipped, elapsed: t, rate, eta: rate === null ? null : left / rate, current, degree, lowest, finished });
  };

  const context: JobContext = {
    evaluators: p.evaluators,
    degrees: p.degrees,
    version: prov.version,
    shared: { gitCommit: prov.gitCommit, nodeVersion: prov.nodeVersion, platform: prov.platform },
  };
  const slots = Math.max(1, BATCHES_PER_WORKER * runner.size);
  const inFlight = new Set<Promise<void>>();
  const sent = new Set<string>();
  let failure: Error | null = null;
  let secondsPerJob: number | null = null;
  const where = new Map<string, string>();
  const maintenance: { started: boolean; stop: (() => Promise<void>) | null } = { started: false, stop: null };

  const written = (r: BatchResult): void => {
    const rows: CellValue[][] = [];
    for (const res of r.results) {
      if (res.error !== undefined) {
        if (failure === null) {
          const msg = `${where.get(res.key) ?? "job"} ${res.key.split("|")[0]}: ${res.error}`;
          failure = res.inputError ? new InputError(msg) : Object.assign(new Error(msg), { stack: res.stack });
        }
        continue;
      }
      rows.push(res.values);
      solverSeconds += res.solverSeconds;
      jobSeconds += res.jobSeconds;
      const ratio = ratioOf(res.values, degreeAt);
      if (ratio !== null && (lowest === null || ratio.upper < lowest.ratio)) {
        lowest = { ratio: ratio.upper, ratioLower: ratio.lower, key: res.key, graph: res.key.split("|")[0] };
      }
    }
    computed += store.insertValues(rows);
    // Log checkpoints on a thread of their own once the sweep is long enough to need them (a
    // short one never fills the log): the main thread then only schedules and appends rows.
    if (!maintenance.started && computed >= BACKGROUND_MAINTENANCE_ROWS) {
      maintenance.started = true;
      maintenance.stop = store.backgroundMaintenance?.() ?? null;
    }
    for (const res of r.results) where.delete(res.key);
    const ok = r.results.filter((x) => x.error === undefined).length;
    if (ok > 0) {
      const per = r.seconds / r.results.length;
      secondsPerJob = secondsPerJob === null ? per : 0.7 * secondsPerJob + 0.3 * per;
    }
    report(false);
  };

  const dispatch = (batch: PlannedJob[]): void => {
    const inputs: JobInput[] = batch.map((j) => j.input);
    for (const j of batch) where.set(j.input.key, j.where);
    const last = batch[batch.length - 1];
    current = { family: last.input.family, n: last.n };
    const done = runner
      .submit(inputs, context)
      .then(written)
      .catch((e: Error) => {
        failure ??= e;
      });
    const tracked = done.finally(() => inFlight.delete(tracked));
    inFlight.add(tracked);
  };

  // The keys already stored, held in memory when there are not too many (one lookup per job
  // otherwise); a row another process adds meanwhile is still never duplicated (the insert skips it).
  let stored: Set<string> | null = null;
  if (store.count() <= KEYS_IN_MEMORY) {
    stored = new Set();
    for (const r of store.rows(undefined, ["key"])) stored.add(String(r.key));
  }

  let stopped = false;
  let batch: PlannedJob[] = [];
  try {
    const timed = (): number => (secondsPerJob === null ? 1 : Math.max(1, Math.min(MAX_BATCH, Math.floor(BATCH_TARGET_SECONDS / Math.max(secondsPerJob, 1e-7)))));
    // Near the end, the jobs left (at most: some may still be skipped) are spread over every slot,
    // so no worker is left with a full queue while the other has nothing.
    const batchSize = (): number => Math.min(timed(), Math.max(1, Math.ceil((total - skipped - sent.size + batch.length) / slots)));
    for await (const job of planJobs(p, prov.version, shard, slices ?? undefined)) {
      if (failure !== null) break;
      if (options.signal?.aborted) {
        stopped = true;
        break;
      }
      const key = job.input.key;
      if (sent.has(key) || (stored === null ? store.has(key) : stored.has(key))) {
        skipped++;
        report(false);
        continue;
      }
      sent.add(key);
      batch.push(job);
      if (batch.length >= batchSize()) {
        dispatch(batch);
        batch = [];
        while (inFlight.size >= slots) await Promise.race(inFlight);
      }
    }
    if (batch.length > 0 && failure === null && !stopped) dispatch(batch);
    while (inFlight.size > 0) await Promise.race(inFlight);
  } catch (e) {
    // A bad graph in a file stream, for instance: run the jobs read before it, then report it.
    if (failure === null && batch.length > 0) dispatch(batch);
    failure ??= e as Error;
    while (inFlight.size > 0) await Promise.race(inFlight);
  } finally {
    workerIdleSeconds = runner.idleSeconds();
    // Every batch has come back: the workers stop while the main thread closes the store (both
    // take tens of milliseconds of wall time, the store mostly waiting for the disk).
    const closing = runner.close();
    log.finishedAt = nowIso();
    log.computed = computed;
    log.status = failure !== null ? "failed" : stopped ? "stopped" : "finished";
    store.logSweep(log);
    await maintenance.stop?.();
    if (ownStore) store.close();
    await closing;
  }
  if (failure !== null) throw failure;
  report(true);
  return { plan: p.name, store: store.path, shard: shardText, workers, total, computed, skipped, stopped, seconds: elapsed(), solverSeconds, jobSeconds, workerIdleSeconds, lowest };
}

/** Keys of the plan's jobs (in this shard) that the store does not hold yet, in plan order. */
export async function* pendingKeys(plan: SweepPlan | Plan | string, options: { store?: string; shard?: Shard | string | null } = {}): AsyncGenerator<string> {
  const p: Plan = typeof plan === "object" && "entries" in plan ? plan : loadPlan(plan as SweepPlan | string);
  const shard = options.shard === undefined || options.shard === null ? null : typeof options.shard === "string" ? parseShard(options.shard) : options.shard;
  const path = options.store ?? DEFAULT_STORE;
  // Listing never creates a store.
  const store = existsSync(path) ? openStore(path, { readonly: true }) : null;
  try {
    const seen = new Set<string>();
    for await (const job of planJobs(p, halfplusVersion(), shard)) {
      const key = job.input.key;
      if (seen.has(key) || store?.has(key) === true) continue;
      seen.add(key);
      yield key;
    }
  } finally {
    store?.close();
  }
}
