// Every subcommand, in the order `halfplus --help` lists them. Each command lives in its own
// file, loaded by `load` only when that command is asked for: importing every command up front
// pulled nearly the whole library into `halfplus --version` (about 0.5 CPU-seconds). To add a
// command, give it a summary in summaries.ts and a line here.
import type { CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES, type CommandName } from "./summaries.js";

export interface CommandEntry {
  name: CommandName;
  summary: string;
  /** The command's full spec (options, help text, `run`), imported on first call. */
  load(): Promise<CommandSpec>;
}

const LOADERS: Readonly<Record<CommandName, () => Promise<CommandSpec>>> = {
  families: async () => (await import("./families.js")).familiesCommand,
  graph: async () => (await import("./graph.js")).graphCommand,
  encode: async () => (await import("./encode.js")).encodeCommand,
  cut: async () => (await import("./cut.js")).cutCommand,
  bounds: async () => (await import("./bounds.js")).boundsCommand,
  verify: async () => (await import("./verify.js")).verifyCommand,
  "sdp-export": async () => (await import("./sdp-export.js")).sdpExportCommand,
  sweep: async () => (await import("./sweep.js")).sweepCommand,
  export: async () => (await import("./export.js")).exportCommand,
  import: async () => (await import("./import.js")).importCommand,
  merge: async () => (await import("./merge.js")).mergeCommand,
  fit: async () => (await import("./fit.js")).fitCommand,
  census: async () => (await import("./census.js")).censusCommand,
  hunt: async () => (await import("./hunt.js")).huntCommand,
  cluster: async () => (await import("./cluster.js")).clusterCommand,
  kernel: async () => (await import("./kernel.js")).kernelCommand,
};

export const COMMANDS: readonly CommandEntry[] = (Object.keys(COMMAND_SUMMARIES) as CommandName[]).map((name) => ({
  name,
  summary: COMMAND_SUMMARIES[name],
  load: LOADERS[name],
}));
