// What tslab needs from the package, checked with tslab's own pieces: its TypeScript 5.0 (the
// @tslab/typescript-for-tslab 5.0.4 that tslab 1.0.22 pins) must parse every published .d.ts and
// resolve "halfplus" and "halfplus/notebook" the pre-exports (Node 10) way, with the compiler
// options tslab sets (node_modules/tslab/dist/converter.js); Node must load both entry points with
// require (tslab runs cells as CommonJS), which fails for a module graph with top-level await.
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join, relative, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { ROOT, ensureBuilt } from "./helpers/cli.js";

ensureBuilt();
const req = createRequire(join(ROOT, "package.json"));
// tslab's bundled compiler: the TypeScript that type-checks notebook cells.
const ts = req("@tslab/typescript-for-tslab") as typeof import("typescript");

function files(dir: string, suffix: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? files(join(dir, e.name), suffix) : e.name.endsWith(suffix) ? [join(dir, e.name)] : []));
}

/** tslab's compiler options for Node (converter.js: createConverter), minus its virtual files. */
function tslabOptions(): import("typescript").CompilerOptions {
  return {
    module: ts.ModuleKind.ESNext,
    moduleResolution: ts.ModuleResolutionKind.Node10,
    esModuleInterop: true,
    target: ts.ScriptTarget.ES2022,
    lib: ["lib.es2022.d.ts"],
    declaration: true,
    resolveJsonModule: true,
    skipLibCheck: true,
    noEmit: true,
    types: ["node"],
  };
}

