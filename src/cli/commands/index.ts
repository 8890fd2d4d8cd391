// Every subcommand, in the order `halfplus --help` lists them. Each command lives in its own
// file; to add one, import it here and put it in the list.
import type { CommandSpec } from "../args.js";
import { boundsCommand } from "./bounds.js";
import { cutCommand } from "./cut.js";
import { encodeCommand } from "./encode.js";
import { familiesCommand } from "./families.js";
import { graphCommand } from "./graph.js";
import { kernelCommand } from "./kernel.js";
import { sdpExportCommand } from "./sdp-export.js";
import { verifyCommand } from "./verify.js";
import { sweepCommand } from "./sweep.js";
import { exportCommand } from "./export.js";
import { importCommand } from "./import.js";
import { mergeCommand } from "./merge.js";
import { fitCommand } from "./fit.js";
import { clusterCommand } from "./cluster.js";
import { censusCommand } from "./census.js";
import { huntCommand } from "./hunt.js";

export const COMMANDS: readonly CommandSpec[] = [familiesCommand, graphCommand, encodeCommand, cutCommand, boundsCommand, verifyCommand, sdpExportCommand, sweepCommand, exportCommand, importCommand, mergeCommand, fitCommand, censusCommand, huntCommand, clusterCommand, kernelCommand];
