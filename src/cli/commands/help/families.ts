// `halfplus families`: its options and help text, apart from its implementation (../families.ts), so that
// `halfplus families --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";

export const familiesHelp: CommandHelp = {
  name: "families",
  summary: COMMAND_SUMMARIES["families"],
  positionals: "[name | spec]",
  minPositionals: 0,
  maxPositionals: 1,
  description: [
    "A family spec is name:key=value,... (lists joined by +, nested specs in brackets: blow-up:of=[petersen],t=3). Random families take seed=N, the graph seed. Given a name or a spec, one family is shown in detail, its predicted size evaluated at that spec.",
  ],
  options: [{ name: "json", type: "boolean", description: "one JSON object per family, one per line" }],
  examples: ["halfplus families", "halfplus families polarity", "halfplus families kneser:n=9,k=4 --json"],
};
