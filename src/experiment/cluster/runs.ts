// Cluster runs on Slurm: generate a run folder for a plan (`createSlurmRun`), submit it, say per
// shard what is done, running, pending, incomplete or missing (`clusterStatus`, from the shard
// stores and squeue), resubmit only what is not done (`resubmitShards`) and merge the shards once
// every one is complete (`mergeRun`). A shard store is resumable (a sweep skips the keys it holds),
// so a task that died is simply run again: nothing lost, nothing duplicated.

import { chmodSync, existsSync, mkdirSync, statSync, writeFileSync } from "node:fs";
import { resolve } from "node:path";
import { InputError } from "../../errors.js";
import { planJobs } from "../jobs.js";
import { mergeStores, type MergeReport } from "../merge.js";
import { loadPlan, type Plan } from "../plan.js";
import { halfplusVersion } from "../provenance.js";
import { planSlices, type PlanSlices } from "../shards.js";
import { openStore } from "../sqlite-store.js";
import { queuedJobs, release, sbatch, scancel, type QueuedJob, type QueueView } from "./scheduler.js";
import { arraySpec, mergeScript, runReadme, submitScript } from "./scripts.js";
import {
  checkPlanUnchanged,
  CLUSTER_RUN_KIND,
  CLUSTER_RUN_VERSION,
  fileSha256,
  readClusterRun,
  runJobName,
  runPaths,
  writeClusterRun,
  type ClusterResources,
  type ClusterRun,
  type ClusterSubmission,
} from "./run.js";

/** Most array tasks a run may have (clusters cap arrays lower: Slurm's MaxArraySize, 1001 by default). */
export const MAX_CLUSTER_TASKS = 100_000;

export interface SlurmRunOptions {
  tasks: number;
  dir: string;
  partition?: string | null;
  time?: string | null;
  cpus?: number;
  mem?: string | null;
  maxRunning?: number | null;
  /** The merged store (default `<dir>/merged.db`). */
  into?: string | null;
  /** The Node binary and halfplus CLI script the tasks run (absolute). */
  node: string;
  cli: string;
}

