// The two ways people get the kernel, each from nothing: (1) a fresh copy of this repository
// (every tracked and new file, no node_modules, no dist) set up with `npm ci`, and (2) a project
// of its own that installs halfplus as a dependency (from `npm pack`). In both, `halfplus kernel
// install --prefix` writes the kernelspec and a notebook beside the code imports "halfplus" and
// "halfplus/notebook", run headless by Jupyter (Debian's jupyter-nbconvert).
import { spawnSync } from "node:child_process";
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync, cpSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { afterAll, beforeAll, expect, it } from "vitest";
import { ROOT } from "./helpers/cli.js";
import { describeNeeds, tool } from "./helpers/requirements.js";

/** A notebook that touches both entry points and every kind of output. */
function smallNotebook(): string {
  const cells = [
    'import { family, surplusScalingFigure, bracket, degeneracy } from "halfplus";\nimport { describe, table, show, bracketCard } from "halfplus/notebook";',
    'const g = family("petersen");\ndescribe(g, { label: "petersen" });',
    'const r = bracket(g, { seconds: 1, solverSeed: 1, effort: "auto", source: { spec: "petersen" } });\nbracketCard(r);\ntable([{ n: g.n, m: g.m, surplus: r.surplusLower }]);',
    'await show(surplusScalingFigure([{ key: "petersen", family: "named", n: g.n, m: g.m, degeneracy: degeneracy(g).degeneracy, maxDegree: 3, averageDegree: 3, surplusLower: r.surplusLower, surplusUpper: r.surplusUpper, exact: r.exact }]), { static: "sketch" });',
  ];
  return JSON.stringify({
    cells: cells.map((s) => ({ cell_type: "code", execution_count: null, metadata: {}, outputs: [], source: s })),
    metadata: { kernelspec: { name: "halfplus", display_name: "halfplus · TypeScript", language: "typescript" } },
    nbformat: 4,
    nbformat_minor: 4,
  });
}

describeNeeds([tool("jupyter-nbconvert"), tool("npm"), tool("git")], "installing the kernel from nothing", () => {
  let work: string;
  const run = (cmd: string, args: string[], cwd: string, env: NodeJS.ProcessEnv = {}) => {
    const r = spawnSync(cmd, args, { cwd, encoding: "utf8", timeout: 600_000, env: { ...process.env, PYDEVD_DISABLE_FILE_VALIDATION: "1", npm_config_audit: "false", npm_config_fund: "false", ...env } });
    return { code: r.status ?? -1, out: `${r.stdout}\n${r.stderr}` };
  };

  /** Installs the kernel with that copy's CLI, runs the notebook in `dir`, returns the outputs' text. */
  function runNotebook(cli: string[], cwd: string, dir: string, name: string): string[] {
    const prefix = join(work, `prefix-${name}`);
    const inst = run(cli[0], [...cli.slice(1), "kernel", "install", "--prefix", prefix], cwd);
    expect(inst.code, inst.out).toBe(0);
    const spec = JSON.parse(readFileSync(join(prefix, "share", "jupyter", "kernels", "halfplus", "kernel.json"), "utf8"));
    expect(spec.argv[1].startsWith(cwd)).toBe(true);
    writeFileSync(join(dir, `${name}.ipynb`), smallNotebook());
    mkdirSync(join(work, `runtime-${name}`), { recursive: true });
    const r = run("jupyter", ["nbconvert", "--to", "notebook", "--execute", "--ExecutePreprocessor.timeout=300", join(dir, `${name}.ipynb`), "--output", join(work, `${name}-out.ipynb`)], dir, {
      JUPYTER_PATH: join(prefix, "share", "jupyter"),
      JUPYTER_RUNTIME_DIR: join(work, `runtime-${name}`),
    });
    expect(r.code, r.out.slice(-3000)).toBe(0);
    const nb = JSON.parse(readFileSync(join(work, `${name}-out.ipynb`), "utf8")) as { cells: { outputs: { data?: Record<string, string | string[]> }[] }[] };
    return nb.cells.flatMap((c) => c.outputs).map((o) => [o.data?.["text/plain"] ?? ""].flat().join(""));
  }

  beforeAll(() => {
    work = mkdtempSync(join(tmpdir(), "halfplus-install-"));
  });
  afterAll(() => {
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it("a fresh copy of the repository: npm ci links the package to itself and builds; a notebook in notebooks/ imports both entry points", () => {
    const clone = join(work, "clone");
    const files = spawnSync("git", ["ls-files", "-co", "--exclude-standard", "-z"], { cwd: ROOT, encoding: "utf8" }).stdout.split("\0").filter((f) => f !== "");
    expect(files).toContain("package-lock.json");
    for (const f of files) {
      mkdirSync(dirname(join(clone, f)), { recursive: true });
      try {
        copyFileSync(join(ROOT, f), join(clone, f));
      } catch {
        // A file deleted in the working tree but still tracked: a clone of the working tree lacks it too.
      }
    }
    const ci = run("npm", ["ci", "--prefer-offline"], clone);
    expect(ci.code, ci.out.slice(-3000)).toBe(0);
    expect(readdirSync(join(clone, "dist", "notebook"))).toContain("index.d.ts");
    const texts = runNotebook([process.execPath, join(clone, "dist", "cli", "main.js")], clone, join(clone, "notebooks"), "clone");
    expect(texts.some((t) => t.startsWith("petersen\nvertices"))).toBe(true);
    expect(texts.some((t) => t.includes("12 ≤ max cut ≤ 12"))).toBe(true);
    expect(texts.some((t) => t.startsWith("figure: "))).toBe(true);
  }, 900_000);

  it("a project that depends on halfplus (npm pack, npm install): a notebook in the project imports both entry points", () => {
    const clone = join(work, "clone");
    const pack = run("npm", ["pack", "--ignore-scripts", "--pack-destination", work], clone);
    expect(pack.code, pack.out).toBe(0);
    const tarball = readdirSync(work).find((f) => /^halfplus-.*\.tgz$/.test(f));
    expect(tarball).toBeDefined();
    const project = join(work, "project");
    mkdirSync(project);
    writeFileSync(join(project, "package.json"), JSON.stringify({ name: "surplus-study", version: "1.0.0", private: true, type: "module" }));
    // Install scripts are skipped here: the one that matters, better-sqlite3's source build, was just
    // exercised by the fresh copy above (same package, same Node), so its addon is copied from there
    // instead of being compiled a second time (about two minutes on two cores).
    const inst = run("npm", ["install", "--prefer-offline", "--ignore-scripts", join(work, tarball!)], project);
    expect(inst.code, inst.out.slice(-3000)).toBe(0);
    cpSync(join(clone, "node_modules", "better-sqlite3", "build"), join(project, "node_modules", "better-sqlite3", "build"), { recursive: true });
    // The store's native module loads in the installed copy (a consumer's sweep would need it).
    const store = run(process.execPath, ["-e", `const D = require(${JSON.stringify(join(project, "node_modules", "better-sqlite3"))}); new D(":memory:").prepare("select 1 as one").get().one === 1 || process.exit(1);`], project);
    expect(store.code, store.out).toBe(0);
    const texts = runNotebook([process.execPath, join(project, "node_modules", "halfplus", "dist", "cli", "main.js")], project, project, "dependency");
    expect(texts.some((t) => t.includes("12 ≤ max cut ≤ 12"))).toBe(true);
    expect(texts.some((t) => t.startsWith("figure: "))).toBe(true);
  }, 900_000);
});
