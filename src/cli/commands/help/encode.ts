// `halfplus encode`: its options and help text, apart from its implementation (../encode.ts), so that
// `halfplus encode --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { GRAPH_FORMATS } from "../../../graph/formats/types.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { SOURCE_HELP, SOURCE_OPTIONS } from "../source-options.js";

export const encodeHelp: CommandHelp = {
  name: "encode",
  summary: COMMAND_SUMMARIES["encode"],
  positionals: "<source>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "graph6 and sparse6 write one graph per line, so a family spec or a whole stream becomes a stream other tools read (nauty's countg, labelg, ...). The other formats hold one graph per file and refuse a second graph. Weighted graphs need a format with weights (edgelist or gset).",
    SOURCE_HELP,
  ],
  options: [
    { name: "as", type: "string", description: "output format", default: "graph6", choices: GRAPH_FORMATS, placeholder: "F" },
    { name: "out", short: "o", type: "string", description: "write to FILE instead of standard output", placeholder: "FILE" },
    ...SOURCE_OPTIONS,
  ],
  examples: [
    "halfplus encode petersen",
    "halfplus encode polarity:q=7 --as sparse6 -o er7.s6",
    "halfplus encode hfree-process:n=30,h=C4 --graph-seed 2 --as edgelist",
    "halfplus encode kneser:n=7,k=2 | nauty-countg",
    "nauty-geng -c 6 | halfplus encode - --as sparse6",
  ],
};
