// `halfplus cut`: its options and help text, apart from its implementation (../cut.ts), so that
// `halfplus cut --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { DEFAULT_BRACKET_SECONDS, MAX_BRACKET_WORK } from "../../../cut/bracket/budget-limits.js";
import { TREE_BRANCHINGS, TREE_RELAXATIONS } from "../../../cut/tree/tree-choices.js";
import { BRACKET_EFFORTS } from "../../../cut/bracket/record.js";
import { MAX_SEED } from "../../../random/seed.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { SOURCE_HELP, SOURCE_OPTIONS } from "../source-options.js";

export const cutHelp: CommandHelp = {
  name: "cut",
  summary: COMMAND_SUMMARIES["cut"],
  positionals: "<source>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "The lower end is a cut anyone can re-evaluate (the partition is in the record); the upper end comes with a certificate: exhaustive search on small graphs, else a dual certificate of the Goemans–Williamson relaxation. The surplus is max cut − W/2, W the total edge weight (m when unweighted).",
    "The budget is --seconds (wall clock, the default) or --work (deterministic units of solver work: moves, sweeps, search nodes, rounding trials). While the bracket is open the run keeps improving both ends until the budget is spent; the summary says where it went, stage by stage.",
    "Two seeds: --solver-seed seeds the randomised solvers (which cuts are tried); --graph-seed picks which random graph a random family builds. Both are recorded (solverSeed, source.graphSeed).",
    "Ctrl-C (SIGINT) or SIGTERM stops the run at once: the best bracket found so far is written (to standard output and --out), marked `interrupted: true`, and the command exits with 130 (SIGINT) or 143 (SIGTERM). The record verifies like any other.",
    SOURCE_HELP,
  ],
  options: [
    { name: "seconds", type: "number", description: `time budget per graph (default ${DEFAULT_BRACKET_SECONDS} unless --work is given); certifying the bound may run a little past it`, min: 0.001, max: 1e7, placeholder: "S" },
    {
      name: "work",
      type: "integer",
      description: "deterministic budget per graph in work units instead of seconds: the same graph, seed and settings then give the same record on any machine (about 10^8 units per CPU-second; the record's budget says what was used)",
      min: 1,
      max: MAX_BRACKET_WORK,
      placeholder: "N",
    },
    {
      name: "effort",
      type: "string",
      description: "auto: exact search on small graphs, heuristics and certified bounds otherwise; exact: exact search only; heuristic: never exact search; quick: cheap methods, for large batches; deep: heuristics, the SDP with triangle inequalities, then branch and bound on SDP bounds (graphs of about a hundred vertices)",
      default: "auto",
      choices: BRACKET_EFFORTS,
      placeholder: "E",
    },
    {
      name: "node-bound",
      type: "string",
      description: "effort deep: what bounds each branch-and-bound node, triangles (the SDP with triangle inequalities) or plain (the SDP alone, cheaper per node)",
      default: "triangles",
      choices: TREE_RELAXATIONS,
      placeholder: "B",
    },
    {
      name: "branching",
      type: "string",
      description: "effort deep: the free vertex each branch-and-bound node splits on, least-decided (its SDP vector closest to orthogonal to the fixed side's), most-decided (closest to parallel; fewer nodes on polarity graphs, bench/exact-hundred) or auto (a short probe of each, the better one kept)",
      default: "auto",
      choices: TREE_BRANCHINGS,
      placeholder: "R",
    },
    {
      name: "symmetry",
      type: "string",
      description: "effort deep: on (branch on whole orbits of the graph's automorphisms where they keep a node's fixings; the certificate lists the maps, verify re-checks them) or off",
      default: "on",
      choices: ["on", "off"],
      placeholder: "S",
    },
    {
      name: "parity",
      type: "string",
      description: "effort deep: on (a node that fixes every odd-degree vertex knows its cuts' parity and rounds its bound to it; few such vertices are branched on first) or off",
      default: "on",
      choices: ["on", "off"],
      placeholder: "P",
    },
    { name: "node-budget", type: "integer", description: "effort deep: stop branch and bound after N nodes (a budget that gives the same result on any machine)", min: 1, max: 1e12, placeholder: "N" },
    { name: "solver-seed", type: "integer", description: "seed of the randomised solvers (local search, SDP start, rounding, breakout)", default: 0, min: 0, max: MAX_SEED, placeholder: "N" },
    { name: "json", type: "boolean", description: "one JSON record per graph, one per line (what `halfplus verify` reads)" },
    { name: "out", short: "o", type: "string", description: "also write the JSON records to FILE", placeholder: "FILE" },
    { name: "progress", type: "boolean", description: "report progress on stderr (default: only when stderr is a terminal)" },
    {
      name: "risk",
      type: "number",
      description: "on graphs too large to prove the upper end, the largest chance that a probable upper end is wrong (0: leave it an unproven estimate)",
      default: 1e-9,
      min: 0,
      max: 0.5,
      placeholder: "P",
    },
    ...SOURCE_OPTIONS,
  ],
  refused: {
    seed: "ambiguous: use --solver-seed N for the randomised solvers, or --graph-seed N (or seed= in the spec) for a random family's graph",
    method: "renamed --effort (auto, exact, heuristic or quick)",
  },
  examples: [
    "halfplus cut petersen",
    "halfplus cut kneser:n=8,k=3 --json > kneser.jsonl && halfplus verify kneser.jsonl",
    "halfplus cut gnp:n=200,p=0.05 --graph-seed 3 --solver-seed 1",
    "nauty-geng -c 9 | halfplus cut - --json --seconds 1",
    "halfplus cut G1.txt --seconds 60 --effort heuristic",
    "halfplus cut polarity:q=13 --work 200000000 --json   # the same record on any machine",
    "halfplus cut polarity:q=7 --effort deep --seconds 600",
  ],
};
