// `halfplus bounds`: its options and help text, apart from its implementation (../bounds.ts), so that
// `halfplus bounds --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { DEFAULT_TRIANGLE_FACTOR, DEFAULT_EXACT_VERTICES } from "../../../cut/decomposition/defaults.js";
import { DEFAULT_BRACKET_SECONDS, MAX_BRACKET_WORK } from "../../../cut/bracket/budget-limits.js";
import { BRACKET_EFFORTS } from "../../../cut/bracket/record.js";
import { GRAY_MAX_VERTICES } from "../../../cut/exact/gray-limit.js";
import { MAX_SEED } from "../../../random/seed.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { formatNumber as num } from "../../format.js";
import { SOURCE_HELP, SOURCE_OPTIONS } from "../source-options.js";
import { SOLVER_REFUSALS } from "../solver-options.js";

export const boundsHelp: CommandHelp = {
  name: "bounds",
  summary: COMMAND_SUMMARIES["bounds"],
  positionals: "<source>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "For each graph: the bracket's surplus interval (as `halfplus cut` finds it), then Edwards' two bounds, the triangle-free form, the explicit vector method with its default choice and with the best choice of sets V_i and weights ε_i found, its few-triangles form, and the decomposition cut with its guarantee. Each is given as a surplus, as a fraction of the bracket's lower end, and with the step of its argument that loses most (the losses of the steps add up to the gap to the lower end).",
    "The vector method's choices are also rounded: their exact expected surplus and the mean and best of the rounded cuts sit beside each guarantee. The decomposition sets neighbourhoods aside while the rest has many triangles, rounds the rest, cuts the pieces exactly when small, and joins them by orientation.",
    SOURCE_HELP,
  ],
  options: [
    { name: "seconds", type: "number", description: `bracket time budget per graph (default ${DEFAULT_BRACKET_SECONDS} unless --work is given)`, min: 0.001, max: 1e7, placeholder: "S" },
    { name: "work", type: "integer", description: "bracket work budget per graph in work units instead of seconds (deterministic: the same account on any machine)", min: 1, max: MAX_BRACKET_WORK, placeholder: "N" },
    { name: "effort", type: "string", description: "how much work the bracket puts in (as in `halfplus cut`)", default: "auto", choices: BRACKET_EFFORTS, placeholder: "E" },
    { name: "solver-seed", type: "integer", description: "seed of the bracket's solvers and of every rounding", default: 0, min: 0, max: MAX_SEED, placeholder: "N" },
    { name: "trials", type: "integer", description: "rounding trials per vector choice", default: 200, min: 1, max: 1e7, placeholder: "N" },
    { name: "fixed-sets", type: "boolean", description: "keep V_i = N(i) and optimise ε only" },
    { name: "pattern", type: "string", description: "H the graph is free of, for the decomposition (K4, C5, K2,3, …; default K_{ω+1}, ω the clique number)", placeholder: "H" },
    { name: "triangle-factor", type: "number", description: `decomposition stops setting pieces aside once T ≤ C·m·√Δ (default 1/(3π) ≈ ${num(DEFAULT_TRIANGLE_FACTOR)}: below it the few-triangles form keeps half its triangle-free value)`, min: 0, max: 1e6, placeholder: "C" },
    { name: "max-depth", type: "integer", description: "deepest piece level decomposed again (default for H = K_r: r − 4; 1 otherwise)", min: 0, max: 64, placeholder: "K" },
    { name: "exact-vertices", type: "integer", description: "pieces up to this many vertices are cut exactly", default: DEFAULT_EXACT_VERTICES, min: 0, max: GRAY_MAX_VERTICES, placeholder: "K" },
    { name: "max-trials", type: "integer", description: "most rounding trials spent to reach a stage's guarantee in the decomposition", default: 1024, min: 1, max: 1e8, placeholder: "N" },
    { name: "json", type: "boolean", description: "one JSON record per graph (kind halfplus/bounds-account), one per line" },
    { name: "progress", type: "boolean", description: "report progress on stderr (default: only when stderr is a terminal)" },
    ...SOURCE_OPTIONS,
  ],
  refused: SOLVER_REFUSALS,
  examples: [
    "halfplus bounds petersen",
    "halfplus bounds hfree-process:n=120,h=K4,seed=3 --pattern K4",
    "halfplus bounds paley:q=29 --json",
    "nauty-geng -c 8 | halfplus bounds - --json --seconds 1",
  ],
};
