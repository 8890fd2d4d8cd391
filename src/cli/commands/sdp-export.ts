// `halfplus sdp-export <source> [-o file]`: writes the graph's max-cut SDP relaxation in SDPA
// sparse format, for cross-checking with an outside SDP solver (e.g. `dsdp5 file.dat-s`).
import { writeFile } from "node:fs/promises";
import { InputError } from "../../errors.js";
import { toSdpa } from "../../cut/sdpa.js";
import { openSingleGraph } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";

/** The parser knows only long options; accept `-o FILE` among the positionals as well. */
function splitOutput(positionals: string[], long: string | undefined): { source: string; output: string | undefined } {
  const rest: string[] = [];
  let output = long;
  for (let i = 0; i < positionals.length; i++) {
    if (positionals[i] === "-o") {
      if (i + 1 >= positionals.length) throw new InputError("-o needs a file name");
      if (output !== undefined) throw new InputError("give the output file once (-o or --output)");
      output = positionals[++i];
    } else rest.push(positionals[i]);
  }
  if (rest.length !== 1) throw new InputError(rest.length === 0 ? "missing <source>" : `expected one source, got ${rest.join(" ")}`);
  return { source: rest[0], output };
}

export const sdpExportCommand: CommandSpec = {
  name: "sdp-export",
  summary: "write the max-cut SDP relaxation in SDPA sparse format (.dat-s)",
  positionals: "<source> [-o file]",
  minPositionals: 1,
  maxPositionals: 3,
  options: [{ name: "output", type: "string", description: "write to this file instead of standard output (same as -o)", placeholder: "FILE" }, ...SOURCE_OPTIONS],
  examples: ["halfplus sdp-export petersen -o petersen.dat-s", "halfplus sdp-export G1.txt --format gset > G1.dat-s"],
  async run(args, io) {
    const { source, output } = splitOutput(args.positionals, args.options["output"] as string | undefined);
    const item = await openSingleGraph(source, sourceOptionsFrom(args, io.stdin));
    for (const note of item.notes) io.stderr.write(`note: ${note}\n`);
    const text = toSdpa(item.graph, { comment: `max-cut SDP relaxation of ${item.label.replace(/[\r\n]/g, " ")}: n = ${item.graph.n}, m = ${item.graph.m}` });
    if (output === undefined || output === "-") {
      await new Promise<void>((resolve, reject) => io.stdout.write(text, (e) => (e ? reject(e) : resolve())));
    } else await writeFile(output, text);
    return 0;
  },
};
