// The code path of `npm run demo` (scripts/demo.mjs, runDemo) on a small plan instead of the
// flagship one: the sweep fills the store, the fit table reaches stdout, and report.html, rows.csv
// and the figure files exist and hold what was computed. Graphs are small enough for exact search,
// so every number is independent of the machine's speed.
import { readFileSync, readdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Writable } from "node:stream";
import { spawnSync } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ROOT, ensureBuilt } from "./helpers/cli.js";
import { itNeeds, tool } from "./helpers/requirements.js";

/** A stream that keeps what is written to it. */
function sink(): Writable & { text: () => string } {
  const chunks: string[] = [];
  const w = new Writable({ write(c, _e, cb) { chunks.push(String(c)); cb(); } }) as Writable & { text: () => string };
  w.text = () => chunks.join("");
  return w;
}

// Hypercubes are bipartite, so their max cut is every edge: surplus = m/2, with m = dim·2^(dim−1)
// (definition of a bipartite graph; edge count of Q_dim, any graph theory text).
// Andrásfai graphs And(k) are k-regular on 3k − 1 vertices (Godsil & Royle, Algebraic Graph Theory §6.10);
// And(2) is C5, whose max cut is 4 of its 5 edges (an odd cycle is not bipartite).
const PLAN = {
  name: "demo-small",
  bracket: { effort: "exact", seconds: 60 },
  solverSeeds: [0],
  evaluators: ["edwards-edges", "triangle-free", "vector-method"],
  families: [
    { family: "hypercube", grid: { dim: { range: { from: 2, to: 5 } } } },
    { family: "andrasfai", grid: { k: { range: { from: 2, to: 6 } } } },
  ],
};
const GRAPHS = 4 + 5;

interface DemoResult {
  store: string;
  report: string;
  rowsCsv: string;
  figureFiles: string[];
  formats: string[];
  summary: { computed: number; skipped: number };
}
type RunDemo = (o: Record<string, unknown>) => Promise<DemoResult>;

