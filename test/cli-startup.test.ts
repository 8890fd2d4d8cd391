// The command line loads only the invoked command's modules (src/cli/commands/index.ts). Checked by
// listing every ES module the main thread loads (a module-loading hook prints each URL on stderr);
// module counts, not timings, so load on the machine cannot change the outcome. The rule and the
// hook are common practice, no source.
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { beforeAll, describe, expect, it } from "vitest";
import { COMMANDS } from "../src/cli/commands/index.js";
import { COMMAND_SUMMARIES } from "../src/cli/commands/summaries.js";
import { BIN, ROOT, ensureBuilt } from "./helpers/cli.js";

let register = "";

beforeAll(() => {
  ensureBuilt();
  const dir = mkdtempSync(join(tmpdir(), "halfplus-startup-"));
  writeFileSync(join(dir, "hooks.mjs"), `export async function load(url, context, next) {\n  if (url.startsWith("file:")) process.stderr.write("LOADED " + url + "\\n");\n  return next(url, context);\n}\n`);
  writeFileSync(join(dir, "register.mjs"), `import { register } from "node:module";\nregister(${JSON.stringify(pathToFileURL(join(dir, "hooks.mjs")).href)});\n`);
  register = join(dir, "register.mjs");
});

/** The dist/-relative paths of the modules the main thread loaded for `halfplus ...args`. */
function loaded(args: string[]): string[] {
  const r = spawnSync(process.execPath, ["--import", register, BIN, ...args], { cwd: ROOT, timeout: 120_000 });
  expect(r.status).toBe(0);
  const prefix = pathToFileURL(join(ROOT, "dist")).href + "/";
  return r.stderr
    .toString()
    .split("\n")
    .filter((l) => l.startsWith("LOADED "))
    .map((l) => l.slice("LOADED ".length))
    .filter((u) => u.startsWith(prefix))
    .map((u) => u.slice(prefix.length));
}

// The table itself and the option lists that several commands share.
const SHARED = new Set(["index", "summaries", "source-options", "solver-options"].map((m) => `cli/commands/${m}.js`));
const commandModules = (paths: string[]): string[] => paths.filter((p) => p.startsWith("cli/commands/") && !SHARED.has(p));

describe("halfplus start-up", () => {
  it("--version and --help load no command's module", () => {
    for (const args of [["--version"], ["--help"]]) {
      const paths = loaded(args);
      expect(paths).toContain("cli/main.js"); // the hook does see the CLI's own modules
      expect(commandModules(paths)).toEqual([]);
    }
  });

  it("cut loads its own module, not the others', and leaves the solvers to the bracket worker", () => {
    const paths = loaded(["cut", "petersen"]);
    expect(commandModules(paths)).toEqual(["cli/commands/cut.js"]);
    expect(paths).not.toContain("cut/bracket/bracket.js");
    expect(paths).not.toContain("cut/tree/relaxation-tree.js");
  });

  it("graph loads only its own command module", () => {
    expect(commandModules(loaded(["graph", "petersen"]))).toEqual(["cli/commands/graph.js"]);
  });

  it("every table entry loads the spec of the same name and summary, in the listed order", async () => {
    expect(COMMANDS.map((c) => c.name)).toEqual(Object.keys(COMMAND_SUMMARIES));
    for (const entry of COMMANDS) {
      const spec = await entry.load();
      expect(spec.name).toBe(entry.name);
      expect(spec.summary).toBe(entry.summary);
    }
  });
});
