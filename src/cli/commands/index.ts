// Every subcommand, in the order `halfplus --help` lists them. Each command lives in its own
// file; register it with one import line and one push below.
import type { CommandSpec } from "../args.js";

export const COMMANDS: CommandSpec[] = [];
