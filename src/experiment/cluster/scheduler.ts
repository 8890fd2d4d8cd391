// Driving Slurm through its own client commands (sbatch, squeue, scancel, scontrol), as a user
// would: no library, no daemon of ours. Each call is one process with a bounded wait; a failure
// becomes one line naming the command and what it said.

import { spawnSync } from "node:child_process";
import { InputError } from "../../errors.js";

/** A queued or running task of one of the run's jobs, from squeue. */
export interface QueuedJob {
  /** The array's job id (the job id itself for a job that is no array). */
  arrayJob: string;
  /** The array task id, or null for a job that is no array. */
  task: number | null;
  /** Slurm's id for this task, e.g. `12_3`. */
  id: string;
  /** The job's name (`<jobName>-shard` or `<jobName>-merge`). */
  name: string;
  /** Slurm's state word: PENDING, RUNNING, COMPLETING, … */
  state: string;
  /** Why it waits (Slurm's reason: Dependency, JobArrayTaskLimit, DependencyNeverSatisfied, …). */
  reason: string;
}

export type QueueView = { reachable: true; jobs: QueuedJob[] } | { reachable: false; why: string };

const WAIT_MS = 60_000;

function run(command: string, args: string[]): { ok: boolean; stdout: string; message: string; missing: boolean } {
  const r = spawnSync(command, args, { encoding: "utf8", timeout: WAIT_MS });
  const missing = (r.error as NodeJS.ErrnoException | undefined)?.code === "ENOENT";
  const said = `${r.stderr ?? ""}`.trim().split("\n").filter((l) => l.trim() !== "").pop() ?? "";
  const message = missing ? `${command} is not installed (not on PATH)` : r.error !== undefined ? `${command}: ${r.error.message}` : r.status !== 0 ? `${command} exited ${r.status}${said === "" ? "" : `: ${said}`}` : "";
  return { ok: r.error === undefined && r.status === 0, stdout: r.stdout ?? "", message, missing };
}

/** The run's jobs in Slurm's queue (each array task on its own line), or why the queue could not be read. */
export function queuedJobs(names: readonly string[]): QueueView {
  const r = run("squeue", ["-h", "-r", `--name=${names.join(",")}`, "-o", "%F|%K|%i|%j|%T|%r"]);
  if (!r.ok) return { reachable: false, why: r.message };
  const jobs: QueuedJob[] = [];
  for (const line of r.stdout.split("\n")) {
    if (line.trim() === "") continue;
    const [arrayJob, task, id, name, state, reason] = line.split("|");
    jobs.push({ arrayJob, task: /^\d+$/.test(task) ? Number(task) : null, id, name, state, reason: reason ?? "" });
  }
  return { reachable: true, jobs };
}

/** `sbatch --parsable …`: the new job's id. */
export function sbatch(args: readonly string[]): string {
  const r = run("sbatch", ["--parsable", ...args]);
  if (!r.ok) throw new InputError(`sbatch ${args.join(" ")}: ${r.message}`);
  // --parsable prints "id" or "id;cluster".
  const id = r.stdout.trim().split(";")[0];
  if (!/^\d+$/.test(id)) throw new InputError(`sbatch ${args.join(" ")}: expected a job id, got ${JSON.stringify(r.stdout.trim())}`);
  return id;
}

/** `scancel id…` (a job, an array, or one task as `12_3`). */
export function scancel(ids: readonly string[]): void {
  if (ids.length === 0) return;
  const r = run("scancel", [...ids]);
  if (!r.ok) throw new InputError(`scancel ${ids.join(" ")}: ${r.message}`);
}

/** `scontrol release id`: let a job submitted with --hold start. */
export function release(id: string): void {
  const r = run("scontrol", ["release", id]);
  if (!r.ok) throw new InputError(`scontrol release ${id}: ${r.message}`);
}
