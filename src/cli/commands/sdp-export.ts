// `halfplus sdp-export <source> [-o FILE]`: writes the graph's max-cut SDP relaxation in SDPA
// sparse format, for cross-checking with an outside SDP solver (e.g. `dsdp5 file.dat-s`).
import { writeFile } from "node:fs/promises";
import { toSdpa } from "../../cut/relaxation/sdpa.js";
import { openSingleGraph } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES } from "./summaries.js";
import { SOURCE_HELP, SOURCE_OPTIONS, sourceOptionsFrom } from "./source-options.js";

export const sdpExportCommand: CommandSpec = {
  name: "sdp-export",
  summary: COMMAND_SUMMARIES["sdp-export"],
  description: [
    "The Goemans–Williamson relaxation max ¼⟨L, X⟩ subject to diag X = 1, X positive semidefinite (L the weighted Laplacian), in the format SDPA-family solvers read (e.g. dsdp5), so halfplus's SDP bounds can be cross-checked. The source must hold exactly one graph.",
    SOURCE_HELP,
  ],
  positionals: "<source>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [{ name: "out", short: "o", type: "string", description: "write to FILE instead of standard output", placeholder: "FILE" }, ...SOURCE_OPTIONS],
  examples: ["halfplus sdp-export petersen -o petersen.dat-s", "halfplus sdp-export G1.txt --format gset > G1.dat-s"],
  async run(args, io) {
    const source = args.positionals[0];
    const output = args.options["out"] as string | undefined;
    const item = await openSingleGraph(source, sourceOptionsFrom(args, io.stdin));
    for (const note of item.notes) io.stderr.write(`note: ${note}\n`);
    const text = toSdpa(item.graph, { comment: `max-cut SDP relaxation of ${item.label.replace(/[\r\n]/g, " ")}: n = ${item.graph.n}, m = ${item.graph.m}` });
    if (output === undefined || output === "-") {
      await new Promise<void>((resolve, reject) => io.stdout.write(text, (e) => (e ? reject(e) : resolve())));
    } else await writeFile(output, text);
    return 0;
  },
};
