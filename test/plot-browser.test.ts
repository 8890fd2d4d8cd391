// Figures in a real browser (Debian's chromium through playwright-core): the report page draws
// every figure with the expected traces and is not blank; SVG exports are well-formed XML with
// both axis titles and byte-identical across browser sessions; the PDF has one vector page; the
// PNG has the asked size. Outside checkers: xmllint (libxml2) and pdfinfo/pdftotext (poppler).
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { afterAll, beforeAll, expect, it } from "vitest";
import { CHROMIUM_FLAGS, CHROMIUM_PATH, openImageExporter, type ImageExporter } from "../src/plot/export/chromium.js";
import { exportFigures } from "../src/plot/export/files.js";
import { reportHtml } from "../src/plot/export/report.js";
import {
  boundTightnessFigure,
  degreeDistributionFigure,
  exponentFigure,
  normalisedRatioFigure,
  surplusScalingFigure,
} from "../src/plot/figures/index.js";
import type { PlotFigure } from "../src/plot/types.js";
import { sampleExponents, sampleFit, sampleRows } from "./helpers/plot-data.js";
import { decodePng, pixelVariety } from "./helpers/png.js";
import { describeNeeds, tool } from "./helpers/requirements.js";

function figures(): { name: string; figure: PlotFigure }[] {
  const rows = sampleRows();
  return [
    { name: "surplus", figure: surplusScalingFigure(rows, { fits: sampleFit(), conjecture: { constant: 0.3, lower: 0.28, upper: 0.32 } }) },
    { name: "ratio", figure: normalisedRatioFigure(rows, { conjecture: { constant: 0.3 } }) },
    { name: "exponents", figure: exponentFigure(sampleExponents()) },
    { name: "bounds", figure: boundTightnessFigure(rows.slice(0, 10)) },
    { name: "degrees", figure: degreeDistributionFigure(rows, { family: ["kneser", "gnp"] }) },
  ];
}

const run = (cmd: string, args: string[]) => spawnSync(cmd, args, { encoding: "utf8" });

/** The text of the SVG <text> element with this class (plotly's axis titles: xtitle, ytitle). */
function svgText(svg: string, cls: string): string | undefined {
  const m = new RegExp(`<text[^>]*class="${cls}"[^>]*>(.*?)</text>`, "s").exec(svg);
  return m?.[1].replace(/<[^>]+>/g, "").replace(/\s+/g, " ").trim();
}
const squash = (s: string) => s.replace(/\s+/g, " ").trim();

