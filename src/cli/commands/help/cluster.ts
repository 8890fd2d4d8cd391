// `halfplus cluster`: its options and help text, apart from its implementation (../cluster.ts), so that
// `halfplus cluster --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";

export const clusterHelp: CommandHelp = {
  name: "cluster",
  summary: COMMAND_SUMMARIES["cluster"],
  positionals: "slurm <plan.json> | status <dir> | resubmit <dir> | merge <dir>",
  minPositionals: 2,
  maxPositionals: 2,
  description: [
    "slurm writes a run folder (--dir, on a file system every node shares): submit.sh, an array job with one task per shard (task i runs halfplus sweep <plan> --shard i/N --store shards/i.db with the resources asked for), merge.sh, a job that waits for the array (afterok) and merges the shard stores, run.json and a README. Shards are balanced by predicted cost (each graph's n, m and the plan's budget), not by count. --submit calls sbatch and prints the job ids; otherwise run sbatch <dir>/submit.sh.",
    "status says per shard whether it is done (every job in its store), running or pending (in Slurm's queue), incomplete (some rows, not queued: the task died) or missing, with its rows; resubmit submits again only the incomplete and missing shards (each rerun computes just what its store lacks) with a fresh merge job; merge merges the shards into the run's store once every one is done (exit 1 while any is not).",
  ],
  options: [
    { name: "tasks", type: "integer", description: "slurm: array tasks, one shard each (clusters cap arrays: MaxArraySize, 1001 by default)", min: 1, max: 100_000, placeholder: "N" },
    { name: "dir", type: "string", description: "slurm: the run folder, on a file system every node shares (created if missing)", placeholder: "DIR" },
    { name: "partition", type: "string", description: "slurm: the partition (default: the cluster's default)", placeholder: "P" },
    { name: "time", type: "string", description: "slurm: wall-clock limit per task, e.g. 02:00:00 (default: the partition's)", placeholder: "HH:MM:SS" },
    { name: "cpus", type: "integer", description: "slurm: CPUs per task; the sweep runs this many workers", min: 1, max: 1024, default: 1, placeholder: "C" },
    { name: "mem", type: "string", description: "slurm: memory per task, e.g. 8G (default: the partition's)", placeholder: "M" },
    { name: "max-running", type: "integer", description: "slurm: at most K tasks at once (default: no limit)", min: 1, max: 100_000, placeholder: "K" },
    { name: "into", type: "string", description: "slurm: the merged store (default DIR/merged.db)", placeholder: "FILE" },
    { name: "submit", type: "boolean", description: "slurm: submit with sbatch and print the job ids" },
    { name: "json", type: "boolean", description: "print one JSON object" },
  ],
  examples: [
    "halfplus cluster slurm plans/c4-free.json --tasks 64 --dir /shared/run1 --time 02:00:00 --cpus 4 --mem 8G --max-running 16",
    "sbatch /shared/run1/submit.sh",
    "halfplus cluster status /shared/run1",
    "halfplus cluster resubmit /shared/run1",
    "halfplus merge /shared/run1/shards/*.db --into results/large.db",
  ],
};
