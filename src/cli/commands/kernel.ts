// `halfplus kernel install [--user | --prefix DIR]` writes the Jupyter kernelspec for TypeScript
// notebooks that import halfplus; `halfplus kernel status` says what is installed and how to get
// what is missing.
import { InputError, echo } from "../../errors.js";
import type { CommandSpec } from "../args.js";
import { kernelHelp } from "./help/kernel.js";
import { KERNEL_DISPLAY_NAME, formatKernelStatus, installKernelSpec, kernelStatus } from "../kernelspec.js";
import { writeLine } from "../output.js";

const ACTIONS = ["install", "status"] as const;

export const kernelCommand: CommandSpec = {
  ...kernelHelp,
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
