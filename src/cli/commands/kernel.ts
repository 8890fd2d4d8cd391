// `halfplus kernel install [--user | --prefix DIR]` writes the Jupyter kernelspec for TypeScript
// notebooks that import halfplus; `halfplus kernel status` says what is installed and how to get
// what is missing.
import { InputError } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { KERNEL_DISPLAY_NAME, formatKernelStatus, installKernelSpec, kernelStatus } from "../kernelspec.js";

const ACTIONS = ["install", "status"] as const;

export const kernelCommand: CommandSpec = {
  name: "kernel",
  summary: "install or check the Jupyter kernel for TypeScript notebooks (tslab)",
  positionals: "<install|status>",
  minPositionals: 1,
  maxPositionals: 1,
  options: [
    { name: "user", type: "boolean", description: "install for this user (the default): Jupyter's user data folder" },
    { name: "prefix", type: "string", description: "install under DIR/share/jupyter/kernels (then JUPYTER_PATH=DIR/share/jupyter)", placeholder: "DIR" },
    { name: "json", type: "boolean", description: "status: print one JSON object" },
  ],
  examples: ["halfplus kernel install", "halfplus kernel install --prefix /tmp/jp && JUPYTER_PATH=/tmp/jp/share/jupyter jupyter nbconvert --execute --to html notebooks/quickstart.ipynb", "halfplus kernel status"],
  async run(args, io) {
    const action = args.positionals[0];
    if (!(ACTIONS as readonly string[]).includes(action)) throw new InputError(`unknown action ${JSON.stringify(action)}: one of ${ACTIONS.join(", ")}`);
    if (action === "install") {
      const { dir, spec } = installKernelSpec({ user: args.options["user"] === true, prefix: args.options["prefix"] as string | undefined });
      io.stdout.write(`installed kernel "${KERNEL_DISPLAY_NAME}" in ${dir}\n  runs: ${spec.argv.slice(0, 3).join(" ")}\n`);
      return 0;
    }
    const status = kernelStatus();
    io.stdout.write(args.options["json"] === true ? `${JSON.stringify(status)}\n` : formatKernelStatus(status));
    return status.ready ? 0 : 1;
  },
};
