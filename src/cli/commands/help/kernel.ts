// `halfplus kernel`: its options and help text, apart from its implementation (../kernel.ts), so that
// `halfplus kernel --help` prints without loading the implementation. The one home of this text.
import type { CommandHelp } from "../../args.js";
import { COMMAND_SUMMARIES } from "../summaries.js";
import { KERNEL_DISPLAY_NAME } from "../../kernelspec.js";

export const kernelHelp: CommandHelp = {
  name: "kernel",
  summary: COMMAND_SUMMARIES["kernel"],
  positionals: "<install|status>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    `install writes a Jupyter kernelspec named "${KERNEL_DISPLAY_NAME}" that runs tslab (a dependency of halfplus) with this Node, so TypeScript notebook cells can import "halfplus" and "halfplus/notebook". It goes to Jupyter's user data folder, or under --prefix DIR (then set JUPYTER_PATH=DIR/share/jupyter).`,
    "status checks Node, tslab, Jupyter, the installed kernel and whether notebooks in the current folder can import halfplus, and says how to fix what is missing; it exits 0 when everything is ready, 1 otherwise.",
  ],
  options: [
    { name: "user", type: "boolean", description: "install for this user (the default): Jupyter's user data folder" },
    { name: "prefix", type: "string", description: "install under DIR/share/jupyter/kernels (then JUPYTER_PATH=DIR/share/jupyter)", placeholder: "DIR" },
    { name: "json", type: "boolean", description: "status: print one JSON object" },
  ],
  examples: ["halfplus kernel install", "halfplus kernel install --prefix /tmp/jp && JUPYTER_PATH=/tmp/jp/share/jupyter jupyter nbconvert --execute --to html notebooks/quickstart.ipynb", "halfplus kernel status"],
};