describe("npm run demo's code path on a small plan", () => {
  let work: string;
  let runDemo: RunDemo;
  let first: DemoResult;
  const stdout = sink();
  const stderr = sink();

  beforeAll(async () => {
    ensureBuilt();
    work = mkdtempSync(join(tmpdir(), "halfplus-demo-"));
    writeFileSync(join(work, "plan.json"), JSON.stringify(PLAN));
    ({ runDemo } = (await import(join(ROOT, "scripts", "demo.mjs"))) as { runDemo: RunDemo });
    first = await runDemo({ plan: join(work, "plan.json"), out: join(work, "results"), workers: 0, images: "off", stdout, stderr, tty: false });
  }, 300_000);

  afterAll(() => {
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it("the sweep computes every graph into out/halfplus.db, with progress on stderr", () => {
    expect(first.summary.computed).toBe(GRAPHS);
    expect(first.store).toBe(join(work, "results", "halfplus.db"));
    expect(stderr.text()).toMatch(/demo: 9 graphs from/);
    expect(stderr.text()).toMatch(/sweep done: 9 computed/);
  });

  it("rows.csv holds one row per graph with the exact surpluses (hypercubes: m/2; And(2) = C5: 1.5)", () => {
    const lines = readFileSync(first.rowsCsv, "utf8").trim().split("\n");
    expect(lines).toHaveLength(GRAPHS + 1);
    const head = lines[0].split(",");
    const col = (name: string) => head.indexOf(name);
    for (const c of ["family", "spec", "m", "surplusLower", "surplusUpper", "exact"]) expect(col(c), c).toBeGreaterThanOrEqual(0);
    // Specs hold no commas inside quotes here except the key; split on commas outside quotes.
    const cells = lines.slice(1).map((l) => l.match(/("([^"]|"")*"|[^,]*)(,|$)/g)!.map((c) => c.replace(/,$/, "").replace(/^"|"$/g, "")));
    const bySpec = new Map(cells.map((c) => [c[col("spec")], c]));
    for (let dim = 2; dim <= 5; dim++) {
      const r = bySpec.get(`hypercube:dim=${dim}`);
      expect(r, `hypercube:dim=${dim}`).toBeDefined();
      const m = dim * 2 ** (dim - 1);
      expect(Number(r![col("m")])).toBe(m);
      expect(Number(r![col("surplusLower")])).toBe(m / 2);
      expect(Number(r![col("surplusUpper")])).toBe(m / 2);
    }
    const c5 = bySpec.get("andrasfai:k=2")!;
    expect([Number(c5[col("m")]), Number(c5[col("surplusLower")]), Number(c5[col("surplusUpper")])]).toEqual([5, 1.5, 1.5]);
    // Exact search closed every bracket (the plan asks for effort "exact" on graphs of at most 32 vertices).
    expect(cells.every((c) => c[col("exact")] === "1" || c[col("exact")] === "true")).toBe(true);
  });

  it("the fit table on stdout has one block per family, and report.html holds every figure, the fit table and provenance", () => {
    const out = stdout.text();
    expect(out).toContain("family andrasfai · d = degeneracy");
    expect(out).toContain("family hypercube · d = degeneracy");
    const page = readFileSync(first.report, "utf8");
    for (let i = 1; i <= 5; i++) expect(page).toContain(`id="hp-figure-${i}"`);
    expect(page).not.toContain('id="hp-figure-6"');
    expect(page).toContain("Fits per family");
    expect(page).toContain("halfplus version");
    expect(page).toContain("bootstrap seed");
    // Offline: plotly.js is embedded, nothing is fetched.
    expect(page).not.toMatch(/<script[^>]+src="https?:/);
  });

  it("pgfplots and CSV for each of the five figures; the surplus figure's CSV holds every graph's m", () => {
    const files = readdirSync(join(work, "results", "figures")).sort();
    expect(files).toEqual(["bound-tightness", "degrees", "exponents", "normalised-ratio", "surplus-scaling"].flatMap((n) => [`${n}.csv`, `${n}.tex`]));
    const tex = readFileSync(join(work, "results", "figures", "surplus-scaling.tex"), "utf8");
    expect(tex).toContain("\\begin{tikzpicture}");
    expect(tex).toContain("\\addplot");
    const csv = readFileSync(join(work, "results", "figures", "surplus-scaling.csv"), "utf8");
    // Q5: m = 80, degeneracy 5, m/√d = 80/√5 (x of the surplus figure).
    expect(csv).toContain(String(80 / Math.sqrt(5)).slice(0, 8));
  });

  it("bad input to the script: one line naming the option or the plan file, exit status 2, nothing written", () => {
    const script = join(ROOT, "scripts", "demo.mjs");
    const unknown = spawnSync(process.execPath, [script, "--sedes", "3"], { cwd: work, encoding: "utf8" });
    expect(unknown.status).toBe(2);
    expect(unknown.stderr.trim().split("\n")).toEqual(['demo: unknown option "--sedes" (options: --plan FILE, --out DIR, --workers N, --no-images)']);
    const workers = spawnSync(process.execPath, [script, "--workers", "two"], { cwd: work, encoding: "utf8" });
    expect([workers.status, workers.stderr.trim()]).toEqual([2, 'demo: --workers: a whole number (got "two")']);
    writeFileSync(join(work, "bad.json"), '{ "families": [ { "family": "kneser", "cases": [{ "n": 4, "k": 3 }] } ] }');
    const bad = spawnSync(process.execPath, [script, "--plan", "bad.json", "--out", "bad-out"], { cwd: work, encoding: "utf8" });
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim().split("\n")).toHaveLength(1);
    expect(bad.stderr).toMatch(/bad\.json.*families\[0\]/);
    expect(readdirSync(work)).not.toContain("bad-out");
  });

  itNeeds([tool("chromium"), tool("xmllint")], "run again: nothing recomputed, and with Chromium each figure also comes out as well-formed SVG", async () => {
    const again = await runDemo({ plan: join(work, "plan.json"), out: join(work, "results"), workers: 0, stdout: sink(), stderr: sink(), tty: false });
    expect(again.summary).toMatchObject({ computed: 0, skipped: GRAPHS });
    expect(again.formats).toEqual(["svg", "tex", "csv"]);
    const svg = join(work, "results", "figures", "surplus-scaling.svg");
    // xmllint (libxml2-utils) parses it as XML.
    const lint = spawnSync("xmllint", ["--noout", svg], { encoding: "utf8" });
    expect(lint.status, lint.stderr).toBe(0);
    expect(readFileSync(svg, "utf8")).toContain("m/√d");
  }, 300_000);
});
