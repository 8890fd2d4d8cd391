// `halfplus cut <source>`: a certified max-cut bracket for each graph a source denotes, as a short
// readable summary or one JSON record per line (--json); progress goes to stderr, never stdout.
import { closeSync, openSync, writeSync } from "node:fs";
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { openSource } from "../../sources/index.js";
import { BRACKET_METHODS, DEFAULT_BRACKET_SECONDS, recordJson, type BracketMethod, type BracketProgress, type BracketRecord, type BracketSnapshot } from "../../cut/bracket.js";
import { runBracket, type RunningBracket } from "../../cut/bracket-runner.js";
import { SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";
import { writeLine } from "../output.js";

/** Integers as they are; other numbers to 4 decimals (fewer when trailing zeros). */
function num(x: number): string {
  if (Number.isInteger(x)) return String(x);
  return x.toFixed(4).replace(/\.?0+$/, "");
}

/** What the summary shows: every field but the partition. */
type Shown = Omit<BracketRecord, "partition">;

function certificateText(r: Shown): string {
  const c = r.certificate;
  switch (c.kind) {
    case "exhaustive":
      return c.search === "exact-gray" ? "exhaustive search (Gray code)" : `exhaustive search (${c.search}, ${c.nodes} nodes)`;
    case "search-bound":
      return `bound of an unfinished search (${c.search})`;
    case "psd-dual":
      return `dual certificate, shift by ${c.shiftMethod}${c.floored ? ", rounded down" : ""}`;
    case "positive-weights":
      return "sum of positive weights";
  }
}

/** Our own layout: the bracket first, then where each side of it came from. */
export function formatBracket(label: string, r: Shown, notes: string[]): string {
  const gap = r.upper - r.lower;
  const rows: [string, string][] = [];
  if (r.exact) {
    rows.push(["max cut", `${num(r.lower)}  (optimal${gap > 0 ? `, within ${num(gap)}` : ""})`]);
    rows.push(["surplus", num(r.surplusLower)]);
  } else {
    const pct = r.upper !== 0 ? ` = ${((100 * gap) / Math.abs(r.upper)).toFixed(2)}% of upper` : "";
    rows.push(["max cut in", `[${num(r.lower)}, ${num(r.upper)}]  gap ${num(gap)}${pct}`]);
    rows.push(["surplus in", `[${num(r.surplusLower)}, ${num(r.surplusUpper)}]`]);
  }
  rows.push(["graph", `n = ${r.n}, m = ${r.m}${r.totalWeight !== r.m ? `, W = ${num(r.totalWeight)}` : ""}`]);
  rows.push(["cut found by", r.lowerMethod]);
  rows.push(["bound from", `${r.upperMethod}: ${certificateText(r)}`]);
  rows.push(["time", `${r.seconds.toFixed(2)} s (method ${r.method}, seed ${r.seed})`]);
  const w = Math.max(...rows.map((x) => x[0].length));
  const out = [label, ...rows.map(([k, v]) => `  ${k.padEnd(w)}  ${v}`)];
  for (const n of notes) out.push(`  note: ${n}`);
  return out.join("\n");
}

/** Conventional exit statuses of a run stopped by a signal: 128 + the signal number. */
export const SIGNAL_EXIT: Readonly<Record<"SIGINT" | "SIGTERM", number>> = Object.freeze({ SIGINT: 130, SIGTERM: 143 });

/** Progress on stderr: rewritten in place on a terminal, one line per update (at most 4/s) otherwise. */
function progressWriter(stderr: NodeJS.WritableStream, label: string): { update: (p: BracketProgress) => void; done: () => void } {
  const tty = (stderr as NodeJS.WriteStream).isTTY === true;
  let last = -Infinity;
  let shown = false;
  return {
    update(p) {
      if (p.elapsed - last < 0.25 && p.method !== "start") return;
      last = p.elapsed;
      const line = `${label}: [${num(p.lower)}, ${num(p.upper)}] after ${p.method}, ${p.elapsed.toFixed(1)} s`;
      stderr.write(tty ? `\r\x1b[2K${line}` : `${line}\n`);
      shown = true;
    },
    done() {
      if (tty && shown) stderr.write("\r\x1b[2K");
    },
  };
}

export const cutCommand: CommandSpec = {
  name: "cut",
  summary: "certified max-cut bracket [lower, upper] of each graph in a file, stream or family spec",
  positionals: "<source>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [
    { name: "seconds", type: "number", description: "time budget per graph", default: DEFAULT_BRACKET_SECONDS, min: 0.001, max: 1e7, placeholder: "S" },
    { name: "seed", type: "integer", description: "seed of every randomised method", default: 0, min: 0, max: 0xffffffff, placeholder: "N" },
    { name: "method", type: "string", description: "auto, exact search only, heuristics with certified bounds, or quick cheap methods", default: "auto", choices: BRACKET_METHODS, placeholder: "M" },
    { name: "json", type: "boolean", description: "one JSON record per graph, one per line (what `halfplus verify` reads)" },
    { name: "out", short: "o", type: "string", description: "also write the JSON records to FILE", placeholder: "FILE" },
    { name: "progress", type: "boolean", description: "report progress on stderr (default: only when stderr is a terminal)" },
    ...SOURCE_OPTIONS,
  ],
  examples: [
    "halfplus cut petersen",
    "halfplus cut kneser:n=8,k=3 --json > kneser.json && halfplus verify kneser.json",
    "nauty-geng -c 9 | halfplus cut - --json --seconds 1",
    "halfplus cut G1.txt --seconds 60 --method heuristic",
  ],
  async run(args, io) {
    const o = args.options;
    const json = o["json"] === true;
    const seconds = o["seconds"] as number;
    const seed = o["seed"] as number;
    const method = o["method"] as BracketMethod;
    const wantProgress = o["progress"] === true || (o["progress"] === undefined && (io.stderr as NodeJS.WriteStream).isTTY === true);
    const outPath = o["out"] as string | undefined;
    if (outPath === "") throw new InputError("--out needs a file name");
    let fd: number | null = null;
    // SIGINT/SIGTERM: the bracket runs in a worker, so this thread can stop it at once and write
    // the best record so far (marked `interrupted`) before exiting with 128 + the signal number.
    let running: RunningBracket | null = null;
    let caught: "SIGINT" | "SIGTERM" | null = null;
    const onSignal = (sig: "SIGINT" | "SIGTERM"): void => {
      caught = sig;
      if (running !== null) running.stop();
      else {
        // Nothing running (reading input): stop now; records written so far are complete.
        if (fd !== null) closeSync(fd);
        process.exit(SIGNAL_EXIT[sig]);
      }
    };
    const onInt = (): void => onSignal("SIGINT");
    const onTerm = (): void => onSignal("SIGTERM");
    process.on("SIGINT", onInt);
    process.on("SIGTERM", onTerm);
    const writeRecord = async (record: BracketSnapshot, label: string, notes: string[], first: boolean): Promise<void> => {
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
      else await writeLine(io.stdout, (first ? "" : "\n") + formatBracket(label, record, notes));
    };
    try {
      let first = true;
      for await (const item of openSource(args.positionals[0], sourceOptionsFrom(args, io.stdin))) {
        const progress = wantProgress ? progressWriter(io.stderr, item.label) : null;
        running = runBracket(item.graph, { seconds, seed, method, source: item.ref, onProgress: progress?.update });
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
            const rec: BracketSnapshot = { ...outcome.record, interrupted: true };
            await writeRecord(rec, item.label, [...item.notes, `interrupted by ${sig}: the best bracket found so far`], first);
          }
          io.stderr.write(`halfplus cut: interrupted by ${sig}${outcome.record !== null ? `; wrote the best record so far for ${item.label}` : ""}\n`);
          return SIGNAL_EXIT[sig];
        }
        const record = outcome.record!;
        await writeRecord(record, item.label, item.notes, first);
        first = false;
      }
      if (first && args.positionals[0] !== "-") io.stderr.write(`halfplus cut: no graphs read from ${args.positionals[0]}\n`);
    } finally {
      process.off("SIGINT", onInt);
      process.off("SIGTERM", onTerm);
      if (fd !== null) closeSync(fd);
    }
    return 0;
  },
};
