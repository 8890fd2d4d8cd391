// `halfplus cluster slurm|status|resubmit|merge`: a sweep plan as a Slurm job array over its
// shards, with a merge job that waits for the array; the run's state per shard; resubmitting only
// the shards that did not finish; merging once all have. Slurm does the scheduling; we write
// scripts and read stores.
import { existsSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { InputError, echo } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { clusterHelp } from "./help/cluster.js";
import { arraySpec, clusterStatus, createSlurmRun, mergeRun, resubmitShards, submitRun, type ClusterStatus, type ShardStatus } from "../../experiment/index.js";
import { formatNumber } from "../format.js";
import { writeLine } from "../output.js";

const ACTIONS = ["slurm", "status", "resubmit", "merge"] as const;
type Action = (typeof ACTIONS)[number];

/** Options that only `cluster slurm` takes. */
const SLURM_ONLY = ["tasks", "dir", "partition", "time", "cpus", "mem", "max-running", "into", "submit"];

/** The CLI script the array tasks run: this build's `dist/cli/main.js` (also when run from the sources). */
function cliScript(): string {
  const here = dirname(fileURLToPath(import.meta.url));
  const beside = join(here, "..", "main.js");
  if (existsSync(beside)) return beside;
  const built = join(here, "..", "..", "..", "dist", "cli", "main.js");
  if (existsSync(built)) return built;
  throw new InputError(`cluster: cannot find the built halfplus CLI (looked for ${beside} and ${built}); run npm run build`);
}

function shardLine(s: ShardStatus): string {
  const queued = s.job === null ? "" : `  job ${s.job} ${s.slurm}`;
  return `  shard ${s.shard}  ${s.state.padEnd(10)} ${s.rows}/${s.jobs} rows${queued}`;
}

export function statusText(st: ClusterStatus): string {
  const c = st.counts;
  const lines = [
    `${st.name}: ${st.tasks} shards, ${st.jobs} jobs: ${c.done} done, ${c.running} running, ${c.pending} pending, ${c.incomplete} incomplete, ${c.missing} missing`,
  ];
  const done = st.shards.filter((s) => s.state === "done");
  // Many shards: the done ones in one line, the rest one line each.
  if (st.tasks <= 20) for (const s of st.shards) lines.push(shardLine(s));
  else {
    if (done.length > 0) lines.push(`  done: shards ${arraySpec(done.map((s) => s.shard))} (${formatNumber(done.reduce((a, s) => a + s.rows, 0))} rows)`);
    for (const s of st.shards) if (s.state !== "done") lines.push(shardLine(s));
  }
  const m = st.merge;
  const mergeText =
    m.state === "merged" ? `merged: ${m.rows}/${st.jobs} rows` : m.state === "absent" ? `not queued${m.rows === null ? "" : ` (merged store holds ${m.rows}/${st.jobs} rows)`}` : `${m.state}, job ${m.job} ${m.slurm}`;
  lines.push(`  merge    ${mergeText}`);
  if (st.counts.incomplete + st.counts.missing > 0 && st.counts.running + st.counts.pending === 0) lines.push(`  to finish: halfplus cluster resubmit ${st.dir}`);
  if (st.counts.done === st.tasks && m.state === "absent") lines.push(`  to merge: halfplus cluster merge ${st.dir}`);
  for (const n of st.notes) lines.push(`  note: ${n}`);
  return lines.join("\n");
}

export const clusterCommand: CommandSpec = {
  ...clusterHelp,
  async run(args, io) {
    const [action, target] = args.positionals as [string, string];
    if (!(ACTIONS as readonly string[]).includes(action)) throw new InputError(`unknown action ${echo(action)}: one of ${ACTIONS.join(", ")}`);
    const o = args.options;
    const json = o["json"] === true;
    if ((action as Action) !== "slurm") {
      for (const name of SLURM_ONLY) if (o[name] !== undefined && !(name === "cpus" && o[name] === 1)) throw new InputError(`--${name} applies to cluster slurm`);
    }
    switch (action as Action) {
      case "slurm": {
        const tasks = o["tasks"] as number | undefined;
        const dir = o["dir"] as string | undefined;
        if (tasks === undefined) throw new InputError("--tasks N is required: how many array tasks (shards)");
        if (dir === undefined || dir === "") throw new InputError("--dir DIR is required: the run folder, on a file system every node shares");
        const { run } = await createSlurmRun(target, {
          tasks,
          dir,
          partition: o["partition"] as string | undefined,
          time: o["time"] as string | undefined,
          cpus: o["cpus"] as number,
          mem: o["mem"] as string | undefined,
          maxRunning: o["max-running"] as number | undefined,
          into: o["into"] as string | undefined,
          node: process.execPath,
          cli: cliScript(),
        });
        const submission = o["submit"] === true ? submitRun(run.dir) : null;
        if (json) await writeLine(io.stdout, JSON.stringify({ dir: run.dir, tasks: run.tasks, shardSizes: run.shardSizes, shardCosts: run.shardCosts, submission }));
        else {
          const minutes = run.shardCosts.map((c) => c / 60000);
          const lines = [
            `${run.dir}: ${run.tasks} shards of ${run.name} (${Math.min(...run.shardSizes)}–${Math.max(...run.shardSizes)} jobs, ${formatNumber(Math.min(...minutes))}–${formatNumber(Math.max(...minutes))} predicted core-minutes each)`,
            `  wrote submit.sh, merge.sh, run.json, README; the merged store will be ${run.into}`,
          ];
          if (submission === null) lines.push(`  submit: sbatch ${run.dir}/submit.sh`);
          else lines.push(`  submitted: array job ${submission.arrayJob} (shards ${arraySpec(submission.shards)}), merge job ${submission.mergeJob} (afterok)`);
          lines.push(`  status: halfplus cluster status ${run.dir}`);
          await writeLine(io.stdout, lines.join("\n"));
        }
        return 0;
      }
      case "status": {
        const st = await clusterStatus(target);
        await writeLine(io.stdout, json ? JSON.stringify(st) : statusText(st));
        return 0;
      }
      case "resubmit": {
        const r = await resubmitShards(target);
        if (json) await writeLine(io.stdout, JSON.stringify({ shards: r.shards, submission: r.submission, cancelled: r.cancelled }));
        else if (r.submission === null) await writeLine(io.stdout, `${r.status.dir}: nothing to resubmit (${r.status.counts.done} done, ${r.status.counts.running} running, ${r.status.counts.pending} pending)`);
        else {
          const cancelled = r.cancelled.length === 0 ? "" : `; cancelled the stale merge job${r.cancelled.length > 1 ? "s" : ""} ${r.cancelled.join(", ")}`;
          await writeLine(io.stdout, `${r.status.dir}: resubmitted shards ${arraySpec(r.shards)} as array job ${r.submission.arrayJob}, merge job ${r.submission.mergeJob}${cancelled}`);
        }
        return 0;
      }
      case "merge": {
        const r = await mergeRun(target);
        if (r.report === null) {
          const list = r.notDone.slice(0, 10).map((s) => `${s.shard} (${s.rows}/${s.jobs} rows)`).join(", ");
          const msg = `${r.status.dir}: ${r.notDone.length} of ${r.status.tasks} shards not complete: ${list}${r.notDone.length > 10 ? ", …" : ""}; nothing merged (halfplus cluster resubmit ${r.status.dir})`;
          if (json) await writeLine(io.stdout, JSON.stringify({ merged: false, notDone: r.notDone.map((s) => s.shard) }));
          io.stderr.write(`halfplus cluster: ${msg}\n`);
          return 1;
        }
        if (json) await writeLine(io.stdout, JSON.stringify({ merged: true, ...r.report }));
        else await writeLine(io.stdout, `${r.report.into}: ${r.report.total} rows from ${r.report.sources.length} shards (${r.report.sources.reduce((a, s) => a + s.added, 0)} added)`);
        return 0;
      }
    }
  },
};