const SAFE_PATH = /^[^\s'"\\$`%]+$/;

function checkOptions(o: SlurmRunOptions): ClusterResources {
  if (!Number.isInteger(o.tasks) || o.tasks < 1 || o.tasks > MAX_CLUSTER_TASKS) throw new InputError(`--tasks: should be an integer from 1 to ${MAX_CLUSTER_TASKS} (got ${o.tasks})`);
  const partition = o.partition ?? null;
  if (partition !== null && !/^[A-Za-z0-9_.,-]+$/.test(partition)) throw new InputError(`--partition: should be a Slurm partition name such as batch or gpu,cpu (got ${JSON.stringify(partition)})`);
  const time = o.time ?? null;
  // Slurm's time formats: minutes, M:S, H:M:S, D-H, D-H:M, D-H:M:S.
  if (time !== null && !/^(\d+|\d+:\d{1,2}|\d+:\d{1,2}:\d{1,2}|\d+-\d+(:\d{1,2}){0,2})$/.test(time)) throw new InputError(`--time: should be a Slurm time limit such as 02:00:00, 90 (minutes) or 1-12:00:00 (got ${JSON.stringify(time)})`);
  const cpus = o.cpus ?? 1;
  if (!Number.isInteger(cpus) || cpus < 1 || cpus > 1024) throw new InputError(`--cpus: should be an integer from 1 to 1024 (got ${cpus})`);
  const mem = o.mem ?? null;
  if (mem !== null && !/^\d+[KMGT]?$/.test(mem)) throw new InputError(`--mem: should be a size as Slurm writes it, such as 8G or 500M (got ${JSON.stringify(mem)})`);
  const maxRunning = o.maxRunning ?? null;
  if (maxRunning !== null && (!Number.isInteger(maxRunning) || maxRunning < 1)) throw new InputError(`--max-running: should be a positive integer (got ${maxRunning})`);
  return { partition, time, cpus, mem, maxRunning };
}

/** Write a run folder for a plan: run.json, submit.sh, merge.sh, README, shards/, logs/, jobs/. */
export async function createSlurmRun(planPath: string, options: SlurmRunOptions): Promise<{ run: ClusterRun; plan: Plan; slices: PlanSlices }> {
  const resources = checkOptions(options);
  const dir = resolve(options.dir);
  if (!SAFE_PATH.test(dir)) throw new InputError(`--dir: ${JSON.stringify(options.dir)}: use a folder path without spaces, quotes, $, % or backslashes (Slurm's #SBATCH lines cannot quote them)`);
  if (existsSync(runPaths.manifest(dir))) throw new InputError(`--dir: ${dir} already holds a cluster run (see halfplus cluster status ${dir}); resubmit it or choose another folder`);
  if (existsSync(dir) && !statSync(dir).isDirectory()) throw new InputError(`--dir: ${dir} is not a folder`);
  const into = resolve(options.into ?? `${dir}/merged.db`);
  const plan = loadPlan(planPath);
  if (options.tasks > plan.total) throw new InputError(`--tasks: ${options.tasks} is more than the plan's ${plan.total} jobs (every task should have work)`);
  const slices = await planSlices(plan, options.tasks);
  const run: ClusterRun = {
    kind: CLUSTER_RUN_KIND,
    version: CLUSTER_RUN_VERSION,
    name: plan.name,
    plan: resolve(planPath),
    planSha256: fileSha256(planPath),
    tasks: options.tasks,
    dir,
    into,
    node: resolve(options.node),
    cli: resolve(options.cli),
    resources,
    jobName: runJobName(dir),
    shardSizes: slices.sizes,
    shardCosts: slices.costs,
    createdAt: new Date().toISOString(),
    halfplusVersion: halfplusVersion(),
    submissions: [],
  };
  for (const d of [dir, runPaths.shards(dir), runPaths.logs(dir), runPaths.jobs(dir)]) mkdirSync(d, { recursive: true });
  writeFileSync(runPaths.submit(dir), submitScript(run));
  writeFileSync(runPaths.merge(dir), mergeScript(run));
  chmodSync(runPaths.submit(dir), 0o755);
  chmodSync(runPaths.merge(dir), 0o755);
  writeFileSync(runPaths.readme(dir), runReadme(run));
  writeClusterRun(run);
  return { run, plan, slices };
}

// ---------------------------------------------------------------------------------------------
// Status

/**
 * done: every job of the shard is in its store. running / pending: Slurm has the task in its
 * queue. incomplete: some rows, not queued (the task died or was cancelled). missing: no rows, not queued.
 */
export type ShardState = "done" | "running" | "pending" | "incomplete" | "missing";
export const SHARD_STATES: readonly ShardState[] = ["done", "running", "pending", "incomplete", "missing"];

export interface ShardStatus {
  shard: number;
  state: ShardState;
  /** Rows of this shard's jobs in its store. */
  rows: number;
  /** Jobs in this shard. */
  jobs: number;
  /** Slurm's id of the queued task (e.g. `12_3`), or null. */
  job: string | null;
  /** Slurm's state and reason when queued. */
  slurm: string | null;
}

export interface MergeStatus {
  /** queued / running (in Slurm's queue), merged (the merged store holds every job), or absent. */
  state: "queued" | "running" | "merged" | "absent";
  job: string | null;
  /** Slurm's state and reason when queued (e.g. `PENDING (DependencyNeverSatisfied)`). */
  slurm: string | null;
  /** Rows of the plan in the merged store, or null when it does not exist. */
  rows: number | null;
}

export interface ClusterStatus {
  dir: string;
  plan: string;
  name: string;
  tasks: number;
  jobs: number;
  shards: ShardStatus[];
  counts: Record<ShardState, number>;
  merge: MergeStatus;
  /** "squeue" when Slurm's queue was read; otherwise why not (the states then come from the stores alone). */
  scheduler: string;
  notes: string[];
}

function keysOf(path: string): Set<string> | null {
  if (!existsSync(path)) return null;
  const store = openStore(path, { readonly: true });
  try {
    const keys = new Set<string>();
    for (const r of store.rows(undefined, ["key"])) keys.add(String(r.key));
    return keys;
  } finally {
    store.close();
  }
}

const RUNNING_STATES = new Set(["RUNNING", "COMPLETING", "CONFIGURING", "STAGE_OUT", "SIGNALING", "RESIZING"]);

/** What each shard of a run has done, from its store and (where present) Slurm's queue. */
export async function clusterStatus(dir: string, options: { queue?: QueueView } = {}): Promise<ClusterStatus> {
  const run = readClusterRun(dir);
  checkPlanUnchanged(run);
  const plan = loadPlan(run.plan);
  const slices = await planSlices(plan, run.tasks);
  const notes: string[] = [];
  const version = halfplusVersion();
  if (version !== run.halfplusVersion) notes.push(`this is halfplus ${version}; the run was generated by ${run.halfplusVersion}, and row keys name the version`);

  const found = new Array<number>(run.tasks).fill(0);
  const keys = Array.from({ length: run.tasks }, (_, s) => keysOf(runPaths.shardStore(run.dir, s)));
  const merged = keysOf(run.into);
  let mergedRows = 0;
  for await (const job of planJobs(plan, version)) {
    const s = slices.shardOf[job.index];
    if (keys[s]?.has(job.input.key) === true) found[s]++;
    if (merged?.has(job.input.key) === true) mergedRows++;
  }

  const queue = options.queue ?? queuedJobs([`${run.jobName}-shard`, `${run.jobName}-merge`]);
  if (!queue.reachable) notes.push(`Slurm's queue not read (${queue.why}); running and pending tasks show as incomplete or missing`);
  const queued = queue.reachable ? queue.jobs : [];
  const byTask = new Map<number, QueuedJob>();
  for (const j of queued) if (j.name === `${run.jobName}-shard` && j.task !== null && (!byTask.has(j.task) || RUNNING_STATES.has(j.state))) byTask.set(j.task, j);

  const shards: ShardStatus[] = [];
  for (let s = 0; s < run.tasks; s++) {
    const jobs = slices.sizes[s];
    const q = byTask.get(s) ?? null;
    let state: ShardState;
    if (found[s] === jobs) state = "done";
    else if (q !== null) state = RUNNING_STATES.has(q.state) ? "running" : "pending";
    else state = found[s] > 0 ? "incomplete" : "missing";
    shards.push({ shard: s, state, rows: found[s], jobs, job: q?.id ?? null, slurm: q === null ? null : slurmWords(q) });
  }
  const counts = Object.fromEntries(SHARD_STATES.map((k) => [k, 0])) as Record<ShardState, number>;
  for (const s of shards) counts[s.state]++;

  const mergeJob = queued.find((j) => j.name === `${run.jobName}-merge` && RUNNING_STATES.has(j.state)) ?? queued.find((j) => j.name === `${run.jobName}-merge`) ?? null;
  const merge: MergeStatus = {
    state: mergeJob !== null ? (RUNNING_STATES.has(mergeJob.state) ? "running" : "queued") : merged !== null && mergedRows === plan.total ? "merged" : "absent",
    job: mergeJob?.id ?? null,
    slurm: mergeJob === null ? null : slurmWords(mergeJob),
    rows: merged === null ? null : mergedRows,
  };
  return { dir: run.dir, plan: run.plan, name: run.name, tasks: run.tasks, jobs: plan.total, shards, counts, merge, scheduler: queue.reachable ? "squeue" : queue.why, notes };
}

function slurmWords(j: QueuedJob): string {
  return j.reason === "" || j.reason === "None" ? j.state : `${j.state} (${j.reason})`;
}

// ---------------------------------------------------------------------------------------------
// Submitting

/**
 * Submit an array over `shards` and a merge job that waits for it (afterok) and for any other
 * array of this run still queued (afterany): the array is held until the merge job is in, so its
 * first task never submits a second one.
 */
function submitShards(run: ClusterRun, shards: readonly number[], otherArrays: readonly string[]): ClusterSubmission {
  const throttle = run.resources.maxRunning === null ? "" : `%${run.resources.maxRunning}`;
  const arrayJob = sbatch(["--hold", `--array=${arraySpec(shards)}${throttle}`, runPaths.submit(run.dir)]);
  let mergeJob: string | null = null;
  try {
    mkdirSync(runPaths.mergeGuard(run.dir, arrayJob), { recursive: true });
    const after = [`afterok:${arrayJob}`, ...otherArrays.map((j) => `afterany:${j}`)].join(",");
    mergeJob = sbatch([`--dependency=${after}`, runPaths.merge(run.dir)]);
    writeFileSync(`${runPaths.mergeGuard(run.dir, arrayJob)}/job`, `${mergeJob}\n`);
  } finally {
    release(arrayJob);
  }
  const submission: ClusterSubmission = { at: new Date().toISOString(), arrayJob, shards: [...shards], mergeJob };
  run.submissions.push(submission);
  writeClusterRun(run);
  return submission;
}

/** Submit every shard of a freshly generated run (`cluster slurm --submit`). */
export function submitRun(dir: string): ClusterSubmission {
  const run = readClusterRun(dir);
  checkPlanUnchanged(run);
  return submitShards(run, Array.from({ length: run.tasks }, (_, i) => i), []);
}

export interface ResubmitReport {
  /** Shards submitted again (incomplete or missing ones), empty when none needed it. */
  shards: number[];
  submission: ClusterSubmission | null;
  /** Merge jobs cancelled because they wait on an array that failed. */
  cancelled: string[];
  status: ClusterStatus;
}

/** Submit again only the shards that are neither done nor queued, with a fresh merge job. */
export async function resubmitShards(dir: string): Promise<ResubmitReport> {
  const run = readClusterRun(dir);
  const queue = queuedJobs([`${run.jobName}-shard`, `${run.jobName}-merge`]);
  if (!queue.reachable) throw new InputError(`${run.dir}: cannot read Slurm's queue (${queue.why}); without it a resubmit could run a shard twice at once`);
  const status = await clusterStatus(dir, { queue });
  const shards = status.shards.filter((s) => s.state === "incomplete" || s.state === "missing").map((s) => s.shard);
  if (shards.length === 0) return { shards, submission: null, cancelled: [], status };
  // A merge job still pending waits on an array with a failed task (afterok never holds): replace it.
  const cancelled = queue.jobs.filter((j) => j.name === `${run.jobName}-merge` && !RUNNING_STATES.has(j.state)).map((j) => j.id);
  scancel(cancelled);
  const others = [...new Set(queue.jobs.filter((j) => j.name === `${run.jobName}-shard`).map((j) => j.arrayJob))];
  const submission = submitShards(run, shards, others);
  return { shards, submission, cancelled, status };
}

// ---------------------------------------------------------------------------------------------
// Merging

/**
 * Merge every shard store of a run into its merged store, only when every shard is done;
 * otherwise `report` is null and `status` names the shards that are not.
 */
export async function mergeRun(dir: string): Promise<{ report: MergeReport | null; status: ClusterStatus; notDone: ShardStatus[] }> {
  // Done or not is read from the stores alone; the queue does not matter here.
  const status = await clusterStatus(dir, { queue: { reachable: true, jobs: [] } });
  const notDone = status.shards.filter((s) => s.state !== "done");
  if (notDone.length > 0) return { report: null, status, notDone };
  const run = readClusterRun(dir);
  const report = mergeStores(Array.from({ length: run.tasks }, (_, s) => runPaths.shardStore(run.dir, s)), run.into);
  return { report, status, notDone };
}
