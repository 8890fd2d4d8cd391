// Every notebook in notebooks/ runs top to bottom, headless, through our kernel: the test installs
// the kernelspec into a temporary prefix (`halfplus kernel install --prefix`), points Jupyter at it
// with JUPYTER_PATH and executes each notebook with `jupyter nbconvert --execute` (Debian's
// jupyter-nbconvert, jupyter-client, python3-ipykernel). A failing cell fails the notebook, and so
// this suite. The quickstart's executed HTML is then opened in headless Chromium (Debian's, driven
// by playwright-core) to see the figure drawn with its traces.
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CHROMIUM_FLAGS, CHROMIUM_PATH } from "../src/plot/export/chromium.js";
import { BIN, ROOT, ensureBuilt } from "./helpers/cli.js";
import { decodePng, pixelVariety } from "./helpers/png.js";
import { describeNeeds, itNeeds, tool } from "./helpers/requirements.js";

const NOTEBOOKS = join(ROOT, "notebooks");
const notebookFiles = readdirSync(NOTEBOOKS).filter((f) => f.endsWith(".ipynb")).sort();

interface Output {
  output_type: string;
  name?: string;
  text?: string | string[];
  data?: Record<string, string | string[]>;
  ename?: string;
  evalue?: string;
}
interface Cell {
  cell_type: string;
  source: string | string[];
  outputs?: Output[];
  execution_count?: number | null;
}
interface Notebook {
  cells: Cell[];
  metadata: { kernelspec?: { name: string } };
}

const text = (v: string | string[] | undefined) => (Array.isArray(v) ? v.join("") : (v ?? ""));
const readNotebook = (path: string) => JSON.parse(readFileSync(path, "utf8")) as Notebook;

