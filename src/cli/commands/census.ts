// `halfplus census`: count a graph6/sparse6 stream into a results store (`--store`), exactly
// and resumably, and show the per-(n, m) aggregates of a store (`--table`, `--json`).
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { censusHelp } from "./help/census.js";
import {
  censusesToShow,
  censusProgressDisplay,
  censusRecords,
  isStoreFile,
  openStore,
  runCensus,
  type CensusCellRecord,
  type CensusSummary,
} from "../../experiment/index.js";
import { formatNumber, formatTable } from "../format.js";
import { writeLine } from "../output.js";

function summaryText(s: CensusSummary): string {
  const how = s.finished ? "stream read to its end" : s.stopped ? "stopped before the end of the stream" : "done";
  let text = `census ${s.name}: ${s.counted} graph${s.counted === 1 ? "" : "s"} counted in ${s.seconds.toFixed(1)} s (${s.consumed} in ${s.store}${s.resumedFrom > 0 ? `, resumed after ${s.resumedFrom}` : ""}), ${s.cells} (n, m) cells; ${how}`;
  if (s.lowest !== null) text += `\n  least surplus/(m/√d): ${formatNumber(s.lowest.ratio)} at n=${s.lowest.n} m=${s.lowest.m} (${s.lowest.graph})`;
  if (s.stopped) text += `\n  feed the same stream to the same command to go on from graph ${s.consumed + 1}`;
  return text;
}

function tableLines(name: string, source: string, counted: number, complete: boolean, records: readonly CensusCellRecord[]): string[] {
  const head = `census ${name}: ${counted} graphs from ${source}${complete ? "" : " (stream not read to its end yet)"}`;
  const rows: string[][] = [["n", "m", "graphs", "min surplus", "attaining", "min surplus·√d/m", "first graph at min surplus"]];
  for (const r of records) {
    rows.push([String(r.n), String(r.m), String(r.graphs), formatNumber(r.minSurplus), String(r.attaining), r.minRatio === null ? "–" : formatNumber(r.minRatio), r.witnesses[0] ?? "–"]);
  }
  return [head, ...formatTable(rows)];
}

export const censusCommand: CommandSpec = {
  ...censusHelp,
  async run(args, io) {
    const o = args.options;
    const target = args.positionals[0];
    const storePath = o["store"] as string | undefined;
    const name = o["name"] as string | undefined;
    const show = o["table"] === true ? "table" : o["json"] === true ? "json" : null;
    if (o["table"] === true && o["json"] === true) throw new InputError("--table and --json: choose one");
    if (storePath === "") throw new InputError("--store needs a file name");
    let exit = 0;
    let storeToShow: string;
    let nameToShow: string | undefined = name;
    if (storePath !== undefined) {
      const display = o["progress"] === false ? null : censusProgressDisplay(io.stderr);
      // First Ctrl-C: finish the batches in flight, commit them, stop. A second one ends the process.
      const stop = new AbortController();
      const onSigint = (): void => {
        if (stop.signal.aborted) process.exit(130);
        io.stderr.write("\nstopping after the batches in flight (Ctrl-C again to quit now)\n");
        stop.abort();
      };
      process.on("SIGINT", onSigint);
      let summary: CensusSummary;
      try {
        summary = await runCensus({
          input: target,
          stdin: io.stdin,
          store: storePath,
          name,
          workers: (o["workers"] as number | undefined) ?? availableParallelism(),
          witnessLimit: o["witnesses"] as number | undefined,
          batchGraphs: o["batch"] as number,
          atMost: o["at-most"] as number | undefined,
          signal: stop.signal,
          onProgress: display === null ? undefined : (p) => display.update(p),
        });
      } finally {
        process.off("SIGINT", onSigint);
        display?.done();
      }
      if (show === null) await writeLine(io.stdout, summaryText(summary));
      else io.stderr.write(summaryText(summary) + "\n");
      if (summary.stopped && stop.signal.aborted) exit = 1;
      if (show === null) return exit;
      storeToShow = storePath;
      nameToShow = summary.name;
    } else {
      if (show === null) throw new InputError(`${target}: give --store FILE to count a stream into a store, or --table / --json to show a store's census`);
      if (target !== "-" && !existsSync(target)) throw new InputError(`${target}: no such results store`);
      if (target === "-" || !isStoreFile(target)) throw new InputError(`${target}: not a results store (to count a stream, give --store FILE)`);
      storeToShow = target;
    }
    const store = openStore(storeToShow, { readonly: true });
    try {
      const states = censusesToShow(store, nameToShow);
      for (const [i, state] of states.entries()) {
        const records = censusRecords(store, state);
        if (show === "json") {
          for (const r of records) await writeLine(io.stdout, JSON.stringify(r));
        } else {
          if (i > 0) await writeLine(io.stdout, "");
          for (const l of tableLines(state.name, state.source, state.consumed, state.finishedAt !== null, records)) await writeLine(io.stdout, l);
        }
      }
    } finally {
      store.close();
    }
    return exit;
  },
};
