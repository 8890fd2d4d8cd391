// Every subcommand, in the order `halfplus --help` lists them. Each command lives in its own
// file; register it with one import line and one push below.
import type { CommandSpec } from "../args.js";

export const COMMANDS: CommandSpec[] = [];
import { graphCommand } from "./graph.js";
COMMANDS.push(graphCommand);
import { familiesCommand } from "./families.js";
COMMANDS.push(familiesCommand);
import { cutCommand } from "./cut.js";
COMMANDS.push(cutCommand);
import { verifyCommand } from "./verify.js";
COMMANDS.push(verifyCommand);
import { sdpExportCommand } from "./sdp-export.js";
COMMANDS.push(sdpExportCommand);
