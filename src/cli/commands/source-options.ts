// Options shared by every command that reads graphs, and their translation to openSource.
import type { OptionSpec, ParsedArgs } from "../args.js";
import type { OpenSourceOptions } from "../../sources/index.js";
import { GRAPH_FORMATS, type GraphFormat } from "../../graph/formats/index.js";

export const SOURCE_OPTIONS: readonly OptionSpec[] = [
  {
    name: "format",
    type: "string",
    description: "input format, overriding detection from extension and content",
    choices: GRAPH_FORMATS,
    placeholder: "F",
  },
  { name: "one-based", type: "boolean", description: "edge-list vertex ids start at 1 (default 0)" },
  { name: "merge-duplicates", type: "boolean", description: "merge repeated edges (weights add) instead of failing" },
  { name: "drop-loops", type: "boolean", description: "drop self-loops instead of failing" },
];

export function sourceOptionsFrom(args: ParsedArgs, stdin: NodeJS.ReadableStream): OpenSourceOptions {
  const o = args.options;
  return {
    format: o["format"] as GraphFormat | undefined,
    base: o["one-based"] ? 1 : undefined,
    build: {
      duplicates: o["merge-duplicates"] ? "merge" : "error",
      loops: o["drop-loops"] ? "drop" : "error",
    },
    stdin,
  };
}