describe("the package under tslab's TypeScript 5.0", () => {
  it("is the compiler tslab 1.0.22 pins", () => {
    // tslab's package.json pins @tslab/typescript-for-tslab 5.0.4.
    expect(ts.version).toBe("5.0.4");
    expect((req("tslab/package.json") as { version: string }).version).toBe("1.0.22");
  });

  it("parses every .d.ts in dist/ without a syntax error", () => {
    const decls = files(join(ROOT, "dist"), ".d.ts");
    expect(decls.length).toBeGreaterThan(50);
    expect(decls).toContain(join(ROOT, "dist", "notebook", "index.d.ts"));
    for (const f of decls) {
      const sf = ts.createSourceFile(f, readFileSync(f, "utf8"), ts.ScriptTarget.ES2022, false, ts.ScriptKind.TS);
      const diags = (sf as unknown as { parseDiagnostics: import("typescript").Diagnostic[] }).parseDiagnostics;
      expect(diags.map((d) => `${relative(ROOT, f)}: ${ts.flattenDiagnosticMessageText(d.messageText, " ")}`)).toEqual([]);
    }
  });

  it("resolves halfplus and halfplus/notebook from notebooks/ the pre-exports way, to the built declarations", () => {
    const from = join(ROOT, "notebooks", "cell.ts");
    const host = ts.createCompilerHost(tslabOptions());
    const main = ts.resolveModuleName("halfplus", from, tslabOptions(), host).resolvedModule;
    const sub = ts.resolveModuleName("halfplus/notebook", from, tslabOptions(), host).resolvedModule;
    expect(main && resolve(main.resolvedFileName)).toBe(join(ROOT, "dist", "index.d.ts"));
    expect(sub && resolve(sub.resolvedFileName)).toBe(join(ROOT, "dist", "notebook", "index.d.ts"));
  });

  it("type-checks a cell that uses both entry points, with no errors", () => {
    const dir = join(ROOT, "notebooks", ".ts50-check");
    mkdirSync(dir, { recursive: true });
    const cell = join(dir, "cell.ts");
    writeFileSync(
      cell,
      [
        'import { family, bracket, surplusScalingFigure, type SurplusRow, type PlotFigure } from "halfplus";',
        'import { show, table, describe, bracketCard, progressDisplay, provenance, type SweepProgressLike } from "halfplus/notebook";',
        'const g = family("petersen");',
        "const r = bracket(g, { seconds: 1 });",
        "bracketCard(r); describe(g); table([{ n: g.n }]);",
        "const p = progressDisplay(); const frame: SweepProgressLike = { done: 1, total: 2, bestRatio: null }; p(frame); p.finish();",
        "const rows: SurplusRow[] = []; const fig: PlotFigure = surplusScalingFigure(rows); void show(fig); provenance({ seed: 1 });",
        "export {};",
      ].join("\n"),
    );
    try {
      const program = ts.createProgram([cell], tslabOptions());
      const diags = ts.getPreEmitDiagnostics(program).map((d) => `${d.file ? relative(ROOT, d.file.fileName) : ""}: ${ts.flattenDiagnosticMessageText(d.messageText, " ")}`);
      expect(diags).toEqual([]);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe("loading under Node the way tslab's cells do (require)", () => {
  it("package.json keeps main and types beside exports, and tslab is pinned exactly", () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, "package.json"), "utf8"));
    expect(pkg.main).toBe("dist/index.js");
    expect(pkg.types).toBe("dist/index.d.ts");
    expect(pkg.exports["."].default).toBe("./dist/index.js");
    expect(pkg.exports["./notebook"].default).toBe("./dist/notebook/index.js");
    expect(pkg.dependencies.tslab).toBe("1.0.22");
    expect(pkg.files).toContain("notebook");
    // The clone links itself as node_modules/halfplus, so notebooks inside it resolve the package.
    expect(pkg.devDependencies.halfplus).toBe("file:.");
    const sub = JSON.parse(readFileSync(join(ROOT, "notebook", "package.json"), "utf8"));
    expect(existsSync(resolve(ROOT, "notebook", sub.main))).toBe(true);
    expect(existsSync(resolve(ROOT, "notebook", sub.types))).toBe(true);
  });

  it("require finds both entry points by exports, and by the old folder rules (main fields)", () => {
    const fromNotebooks = createRequire(join(ROOT, "notebooks", "cell.js"));
    expect(fromNotebooks.resolve("halfplus")).toBe(join(ROOT, "dist", "index.js"));
    expect(fromNotebooks.resolve("halfplus/notebook")).toBe(join(ROOT, "dist", "notebook", "index.js"));
    // Folder paths bypass exports: Node reads package.json "main", as pre-exports resolvers do.
    const byFolder = createRequire(import.meta.url);
    const root = byFolder(ROOT) as Record<string, unknown>;
    const notebook = byFolder(join(ROOT, "notebook")) as Record<string, unknown>;
    expect(typeof root.bracket).toBe("function");
    expect(typeof notebook.show).toBe("function");
    expect(typeof notebook.progressDisplay).toBe("function");
  });

  it("neither entry point reaches a module with top-level await (the CLI's main.ts has one)", () => {
    // require() of an ES module graph with top-level await throws ERR_REQUIRE_ASYNC_MODULE.
    const r = createRequire(join(ROOT, "notebooks", "cell.js"));
    expect(() => r("halfplus")).not.toThrow();
    expect(() => r("halfplus/notebook")).not.toThrow();
    // And statically: walk both import graphs; dist/cli/ is never in them.
    const seen = new Set<string>();
    const walk = (file: string) => {
      if (seen.has(file)) return;
      seen.add(file);
      const text = readFileSync(file, "utf8");
      for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\s[^;]*?from\s+"(\.[^"]+)"/g)) walk(resolve(dirname(file), m[1]));
      for (const m of text.matchAll(/(?:^|\n)\s*import\s+"(\.[^"]+)"/g)) walk(resolve(dirname(file), m[1]));
    };
    walk(join(ROOT, "dist", "index.js"));
    walk(join(ROOT, "dist", "notebook", "index.js"));
    expect(seen.size).toBeGreaterThan(50);
    expect([...seen].filter((f) => f.includes(`${join("dist", "cli")}`))).toEqual([]);
  });
});

describe("kernel-helpers layering", () => {
  it("imports only the public entry point, node: builtins and its own modules; the index re-exports every module", () => {
    const dir = join(ROOT, "kernel-helpers");
    const mods = readdirSync(dir).filter((f) => f.endsWith(".ts"));
    for (const f of mods) {
      const text = readFileSync(join(dir, f), "utf8");
      for (const m of text.matchAll(/\bfrom\s+"([^"]+)"/g)) {
        const spec = m[1];
        expect(spec === "halfplus" || spec.startsWith("node:") || /^\.\/[\w-]+\.js$/.test(spec), `${f} imports ${spec}`).toBe(true);
      }
    }
    const index = readFileSync(join(dir, "index.ts"), "utf8");
    for (const f of mods.filter((x) => x !== "index.ts")) expect(index).toContain(`./${f.replace(/\.ts$/, ".js")}`);
  });
});
