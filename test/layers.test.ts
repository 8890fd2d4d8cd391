// The import layering of src/, enforced: every import points down the layer list in DEVELOPERS.md
// ("Layers"), the three solver sub-folders of cut/ do not import each other (nor do the bracket and
// the decomposition cut, which both build on them), no module imports itself through a cycle, and
// kernel-helpers/ uses only the package's public entry point.
// Source of the rule: the project's own architecture decision (common practice, no source).
import { existsSync, readdirSync, readFileSync } from "node:fs";
import { dirname, join, relative, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { ROOT } from "./helpers/cli.js";

/** Layers from the bottom up: [rank, folder group, path test]. Same rank, different group = siblings. */
const LAYERS: readonly [number, string, (p: string) => boolean][] = [
  [0, "base", (p) => p === "src/errors.ts" || p === "src/validate.ts" || p === "src/decimal.ts" || p.startsWith("src/random/") || p.startsWith("src/limits/")],
  [1, "graph", (p) => /^src\/graph\/[^/]+\.ts$/.test(p)],
  [2, "graph/formats", (p) => p.startsWith("src/graph/formats/")],
  [3, "graph/record", (p) => p.startsWith("src/graph/record/")],
  [4, "graph/structure", (p) => p.startsWith("src/graph/structure/")],
  [5, "linalg", (p) => p.startsWith("src/linalg/")],
  [6, "families", (p) => p.startsWith("src/families/")],
  [7, "bounds", (p) => p.startsWith("src/bounds/")],
  [8, "cut", (p) => /^src\/cut\/[^/]+\.ts$/.test(p) && p !== "src/cut/index.ts"],
  [9, "cut/exact", (p) => p.startsWith("src/cut/exact/")],
  [9, "cut/heuristic", (p) => p.startsWith("src/cut/heuristic/")],
  [9, "cut/relaxation", (p) => p.startsWith("src/cut/relaxation/")],
  // Branch and bound bounded by the relaxation: uses the three solver folders, serves the bracket.
  [9.5, "cut/tree", (p) => p.startsWith("src/cut/tree/")],
  [10, "cut/bracket", (p) => p.startsWith("src/cut/bracket/")],
  [10, "cut/decomposition", (p) => p.startsWith("src/cut/decomposition/")],
  [11, "cut/account", (p) => p.startsWith("src/cut/account/")],
  [12, "cut/index", (p) => p === "src/cut/index.ts"],
  [13, "sources", (p) => p.startsWith("src/sources/")],
  [13, "hunt", (p) => p.startsWith("src/hunt/")],
  [14, "experiment", (p) => p.startsWith("src/experiment/")],
  [15, "fit", (p) => p.startsWith("src/fit/")],
  [16, "plot", (p) => p.startsWith("src/plot/")],
  [17, "cli", (p) => p.startsWith("src/cli/")],
  [18, "package", (p) => p === "src/index.ts"],
];

function layerOf(path: string): { rank: number; group: string } | null {
  const hit = LAYERS.find(([, , test]) => test(path));
  return hit === undefined ? null : { rank: hit[0], group: hit[1] };
}

function sourceFiles(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? sourceFiles(join(dir, e.name)) : e.name.endsWith(".ts") ? [join(dir, e.name)] : [],
  );
}

/** Relative module specifiers of static imports/re-exports (type-only ones too) and dynamic imports. */
function importsOf(text: string): string[] {
  const code = text.replace(/\/\*[\s\S]*?\*\//g, "").replace(/^\s*\/\/.*$/gm, "");
  const out: string[] = [];
  const statement = /^(?:import|export)\s+(?:type\s+)?(?:\*(?:\s+as\s+\w+)?|\{[^}]*\}|\w+(?:\s*,\s*\{[^}]*\})?)\s+from\s+"([^"]+)"/gm;
  for (const m of code.matchAll(statement)) out.push(m[1]);
  for (const m of code.matchAll(/^import\s+"([^"]+)"/gm)) out.push(m[1]);
  for (const m of code.matchAll(/\bimport\(\s*"([^"]+)"\s*\)/g)) out.push(m[1]);
  return out.filter((s) => s.startsWith("."));
}

