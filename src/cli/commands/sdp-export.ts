// `halfplus sdp-export <source> [-o FILE]`: writes the graph's max-cut SDP relaxation in SDPA
// sparse format, for cross-checking with an outside SDP solver (e.g. `dsdp5 file.dat-s`).
import { writeFile } from "node:fs/promises";
import { toSdpa } from "../../cut/relaxation/sdpa.js";
import { openSingleGraph } from "../../sources/index.js";
import type { CommandSpec } from "../args.js";
import { sdpExportHelp } from "./help/sdp-export.js";
import { sourceOptionsFrom } from "./source-options.js";

export const sdpExportCommand: CommandSpec = {
  ...sdpExportHelp,
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
