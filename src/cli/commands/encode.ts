// `halfplus encode <source>`: writes every graph a source denotes (family spec, file, stream) as
// text in one format, so halfplus families feed other tools and pipes:
// `halfplus encode kneser:n=7,k=2 | nauty-countg`, `... | halfplus cut -`.
import { closeSync, openSync, writeSync } from "node:fs";
import { InputError } from "../../errors.js";
import { GRAPH_FORMATS, writeGraph, type GraphFormat } from "../../graph/formats/index.js";
import { openSource } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES } from "./summaries.js";
import { writeLine } from "../output.js";
import { SOURCE_HELP, SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";

/** Formats that hold any number of graphs, one per line; the others hold one graph per file. */
const STREAM_FORMATS: readonly GraphFormat[] = ["graph6", "sparse6"];

export const encodeCommand: CommandSpec = {
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
  async run(args, io) {
    const format = args.options["as"] as GraphFormat;
    const outPath = args.options["out"] as string | undefined;
    if (outPath === "") throw new InputError("--out needs a file name");
    let fd: number | null = null;
    let count = 0;
    try {
      for await (const item of openSource(args.positionals[0], sourceOptionsFrom(args, io.stdin))) {
        if (++count === 2 && !STREAM_FORMATS.includes(format)) {
          throw new InputError(`${item.label}: ${format} holds one graph per file and this source has more; use --as graph6 or --as sparse6 for streams`);
        }
        for (const note of item.notes) io.stderr.write(`note: ${item.label}: ${note}\n`);
        const text = writeGraph(item.graph, format);
        if (outPath === undefined || outPath === "-") {
          await writeLine(io.stdout, text.endsWith("\n") ? text.slice(0, -1) : text);
          continue;
        }
        // Opened only once the first graph is read, so a bad source leaves no empty file behind.
        if (fd === null) {
          try {
            fd = openSync(outPath, "w");
          } catch (e) {
            throw new InputError(`--out ${outPath}: cannot write (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
          }
        }
        writeSync(fd, text);
      }
    } finally {
      if (fd !== null) closeSync(fd);
    }
    return 0;
  },
};
