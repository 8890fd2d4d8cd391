// Each command's name and one-line summary, in the order `halfplus --help` lists them. The one home
// of a summary: `halfplus --help` reads it from here without loading any command, and each command's
// spec takes it from here for `halfplus <command> --help`.

export const COMMAND_SUMMARIES = {
  "families": "list graph families: parameters, subgraphs proven absent (with citations), predicted size",
  "graph": "structure of each graph: degrees, degeneracy, girth, triangles, 4-cycles, K3/K4/C4/C5 present?",
  "encode": "write each graph of a source as graph6, sparse6, an edge list (or gset, DIMACS), for pipes",
  "cut": "bracket the max cut of each graph, lower ≤ max cut ≤ upper, with evidence for both ends",
  "bounds": "each surplus argument against the bracket: its surplus, its share, the proof step that gives most away",
  "verify": "re-check bracket records (from `halfplus cut --json`, or the rows of a results store) against their graphs",
  "sdp-export": "write a graph's max-cut SDP relaxation in SDPA sparse format (.dat-s), for outside solvers",
  "sweep": "run a sweep plan (families × parameters × seeds) into a results store; re-running computes only what is missing",
  "export": "write the rows of a results store (or its census or hunt frontier tables) as CSV or JSON lines (same plan, same bytes)",
  "import": "add rows measured elsewhere (CSV: m, surplus bounds, optionally n and d) to a results store",
  "merge": "merge results stores into one, census and hunt frontier included (refuses rows that disagree on the same key; merging again adds nothing)",
  "fit": "fit surplus ≈ C·m^a·d^b (or a one-predictor law) per family to a results store's brackets",
  "census": "exact max cut of every graph in a graph6/sparse6 stream, aggregated per (n, m) in a results store; resumable",
  "hunt": "search H-free graphs on n vertices for small certified surplus; keep the best graph per m in the store",
  "cluster": "run a sweep plan on a Slurm cluster: a job array over its shards, status, resubmitting what died, merging",
  "kernel": "install or check the Jupyter kernel for TypeScript notebooks (tslab)",
} as const;

export type CommandName = keyof typeof COMMAND_SUMMARIES;
