// `halfplus cut <source>`: a certified max-cut bracket for each graph a source denotes, as a short
// readable summary or one JSON record per line (--json); progress goes to stderr, never stdout.
// Each bracket runs in a worker thread, so Ctrl-C (SIGINT) or SIGTERM can stop it at once and still
// write the best verifiable record so far, marked `interrupted`, before exiting with 130 / 143.
import { closeSync, openSync, writeSync } from "node:fs";
import { InputError } from "../../errors.js";
import type { BracketProgress } from "../../cut/bracket/bracket.js";
import { DEFAULT_BRACKET_SECONDS } from "../../cut/bracket/budget-limits.js";
import { BracketRunner, type RunningBracket } from "../../cut/bracket/bracket-runner.js";
import { type TreeBranching, type TreeRelaxation } from "../../cut/tree/tree-choices.js";
import { recordJson, type BracketEffort, type BracketRecord, type BracketSnapshot } from "../../cut/bracket/record.js";
import type { BracketBudget } from "../../cut/bracket/budget.js";
import { openSource } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { cutHelp } from "./help/cut.js";
import { formatNumber as num, formatRows } from "../format.js";
import { writeLine } from "../output.js";
import { sourceOptionsFrom } from "./source-options.js";

/** Each algorithm in plain words, for the summary (records keep the short ids). */
const METHOD_WORDS: Readonly<Record<string, string>> = {
  "all-on-one-side": "no cut yet (all vertices on one side)",
  "local-search": "multi-start local search",
  breakout: "breakout search",
  rank2: "rank-2 heuristic",
  "hyperplane-rounding": "hyperplane rounding of the SDP vectors",
  "vector-rounding": "sparse vector rounding",
  "exact-gray": "exhaustive search (Gray code)",
  "exact-bnb": "branch and bound",
  "exact-mixed": "exact search (Gray code and branch and bound, one per component)",
  "exact-trivial": "exact search (no component has an edge)",
  "positive-weights": "sum of the positive edge weights",
  eigenvalue: "eigenvalue bound n·λmax(L)/4",
  "sdp-certified": "Goemans–Williamson SDP",
  "sdp-triangles": "SDP with triangle inequalities",
  "exact-sdp-tree": "branch and bound on SDP bounds",
};

const SHIFT_WORDS: Readonly<Record<string, string>> = {
  cholesky: "proven by a Cholesky factorisation",
  gershgorin: "proven by Gershgorin's circle theorem",
  "lanczos-estimate": "a Lanczos estimate, not a proof",
  "sparse-cholesky": "proven by a sparse Cholesky factorisation",
  "chebyshev-probable": "probable (a Chebyshev filter from a recorded random start)",
};

export function words(method: string): string {
  return METHOD_WORDS[method] ?? method;
}

/** What the summary shows: every field but the partition. */
type Shown = Omit<BracketRecord, "partition">;

function certificateText(r: Shown): string {
  const c = r.certificate;
  const rounded = c.roundedDown ? ", rounded down to an integer (integer weights make every cut an integer)" : "";
  switch (c.kind) {
    case "exhaustive":
      return `${words(c.search)} finished${c.branchNodes > 0 ? ` after ${c.branchNodes} branch nodes` : ""}`;
    case "unfinished-search":
      return `bound left by ${words(c.search)} when it stopped${rounded}`;
    case "psd-dual":
      return `${words(r.upperMethod)}: dual certificate, eigenvalue shift ${SHIFT_WORDS[c.shiftProof] ?? c.shiftProof}${rounded}`;
    case "positive-weights":
      return `${words("positive-weights")}${rounded}`;
    case "triangle-dual":
      return `${words(r.upperMethod)}: dual vector, ${c.mu.length} weighted triangle inequalities, shift proven by a Cholesky factorisation${rounded}`;
    case "sdp-tree":
      return `${words(r.upperMethod)} (${c.relaxation === "triangles" ? "SDP with triangle inequalities" : "plain SDP"} at each node): ${c.packed?.regions ?? c.regions?.length ?? 0} regions after ${c.nodes} nodes, each with its certificate`;
  }
}

