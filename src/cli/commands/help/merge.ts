// `halfplus merge`: its options and help text, apart from its implementation (../merge.ts), so that
// `halfplus merge --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";

export const mergeHelp: CommandHelp = {
  name: "merge",
  summary: COMMAND_SUMMARIES["merge"],
  positionals: "<store.db...>",
  minPositionals: 1,
  maxPositionals: Infinity,
  options: [
    { name: "into", type: "string", description: "the store to merge into (created if missing)", placeholder: "FILE" },
    { name: "json", type: "boolean", description: "print the report as one JSON object" },
  ],
  examples: ["halfplus merge shard-0.db shard-1.db shard-2.db --into all.db"],
};
