#!/usr/bin/env node
// Entry point of the `halfplus` command: dispatches to one module per subcommand.
// User mistakes (InputError) print one line and exit 2; anything else is a bug and
// prints its stack.

import { echo, isInputError, oneLine } from "../errors.js";
import { commandHelp, parseArgs, type CommandIO } from "./args.js";
import { COMMANDS } from "./commands/index.js";

function overview(): string {
  const w = Math.max(...COMMANDS.map((c) => c.name.length));
  return [
    "halfplus: graph families, structure checks and certified max-cut brackets for studying the",
    "max-cut surplus, maxcut − W/2 (W the total edge weight; m/2 for unweighted graphs).",
    "",
    "usage: halfplus <command> [arguments] [options]",
    "",
    "commands:",
    ...COMMANDS.map((c) => `  ${c.name.padEnd(w)}  ${c.summary}`),
    "",
    "A source is a graph file, `-` for standard input (graph6/sparse6 streams hold many graphs), or a",
    "family spec such as kneser:n=8,k=3. A random family's graph is fixed by its graph seed (seed= in",
    "the spec, or --graph-seed); the randomised solvers of `cut` have their own --solver-seed.",
    "With --json every record carries kind, version, the graph's hash and its source.",
    "",
    "Run `halfplus <command> --help` for a command's options.",
    "",
  ].join("\n");
}

export async function runCli(argv: readonly string[], io: CommandIO): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === "--help" || name === "-h" || name === "help") {
    io.stdout.write(overview());
    return name === undefined ? 2 : 0;
  }
  if (name === "--version") {
    io.stdout.write(`${await packageVersion()}\n`);
    return 0;
  }
  const entry = COMMANDS.find((c) => c.name === name);
  if (entry === undefined) {
    io.stderr.write(`halfplus: unknown command ${oneLine(echo(name))} (run halfplus --help)\n`);
    return 2;
  }
  // --help needs only the command's help module; otherwise only the invoked command's module (and what it imports) is loaded.
  if (rest.includes("--help") || rest.includes("-h")) {
    io.stdout.write(commandHelp(await entry.help()));
    return 0;
  }
  const cmd = await entry.load();
  try {
    return await cmd.run(parseArgs(cmd, rest), io);
  } catch (e) {
    if (isInputError(e)) {
      io.stderr.write(`halfplus ${cmd.name}: ${oneLine(e.message)}\n`);
      return 2;
    }
    throw e;
  }
}

async function packageVersion(): Promise<string> {
  const { readFile } = await import("node:fs/promises");
  const url = new URL("../../package.json", import.meta.url);
  return JSON.parse(await readFile(url, "utf8")).version as string;
}

// A closed downstream pipe (`halfplus graph - | head`) is a normal way to stop.
process.stdout.on("error", (e: NodeJS.ErrnoException) => {
  if (e.code === "EPIPE") process.exit(0);
  throw e;
});

const isMain = process.argv[1] !== undefined && import.meta.url === (await import("node:url")).pathToFileURL((await import("node:fs")).realpathSync(process.argv[1])).href;
if (isMain) {
  runCli(process.argv.slice(2), { stdout: process.stdout, stderr: process.stderr, stdin: process.stdin }).then(
    (code) => {
      process.exitCode = code;
      // Stopped by a signal: leave now, whatever else (a half-read stdin) still holds the event loop.
      if (code === 130 || code === 143) process.exit(code);
    },
    (e: unknown) => {
      process.stderr.write(`halfplus: internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
      process.exitCode = 1;
    },
  );
}
