// Options shared by every command that reads graphs, and their translation to openSource.
import { GRAPH_FORMATS, type GraphFormat } from "../../graph/formats/types.js";
import { MAX_SEED } from "../../random/seed.js";
import type { OpenSourceOptions } from "../../sources/index.js";
import type { OptionSpec, ParsedArgs } from "../args.js";

export const SOURCE_OPTIONS: readonly OptionSpec[] = [
  {
    name: "graph-seed",
    type: "integer",
    description:
      "seed of a random family's graph, for a spec without seed= (the graph seed: which random graph is built; without either, seed 0 is used and a note says so)",
    min: 0,
    max: MAX_SEED,
    placeholder: "N",
  },
  {
    name: "format",
    type: "string",
    description: "read files in this format instead of detecting it from the extension and content",
    choices: GRAPH_FORMATS,
    placeholder: "F",
  },
  { name: "one-based", type: "boolean", description: "edge-list vertex numbers start at 1 (default 0)" },
  { name: "merge-duplicates", type: "boolean", description: "merge repeated edges (weights add up) instead of refusing the file" },
  { name: "drop-loops", type: "boolean", description: "drop edges from a vertex to itself instead of refusing the file" },
];

/** How a source argument is written, for every command's help. */
export const SOURCE_HELP =
  "A source is a graph file (graph6, sparse6, edge list, the `n m` / `u v w` benchmark format, DIMACS), `-` for standard input (a graph6/sparse6 stream may hold many graphs), or a family spec such as kneser:n=8,k=3 (run `halfplus families` for the list).";

export function sourceOptionsFrom(args: ParsedArgs, stdin: NodeJS.ReadableStream): OpenSourceOptions {
  const o = args.options;
  return {
    format: o["format"] as GraphFormat | undefined,
    base: o["one-based"] ? 1 : undefined,
    build: {
      duplicates: o["merge-duplicates"] ? "merge" : "error",
      loops: o["drop-loops"] ? "drop" : "error",
    },
    graphSeed: o["graph-seed"] as number | undefined,
    stdin,
  };
}
