// The published package works in a notebook: `npm pack` makes the tarball users install, a project
// of its own installs it with npm (offline, from npm's cache: `npm ci --offline` with a lock file
// made from this repository's, so the same dependency versions as `npm ci` here), `halfplus kernel
// install --prefix` from the installed copy writes the kernelspec, and Jupyter (Debian's
// jupyter-nbconvert) runs a notebook beside the project's code that imports "halfplus" and
// "halfplus/notebook" and shows every kind of output. A fresh copy of the repository gets the same
// package through the link `npm ci` makes (node_modules/halfplus → ..), checked here from the lock
// file; test/notebooks.test.ts executes notebooks through that link.
import { spawnSync } from "node:child_process";
import { cpSync, mkdirSync, mkdtempSync, readFileSync, realpathSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, expect, it } from "vitest";
import { ROOT, ensureBuilt } from "./helpers/cli.js";
import { describeNeeds, tool } from "./helpers/requirements.js";

/** A notebook that touches both entry points and every kind of output. */
function smallNotebook(): string {
  const cells = [
    'import { family, surplusScalingFigure, bracket, degeneracy } from "halfplus";\nimport { describe, table, show, bracketCard } from "halfplus/notebook";',
    'const g = family("petersen");\ndescribe(g, { label: "petersen" });',
    'const r = bracket(g, { seconds: 1, solverSeed: 1, effort: "exact", source: { spec: "petersen" } });\nbracketCard(r);\ntable([{ n: g.n, m: g.m, surplus: r.surplusLower }]);',
    'await show(surplusScalingFigure([{ key: "petersen", family: "named", n: g.n, m: g.m, degeneracy: degeneracy(g).degeneracy, maxDegree: 3, averageDegree: 3, surplusLower: r.surplusLower, surplusUpper: r.surplusUpper, exact: r.exact }]), { static: "sketch" });',
  ];
  return JSON.stringify({
    cells: cells.map((s) => ({ cell_type: "code", execution_count: null, metadata: {}, outputs: [], source: s })),
    metadata: { kernelspec: { name: "halfplus", display_name: "halfplus · TypeScript", language: "typescript" } },
    nbformat: 4,
    nbformat_minor: 4,
  });
}

interface LockEntry {
  version?: string;
  resolved?: string;
  link?: boolean;
  dev?: boolean;
  devOptional?: boolean;
  [key: string]: unknown;
}

