// `halfplus kernel install [--user | --prefix DIR]` writes the Jupyter kernelspec for TypeScript
// notebooks that import halfplus; `halfplus kernel status` says what is installed and how to get
// what is missing.
import { InputError, echo } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES } from "./summaries.js";
import { KERNEL_DISPLAY_NAME, formatKernelStatus, installKernelSpec, kernelStatus } from "../kernelspec.js";
import { writeLine } from "../output.js";

const ACTIONS = ["install", "status"] as const;

export const kernelCommand: CommandSpec = {
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
  async run(args, io) {
    const action = args.positionals[0];
    if (!(ACTIONS as readonly string[]).includes(action)) throw new InputError(`unknown action ${echo(action)}: one of ${ACTIONS.join(", ")}`);
    if (action === "install") {
      if (args.options["json"] === true) throw new InputError("--json applies to kernel status");
      const { dir, spec } = installKernelSpec({ user: args.options["user"] === true, prefix: args.options["prefix"] as string | undefined });
      await writeLine(io.stdout, `installed kernel "${KERNEL_DISPLAY_NAME}" in ${dir}\n  runs: ${spec.argv.slice(0, 3).join(" ")}`);
      return 0;
    }
    if (args.options["user"] !== undefined || args.options["prefix"] !== undefined) throw new InputError("--user and --prefix apply to kernel install");
    const status = kernelStatus();
    await writeLine(io.stdout, args.options["json"] === true ? JSON.stringify(status) : formatKernelStatus(status).trimEnd());
    return status.ready ? 0 : 1;
  },
};
