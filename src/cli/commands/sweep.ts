// `halfplus sweep <plan.json>`: run a plan into a results store, resumably: rows already stored
// are skipped, a killed run loses only the jobs in flight. Progress on stderr, a summary on stdout.
import { availableParallelism } from "node:os";
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { sweepHelp } from "./help/sweep.js";
import { loadPlan, parseShard, pendingKeys, progressDisplay, runSweep, type SweepSummary } from "../../experiment/index.js";
import { writeLine } from "../output.js";

function summaryText(s: SweepSummary): string {
  const head = s.stopped ? "stopped" : "done";
  const shard = s.shard === null ? "" : ` (shard ${s.shard})`;
  let text = `${s.plan}${shard}: ${head}, ${s.computed} row${s.computed === 1 ? "" : "s"} computed, ${s.skipped} already in ${s.store}, ${s.seconds.toFixed(1)} s with ${s.workers === 0 ? "no worker threads" : `${s.workers} worker${s.workers === 1 ? "" : "s"}`}`;
  if (s.lowest !== null) text += `\n  lowest surplus/(m/√d): ${s.lowest.ratio.toPrecision(4)} at ${s.lowest.graph}`;
  if (s.stopped) text += `\n  run the same command again to finish the remaining ${s.total - s.computed - s.skipped} jobs`;
  return text;
}

export const sweepCommand: CommandSpec = {
  ...sweepHelp,
  async run(args, io) {
    const o = args.options;
    const store = o["store"] as string;
    if (store === "") throw new InputError("--store needs a file name");
    const shardText = o["shard"] as string | undefined;
    const shard = shardText === undefined ? null : parseShard(shardText);
    const plan = args.positionals[0];
    if (o["list"] === true) {
      for await (const key of pendingKeys(loadPlan(plan), { store, shard })) await writeLine(io.stdout, key);
      return 0;
    }
    const workers = (o["workers"] as number | undefined) ?? availableParallelism();
    const display = o["progress"] === false ? null : progressDisplay(io.stderr);
    // First Ctrl-C: finish the jobs in flight, write them, stop. A second one ends the process.
    const stop = new AbortController();
    const onSigint = (): void => {
      if (stop.signal.aborted) process.exit(130);
      io.stderr.write("\nstopping after the jobs in flight (Ctrl-C again to quit now)\n");
      stop.abort();
    };
    process.on("SIGINT", onSigint);
    let summary: SweepSummary;
    try {
      summary = await runSweep(plan, { store, workers, shard, signal: stop.signal, onProgress: display === null ? undefined : (p) => display.update(p) });
    } finally {
      process.off("SIGINT", onSigint);
      display?.done();
    }
    await writeLine(io.stdout, o["json"] === true ? JSON.stringify(summary) : summaryText(summary));
    return summary.stopped ? 1 : 0;
  },
};