describeNeeds([tool("chromium")], "figures in headless Chromium", () => {
  let work: string;
  let exporter: ImageExporter;

  beforeAll(async () => {
    work = mkdtempSync(join(tmpdir(), "halfplus-plot-browser-"));
    exporter = await openImageExporter();
  });

  afterAll(async () => {
    await exporter?.close();
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it("the report page draws every figure with its traces, fetches nothing, and is not blank", async () => {
    const figs = figures();
    const path = join(work, "report.html");
    writeFileSync(path, reportHtml({ title: "Report", figures: figs.map((f) => f.figure), tables: [{ title: "Fits", rows: [{ family: "kneser", c: 0.3 }] }], provenance: { seed: 1 } }));
    const { chromium } = await import("playwright-core");
    const ctx = await chromium.launchPersistentContext(join(work, "reader-profile"), { executablePath: CHROMIUM_PATH, headless: true, args: [...CHROMIUM_FLAGS], viewport: { width: 1100, height: 900 } });
    try {
      const page = await ctx.newPage();
      const errors: string[] = [];
      const requests: string[] = [];
      page.on("pageerror", (e) => errors.push(String(e)));
      page.on("request", (r) => requests.push(r.url()));
      await page.goto(pathToFileURL(path).href);
      // Page-side code as strings: this project's TypeScript has no DOM types.
      await page.waitForFunction(`document.querySelectorAll(".js-plotly-plot .main-svg").length >= 5`, undefined, { timeout: 60_000 });
      const drawn = (await page.evaluate(`[...document.querySelectorAll("div.hp-plot")].map((el) => ({
          kind: el.getAttribute("data-hp-figure"),
          data: el.data.length,
          svgTraces: el.querySelectorAll(".scatterlayer g.trace").length,
          xtitle: el.querySelector("text.xtitle")?.textContent ?? "",
        }))`)) as { kind: string; data: number; svgTraces: number; xtitle: string }[];
      expect(drawn.map((d) => d.kind)).toEqual(["surplus-scaling", "normalised-ratio", "exponents", "bound-tightness", "degree-distribution"]);
      drawn.forEach((d, i) => {
        expect(d.data).toBe(figs[i].figure.data.length);
        // Plotly draws one <g class="trace"> per scatter trace.
        expect(d.svgTraces).toBe(figs[i].figure.data.length);
        expect(squash(d.xtitle)).toBe(squash(figs[i].figure.layout.xaxis.title.text));
      });
      expect(errors).toEqual([]);
      expect(requests.filter((u) => !u.startsWith("file:") && !u.startsWith("data:"))).toEqual([]);
      const shot = decodePng(await page.screenshot({ fullPage: true }));
      const variety = pixelVariety(shot);
      // A blank page has one colour; a page of plots has hundreds (antialiased marks and text).
      expect(variety.colours).toBeGreaterThan(200);
      expect(variety.offBackground).toBeGreaterThan(0.05);
    } finally {
      await ctx.close();
    }
  });

  it("SVG: well-formed XML (xmllint) with both axis titles", async () => {
    for (const { name, figure } of figures()) {
      const svg = await exporter.svg(figure);
      const file = join(work, `${name}.svg`);
      writeFileSync(file, svg);
      const lint = run("xmllint", ["--noout", file]);
      expect(lint.status, `${name}: ${lint.stderr}`).toBe(0);
      expect(svgText(svg, "xtitle")).toBe(squash(figure.layout.xaxis.title.text));
      if (figure.layout.yaxis.title.text) expect(svgText(svg, "ytitle")).toBe(squash(figure.layout.yaxis.title.text));
    }
  });

  it("SVG: the same figure gives the same bytes, in one session and in a new browser", async () => {
    const fig = figures()[0].figure;
    const first = await exporter.svg(fig);
    expect(await exporter.svg(figures()[0].figure)).toBe(first);
    const other = await openImageExporter();
    try {
      expect(await other.svg(fig)).toBe(first);
    } finally {
      await other.close();
    }
  });

  it("PDF: one page of the figure's size, with its text as text (vector)", async () => {
    const { figure } = figures()[0];
    const file = join(work, "surplus.pdf");
    writeFileSync(file, await exporter.pdf(figure));
    const info = run("pdfinfo", [file]);
    expect(info.status).toBe(0);
    // poppler's pdfinfo: 720 × 460 CSS px at 96 px/in is 540 × 345 pt.
    expect(info.stdout).toMatch(/^Pages:\s+1$/m);
    expect(info.stdout).toMatch(/^Page size:\s+540 x 345(\.\d+)? pts/m);
    const text = run("pdftotext", [file, "-"]);
    expect(text.stdout).toContain("surplus");
    expect(text.stdout).toContain("kneser");
  });

  it("PNG: the asked size times the scale, and not blank", async () => {
    const png = decodePng(await exporter.png(figures()[1].figure, { width: 600, height: 400, scale: 2 }));
    expect([png.width, png.height]).toEqual([1200, 800]);
    expect(pixelVariety(png).colours).toBeGreaterThan(100);
  });

  it("a batch through an open exporter writes every format", async () => {
    const dir = join(work, "batch");
    const paths = await exportFigures({ figures: figures().slice(0, 2), dir, formats: ["svg", "png", "pdf"], exporter });
    expect(paths.map((p) => p.slice(dir.length + 1))).toEqual(["surplus.svg", "surplus.png", "surplus.pdf", "ratio.svg", "ratio.png", "ratio.pdf"]);
  });
}, );

// Chromium's own checker tools are only needed above; keep them in the requirement list so CI
// names them when missing.
describeNeeds([tool("chromium"), tool("xmllint"), tool("pdfinfo"), tool("pdftotext")], "outside checkers for exported files", () => {
  it("are on PATH", () => {
    expect(run("xmllint", ["--version"]).status).toBe(0);
    expect(run("pdfinfo", ["-v"]).status).toBe(0);
  });
});