describe("notebooks as committed", () => {
  it("there is at least the quickstart", () => {
    expect(notebookFiles).toContain("quickstart.ipynb");
  });

  for (const file of notebookFiles)
    it(`${file}: outputs cleared, our kernel, a title, a parameters cell first and a provenance cell last`, () => {
      const nb = readNotebook(join(NOTEBOOKS, file));
      expect(nb.metadata.kernelspec?.name).toBe("halfplus");
      const code = nb.cells.filter((c) => c.cell_type === "code");
      for (const c of code) {
        expect(c.outputs).toEqual([]);
        expect(c.execution_count).toBeNull();
      }
      expect(nb.cells[0].cell_type).toBe("markdown");
      expect(text(nb.cells[0].source)).toMatch(/^# /);
      expect(text(code[0].source)).toMatch(/^\/\/ Parameters/);
      expect(text(code[code.length - 1].source)).toContain("provenance(");
    });
});

const JUPYTER = [tool("jupyter"), tool("jupyter-nbconvert"), tool("chromium")];

describeNeeds(JUPYTER, "notebooks executed headless through the halfplus kernel", () => {
  let work: string;
  let env: NodeJS.ProcessEnv;
  const executed = new Map<string, string>();

  /** `jupyter nbconvert` with our kernel on JUPYTER_PATH; the kernel's working folder is the notebook's. */
  function nbconvert(args: string[]) {
    return spawnSync("jupyter", ["nbconvert", ...args], { encoding: "utf8", env, timeout: 600_000 });
  }

  function execute(src: string, out: string) {
    return nbconvert(["--to", "notebook", "--execute", "--ExecutePreprocessor.timeout=300", src, "--output", out]);
  }

  beforeAll(() => {
    ensureBuilt();
    work = mkdtempSync(join(tmpdir(), "halfplus-notebooks-"));
    const prefix = join(work, "prefix");
    const r = spawnSync(process.execPath, [BIN, "kernel", "install", "--prefix", prefix], { encoding: "utf8" });
    expect(r.status, r.stderr).toBe(0);
    mkdirSync(join(work, "runtime"));
    env = { ...process.env, JUPYTER_PATH: join(prefix, "share", "jupyter"), JUPYTER_RUNTIME_DIR: join(work, "runtime"), PYDEVD_DISABLE_FILE_VALIDATION: "1" };
  });

  afterAll(() => {
    if (work) rmSync(work, { recursive: true, force: true });
  });

  for (const file of notebookFiles)
    it(`${file} runs top to bottom: every cell executed, no error, nothing on stderr`, () => {
      const out = join(work, file);
      const r = execute(join(NOTEBOOKS, file), out);
      expect(r.status, r.stderr.slice(-3000)).toBe(0);
      const nb = readNotebook(out);
      // tslab sends no execute_input message, so nbclient leaves execution_count empty; the evidence a
      // cell ran is its output: every code cell after the parameters cell shows something.
      nb.cells.filter((c) => c.cell_type === "code").forEach((c, i) => {
        if (i > 0) expect(c.outputs?.length, `code cell ${i + 1} of ${file} shows nothing`).toBeGreaterThan(0);
        for (const o of c.outputs ?? []) {
          expect(o.output_type, `${o.ename}: ${o.evalue}`).not.toBe("error");
          if (o.output_type === "stream") expect(o.name, text(o.text)).toBe("stdout");
        }
      });
      executed.set(file, out);
    }, 600_000);

  it("quickstart: progress updated in one output, the figure as HTML + SVG + text, plotly.js embedded once", () => {
    const out = executed.get("quickstart.ipynb");
    expect(out, "the quickstart ran").toBeDefined();
    const nb = readNotebook(out!);
    const code = nb.cells.filter((c) => c.cell_type === "code");
    const outputs = code.flatMap((c) => c.outputs ?? []);
    const progress = outputs.filter((o) => text(o.data?.["text/plain"]).startsWith("bracketing:"));
    // update_display_data replaced the first frame in place: one output, showing the last frame.
    expect(progress).toHaveLength(1);
    expect(text(progress[0].data!["text/plain"])).toContain("8 / 8 graphs");
    const figures = outputs.filter((o) => text(o.data?.["text/html"]).includes('class="hp-plot"'));
    expect(figures).toHaveLength(1);
    expect(Object.keys(figures[0].data!).sort()).toEqual(["image/svg+xml", "text/html", "text/plain"]);
    expect(text(figures[0].data!["image/svg+xml"])).toMatch(/^<svg/);
    // Chromium is present here (a requirement of this suite), so the static picture is plotly's own rendering.
    expect(text(figures[0].data!["text/html"])).toContain('data-hp-static="chromium"');
    const all = outputs.map((o) => text(o.data?.["text/html"])).join("\n");
    expect(all.split("embedded once so the notebook works offline").length - 1).toBe(1);
    const cards = outputs.filter((o) => o.data?.["text/html"] && text(o.data["text/html"]).includes("hp-nb-bracket"));
    expect(cards).toHaveLength(1);
    expect(text(cards[0].data!["text/plain"])).toMatch(/^polarity:q=13 \(n = 183, m = 1274\)/);
  });

  for (const file of notebookFiles)
    it(`${file}: one figure per show() call, plotly.js embedded once, every progress display finished in place`, () => {
      const out = executed.get(file);
      expect(out, `${file} ran`).toBeDefined();
      const nb = readNotebook(out!);
      const code = nb.cells.filter((c) => c.cell_type === "code");
      const shows = code.map((c) => text(c.source).match(/\bshow\(/g)?.length ?? 0).reduce((a, b) => a + b, 0);
      const outputs = code.flatMap((c) => c.outputs ?? []);
      const figures = outputs.filter((o) => text(o.data?.["text/html"]).includes('class="hp-plot"'));
      expect(figures).toHaveLength(shows);
      const html = outputs.map((o) => text(o.data?.["text/html"])).join("\n");
      expect(html.split("embedded once so the notebook works offline").length - 1).toBe(shows > 0 ? 1 : 0);
      // Each progressDisplay() is one output updated in place: its last frame says every graph is done.
      const displays = code.map((c) => text(c.source).match(/\bprogressDisplay\(/g)?.length ?? 0).reduce((a, b) => a + b, 0);
      const frames = outputs.filter((o) => o.data?.["text/html"] && text(o.data["text/html"]).includes("hp-nb-progress"));
      expect(frames).toHaveLength(displays);
      for (const f of frames) {
        const m = / (\d+) \/ (\d+) graphs/.exec(text(f.data!["text/plain"]));
        expect(m, text(f.data!["text/plain"])).not.toBeNull();
        expect(m![1]).toBe(m![2]);
      }
    });

  // The quickstart has one figure; c4-free.ipynb has four in three cells (plotly.js embedded in the first only).
  const BROWSER_CHECKS: { file: string; figures: string[] }[] = [
    { file: "quickstart.ipynb", figures: ["surplus-scaling"] },
    { file: "c4-free.ipynb", figures: ["surplus-scaling", "normalised-ratio", "degree-distribution", "exponents"] },
  ];
  for (const { file, figures } of BROWSER_CHECKS)
    itNeeds(JUPYTER, `${file}: the executed notebook's HTML in headless Chromium draws every figure with its traces, and none is blank`, async () => {
      const out = executed.get(file);
      expect(out, `${file} ran`).toBeDefined();
      const html = join(work, file.replace(/\.ipynb$/, ".html"));
      const r = nbconvert(["--to", "html", out!, "--output", html]);
      expect(r.status, r.stderr).toBe(0);
      const page = readFileSync(html, "utf8");
      const specs = [...page.matchAll(/<script type="application\/json" id="hp-fig-[^"]+-spec">(.*?)<\/script>/gs)].map((m) => JSON.parse(m[1]) as { data: unknown[] });
      expect(specs).toHaveLength(figures.length);
      const { chromium } = await import("playwright-core");
      const ctx = await chromium.launchPersistentContext(join(work, `reader-profile-${file}`), { executablePath: CHROMIUM_PATH, headless: true, args: [...CHROMIUM_FLAGS], viewport: { width: 1100, height: 900 }, offline: true });
      try {
        const p = await ctx.newPage();
        const errors: string[] = [];
        p.on("pageerror", (e) => errors.push(String(e)));
        await p.goto(pathToFileURL(html).href);
        await p.waitForFunction(`document.querySelectorAll("div.hp-plot .main-svg").length >= ${figures.length}`, undefined, { timeout: 60_000 });
        // Page-side code as strings: this project's TypeScript has no DOM types. Every trace of a drawn plot
        // is one <g class="trace"> in its layer (scatter, bar), so their count equals the spec's traces.
        const drawn = (await p.evaluate(`[...document.querySelectorAll("div.hp-plot")].map((el) => ({
            kind: el.getAttribute("data-hp-figure"),
            drawn: el.getAttribute("data-hp-drawn"),
            data: el.data.length,
            svgTraces: el.querySelectorAll(".cartesianlayer g.trace").length,
            img: el.querySelectorAll("img").length,
          }))`)) as { kind: string; drawn: string; data: number; svgTraces: number; img: number }[];
        expect(drawn).toEqual(figures.map((kind, i) => ({ kind, drawn: "1", data: specs[i].data.length, svgTraces: specs[i].data.length, img: 0 })));
        expect(errors.filter((e) => /plotly|halfplus|hp-/i.test(e))).toEqual([]);
        const plots = await p.$$("div.hp-plot");
        for (const [i, plot] of plots.entries()) {
          const shot = decodePng(await plot.screenshot());
          const variety = pixelVariety(shot);
          // A blank figure is one colour; a drawn one has hundreds (antialiased marks and text). The sparsest
          // figure here (degree histograms) leaves about 97 % of its pixels on the background.
          expect(variety.colours, `${file} figure ${i + 1}`).toBeGreaterThan(200);
          expect(variety.offBackground, `${file} figure ${i + 1}`).toBeGreaterThan(0.01);
        }
      } finally {
        await ctx.close();
      }
    }, 300_000);

  it("a failing cell fails the run, and the cells after it do not run", () => {
    const dir = join(work, "failing");
    mkdirSync(dir);
    const marker = join(dir, "after.txt");
    const cells = [
      'import { family } from "halfplus";\nconst g = family("petersen");',
      'family("kneser:n=3,k=2");',
      `import { writeFileSync } from "node:fs";\nwriteFileSync(${JSON.stringify(marker)}, "ran");`,
    ];
    const nb = {
      cells: cells.map((s) => ({ cell_type: "code", execution_count: null, metadata: {}, outputs: [], source: s })),
      metadata: { kernelspec: { name: "halfplus", display_name: "halfplus · TypeScript", language: "typescript" } },
      nbformat: 4,
      nbformat_minor: 4,
    };
    // Inside the clone, so "halfplus" resolves as it does for notebooks/.
    const inside = join(NOTEBOOKS, ".failing-check");
    mkdirSync(inside, { recursive: true });
    try {
      writeFileSync(join(inside, "failing.ipynb"), JSON.stringify(nb));
      const r = execute(join(inside, "failing.ipynb"), join(dir, "out.ipynb"));
      expect(r.status).not.toBe(0);
      // The family's own one-line error (k must be at most n/2) reaches the runner.
      expect(r.stderr).toMatch(/kneser/);
      expect(existsSync(marker)).toBe(false);
    } finally {
      rmSync(inside, { recursive: true, force: true });
    }
  }, 300_000);
});
