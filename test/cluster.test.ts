// Cluster runs without a scheduler: cost-balanced slicing (against brute force and Graham's bound),
// the generated scripts (checked by bash itself and executed as a Slurm task would run them, one
// shard after another), status from the shard stores, resuming an incomplete shard, merging into
// exactly the rows of one run, and one-line refusals. The real Slurm run: test/cluster-slurm.test.ts.
import Database from "better-sqlite3";
import { spawnSync } from "node:child_process";
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Writable } from "node:stream";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { runCli } from "../src/cli/main.js";
import { loadPlan } from "../src/experiment/plan.js";
import { jobCost, planJobCosts, planSlices, sliceByCost } from "../src/experiment/shards.js";
import { arraySpec } from "../src/experiment/cluster/scripts.js";
import { encodeGraph6 } from "../src/graph/formats/graph6.js";
import { family } from "../src/families/registry.js";
import { Rng } from "../src/random/prng.js";
import { BIN, ensureBuilt, halfplus } from "./helpers/cli.js";
import { itNeeds, tool } from "./helpers/requirements.js";

const dir = mkdtempSync(join(tmpdir(), "halfplus-cluster-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
beforeAll(() => ensureBuilt());

/** The smallest possible largest shard, by trying every assignment (brute force). */
function optimalMakespan(costs: number[], count: number): number {
  let best = Infinity;
  const loads = new Array<number>(count).fill(0);
  const place = (i: number): void => {
    if (i === costs.length) {
      best = Math.min(best, Math.max(...loads));
      return;
    }
    for (let s = 0; s < count; s++) {
      loads[s] += costs[i];
      if (loads[s] < best) place(i + 1);
      loads[s] -= costs[i];
      if (loads[s] === 0) break; // empty shards are interchangeable
    }
  };
  place(0);
  return best;
}

describe("slicing by predicted cost", () => {
  it("stays within Graham's 4/3 − 1/(3N) of the best largest shard, covers every job once, and is deterministic", () => {
    // Largest-first list scheduling is within 4/3 − 1/(3m) of optimal: Graham, "Bounds on
    // multiprocessing timing anomalies", SIAM J. Appl. Math. 17 (1969) 416–429.
    const rng = new Rng(7);
    let tight = 0;
    for (let trial = 0; trial < 60; trial++) {
      const count = 2 + (trial % 3);
      const costs = Array.from({ length: 5 + rng.nextInt(5) }, () => 1 + rng.nextInt(trial % 2 === 0 ? 20 : 1000));
      const s = sliceByCost(Float64Array.from(costs), count);
      const again = sliceByCost(Float64Array.from(costs), count);
      expect(Array.from(again.shardOf)).toEqual(Array.from(s.shardOf));
      const loads = new Array<number>(count).fill(0);
      s.shardOf.forEach((shard, i) => (loads[shard] += costs[i]));
      expect(loads).toEqual(s.costs);
      expect(s.sizes.reduce((a, b) => a + b, 0)).toBe(costs.length);
      const opt = optimalMakespan(costs, count);
      const got = Math.max(...loads);
      expect(got).toBeLessThanOrEqual((4 / 3 - 1 / (3 * count)) * opt + 1e-9);
      if (got === opt) tight++;
    }
    expect(tight).toBeGreaterThan(30); // mostly optimal on instances this small
  });

  it("equal costs slice by position modulo N (the old round-robin)", () => {
    const s = sliceByCost(new Float64Array(11).fill(5), 4);
    expect(Array.from(s.shardOf)).toEqual([0, 1, 2, 3, 0, 1, 2, 3, 0, 1, 2]);
    expect(arraySpec([7, 0, 1, 2, 9, 10, 3, 12])).toBe("0-3,7,9-10,12");
  });

  it("a few large graphs do not pile onto one shard: predicted sizes and the budget set the cost", async () => {
    // 4 heuristic brackets on 2000-vertex graphs (each stopped by its 30 s budget) and 40 small
    // exact ones; by position modulo 4 all four large graphs would land in shard 0.
    const plan = loadPlan({
      families: [
        { family: "gnp", grid: { n: 2000, p: 0.005 }, graphSeeds: { from: 0, count: 4 }, bracket: { effort: "heuristic", seconds: 30 } },
        { family: "gnp", grid: { n: 12, p: 0.5 }, graphSeeds: { from: 0, count: 40 }, bracket: { effort: "exact", seconds: 30 } },
      ],
      solverSeeds: [0],
    });
    const costs = await planJobCosts(plan);
    // The large ones cost their budget (30 s, plus structure checks), the small ones milliseconds.
    expect(costs[0]).toBeGreaterThanOrEqual(30_000);
    expect(costs[4]).toBeLessThan(100);
    const slices = await planSlices(plan, 4);
    const largeShards = [0, 1, 2, 3].map((i) => slices.shardOf[i]);
    expect(new Set(largeShards).size).toBe(4);
    expect(Math.max(...slices.costs) / Math.min(...slices.costs)).toBeLessThan(1.01);
    // A longer budget costs more; a work budget caps the cost like seconds do.
    expect(jobCost(2000, 10_000, { effort: "heuristic", seconds: 60, work: null })).toBeGreaterThan(jobCost(2000, 10_000, { effort: "heuristic", seconds: 30, work: null }));
    expect(jobCost(2000, 10_000, { effort: "heuristic", seconds: 60, work: 1e6 })).toBeLessThan(jobCost(2000, 10_000, { effort: "heuristic", seconds: 60, work: null }));
  });

  it("a file graph costs what the same graph costs as a family member", async () => {
    const g = family("gnp:n=300,p=0.05,seed=3");
    writeFileSync(join(dir, "one.g6"), `${encodeGraph6(g)}\n`);
    const plan = loadPlan({ bracket: { effort: "heuristic", seconds: 5 }, families: [{ source: "one.g6" }, { specs: ["gnp:n=300,p=0.05,seed=3"] }] }, { base: dir });
    const costs = await planJobCosts(plan);
    expect(costs[0]).toBe(costs[1]);
    expect(costs[0]).toBe(jobCost(g.n, g.m, { effort: "heuristic", seconds: 5, work: null }));
  });
});

// Small graphs and exact search: every row is deterministic (common practice, no source).
const planPath = join(dir, "plan.json");
writeFileSync(
  planPath,
  JSON.stringify({
    name: "cluster-small",
    bracket: { effort: "exact", seconds: 30 },
    evaluators: ["edwards-edges"],
    families: [
      { family: "gnp", grid: { n: [6, 9, 12, 18], p: 0.5 }, graphSeeds: { from: 0, count: 3 } },
      { specs: ["petersen", "kneser:n=7,k=2"] },
    ],
  }),
);
const JOBS = 4 * 3 + 2;

/** The command line in this process (no Node start-up per call); the scripts themselves run in bash. */
async function cli(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = "";
  let stderr = "";
  const sink = (add: (s: string) => void): Writable => new Writable({ write: (chunk, _enc, done) => (add(String(chunk)), done()) });
  const code = await runCli(args, { stdout: sink((t) => (stdout += t)), stderr: sink((t) => (stderr += t)), stdin: process.stdin });
  return { code, stdout, stderr };
}

async function csvOf(store: string): Promise<string> {
  const r = await cli(["export", store, "--csv", "-"]);
  expect(r.code, r.stderr).toBe(0);
  return r.stdout;
}

/** The environment without any Slurm configuration: squeue fails at once, so states come from the stores alone. */
function noSlurm(extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, ...extra };
  delete env.SLURM_CONF;
  return env;
}

/** Run shard `i` the way a Slurm array task does: the generated script, with the variables Slurm sets. */
function runTask(run: string, i: number, arrayJob = "41"): { code: number; stdout: string; stderr: string } {
  // The merge job of this "array" counts as submitted, so the script asks no scheduler for one.
  mkdirSync(join(run, "jobs", `merge-for-${arrayJob}`), { recursive: true });
  const r = spawnSync("bash", [join(run, "submit.sh")], { encoding: "utf8", env: noSlurm({ SLURM_ARRAY_TASK_ID: String(i), SLURM_ARRAY_JOB_ID: arrayJob }) });
  return { code: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

interface Status {
  shards: { shard: number; state: string; rows: number; jobs: number }[];
  counts: Record<string, number>;
  merge: { state: string; rows: number | null };
  scheduler: string;
}

async function status(run: string): Promise<Status> {
  // SLURM_CONF is unset here (noSlurm): squeue fails at once and the states come from the stores.
  const r = await cli(["cluster", "status", run, "--json"]);
  expect(r.code, r.stderr).toBe(0);
  return JSON.parse(r.stdout) as Status;
}

describe("a cluster run without a scheduler", () => {
  const run = join(dir, "run");
  const single = join(dir, "single.db");

  it("generates an array script with the resources asked for, a merge script and a README; bash accepts both scripts", () => {
    const r = halfplus(["cluster", "slurm", planPath, "--tasks", "4", "--dir", run, "--partition", "short", "--time", "00:20:00", "--cpus", "2", "--mem", "2G", "--max-running", "3"]);
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/: 4 shards of cluster-small \(\d+–\d+ jobs/);
    const submit = readFileSync(join(run, "submit.sh"), "utf8");
    for (const line of ["#SBATCH --array=0-3%3", "#SBATCH --cpus-per-task=2", "#SBATCH --partition=short", "#SBATCH --time=00:20:00", "#SBATCH --mem=2G", `#SBATCH --output=${run}/logs/shard-%a.out`]) {
      expect(submit.split("\n")).toContain(line);
    }
    expect(submit).toContain(`${process.execPath} `);
    expect(submit).toMatch(/ sweep \S+plan\.json --shard "\$SLURM_ARRAY_TASK_ID\/4" --store "\$DIR\/shards\/\$SLURM_ARRAY_TASK_ID\.db" --workers 2$/m);
    const merge = readFileSync(join(run, "merge.sh"), "utf8");
    expect(merge).toContain("#SBATCH --cpus-per-task=1");
    expect(merge).toMatch(/ cluster merge \S+\/run$/m);
    expect(readFileSync(join(run, "README"), "utf8")).toMatch(/cluster resubmit/);
    // bash's own parser (bash -n) on both scripts.
    for (const f of ["submit.sh", "merge.sh"]) {
      const check = spawnSync("bash", ["-n", join(run, f)], { encoding: "utf8" });
      expect(check.status, check.stderr).toBe(0);
    }
    // Outside an array task the script refuses, naming how to submit it.
    const bare = spawnSync("bash", [join(run, "submit.sh")], { encoding: "utf8", env: { ...process.env, SLURM_ARRAY_TASK_ID: "" } });
    expect(bare.status).toBe(2);
    expect(bare.stderr).toMatch(/submit it with sbatch/);
  });

  it("shards run one after another through the script; status follows the stores; merge waits for every shard", async () => {
    const first = await status(run);
    expect(first.scheduler).not.toBe("squeue");
    expect(first.counts).toEqual({ done: 0, running: 0, pending: 0, incomplete: 0, missing: 4 });
    expect(first.shards.reduce((a, s) => a + s.jobs, 0)).toBe(JOBS);
    for (const i of [0, 1, 2]) {
      const t = runTask(run, i);
      expect(t.code, t.stderr).toBe(0);
      expect(t.stdout).toMatch(new RegExp(`\\(shard ${i}/4\\): done, ${first.shards[i].jobs} rows? computed, 0 already in`));
    }
    // Shard 2 loses a row, as if its task died before writing its last batch.
    const db = new Database(join(run, "shards", "2.db"));
    db.prepare("DELETE FROM results WHERE rowid = (SELECT max(rowid) FROM results)").run();
    db.close();
    const mid = await status(run);
    expect(mid.shards.map((s) => s.state)).toEqual(["done", "done", "incomplete", "missing"]);
    expect(mid.shards[2].rows).toBe(mid.shards[2].jobs - 1);
    const early = await cli(["cluster", "merge", run]);
    expect(early.code).toBe(1);
    expect(early.stderr).toMatch(/: 2 of 4 shards not complete: 2 \(\d+\/\d+ rows\), 3 \(0\/\d+ rows\); nothing merged/);
    expect(early.stderr.trim().split("\n")).toHaveLength(1);

    // Rerunning shard 2 computes only the missing row; shard 3 runs in a later "array".
    const resumed = runTask(run, 2, "42");
    expect(resumed.code, resumed.stderr).toBe(0);
    expect(resumed.stdout).toMatch(new RegExp(`done, 1 row computed, ${mid.shards[2].jobs - 1} already in`));
    expect(runTask(run, 3, "42").code).toBe(0);
    expect((await status(run)).counts.done).toBe(4);

    const merged = await cli(["cluster", "merge", run]);
    expect(merged.code, merged.stderr).toBe(0);
    expect(merged.stdout).toMatch(new RegExp(`merged\\.db: ${JOBS} rows from 4 shards \\(${JOBS} added\\)`));
    expect((await status(run)).merge).toEqual({ state: "merged", job: null, slurm: null, rows: JOBS });

    // One run of the whole plan on one machine: exactly the same rows.
    const one = await cli(["sweep", planPath, "--store", single, "--workers", "0", "--no-progress"]);
    expect(one.code, one.stderr).toBe(0);
    const a = await csvOf(join(run, "merged.db"));
    expect(a).toBe(await csvOf(single));
    expect(a.trim().split("\n")).toHaveLength(JOBS + 1);
  });

  it("refuses bad options, a second run in the same folder and a plan changed since, each in one line with exit 2", async () => {
    const cases: [string[], RegExp][] = [
      [["cluster", "slurm", planPath, "--dir", join(dir, "x")], /--tasks N is required/],
      [["cluster", "slurm", planPath, "--tasks", "2"], /--dir DIR is required/],
      [["cluster", "slurm", planPath, "--tasks", "99", "--dir", join(dir, "x")], /--tasks: 99 is more than the plan's 14 jobs/],
      [["cluster", "slurm", planPath, "--tasks", "2", "--dir", join(dir, "x"), "--time", "2 hours"], /--time: should be a Slurm time limit/],
      [["cluster", "slurm", planPath, "--tasks", "2", "--dir", join(dir, "x"), "--mem", "lots"], /--mem: should be a size/],
      [["cluster", "slurm", planPath, "--tasks", "2", "--dir", join(dir, "with space")], /--dir: .*without spaces/],
      [["cluster", "slurm", planPath, "--tasks", "2", "--dir", run], /already holds a cluster run/],
      [["cluster", "status", dir], /not a cluster run folder \(no run\.json/],
      [["cluster", "status", run, "--tasks", "3"], /--tasks applies to cluster slurm/],
      [["cluster", "launch", run], /unknown action "launch"/],
    ];
    for (const [args, message] of cases) {
      const r = await cli(args);
      expect(r.code, args.join(" ")).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.trim().split("\n"), args.join(" ")).toHaveLength(1);
    }
    writeFileSync(planPath, readFileSync(planPath, "utf8").replace('"cluster-small"', '"cluster-changed"'));
    const changed = await cli(["cluster", "status", run]);
    expect(changed.code).toBe(2);
    expect(changed.stderr).toMatch(/plan\.json: changed since the run in .* was generated .*would slice differently/);
  });

  itNeeds([tool("squeue")], "resubmit refuses without a reachable Slurm (it cannot tell what is still running)", () => {
    const r = spawnSync(process.execPath, [BIN, "cluster", "resubmit", run], { encoding: "utf8", env: noSlurm() });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/cannot read Slurm's queue \(squeue exited \d+/);
  });
});
