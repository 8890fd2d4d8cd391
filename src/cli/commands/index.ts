// Every subcommand, in the order `halfplus --help` lists them. Add new commands here.
import type { CommandSpec } from "../args.js";

export const COMMANDS: CommandSpec[] = [];
