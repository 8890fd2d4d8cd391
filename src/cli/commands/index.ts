// Every subcommand, in the order `halfplus --help` lists them. Each command lives in its own
// file, loaded by `load` only when that command is asked for: importing every command up front
// pulled nearly the whole library into `halfplus --version` (about 0.5 CPU-seconds). A command's
// options and help text live in help/<name>.ts, which its implementation spreads into its spec, so
// `halfplus <name> --help` loads that file alone. To add a command, give it a summary in
// summaries.ts, its help in help/<name>.ts, and a line in both tables here.
import type { CommandHelp, CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES, type CommandName } from "./summaries.js";

export interface CommandEntry {
  name: CommandName;
  summary: string;
  /** The command's full spec (options, help text, `run`), imported on first call. */
  load(): Promise<CommandSpec>;
  /** Its options and help text alone (`help/<name>.ts`), without the implementation: what `--help` loads. */
  help(): Promise<CommandHelp>;
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

const HELPS: Readonly<Record<CommandName, () => Promise<CommandHelp>>> = {
  families: async () => (await import("./help/families.js")).familiesHelp,
  graph: async () => (await import("./help/graph.js")).graphHelp,
  encode: async () => (await import("./help/encode.js")).encodeHelp,
  cut: async () => (await import("./help/cut.js")).cutHelp,
  bounds: async () => (await import("./help/bounds.js")).boundsHelp,
  verify: async () => (await import("./help/verify.js")).verifyHelp,
  "sdp-export": async () => (await import("./help/sdp-export.js")).sdpExportHelp,
  sweep: async () => (await import("./help/sweep.js")).sweepHelp,
  export: async () => (await import("./help/export.js")).exportHelp,
  import: async () => (await import("./help/import.js")).importHelp,
  merge: async () => (await import("./help/merge.js")).mergeHelp,
  fit: async () => (await import("./help/fit.js")).fitHelp,
  census: async () => (await import("./help/census.js")).censusHelp,
  hunt: async () => (await import("./help/hunt.js")).huntHelp,
  cluster: async () => (await import("./help/cluster.js")).clusterHelp,
  kernel: async () => (await import("./help/kernel.js")).kernelHelp,
};

export const COMMANDS: readonly CommandEntry[] = (Object.keys(COMMAND_SUMMARIES) as CommandName[]).map((name) => ({
  name,
  summary: COMMAND_SUMMARIES[name],
  load: LOADERS[name],
  help: HELPS[name],
}));
