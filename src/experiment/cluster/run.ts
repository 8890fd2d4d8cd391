// A cluster run folder: what `halfplus cluster slurm` generated, in `run.json` (our own record,
// kind `halfplus/cluster-run`), beside the scripts, the shard stores and the logs. Everything a
// later `cluster status`, `cluster resubmit` or `cluster merge` needs is read from here, so they
// work from any machine that sees the shared folder.

import { createHash } from "node:crypto";
import { existsSync, readFileSync, renameSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { InputError } from "../../errors.js";
import { parseStrictJson } from "../../limits/strict-json.js";

export const CLUSTER_RUN_KIND = "halfplus/cluster-run";
export const CLUSTER_RUN_VERSION = 1;

/** What each array task asks the scheduler for. */
export interface ClusterResources {
  partition: string | null;
  /** Wall-clock limit per task as Slurm writes it (`HH:MM:SS`, `D-HH:MM:SS`, minutes), or null for the partition's default. */
  time: string | null;
  /** CPUs per task; the sweep runs this many worker threads. */
  cpus: number;
  /** Memory per task as Slurm writes it (`8G`, `500M`), or null for the default. */
  mem: string | null;
  /** At most this many tasks at once (`%K` of `--array`), or null for no limit. */
  maxRunning: number | null;
}

/** One sbatch submission: an array over some shards and the merge job that waits for it. */
export interface ClusterSubmission {
  at: string;
  arrayJob: string;
  shards: number[];
  mergeJob: string | null;
}

export interface ClusterRun {
  kind: typeof CLUSTER_RUN_KIND;
  version: number;
  /** The plan's name. */
  name: string;
  /** The plan file, absolute. */
  plan: string;
  /** sha256 of the plan file's bytes when the run was generated: the slicing depends on it. */
  planSha256: string;
  tasks: number;
  /** The run folder, absolute. */
  dir: string;
  /** The store the merge job writes, absolute. */
  into: string;
  /** The Node binary and the halfplus CLI the tasks run, absolute (a folder every node shares). */
  node: string;
  cli: string;
  resources: ClusterResources;
  /** Slurm job names: `<jobName>-shard` for the array, `<jobName>-merge` for the merge job. */
  jobName: string;
  /** Jobs per shard and predicted cost per shard (milliseconds on one core), from the plan's slicing. */
  shardSizes: number[];
  shardCosts: number[];
  createdAt: string;
  halfplusVersion: string;
  submissions: ClusterSubmission[];
}

export const RUN_FILE = "run.json";

/** Where things live in a run folder. */
export const runPaths = {
  manifest: (dir: string): string => join(dir, RUN_FILE),
  submit: (dir: string): string => join(dir, "submit.sh"),
  merge: (dir: string): string => join(dir, "merge.sh"),
  readme: (dir: string): string => join(dir, "README"),
  shards: (dir: string): string => join(dir, "shards"),
  shardStore: (dir: string, shard: number): string => join(dir, "shards", `${shard}.db`),
  logs: (dir: string): string => join(dir, "logs"),
  /** One folder per array job once its merge job is submitted (mkdir is the lock). */
  jobs: (dir: string): string => join(dir, "jobs"),
  mergeGuard: (dir: string, arrayJob: string): string => join(dir, "jobs", `merge-for-${arrayJob}`),
};

/** sha256 of a file's bytes, hex. */
export function fileSha256(path: string): string {
  return createHash("sha256").update(readFileSync(path)).digest("hex");
}

/** A short, stable name for the run's Slurm jobs, from its folder. */
export function runJobName(dir: string): string {
  return `hp-${createHash("sha256").update(resolve(dir)).digest("hex").slice(0, 8)}`;
}

/** Read and check `run.json` of a run folder. */
export function readClusterRun(dir: string): ClusterRun {
  const path = runPaths.manifest(dir);
  if (!existsSync(path)) throw new InputError(`${dir}: not a cluster run folder (no ${RUN_FILE}; make one with halfplus cluster slurm)`);
  const raw = parseStrictJson(readFileSync(path, "utf8"), path) as Partial<ClusterRun> | null;
  if (raw === null || typeof raw !== "object" || raw.kind !== CLUSTER_RUN_KIND) throw new InputError(`${path}: kind should be ${JSON.stringify(CLUSTER_RUN_KIND)}`);
  if (raw.version !== CLUSTER_RUN_VERSION) throw new InputError(`${path}: version ${JSON.stringify(raw.version)} is not one this halfplus reads (${CLUSTER_RUN_VERSION})`);
  for (const field of ["plan", "planSha256", "dir", "into", "node", "cli", "jobName"] as const) {
    if (typeof raw[field] !== "string" || raw[field] === "") throw new InputError(`${path}: ${field} should be a non-empty string`);
  }
  if (!Number.isInteger(raw.tasks) || (raw.tasks as number) < 1) throw new InputError(`${path}: tasks should be a positive integer`);
  if (!Array.isArray(raw.shardSizes) || raw.shardSizes.length !== raw.tasks) throw new InputError(`${path}: shardSizes should list one count per task`);
  if (!Array.isArray(raw.submissions)) throw new InputError(`${path}: submissions should be a list`);
  return raw as ClusterRun;
}

/** Write `run.json` whole (a temporary file renamed over it, so a reader never sees half). */
export function writeClusterRun(run: ClusterRun): void {
  const path = runPaths.manifest(run.dir);
  const tmp = `${path}.tmp-${process.pid}`;
  writeFileSync(tmp, `${JSON.stringify(run, null, 2)}\n`);
  renameSync(tmp, path);
}

/** Refuse to go on when the plan file changed since the run was generated: the slices would differ. */
export function checkPlanUnchanged(run: ClusterRun): void {
  if (!existsSync(run.plan)) throw new InputError(`${run.plan}: the run's plan file is gone (the shards cannot be checked without it)`);
  const now = fileSha256(run.plan);
  if (now !== run.planSha256) {
    throw new InputError(`${run.plan}: changed since the run in ${run.dir} was generated (sha256 ${now.slice(0, 12)}… vs ${run.planSha256.slice(0, 12)}…); its shards would slice differently: restore the plan or start a new run folder`);
  }
}
