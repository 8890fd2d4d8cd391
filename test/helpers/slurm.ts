// A real single-node Slurm cluster on loopback for one test file, without systemd: munged (as
// user munge, on a socket in a temporary folder), slurmctld and slurmd with a minimal slurm.conf
// (Debian's slurmctld, slurmd, slurm-client and munge packages). Ports are free ones picked at
// start, and every file (state, spool, logs, pid files) lives in the temporary folder, so nothing
// of the machine's own Slurm or munge setup is touched. `stop()` shuts it all down.
import { spawnSync } from "node:child_process";
import { chmodSync, chownSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { check, tool, type Requirement } from "./requirements.js";

/** What starting the cluster needs: the daemons, the clients, runuser and root (slurmd runs jobs as their user). */
export const SLURM_REQUIREMENTS: Requirement[] = [
  tool("munged"),
  tool("slurmctld"),
  tool("slurmd"),
  tool("sbatch"),
  tool("squeue"),
  tool("scancel"),
  tool("scontrol"),
  tool("sinfo"),
  tool("runuser"),
  check("root (to start munged as user munge and slurmd)", () => process.getuid?.() === 0),
  check("the user munge (Debian's munge package)", () => spawnSync("id", ["-u", "munge"]).status === 0),
];

export interface SlurmCluster {
  dir: string;
  /** The slurm.conf every client command must see (also exported as SLURM_CONF while the cluster runs). */
  conf: string;
  node: string;
  cpus: number;
  stop(): void;
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as { port: number }).port;
      s.close(() => resolve(port));
    });
  });
}