/** Where the budget went: which limit governed, what was used, and each stage's share of the work. */
function budgetRows(b: BracketBudget): [string, string][] {
  const limit = b.governing === "work" ? `${num(b.workLimit ?? 0)} work units` : `${num(b.secondsLimit ?? 0)} s`;
  const rows: [string, string][] = [["budget", `${limit} (${b.governing}): used ${num(b.workUsed)} work units in ${num(b.secondsUsed)} s`]];
  const total = Math.max(1, b.workUsed);
  const stages = b.stages.filter((s) => s.workUsed > 0 || s.secondsUsed >= 0.001);
  if (stages.length > 0) {
    rows.push(["stages", stages.map((s) => `${s.stage} ${num(Math.round((1000 * s.workUsed) / total) / 10)}% (${num(s.secondsUsed)} s)`).join(", ")]);
  }
  return rows;
}

/** Our own layout: the bracket first, then where each side of it came from. */
export function formatBracket(label: string, r: Shown): string {
  const gap = r.upper - r.lower;
  const rows: [string, string][] = [];
  if (r.exact) {
    rows.push(["max cut", `${num(r.lower)}  (optimal${gap > 0 ? `, within ${num(gap)}` : ""})`]);
    rows.push(["surplus", `${num(r.surplusLower)}  (max cut − W/2)`]);
  } else {
    const pct = r.upper !== 0 ? ` = ${num((100 * gap) / Math.abs(r.upper))}% of upper` : "";
    rows.push(["max cut in", `[${num(r.lower)}, ${num(r.upper)}]  gap ${num(gap)}${pct}`]);
    rows.push(["surplus in", `[${num(r.surplusLower)}, ${num(r.surplusUpper)}]  (max cut − W/2)`]);
  }
  rows.push(["graph", `n = ${r.n}, m = ${r.m}, W = ${num(r.totalWeight)} (total weight)`]);
  rows.push(["cut found by", words(r.lowerMethod)]);
  rows.push(["upper bound", certificateText(r)]);
  const delta = r.certificate.kind === "psd-dual" ? r.certificate.probable?.failureProbability : undefined;
  if (r.upperKind !== "proven") rows.push(["caution", `the upper bound is ${r.upperKind === "estimate" ? "an estimate" : `probable (wrong with probability at most ${delta})`}, not a proof`]);
  if (r.interrupted === true) rows.push(["caution", "interrupted: the best bracket found before the run was stopped"]);
  rows.push(["time", `${num(r.seconds)} s (effort ${r.effort}, solver seed ${r.solverSeed})`]);
  if (r.budget !== undefined) rows.push(...budgetRows(r.budget));
  const out = [label, ...formatRows(rows)];
  for (const n of r.notes) out.push(`  note: ${n}`);
  return out.join("\n");
}

/** Conventional exit statuses of a run stopped by a signal: 128 + the signal number. */
export const SIGNAL_EXIT: Readonly<Record<"SIGINT" | "SIGTERM", number>> = Object.freeze({ SIGINT: 130, SIGTERM: 143 });

/** Progress on stderr: rewritten in place on a terminal, one line per update (at most 4/s) otherwise. */
export function progressWriter(stderr: NodeJS.WritableStream, label: string): { update: (p: BracketProgress) => void; done: () => void } {
  const tty = (stderr as NodeJS.WriteStream).isTTY === true;
  let last = -Infinity;
  let shown = false;
  let said = "";
  return {
    update(p) {
      if (p.elapsed - last < 0.25 && p.method !== "start") return;
      const news = `${p.lower} ${p.upper} ${p.method}`;
      // A log (stderr not a terminal) gets a line when the bracket or the stage changes, and
      // otherwise one every 5 s to show the run is alive; a terminal's one line is redrawn freely.
      if (!tty && news === said && p.elapsed - last < 5) return;
      said = news;
      last = p.elapsed;
      const line = `${label}: max cut in [${num(p.lower)}, ${num(p.upper)}] after ${p.method === "start" ? "start" : words(p.method)}, ${num(p.elapsed)} s`;
      stderr.write(tty ? `\r\x1b[2K${line}` : `${line}\n`);
      shown = true;
    },
    done() {
      if (tty && shown) stderr.write("\r\x1b[2K");
    },
  };
}

