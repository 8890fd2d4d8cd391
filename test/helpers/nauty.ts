// Runs nauty's Debian tools (geng, labelg, genspecialg) and collects their graph6 output lines;
// callers declare the tool with itNeeds / describeNeeds (test/helpers/requirements.ts).
import { spawnSync } from "node:child_process";

function run(tool: string, args: string[], input?: string): string[] {
  const r = spawnSync(tool, args, { input, encoding: "utf8", maxBuffer: 1 << 28 });
  if (r.status !== 0) throw new Error(`${tool} ${args.join(" ")} failed: ${r.error?.message ?? r.stderr}`);
  return r.stdout.split("\n").filter((l) => l !== "");
}

/** The graph6 lines of `nauty-geng -q ...args` (e.g. ["-c", "7"]: connected graphs on 7 vertices). */
export function gengLines(args: string[]): string[] {
  return run("nauty-geng", ["-q", ...args]);
}

/** Canonical graph6 of each input line (graph6 or sparse6), via `nauty-labelg -q -g`. */
export function labelgLines(lines: string[]): string[] {
  return run("nauty-labelg", ["-q", "-g"], lines.join("\n") + "\n");
}

/** The graph6 lines of `nauty-genspecialg -q -g ...switches` (e.g. ["-P5,2"]). */
export function genspecialLines(switches: string[]): string[] {
  return run("nauty-genspecialg", ["-q", "-g", ...switches]);
}