function must(cmd: string, args: string[], env?: NodeJS.ProcessEnv): string {
  const r = spawnSync(cmd, args, { encoding: "utf8", env: env ?? process.env, timeout: 30_000 });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(" ")}: exit ${r.status}: ${(r.stderr || r.stdout || String(r.error)).trim()}`);
  return r.stdout;
}

const sleep = (ms: number): Promise<void> => new Promise((r) => setTimeout(r, ms));

function pidOf(file: string): number | null {
  if (!existsSync(file)) return null;
  const pid = Number(readFileSync(file, "utf8").trim());
  return Number.isInteger(pid) && pid > 0 ? pid : null;
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    // A zombie (no init reaping in a container) counts as gone.
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    return !/^\d+ \(.*\) Z /.test(stat);
  } catch {
    return false;
  }
}

/** Start munged, slurmctld and slurmd; resolve when the node is idle. */
export async function startSlurm(): Promise<SlurmCluster> {
  const dir = mkdtempSync(join(tmpdir(), "halfplus-slurm-"));
  // munged insists that every folder above its socket is searchable by all and not writable by others.
  chmodSync(dir, 0o755);
  const munge = join(dir, "munge");
  for (const d of [munge, join(dir, "state"), join(dir, "spool"), join(dir, "log")]) mkdirSync(d, { mode: 0o755 });
  const uid = Number(must("id", ["-u", "munge"]).trim());
  const gid = Number(must("id", ["-g", "munge"]).trim());
  chownSync(munge, uid, gid);
  // The machine's key when there is one; otherwise a fresh key of our own (the cluster is one node).
  let key = "/etc/munge/munge.key";
  if (!existsSync(key)) {
    key = join(munge, "munge.key");
    must("runuser", ["-u", "munge", "--", "mungekey", "--create", `--keyfile=${key}`]);
  }
  const socket = join(munge, "munge.socket");
  const mungePid = join(munge, "munged.pid");
  const conf = join(dir, "slurm.conf");
  const slurmPids = [join(dir, "slurmctld.pid"), join(dir, "slurmd.pid")];
  let started = false;
  const pause = (ms: number): void => void Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
  /** Wait (at most about 15 s) until none of these pid files names a live process. */
  const gone = (files: string[]): boolean => {
    for (let i = 0; i < 150; i++) {
      if (files.every((f) => {
        const pid = pidOf(f);
        return pid === null || !alive(pid);
      })) return true;
      pause(100);
    }
    return false;
  };
  const stop = (): void => {
    if (started) {
      spawnSync("scontrol", ["shutdown"], { env: { ...process.env, SLURM_CONF: conf }, timeout: 20_000 });
      gone(slurmPids);
    }
    // Whatever did not go (or never heard the shutdown) by its pid file; munged last, Slurm needs it to the end.
    for (const f of [...slurmPids, mungePid]) {
      const pid = pidOf(f);
      if (pid !== null && alive(pid)) {
        try {
          process.kill(pid, "SIGTERM");
        } catch {
          // gone meanwhile
        }
      }
    }
    gone([...slurmPids, mungePid]);
    if (process.env.SLURM_CONF === conf) delete process.env.SLURM_CONF;
    rmSync(dir, { recursive: true, force: true, maxRetries: 5 });
  };
  try {
    must("runuser", ["-u", "munge", "--", "munged", `--socket=${socket}`, `--key-file=${key}`, `--pid-file=${mungePid}`, `--log-file=${join(munge, "munged.log")}`, `--seed-file=${join(munge, "munged.seed")}`]);
    const node = must("hostname", ["-s"]).trim();
    const described = must("slurmd", ["-C"]);
    const cpus = Number(/CPUs=(\d+)/.exec(described)?.[1] ?? "1");
    const memory = Number(/RealMemory=(\d+)/.exec(described)?.[1] ?? "1000");
    const [ctldPort, dPort] = [await freePort(), await freePort()];
    writeFileSync(
      conf,
      [
        "ClusterName=halfplus-test",
        `SlurmctldHost=${node}(127.0.0.1)`,
        `SlurmctldPort=${ctldPort}`,
        `SlurmdPort=${dPort}`,
        "AuthType=auth/munge",
        "CredType=cred/munge",
        `AuthInfo=socket=${socket}`,
        "SlurmUser=root",
        "SlurmdUser=root",
        `StateSaveLocation=${join(dir, "state")}`,
        `SlurmdSpoolDir=${join(dir, "spool")}`,
        `SlurmctldPidFile=${slurmPids[0]}`,
        `SlurmdPidFile=${slurmPids[1]}`,
        `SlurmctldLogFile=${join(dir, "log", "slurmctld.log")}`,
        `SlurmdLogFile=${join(dir, "log", "slurmd.log")}`,
        "ProctrackType=proctrack/linuxproc",
        "TaskPlugin=task/none",
        "SelectType=select/cons_tres",
        "SelectTypeParameters=CR_Core",
        "MpiDefault=none",
        "AccountingStorageType=accounting_storage/none",
        "JobAcctGatherType=jobacct_gather/none",
        "JobCompType=jobcomp/none",
        "ReturnToService=2",
        "SchedulerType=sched/backfill",
        // The scheduler looks at the queue often, so a 4-task array does not wait between passes.
        "SchedulerParameters=sched_interval=1",
        `NodeName=${node} NodeAddr=127.0.0.1 CPUs=${cpus} RealMemory=${memory} State=UNKNOWN`,
        `PartitionName=debug Nodes=${node} Default=YES MaxTime=INFINITE State=UP`,
        "",
      ].join("\n"),
    );
    process.env.SLURM_CONF = conf;
    started = true;
    must("slurmctld", ["-i", "-f", conf]);
    must("slurmd", ["-f", conf]);
    for (let i = 0; ; i++) {
      const r = spawnSync("sinfo", ["-h", "-o", "%T"], { encoding: "utf8", timeout: 10_000 });
      if (r.status === 0 && r.stdout.trim() === "idle") break;
      if (i >= 120) throw new Error(`the Slurm node did not come up (sinfo: ${(r.stdout + r.stderr).trim()}); logs in ${dir}/log`);
      await sleep(250);
    }
    return { dir, conf, node, cpus, stop };
  } catch (e) {
    stop();
    throw e;
  }
}
