// `halfplus graph`: its options and help text, apart from its implementation (../graph.ts), so that
// `halfplus graph --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { SOURCE_HELP, SOURCE_OPTIONS } from "../source-options.js";

export const graphHelp: CommandHelp = {
  name: "graph",
  summary: COMMAND_SUMMARIES["graph"],
  positionals: "<source>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "Subgraphs are counted as subgraphs, not necessarily induced. With --json each graph gives one record (kind halfplus/graph-summary) carrying the graph's hash and source, so it joins with `halfplus cut` records of the same graph.",
    SOURCE_HELP,
  ],
  options: [{ name: "json", type: "boolean", description: "one JSON record per graph, one per line" }, ...SOURCE_OPTIONS],
  examples: [
    "halfplus graph petersen",
    "halfplus graph graphs.g6 --json",
    "nauty-geng -c 8 -t | halfplus graph - --json",
    "halfplus graph gnp:n=500,p=0.02 --graph-seed 7",
  ],
};
