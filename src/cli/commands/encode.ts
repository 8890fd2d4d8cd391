// `halfplus encode <source>`: writes every graph a source denotes (family spec, file, stream) as
// text in one format, so halfplus families feed other tools and pipes:
// `halfplus encode kneser:n=7,k=2 | nauty-countg`, `... | halfplus cut -`.
import { closeSync, openSync, writeSync } from "node:fs";
import { InputError } from "../../errors.js";
import { writeGraph, type GraphFormat } from "../../graph/formats/index.js";
import { openSource } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { encodeHelp } from "./help/encode.js";
import { writeLine } from "../output.js";
import { sourceOptionsFrom } from "./source-options.js";

/** Formats that hold any number of graphs, one per line; the others hold one graph per file. */
const STREAM_FORMATS: readonly GraphFormat[] = ["graph6", "sparse6"];

export const encodeCommand: CommandSpec = {
  ...encodeHelp,
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
