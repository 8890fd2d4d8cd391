// `halfplus hunt`: its options and help text, apart from its implementation (../hunt.ts), so that
// `halfplus hunt --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { HUNT_STARTS } from "../../../hunt/starts.js";
import { OBJECTIVE_KINDS } from "../../../hunt/objective.js";
import { DEFAULT_STORE } from "../../../experiment/default-store.js";
import { COMMAND_SUMMARIES } from "../summaries.js";

export const huntHelp: CommandHelp = {
  name: "hunt",
  summary: COMMAND_SUMMARIES["hunt"],
  positionals: "",
  minPositionals: 0,
  maxPositionals: 0,
  description: [
    "Simulated annealing over H-free graphs: every move (add an edge that creates no copy of H, delete one, swap one for another, redraw a vertex's neighbourhood) keeps the graph H-free. Each graph is screened with a few mixing-method sweeps started from the previous graph's SDP vectors; a graph that could beat the best one found so far for its number of edges m is certified: the SDP is solved further, its dual is certified, and the bracket record (which `halfplus verify` re-checks) gives the proven surplus upper end the objective is computed from.",
    "Chains start from the known constructions on n vertices that are proved H-free (polarity graphs, Kneser graphs, blow-ups, …) and from H-free process outputs (--start references), from process outputs only (--start process), or from the empty graph (--start empty); later chains start from frontier graphs. The constructions are certified the same way and reported as reference values.",
    "Budgets: --iterations N moves (deterministic: the same seed gives the same frontier on any machine) and/or --minutes M (or --seconds S); the search stops at whichever runs out first.",
  ],
  options: [
    { name: "free", type: "string", description: "H: K3, C4, C5, K4, K2,3 (any K<r>, C<k>, K<s>,<t>, P<k>), or a graph file or family spec", placeholder: "H" },
    { name: "n", type: "integer", description: "number of vertices", min: 2, max: 256 },
    { name: "objective", type: "string", description: "what to minimise: ratio = surplus/(m/√d), d the degeneracy; power = surplus/m^alpha; surplus = the surplus at --m edges", choices: OBJECTIVE_KINDS, default: "ratio" },
    { name: "alpha", type: "number", description: "the exponent of --objective power", min: 0, max: 2, placeholder: "A" },
    { name: "m", type: "integer", description: "the number of edges of --objective surplus", min: 1, placeholder: "M" },
    { name: "minutes", type: "number", description: "time budget in minutes", min: 0, placeholder: "M" },
    { name: "seconds", type: "number", description: "time budget in seconds (instead of --minutes)", min: 0, placeholder: "S" },
    { name: "iterations", type: "integer", description: "work budget: moves in all (deterministic)", min: 0, placeholder: "N" },
    { name: "start", type: "string", description: "where chains start", choices: HUNT_STARTS, default: "references" },
    { name: "process-runs", type: "integer", description: "H-free process outputs among the starts", min: 0, max: 1000, default: 4 },
    { name: "chain-length", type: "integer", description: "moves per chain before the next one starts", min: 1, default: 1500 },
    { name: "solver-seed", type: "integer", description: "seed of the search, the process outputs and the solvers", min: 0, max: 4294967295, default: 0 },
    { name: "store", type: "string", description: `results store for the frontier (table hunt_frontier; default ${DEFAULT_STORE})`, placeholder: "FILE" },
    { name: "records", type: "string", description: "also write the frontier's bracket records, one JSON line each (for `halfplus verify`)", placeholder: "FILE" },
    { name: "figure", type: "string", description: "also write the frontier figure against the reference constructions as an HTML page", placeholder: "FILE" },
    { name: "json", type: "boolean", description: "print the frontier as JSON lines (record included) instead of a table" },
    { name: "progress", type: "boolean", description: "progress on stderr: a live line on a terminal, a plain line every 10 s otherwise (on by default; --no-progress turns it off)", default: true },
  ],
  refused: { seed: "ambiguous: use --solver-seed N (the search and its solvers)" },
  examples: [
    "halfplus hunt --free C4 --n 31 --objective ratio --minutes 10 --store results/hunt.db",
    "halfplus hunt --free K3 --n 24 --iterations 20000 --start process --records frontier.jsonl && halfplus verify frontier.jsonl",
  ],
};
