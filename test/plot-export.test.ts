// Exporters that need no browser: standalone HTML, the report page, pgfplots and CSV — what they
// contain, that plotly is embedded exactly once and nothing is fetched, and that the same data
// gives byte-identical files. Also the one-line error when Chromium is missing.
import { mkdtempSync, readFileSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { InputError } from "../src/errors.js";
import { figureToCsv } from "../src/plot/export/csv.js";
import { CHROMIUM_INSTALL, openImageExporter } from "../src/plot/export/chromium.js";
import { exportFigures } from "../src/plot/export/files.js";
import { figureHtml, plotlyBundle } from "../src/plot/export/html.js";
import { figureToPgfplots, pgfplotsDocument, texNumber } from "../src/plot/export/pgfplots.js";
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

/** The five figures, built from scratch each call (so equal output is not the same object reused). */
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

const count = (s: string, sub: string) => s.split(sub).length - 1;

function report(): string {
  return reportHtml({
    title: "Surplus study <draft>",
    intro: "Does the surplus grow like m/√d?",
    figures: figures().map((f) => ({ figure: f.figure, caption: `the ${f.name} figure` })),
    tables: [{ title: "Fits", rows: [{ family: "kneser", c: 0.3123456789, exponent: 0.97, exact: true }, { family: "gnp", c: 0.29, exponent: 1.02, exact: false }] }],
    provenance: { halfplus: "0.1.0", seeds: [1, 2, 3], store: "results/halfplus.sqlite" },
  });
}

describe("standalone HTML", () => {
  const { version } = plotlyBundle();

  it("embeds the minified plotly.js exactly once and fetches nothing", () => {
    const html = figureHtml(figures()[0].figure);
    // The bundle's licence header names its version once (plotly.js-dist-min's plotly.min.js).
    expect(count(html, `plotly.js v${version}`)).toBe(1);
    expect(html).not.toMatch(/<script[^>]+src=/i);
    expect(html).not.toMatch(/<link[^>]+href=/i);
    // The minified build keeps the file near 5 MB (the unminified one is about 12 MB).
    expect(html.length).toBeLessThan(6_000_000);
  });

  it("carries the figure as JSON that parses back to the same figure", () => {
    const fig = figures()[0].figure;
    const html = figureHtml(fig);
    const json = /<script type="application\/json" id="hp-figure-1-spec">(.*?)<\/script>/s.exec(html)![1];
    const spec = JSON.parse(json);
    expect(spec.data).toEqual(fig.data);
    expect(spec.layout).toEqual(fig.layout);
  });

  it("cannot be broken out of by a family named like a closing script tag", () => {
    const rows = sampleRows().map((r) => ({ ...r, family: "</script><b>x" }));
    const html = figureHtml(surplusScalingFigure(rows));
    expect(count(html, "</script><b>")).toBe(0);
  });

  it("is byte-identical for the same data", () => {
    expect(figureHtml(figures()[1].figure)).toBe(figureHtml(figures()[1].figure));
  });
});

describe("report page", () => {
  const html = report();

  it("has plotly once, one plot element per figure, the table and the provenance", () => {
    expect(count(html, `plotly.js v${plotlyBundle().version}`)).toBe(1);
    expect(count(html, 'class="hp-plot"')).toBe(5);
    expect(html).toContain("<title>Surplus study &lt;draft&gt;</title>");
    expect(html).toContain("<td>0.312346</td>");
    expect(html).toContain("<td>yes</td>");
    expect(html).toContain("<dt>seeds</dt><dd>1, 2, 3</dd>");
    // Each figure's notes are shown under it.
    expect(html).toContain("bars span the bracket");
  });

  it("is byte-identical for the same data", () => {
    expect(report()).toBe(html);
  });

  it("refuses input without a title or provenance, in one line", () => {
    expect(() => reportHtml({ title: "", figures: [], provenance: {} })).toThrow(InputError);
    expect(() => reportHtml({ title: "t", figures: [], provenance: null as never })).toThrow(/provenance/);
  });
});

describe("CSV of the plotted data", () => {
  it("one line per drawn point of every trace, with each bar's ends", () => {
    const { figure } = figures()[0];
    const csv = figureToCsv(figure);
    const lines = csv.trimEnd().split("\n");
    expect(lines[0]).toBe("series,role,label,m_over_sqrt_d,surplus,surplus_low,surplus_high");
    const drawn = figure.data.reduce((k, t) => k + t.x.filter((x, i) => x !== null && t.y[i] !== null).length, 0);
    expect(lines).toHaveLength(drawn + 1);
    const rows = new Map(sampleRows().map((r) => [r.key, r]));
    // Points' bar ends give back the brackets (up to one rounding: common practice, no source).
    for (const line of lines.filter((l) => l.includes(",points,"))) {
      const [, , label, , , low, high] = line.split(",");
      const r = rows.get(label)!;
      expect(Number(low)).toBeCloseTo(r.surplusLower, 9);
      expect(Number(high)).toBeCloseTo(r.surplusUpper, 9);
    }
    expect(lines.filter((l) => l.includes(",band-upper,"))).toHaveLength(64);
  });

  it("names the panel in two-panel figures and quotes fields that need it", () => {
    const rows = sampleRows().map((r) => ({ ...r, family: r.family === "gnp" ? 'g,"n"p' : r.family }));
    const csv = figureToCsv(degreeDistributionFigure(rows, { family: 'g,"n"p' }));
    expect(csv.split("\n")[0]).toBe("panel,series,role,label,x,y");
    expect(csv).toContain('degree,"g,""n""p",distribution,,');
    expect(csv).toContain('degeneracy,"g,""n""p (degeneracy)",distribution,,');
  });

  it("is byte-identical for the same data", () => {
    for (let i = 0; i < 5; i++) expect(figureToCsv(figures()[i].figure)).toBe(figureToCsv(figures()[i].figure));
  });
});

describe("pgfplots", () => {
  it("contains every plotted coordinate with its asymmetric bar, log axes, legend and the filled band", () => {
    const { figure } = figures()[0];
    const tex = figureToPgfplots(figure);
    for (const t of figure.data)
      t.x.forEach((x, i) => {
        if (x !== null && t.y[i] !== null) expect(tex).toContain(`(${texNumber(x)},${texNumber(t.y[i]!)})`);
      });
    for (const t of figure.data.filter((t) => t.meta.role === "points"))
      t.x.forEach((x, i) => expect(tex).toContain(`(${texNumber(x!)},${texNumber(t.y[i]!)}) += (0,${texNumber(t.error_y!.array[i])}) -= (0,${texNumber(t.error_y!.arrayminus[i])})`));
    expect(tex).toContain("xmode=log");
    expect(tex).toContain("ymode=log");
    expect(tex).toContain("fill between[of=hpband1hi and hpband1lo]");
    expect(tex).toContain("\\addlegendentry{kneser}");
    expect(tex).toContain("\\addlegendentry{95\\,\\% band}");
    expect(tex).toContain("xlabel={$m/\\sqrt{d}$ ($d$ = degeneracy)}");
    expect(count(tex, "\\begin{tikzpicture}")).toBe(1);
  });

  it("draws the band as two dashed edges when asked", () => {
    const tex = figureToPgfplots(figures()[0].figure, { band: "dashed" });
    expect(tex).not.toContain("fill between");
    expect(count(tex, "line width=0.6pt, dashed, no marks")).toBe(2);
  });

  it("writes categorical rows, reversed axes and two panels", () => {
    const exp = figureToPgfplots(figures()[2].figure);
    expect(exp).toContain("yticklabels={{gnp $\\cdot$ exponent of m/$\\surd$d}");
    expect(exp).toContain("y dir=reverse");
    const deg = figureToPgfplots(figures()[4].figure);
    expect(count(deg, "\\begin{axis}")).toBe(2);
    expect(deg).toContain("at={(hppanel1.east)}");
  });

  it("escapes TeX's special characters in names", () => {
    const rows = sampleRows().map((r) => ({ ...r, family: r.family === "gnp" ? "g_n&p 50%" : r.family }));
    const tex = figureToPgfplots(surplusScalingFigure(rows));
    expect(tex).toContain("\\addlegendentry{g\\_n\\&p 50\\%}");
  });

  it("writes an empty figure that still has axis limits, and a complete document", () => {
    const tex = pgfplotsDocument(surplusScalingFigure([]));
    expect(tex).toContain("xmin=1, xmax=10");
    expect(tex).toContain("\\documentclass{article}");
    expect(tex).toContain("\\end{document}");
  });

  it("is byte-identical for the same data", () => {
    for (let i = 0; i < 5; i++) expect(figureToPgfplots(figures()[i].figure)).toBe(figureToPgfplots(figures()[i].figure));
  });
});

describe("batch export without a browser", () => {
  it("writes html, tex and csv for every figure, byte-identical on a second run", async () => {
    const a = mkdtempSync(join(tmpdir(), "halfplus-plot-a-"));
    const b = mkdtempSync(join(tmpdir(), "halfplus-plot-b-"));
    try {
      const progress: number[] = [];
      await exportFigures({ figures: figures(), dir: a, formats: ["html", "tex", "csv"], onProgress: (done) => progress.push(done) });
      await exportFigures({ figures: figures(), dir: b, formats: ["html", "tex", "csv"] });
      const files = readdirSync(a).sort();
      expect(files).toHaveLength(15);
      expect(progress).toEqual(Array.from({ length: 15 }, (_, i) => i + 1));
      for (const f of files) expect(readFileSync(join(b, f)).equals(readFileSync(join(a, f))), f).toBe(true);
    } finally {
      rmSync(a, { recursive: true, force: true });
      rmSync(b, { recursive: true, force: true });
    }
  });

  it("refuses unsafe names and unknown formats", async () => {
    await expect(exportFigures({ figures: [{ name: "../x", figure: figures()[0].figure }], dir: tmpdir(), formats: ["csv"] })).rejects.toThrow(/invalid figure `name`/);
    await expect(exportFigures({ figures: [], dir: tmpdir(), formats: ["gif" as never] })).rejects.toThrow(/`formats`/);
  });
});

describe("image export without Chromium", () => {
  it("fails with one line that gives the install command", async () => {
    const err = await openImageExporter({ executablePath: "/nonexistent/chromium" }).catch((e) => e);
    expect(err).toBeInstanceOf(InputError);
    expect(err.message).toContain(CHROMIUM_INSTALL);
    expect(err.message).toContain("/nonexistent/chromium");
    expect(err.message).not.toContain("\n");
  });
});