export const cutCommand: CommandSpec = {
  ...cutHelp,
  async run(args, io) {
    const o = args.options;
    const json = o["json"] === true;
    const seconds = o["seconds"] as number | undefined;
    const work = o["work"] as number | undefined;
    if (seconds !== undefined && work !== undefined) throw new InputError("--seconds and --work: give one budget, not both");
    const budget = work !== undefined ? { work } : { seconds: seconds ?? DEFAULT_BRACKET_SECONDS };
    const solverSeed = o["solver-seed"] as number;
    const effort = o["effort"] as BracketEffort;
    const deep = { relaxation: o["node-bound"] as TreeRelaxation, treeNodes: o["node-budget"] as number | undefined, branching: o["branching"] as TreeBranching, symmetry: o["symmetry"] === "on", parity: o["parity"] === "on" };
    const wantProgress = o["progress"] === true || (o["progress"] === undefined && (io.stderr as NodeJS.WriteStream).isTTY === true);
    const outPath = o["out"] as string | undefined;
    if (outPath === "") throw new InputError("--out needs a file name");
    let fd: number | null = null;
    // SIGINT/SIGTERM: the bracket runs in a worker, so this thread can stop it at once and write
    // the best record so far (marked `interrupted`) before exiting with 128 + the signal number.
    const runner = new BracketRunner();
    let running: RunningBracket | null = null;
    let caught: "SIGINT" | "SIGTERM" | null = null;
    const onSignal = (sig: "SIGINT" | "SIGTERM"): void => {
      caught = sig;
      if (running !== null) running.stop();
      else {
        // Nothing running (reading input): stop now; records written so far are complete.
        runner.close();
        if (fd !== null) closeSync(fd);
        process.exit(SIGNAL_EXIT[sig]);
      }
    };
    const onInt = (): void => onSignal("SIGINT");
    const onTerm = (): void => onSignal("SIGTERM");
    process.on("SIGINT", onInt);
    process.on("SIGTERM", onTerm);
    const writeRecord = async (record: BracketSnapshot, label: string, first: boolean): Promise<void> => {
      const line = recordJson(record);
      if (outPath !== undefined) {
        // Opened only once the first graph is read, so a bad source leaves no empty file behind.
        if (fd === null) {
          try {
            fd = openSync(outPath, "w");
          } catch (e) {
            throw new InputError(`--out ${outPath}: cannot write (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
          }
        }
        writeSync(fd, line + "\n");
      }
      if (json) await writeLine(io.stdout, line);
      else await writeLine(io.stdout, (first ? "" : "\n") + formatBracket(label, record));
    };
    try {
      let first = true;
      for await (const item of openSource(args.positionals[0], sourceOptionsFrom(args, io.stdin))) {
        const progress = wantProgress ? progressWriter(io.stderr, item.label) : null;
        running = runner.run(item.graph, { ...budget, solverSeed, effort, ...deep, source: item.source, notes: item.notes, onProgress: progress?.update, failureProbability: o["risk"] as number });
        let outcome: Awaited<RunningBracket["done"]>;
        try {
          outcome = await running.done;
        } catch (e) {
          // Name the graph: a method may refuse it (too large for memory) without knowing its file.
          if (e instanceof InputError) throw new InputError(`${item.label}: ${e.message}`);
          throw e;
        } finally {
          running = null;
          progress?.done();
        }
        if (outcome.stopped || caught !== null) {
          const sig: "SIGINT" | "SIGTERM" = caught ?? "SIGINT";
          if (outcome.record !== null) {
            const note = `interrupted by ${sig}: the best bracket found so far`;
            await writeRecord({ ...outcome.record, interrupted: true, notes: [...outcome.record.notes, note] }, item.label, first);
          }
          io.stderr.write(`halfplus cut: interrupted by ${sig}${outcome.record !== null ? `; wrote the best record so far for ${item.label}` : ""}\n`);
          return SIGNAL_EXIT[sig];
        }
        await writeRecord(outcome.record!, item.label, first);
        first = false;
      }
      // An empty stream in a pipe is normal (a filter kept nothing); an empty named file deserves a word.
      if (first && args.positionals[0] !== "-") io.stderr.write(`halfplus cut: no graphs read from ${args.positionals[0]}\n`);
    } finally {
      process.off("SIGINT", onInt);
      process.off("SIGTERM", onTerm);
      runner.close();
      if (fd !== null) closeSync(fd);
    }
    return 0;
  },
};
