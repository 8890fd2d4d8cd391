// The text of a run folder's files, as pure functions of the run: the array job script (one task
// per shard), the merge job script and the README. Slurm does the orchestration (arrays,
// dependencies, throttles); the scripts only run halfplus. Every path is absolute and halfplus is
// started as `<node> <cli>`, so compute nodes that share the folder need nothing on their PATH.

import { runPaths, type ClusterRun } from "./run.js";

/** A word for a POSIX shell, single-quoted unless it is plainly safe. */
export function shellWord(s: string): string {
  return /^[A-Za-z0-9_./:=@%+,-]+$/.test(s) ? s : `'${s.replace(/'/g, `'\\''`)}'`;
}

/** Task ids as Slurm's `--array` writes them: ranges and single ids, e.g. `0-3,7,9-12`. */
export function arraySpec(ids: readonly number[]): string {
  const sorted = [...new Set(ids)].sort((a, b) => a - b);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length; ) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    parts.push(i === j ? `${sorted[i]}` : `${sorted[i]}-${sorted[j]}`);
    i = j + 1;
  }
  return parts.join(",");
}

function resourceLines(run: ClusterRun, cpus: number): string[] {
  const r = run.resources;
  const lines = [`#SBATCH --cpus-per-task=${cpus}`];
  if (r.partition !== null) lines.push(`#SBATCH --partition=${r.partition}`);
  if (r.time !== null) lines.push(`#SBATCH --time=${r.time}`);
  if (r.mem !== null) lines.push(`#SBATCH --mem=${r.mem}`);
  return lines;
}

const halfplusCommand = (run: ClusterRun): string => `${shellWord(run.node)} ${shellWord(run.cli)}`;

/** `submit.sh`: the array job, one task per shard. */
export function submitScript(run: ClusterRun): string {
  const dir = run.dir;
  const array = `0-${run.tasks - 1}${run.resources.maxRunning === null ? "" : `%${run.resources.maxRunning}`}`;
  return [
    "#!/bin/bash",
    `# halfplus cluster run ${JSON.stringify(run.name)}: one Slurm array task per shard of the plan`,
    `# ${run.plan}, written by halfplus cluster slurm. Submit with: sbatch ${shellWord(runPaths.submit(dir))}`,
    `#SBATCH --job-name=${run.jobName}-shard`,
    `#SBATCH --array=${array}`,
    `#SBATCH --output=${runPaths.logs(dir)}/shard-%a.out`,
    ...resourceLines(run, run.resources.cpus),
    "set -euo pipefail",
    `DIR=${shellWord(dir)}`,
    'if [ -z "${SLURM_ARRAY_TASK_ID:-}" ]; then',
    '  echo "submit.sh: a Slurm array job script: submit it with sbatch $DIR/submit.sh (or halfplus cluster resubmit $DIR)" >&2',
    "  exit 2",
    "fi",
    "# After a plain `sbatch submit.sh`, the first task to start submits the merge job (afterok on this",
    "# array); mkdir makes sure only one does. `cluster slurm --submit` and `cluster resubmit` submit it",
    "# themselves before the array is released, and make this folder first.",
    'guard="$DIR/jobs/merge-for-$SLURM_ARRAY_JOB_ID"',
    'if mkdir "$guard" 2>/dev/null; then',
    `  sbatch --parsable --dependency=afterok:"$SLURM_ARRAY_JOB_ID" "$DIR/merge.sh" > "$guard/job" || echo "shard $SLURM_ARRAY_TASK_ID: could not submit the merge job; when every shard is done run: ${halfplusCommand(run)} cluster merge $DIR" >&2`,
    "fi",
    `exec ${halfplusCommand(run)} sweep ${shellWord(run.plan)} --shard "$SLURM_ARRAY_TASK_ID/${run.tasks}" --store "$DIR/shards/$SLURM_ARRAY_TASK_ID.db" --workers ${run.resources.cpus}`,
    "",
  ].join("\n");
}

/** `merge.sh`: checks that every shard is complete, then merges the shard stores into one. */
export function mergeScript(run: ClusterRun): string {
  return [
    "#!/bin/bash",
    `# halfplus cluster run ${JSON.stringify(run.name)}: merge the shard stores into ${run.into}.`,
    "# Submitted to wait for the array (afterok); refuses while any shard is incomplete.",
    `#SBATCH --job-name=${run.jobName}-merge`,
    `#SBATCH --output=${runPaths.logs(run.dir)}/merge-%j.out`,
    ...resourceLines(run, 1),
    "set -euo pipefail",
    `exec ${halfplusCommand(run)} cluster merge ${shellWord(run.dir)}`,
    "",
  ].join("\n");
}

/** The run folder's README: what was generated and how to go on. */
export function runReadme(run: ClusterRun): string {
  const d = run.dir;
  const hp = `${shellWord(run.node)} ${shellWord(run.cli)}`;
  const total = run.shardSizes.reduce((a, b) => a + b, 0);
  const costs = run.shardCosts.map((c) => c / 60000);
  const fmt = (x: number): string => (x >= 10 ? x.toFixed(0) : x.toPrecision(2));
  return [
    `halfplus cluster run ${JSON.stringify(run.name)}`,
    "",
    `Plan:   ${run.plan} (${total} jobs, sha256 ${run.planSha256.slice(0, 16)}…)`,
    `Shards: ${run.tasks}, one Slurm array task each, balanced by predicted cost:`,
    `        ${Math.min(...run.shardSizes)}–${Math.max(...run.shardSizes)} jobs and ${fmt(Math.min(...costs))}–${fmt(Math.max(...costs))} predicted core-minutes per shard`,
    `Result: ${run.into}`,
    `Made:   ${run.createdAt} by halfplus ${run.halfplusVersion}`,
    "",
    "Files",
    "  run.json        what was generated (read by cluster status, resubmit and merge)",
    "  submit.sh       the array job: task i runs `halfplus sweep <plan> --shard i/N --store shards/i.db`",
    "  merge.sh        the merge job: waits for the array (afterok), checks every shard, merges",
    "  shards/i.db     shard i's results store (written as jobs finish; a rerun skips what it holds)",
    "  logs/           shard-i.out per task, merge-<job>.out per merge job",
    "  jobs/           one folder per array job whose merge job has been submitted",
    "",
    "Run",
    `  sbatch ${shellWord(runPaths.submit(d))}          # the array; its first task submits the merge job`,
    `  ${hp} cluster status ${shellWord(d)}`,
    "",
    "When a task dies (node failure, time limit, scancel)",
    "  Its shard store keeps every job finished before the end. Resubmit only the shards that are",
    "  not done; each rerun computes just the jobs its store lacks, so nothing is lost or duplicated:",
    `  ${hp} cluster resubmit ${shellWord(d)}`,
    "  (the stale merge job, which waits forever on the failed array, is cancelled and a new one queued).",
    "",
    "By hand",
    `  ${hp} cluster merge ${shellWord(d)}       # refuses while a shard is incomplete`,
    `  ${hp} merge ${shellWord(runPaths.shards(d))}/*.db --into ${shellWord(run.into)}`,
    "",
  ].join("\n");
}
