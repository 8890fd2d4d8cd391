// `halfplus fit`: its options and help text, apart from its implementation (../fit.ts), so that
// `halfplus fit --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { DEFAULT_LEVEL, DEFAULT_RESAMPLES, MAX_RESAMPLES, MIN_RESAMPLES } from "../../../fit/options.js";
import { POWER_LAWS, SURPLUS_RESPONSES } from "../../../fit/rows.js";
import { DEGREE_MEASURES } from "../../../experiment/rows.js";

/** The ends `--end` may fit: the band, or one surplus column. */
export const ENDS = ["band", ...SURPLUS_RESPONSES] as const;

export const fitHelp: CommandHelp = {
  name: "fit",
  summary: COMMAND_SUMMARIES["fit"],
  positionals: "<store.db>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "Fits are least squares on the log scale with t-intervals and a seeded bootstrap. By default each family gets three fits, " +
      "of the bracket's lower ends, its upper ends and the closed brackets, and the band between their exponents: an exponent " +
      "claim is only as good as the bracket under it. Rows with a surplus bound ≤ 0 or missing are left out and counted.",
  ],
  options: [
    { name: "family", type: "string", description: "only these families (comma-separated labels)", placeholder: "NAMES" },
    { name: "law", type: "string", description: "m-and-d: C·m^a·d^b; m: C·m^a; m-over-sqrt-d: C·(m/√d)^a", default: "m-and-d", choices: POWER_LAWS, placeholder: "LAW" },
    { name: "end", type: "string", description: "band: lower, upper and exact fits with the band between them; or one bracket end", default: "band", choices: ENDS, placeholder: "END" },
    { name: "degree", type: "string", description: "what d is", default: "degeneracy", choices: DEGREE_MEASURES, placeholder: "MEASURE" },
    { name: "level", type: "number", description: "level of the intervals", default: DEFAULT_LEVEL, min: 0.5, max: 0.9999, placeholder: "P" },
    { name: "resamples", type: "integer", description: "bootstrap resamples", default: DEFAULT_RESAMPLES, min: MIN_RESAMPLES, max: MAX_RESAMPLES, placeholder: "N" },
    { name: "solver-seed", type: "integer", description: "seed of the bootstrap's resampling (default 0)", min: 0, max: 4294967295, placeholder: "N" },
    { name: "bootstrap", type: "boolean", description: "bootstrap intervals beside the t-intervals (--no-bootstrap skips them)", default: true },
    { name: "conjecture", type: "string", description: "conjectured values to test, e.g. mExponent=1,dExponent=-0.5 (defaults: those two; slope=1 for m-over-sqrt-d)", placeholder: "TERM=X,..." },
    { name: "json", type: "boolean", description: "print one JSON object (every fit's record)" },
    { name: "latex", type: "boolean", description: "print a booktabs tabular for a paper (needs \\usepackage{booktabs})" },
  ],
  examples: [
    "halfplus fit results/halfplus.db",
    "halfplus fit results/halfplus.db --family polarity --json",
    "halfplus fit results/halfplus.db --latex > table.tex",
    "halfplus fit results/halfplus.db --law m --end exact --conjecture slope=0.8333",
  ],
};