describeNeeds([tool("jupyter-nbconvert"), tool("npm")], "the packed package installed into a project and used in a notebook", () => {
  let work: string;
  let tarball: string;
  const pkg = JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8")) as { name: string; version: string; license: string; dependencies: Record<string, string>; bin: unknown; engines: unknown };
  const lock = JSON.parse(readFileSync(join(ROOT, "package-lock.json"), "utf8")) as { packages: Record<string, LockEntry> };
  const run = (cmd: string, args: string[], cwd: string, env: NodeJS.ProcessEnv = {}) => {
    const r = spawnSync(cmd, args, { cwd, encoding: "utf8", timeout: 600_000, env: { ...process.env, PYDEVD_DISABLE_FILE_VALIDATION: "1", npm_config_audit: "false", npm_config_fund: "false", npm_config_update_notifier: "false", ...env } });
    return { code: r.status ?? -1, out: `${r.stdout}\n${r.stderr}`, stdout: r.stdout };
  };

  beforeAll(() => {
    ensureBuilt();
    work = mkdtempSync(join(tmpdir(), "halfplus-install-"));
  });
  afterAll(() => {
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it("npm pack: the tarball holds the built package, the notebook entry point and the README, and no sources or tests", () => {
    const pack = run("npm", ["pack", "--ignore-scripts", "--json", "--pack-destination", work], ROOT);
    expect(pack.code, pack.out.slice(-3000)).toBe(0);
    const [info] = JSON.parse(pack.stdout) as { filename: string; files: { path: string }[] }[];
    tarball = join(work, info.filename);
    const files = info.files.map((f) => f.path);
    for (const f of ["package.json", "README.md", "dist/index.js", "dist/index.d.ts", "dist/notebook/index.js", "dist/notebook/index.d.ts", "notebook/package.json", "dist/cli/main.js"])
      expect(files, f).toContain(f);
    expect(files.filter((f) => /^(src|test|kernel-helpers|notebooks|scripts|bench)\//.test(f))).toEqual([]);
  });

  it("a fresh copy of the repository gets the package through npm ci's self-link (the lock file says so, and this checkout has it)", () => {
    // npm ci installs exactly what package-lock.json lists: a link entry makes node_modules/halfplus → ..
    expect(lock.packages["node_modules/halfplus"]).toEqual({ resolved: "", link: true });
    expect((lock.packages[""] as { devDependencies?: Record<string, string> }).devDependencies?.halfplus).toBe("file:.");
    expect(realpathSync(join(ROOT, "node_modules", "halfplus"))).toBe(realpathSync(ROOT));
  });

  it("a project that depends on halfplus (npm ci --offline of the tarball): the store's native module loads and a notebook imports both entry points", () => {
    expect(tarball, "the pack test ran").toBeDefined();
    const project = join(work, "project");
    mkdirSync(project);
    const spec = `file:${tarball}`;
    // The project's lock: halfplus from the tarball, its dependencies at the versions this repository's lock
    // pins (without the dev tools), so npm installs them from its cache, offline.
    const packages: Record<string, LockEntry> = {
      "": { name: "surplus-study", version: "1.0.0", dependencies: { halfplus: spec } },
      "node_modules/halfplus": { version: pkg.version, resolved: spec, license: pkg.license, dependencies: pkg.dependencies, bin: pkg.bin, engines: pkg.engines },
    };
    for (const [path, entry] of Object.entries(lock.packages)) if (path.startsWith("node_modules/") && path !== "node_modules/halfplus" && !entry.dev && !entry.devOptional) packages[path] = entry;
    writeFileSync(join(project, "package.json"), JSON.stringify({ name: "surplus-study", version: "1.0.0", private: true, type: "module", dependencies: { halfplus: spec } }));
    writeFileSync(join(project, "package-lock.json"), JSON.stringify({ name: "surplus-study", version: "1.0.0", lockfileVersion: 3, requires: true, packages }));
    // Install scripts are skipped: the one that matters, better-sqlite3's source build, made this checkout's
    // addon (same package version, same Node), which is copied instead of compiled again (minutes on two cores).
    const inst = run("npm", ["ci", "--offline", "--ignore-scripts"], project);
    expect(inst.code, `${inst.out.slice(-3000)}\n(npm's cache is filled by npm ci in this checkout)`).toBe(0);
    const installed = JSON.parse(readFileSync(join(project, "node_modules", "halfplus", "package.json"), "utf8")) as { version: string };
    expect(installed.version).toBe(pkg.version);
    cpSync(join(ROOT, "node_modules", "better-sqlite3", "build", "Release", "better_sqlite3.node"), join(project, "node_modules", "better-sqlite3", "build", "Release", "better_sqlite3.node"));
    const store = run(process.execPath, ["-e", `const D = require(${JSON.stringify(join(project, "node_modules", "better-sqlite3"))}); new D(":memory:").prepare("select 1 as one").get().one === 1 || process.exit(1);`], project);
    expect(store.code, store.out).toBe(0);

    // The kernel, installed by the project's own copy of the CLI, into a prefix Jupyter is pointed at.
    const prefix = join(work, "prefix");
    const cli = join(project, "node_modules", "halfplus", "dist", "cli", "main.js");
    const kernel = run(process.execPath, [cli, "kernel", "install", "--prefix", prefix], project);
    expect(kernel.code, kernel.out).toBe(0);
    const kernelSpec = JSON.parse(readFileSync(join(prefix, "share", "jupyter", "kernels", "halfplus", "kernel.json"), "utf8")) as { argv: string[] };
    expect(kernelSpec.argv[1].startsWith(project)).toBe(true);

    writeFileSync(join(project, "study.ipynb"), smallNotebook());
    mkdirSync(join(work, "runtime"));
    const r = run("jupyter", ["nbconvert", "--to", "notebook", "--execute", "--ExecutePreprocessor.timeout=300", join(project, "study.ipynb"), "--output", join(work, "study-out.ipynb")], project, {
      JUPYTER_PATH: join(prefix, "share", "jupyter"),
      JUPYTER_RUNTIME_DIR: join(work, "runtime"),
    });
    expect(r.code, r.out.slice(-3000)).toBe(0);
    const nb = JSON.parse(readFileSync(join(work, "study-out.ipynb"), "utf8")) as { cells: { outputs: { output_type: string; data?: Record<string, string | string[]> }[] }[] };
    expect(nb.cells.flatMap((c) => c.outputs).filter((o) => o.output_type === "error")).toEqual([]);
    const texts = nb.cells.flatMap((c) => c.outputs).map((o) => [o.data?.["text/plain"] ?? ""].flat().join(""));
    expect(texts.some((t) => t.startsWith("petersen\nvertices"))).toBe(true);
    // The Petersen graph's max cut is 12 of its 15 edges (from memory; also test/cut-exact.test.ts).
    expect(texts.some((t) => t.includes("12 ≤ max cut ≤ 12"))).toBe(true);
    expect(texts.some((t) => t.startsWith("figure: "))).toBe(true);
  }, 600_000);
});