const files = sourceFiles(join(ROOT, "src")).map((f) => relative(ROOT, f).split("\\").join("/"));
const edges = new Map<string, string[]>();
for (const f of files) {
  const targets = importsOf(readFileSync(join(ROOT, f), "utf8")).map((s) => relative(ROOT, resolve(ROOT, dirname(f), s)).split("\\").join("/").replace(/\.js$/, ".ts"));
  edges.set(f, targets);
}

describe("import layering of src/", () => {
  it("finds the modules and their imports (the scan itself works)", () => {
    expect(files.length).toBeGreaterThan(100);
    expect(edges.get("src/cut/bracket/bracket.ts")).toContain("src/cut/bracket/record.ts");
    expect(edges.get("src/index.ts")).toContain("src/cut/index.ts");
    // A type-only import and a multi-line import are both seen.
    expect(importsOf('import type { A } from "./a.js";\nimport {\n  b,\n  c,\n} from "../b.js";\nexport * from "./c.js";')).toEqual(["./a.js", "../b.js", "./c.js"]);
  });

  it("places every module in a layer", () => {
    expect(files.filter((f) => layerOf(f) === null)).toEqual([]);
  });

  it("has no upward or sideways arrow: each import goes to a lower layer or the same folder group", () => {
    const bad: string[] = [];
    for (const [from, targets] of edges) {
      const a = layerOf(from)!;
      for (const to of targets) {
        if (!existsSync(join(ROOT, to))) {
          bad.push(`${from} → ${to} (no such module)`);
          continue;
        }
        const b = layerOf(to);
        if (b === null) bad.push(`${from} → ${to} (outside src/)`);
        else if (b.rank > a.rank || (b.rank === a.rank && b.group !== a.group)) bad.push(`${from} (${a.group}) → ${to} (${b.group})`);
      }
    }
    expect(bad).toEqual([]);
  });

  it("has no import cycle", () => {
    const state = new Map<string, 1 | 2>();
    const cycles: string[] = [];
    const visit = (f: string, path: string[]): void => {
      state.set(f, 1);
      for (const t of edges.get(f) ?? []) {
        if (state.get(t) === 1) cycles.push([...path.slice(path.indexOf(t)), t].join(" → "));
        else if (state.get(t) === undefined && edges.has(t)) visit(t, [...path, t]);
      }
      state.set(f, 2);
    };
    for (const f of files) if (!state.has(f)) visit(f, [f]);
    expect(cycles).toEqual([]);
  });

  it("the row shapes (src/experiment/rows.ts) import nothing; src/fit and src/plot reach into src/experiment only there", () => {
    // The store produces the rows, so their shapes live with it; fits and figures must not load the
    // store's machinery (SQLite, workers) to read them (project decision, common practice, no source).
    expect(edges.get("src/experiment/rows.ts")).toEqual([]);
    const bad: string[] = [];
    for (const [from, targets] of edges) {
      if (!from.startsWith("src/fit/") && !from.startsWith("src/plot/")) continue;
      for (const to of targets) if (to.startsWith("src/experiment/") && to !== "src/experiment/rows.ts") bad.push(`${from} → ${to}`);
    }
    expect(bad).toEqual([]);
  });

  it("src/fit imports nothing but errors.ts, random/, the row shapes and its own modules, and re-exports each", () => {
    const bad: string[] = [];
    const fit = files.filter((f) => f.startsWith("src/fit/"));
    for (const f of fit) {
      for (const to of edges.get(f) ?? []) {
        if (!(to.startsWith("src/fit/") || to === "src/errors.ts" || to.startsWith("src/random/") || to === "src/experiment/rows.ts")) bad.push(`${f} → ${to}`);
      }
    }
    expect(bad).toEqual([]);
    const index = edges.get("src/fit/index.ts") ?? [];
    expect(fit.filter((f) => f !== "src/fit/index.ts" && !index.includes(f))).toEqual([]);
  });

  it("kernel-helpers/ imports only the package's public entry point", () => {
    const dir = join(ROOT, "kernel-helpers");
    const bad: string[] = [];
    for (const f of sourceFiles(dir)) {
      for (const s of importsOf(readFileSync(f, "utf8"))) {
        const target = relative(ROOT, resolve(dirname(f), s)).split("\\").join("/");
        if (target !== "src/index.js" && !target.startsWith("kernel-helpers/")) bad.push(`${relative(ROOT, f)} → ${s}`);
      }
    }
    expect(bad).toEqual([]);
  });
});
