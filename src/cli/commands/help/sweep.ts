// `halfplus sweep`: its options and help text, apart from its implementation (../sweep.ts), so that
// `halfplus sweep --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { DEFAULT_STORE } from "../../../experiment/default-store.js";

export const sweepHelp: CommandHelp = {
  name: "sweep",
  summary: COMMAND_SUMMARIES["sweep"],
  positionals: "<plan.json>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [
    { name: "store", type: "string", description: "results store (SQLite file; created with its folder)", default: DEFAULT_STORE, placeholder: "FILE" },
    { name: "workers", type: "integer", description: "worker threads (default: one per core; 0 runs jobs in the main thread)", min: 0, max: 1024, placeholder: "N" },
    {
      name: "shard",
      type: "string",
      description: "run only slice i of N, 0 ≤ i < N (a Slurm array task id fits as i): the N slices have about equal predicted cost (n, m and the budget of each job), the same on every machine",
      placeholder: "i/N",
    },
    { name: "list", type: "boolean", description: "print the keys of the jobs still to run (one per line) and stop" },
    { name: "json", type: "boolean", description: "print the summary as one JSON object" },
    { name: "progress", type: "boolean", description: "progress on stderr: a live line on a terminal, a plain line every 10 s otherwise (on by default; --no-progress turns it off)", default: true },
  ],
  examples: [
    "halfplus sweep plans/triangle-free.json",
    "halfplus sweep plans/c4-free.json --store runs/c4.db --workers 2 --shard 0/4",
    "halfplus sweep plans/random-graphs.json --list | wc -l",
  ],
};
