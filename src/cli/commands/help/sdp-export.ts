// `halfplus sdp-export`: its options and help text, apart from its implementation (../sdp-export.ts), so that
// `halfplus sdp-export --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { SOURCE_HELP, SOURCE_OPTIONS } from "../source-options.js";

export const sdpExportHelp: CommandHelp = {
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
};
