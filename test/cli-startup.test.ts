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
import { commandHelp } from "../src/cli/args.js";
import { COMMANDS } from "../src/cli/commands/index.js";
import { COMMAND_SUMMARIES } from "../src/cli/commands/summaries.js";
import { BIN, ROOT, ensureBuilt } from "./helpers/cli.js";

let register = "";

beforeAll(() => {
  ensureBuilt();
  const dir = mkdtempSync(join(tmpdir(), "halfplus-startup-"));
  // writeSync: the hooks run on their own thread, and an asynchronous write of the last module's
  // line could be lost when a short command (`cluster --help`) exits at once.
  writeFileSync(join(dir, "hooks.mjs"), `import { writeSync } from "node:fs";\nexport async function load(url, context, next) {\n  if (url.startsWith("file:")) writeSync(2, "LOADED " + url + "\\n");\n  return next(url, context);\n}\n`);
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
/** Command implementations loaded (help/<name>.js, a command's options and help text alone, apart). */
const commandModules = (paths: string[]): string[] => paths.filter((p) => p.startsWith("cli/commands/") && !p.startsWith("cli/commands/help/") && !SHARED.has(p));
const helpModules = (paths: string[]): string[] => paths.filter((p) => p.startsWith("cli/commands/help/"));
const familyModules = (paths: string[]): string[] => paths.filter((p) => p.startsWith("families/"));

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

  it("<command> --help loads that command's help module and no command's implementation", () => {
    for (const entry of COMMANDS) {
      const paths = loaded([entry.name, "--help"]);
      expect(commandModules(paths), entry.name).toEqual([]);
      expect(helpModules(paths), entry.name).toEqual([`cli/commands/help/${entry.name}.js`]);
      // Neither the solvers nor the store nor the family registry for a help text.
      for (const heavy of ["cut/bracket/bracket.js", "cut/bracket/verify.js", "experiment/sqlite-store.js", "families/registry.js", "fit/index.js"]) expect(paths, `${entry.name} --help`).not.toContain(heavy);
    }
  });

  it("a family spec loads that family's module (and nested specs' modules) only; families loads them all", () => {
    const petersen = familyModules(loaded(["cut", "petersen"]));
    expect(petersen).toContain("families/named/petersen.js");
    for (const other of ["families/registry.js", "families/catalog-structured.js", "families/kneser.js", "families/gnp.js", "families/operations/blow-up.js"]) expect(petersen).not.toContain(other);
    const nested = familyModules(loaded(["graph", "blow-up:of=[kneser:n=5,k=2],t=2"]));
    expect(nested).toEqual(expect.arrayContaining(["families/operations/blow-up.js", "families/kneser.js"]));
    for (const other of ["families/registry.js", "families/named/petersen.js", "families/polarity.js"]) expect(nested).not.toContain(other);
    const all = familyModules(loaded(["families"]));
    for (const each of ["families/registry.js", "families/kneser.js", "families/named/petersen.js", "families/operations/blow-up.js", "families/gnp.js"]) expect(all).toContain(each);
  });

  it("every table entry loads the spec of the same name and summary, in the listed order", async () => {
    expect(COMMANDS.map((c) => c.name)).toEqual(Object.keys(COMMAND_SUMMARIES));
    for (const entry of COMMANDS) {
      const spec = await entry.load();
      expect(spec.name).toBe(entry.name);
      expect(spec.summary).toBe(entry.summary);
      // One source for the help: the spec spreads its help module, so --help prints the same text
      // from either, and the option list the parser uses is the help module's own array.
      const help = await entry.help();
      expect(commandHelp(help)).toBe(commandHelp(spec));
      expect(spec.options).toBe(help.options);
      expect(Object.keys(spec).filter((k) => k !== "run").sort()).toEqual(Object.keys(help).sort());
    }
  });
});
