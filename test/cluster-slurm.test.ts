// `halfplus cluster` on a real Slurm: a single-node cluster on loopback (test/helpers/slurm.ts,
// Debian's slurmctld, slurmd, slurm-client and munge). A small plan runs as a 4-task array
// submitted with plain `sbatch submit.sh` (its first task queues the merge job); one task is
// cancelled midway (scancel), `cluster status` names its shard incomplete and the merge job stuck
// on its dependency, `cluster resubmit` reruns that shard alone with a fresh merge job, and the
// merged store equals a single-machine run of the same plan row for row.
import Database from "better-sqlite3";
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect } from "vitest";
import { ensureBuilt, halfplus } from "./helpers/cli.js";
import { itNeeds } from "./helpers/requirements.js";
import { SLURM_REQUIREMENTS, startSlurm, type SlurmCluster } from "./helpers/slurm.js";

const dir = mkdtempSync(join(tmpdir(), "halfplus-cluster-slurm-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
beforeAll(() => ensureBuilt());

// Exact search closes every bracket, so the rows are deterministic (common practice, no source);
// each shard holds several jobs of a few tenths of a second, so a task can be caught midway.
const plan = join(dir, "plan.json");
writeFileSync(
  plan,
  JSON.stringify({
    name: "slurm-small",
    bracket: { effort: "exact", seconds: 120 },
    evaluators: ["edwards-edges"],
    families: [{ family: "gnp", grid: { n: [24, 26, 28], p: 0.5 }, graphSeeds: { from: 0, count: 8 } }, { specs: ["petersen", "cycle:n=7"] }],
  }),
);
const JOBS = 3 * 8 + 2;

const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

/** Rows in a store, read with SQLite directly (not through halfplus). */
function rowsIn(path: string): number {
  if (!existsSync(path)) return 0;
  const db = new Database(path, { readonly: true, fileMustExist: true });
  try {
    db.pragma("busy_timeout = 5000");
    return (db.prepare("SELECT count(*) AS c FROM results").get() as { c: number }).c;
  } catch {
    return 0; // created but its tables not yet written
  } finally {
    db.close();
  }
}

/** Slurm's queue for a job name: array task id → state, straight from squeue. */
function queue(name: string): { id: string; task: string; state: string; reason: string }[] {
  const r = spawnSync("squeue", ["-h", "-r", `--name=${name}`, "-o", "%i|%K|%T|%r"], { encoding: "utf8" });
  expect(r.status, r.stderr).toBe(0);
  return r.stdout
    .split("\n")
    .filter((l) => l.trim() !== "")
    .map((l) => {
      const [id, task, state, reason] = l.split("|");
      return { id, task, state, reason };
    });
}

/** Wait for a condition, polling; the limit only guards against a hung cluster. */
async function until<T>(what: string, probe: () => T | null | undefined | false, limitMs = 90_000, everyMs = 100): Promise<T> {
  const t0 = Date.now();
  for (;;) {
    const v = probe();
    if (v !== null && v !== undefined && v !== false) return v;
    if (Date.now() - t0 > limitMs) throw new Error(`gave up waiting for ${what}`);
    await sleep(everyMs);
  }
}

function json(args: string[]): Record<string, unknown> {
  const r = halfplus(args);
  expect(r.code, r.stderr).toBe(0);
  return JSON.parse(r.stdout) as Record<string, unknown>;
}

describe("halfplus cluster on a single-node Slurm", () => {
  itNeeds(
    SLURM_REQUIREMENTS,
    "a task cancelled midway is resubmitted alone; the merged store equals a one-machine run row for row",
    async () => {
      let cluster: SlurmCluster | null = null;
      try {
        cluster = await startSlurm();
        const run = join(dir, "run");
        const made = halfplus(["cluster", "slurm", plan, "--tasks", "4", "--dir", run, "--max-running", "4", "--time", "00:10:00", "--mem", "500M"]);
        expect(made.code, made.stderr).toBe(0);
        const manifest = JSON.parse(readFileSync(join(run, "run.json"), "utf8")) as { jobName: string; shardSizes: number[] };
        expect(manifest.shardSizes.reduce((a, b) => a + b, 0)).toBe(JOBS);
        const shardName = `${manifest.jobName}-shard`;
        const mergeName = `${manifest.jobName}-merge`;

        // Submitted the way a user would: sbatch on the generated script.
        const sub = spawnSync("sbatch", ["--parsable", join(run, "submit.sh")], { encoding: "utf8" });
        expect(sub.status, sub.stderr).toBe(0);
        const arrayJob = sub.stdout.trim().split(";")[0];
        expect(arrayJob).toMatch(/^\d+$/);

        // Catch a task before it is done: running, with fewer rows committed than its shard holds
        // (none, some: how many commits a task makes depends on the sweep's batch sizing, so the
        // checks below follow the rows found, not a count of commits).
        const victim = await until("a running task without all of its rows", () => {
          for (const q of queue(shardName)) {
            if (q.state !== "RUNNING") continue;
            const shard = Number(q.task);
            const rows = rowsIn(join(run, "shards", `${shard}.db`));
            if (rows < manifest.shardSizes[shard]) return { shard, rows };
          }
          return null;
        });
        const cancel = spawnSync("scancel", [`${arrayJob}_${victim.shard}`], { encoding: "utf8" });
        expect(cancel.status, cancel.stderr).toBe(0);

        // The other tasks finish; the merge job, queued by the first task, can never start (afterok).
        await until("the array to leave the queue", () => queue(shardName).length === 0);
        const merges = queue(mergeName);
        expect(merges).toHaveLength(1);
        expect(merges[0].state).toBe("PENDING");
        const status = json(["cluster", "status", run, "--json"]) as { shards: { shard: number; state: string; rows: number; jobs: number }[]; merge: { state: string; slurm: string; job: string }; scheduler: string };
        expect(status.scheduler).toBe("squeue");
        const killed = status.shards[victim.shard];
        // Some rows: incomplete; none yet: missing (src/experiment/cluster/runs.ts); both are resubmitted.
        expect(killed.state).toBe(killed.rows > 0 ? "incomplete" : "missing");
        expect(killed.rows).toBeGreaterThanOrEqual(victim.rows);
        expect(killed.rows).toBeLessThan(killed.jobs);
        expect(status.shards.filter((s) => s.shard !== victim.shard).map((s) => s.state)).toEqual(["done", "done", "done"]);
        expect(status.merge.state).toBe("queued");
        expect(status.merge.slurm).toMatch(/^PENDING \(Dependency/);
        expect(status.merge.job).toBe(merges[0].id);

        const again = json(["cluster", "resubmit", run, "--json"]) as { shards: number[]; cancelled: string[]; submission: { arrayJob: string; mergeJob: string } };
        expect(again.shards).toEqual([victim.shard]);
        expect(again.cancelled).toEqual([merges[0].id]);
        // Nothing left to resubmit while the new task is queued or running (or done).
        const twice = json(["cluster", "resubmit", run, "--json"]) as { shards: number[] };
        expect(twice.shards).toEqual([]);

        await until("the new merge job to finish", () => queue(shardName).length === 0 && queue(mergeName).length === 0);
        const after = json(["cluster", "status", run, "--json"]) as { counts: Record<string, number>; merge: { state: string; rows: number } };
        expect(after.counts).toEqual({ done: 4, running: 0, pending: 0, incomplete: 0, missing: 0 });
        expect(after.merge).toMatchObject({ state: "merged", rows: JOBS });

        // The rerun computed only what the cancelled task had not stored: nothing lost, nothing twice.
        const log = readFileSync(join(run, "logs", `shard-${victim.shard}.out`), "utf8");
        const rerun = /(\d+) rows? computed, (\d+) already in/.exec(log);
        expect(rerun, log).not.toBeNull();
        expect(Number(rerun![2])).toBe(killed.rows);
        expect(Number(rerun![1]) + Number(rerun![2])).toBe(killed.jobs);

        // One machine, one run, the same plan: the same rows (wall-clock fields are not exported).
        const single = join(dir, "single.db");
        const one = halfplus(["sweep", plan, "--store", single, "--workers", "1", "--no-progress"]);
        expect(one.code, one.stderr).toBe(0);
        const csv = (store: string): string => {
          const r = halfplus(["export", store, "--csv", "-"]);
          expect(r.code, r.stderr).toBe(0);
          return r.stdout;
        };
        const merged = csv(join(run, "merged.db"));
        expect(merged.trim().split("\n")).toHaveLength(JOBS + 1);
        expect(merged).toBe(csv(single));
      } finally {
        cluster?.stop();
      }
    },
    180_000,
  );
});
