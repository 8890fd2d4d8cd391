// `halfplus census`: its options and help text, apart from its implementation (../census.ts), so that
// `halfplus census --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { DEFAULT_BATCH_GRAPHS, DEFAULT_CENSUS, DEFAULT_WITNESS_LIMIT } from "../../../experiment/census/defaults.js";

export const censusHelp: CommandHelp = {
  name: "census",
  summary: COMMAND_SUMMARIES["census"],
  positionals: "<stream | store.db>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "With --store, reads the stream (a file, or - for standard input: pipe a generator such as nauty-geng into it), solves each graph's max cut exactly, and keeps per (n, m): the least surplus (max cut − m/2), how many graphs attain it and the first of them as graph6, the least surplus·√d/m with d the degeneracy, and the histogram of surplus.",
    "Killed or stopped, the census keeps every batch it committed and how many graphs of the stream they hold; feeding it the same stream again skips those graphs (checking a sha256 of them) and goes on. One store can hold several censuses (--name).",
    "With --table or --json and a store, shows its censuses: a table per census, or one JSON object per (n, m).",
  ],
  options: [
    { name: "store", type: "string", description: "count the stream into this results store (SQLite file; created with its folder)", placeholder: "FILE" },
    { name: "name", type: "string", description: `which census of the store (default ${DEFAULT_CENSUS} when counting; every one when showing)`, placeholder: "NAME" },
    { name: "workers", type: "integer", description: "worker threads (default: one per core; 0 solves in the main thread)", min: 0, max: 1024, placeholder: "N" },
    { name: "witnesses", type: "integer", description: `graph6 witnesses kept per (n, m) for the least surplus (default ${DEFAULT_WITNESS_LIMIT}; fixed when a census starts)`, min: 0, max: 10000, placeholder: "N" },
    { name: "batch", type: "integer", description: "graphs per batch handed to a worker", default: DEFAULT_BATCH_GRAPHS, min: 1, max: 1000000, placeholder: "N" },
    { name: "at-most", type: "integer", description: "count at most N more graphs in this run, then stop (the rest can follow later)", min: 1, placeholder: "N" },
    { name: "table", type: "boolean", description: "show the census as a table (after counting, when --store is given)" },
    { name: "json", type: "boolean", description: "show the census as one JSON object per (n, m)" },
    { name: "progress", type: "boolean", description: "progress on stderr: a live line on a terminal, a plain line every 10 s otherwise (--no-progress turns it off)", default: true },
  ],
  examples: [
    "nauty-geng -t 12 | halfplus census - --store results/census.db --workers 2",
    "halfplus census results/census.db --table",
    "halfplus census results/census.db --json",
    "nauty-geng -f 10 | halfplus census - --store results/census.db --name c4-free-10",
  ],
};
