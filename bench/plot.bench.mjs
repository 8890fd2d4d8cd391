// Figure export speed: the five figures of a study (80 graphs in four families, a fit with its
// band, fitted exponents) exported to SVG + PNG + PDF in one batch with one Chromium launch,
// best of three batches; plus the browser-free formats (HTML, pgfplots, CSV) and the builders.
// Target: a whole batch in a few seconds (the issue measured about 2 s per batch).
// Run: npm run build && node bench/run.mjs plot
import { existsSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import {
  CHROMIUM_PATH,
  boundTightnessFigure,
  degreeDistributionFigure,
  exponentFigure,
  exportFigures,
  normalisedRatioFigure,
  openImageExporter,
  surplusScalingFigure,
} from "../dist/plot/index.js";
import { report, timeBest } from "./util.mjs";

// Invented rows for timing only (same shape as the results store's).
const families = ["kneser", "polarity", "triangle-free-process", "gnp"];
const rows = [];
families.forEach((family, fi) => {
  for (let k = 0; k < 20; k++) {
    const n = Math.round(20 * 1.25 ** k);
    const d = 3 + fi + (k % 7);
    const m = (n * d) / 2;
    const surplus = 0.3 * (m / Math.sqrt(d)) * (0.9 + 0.01 * ((fi * 7 + k) % 20));
    const gap = k < 5 ? 0 : surplus * 0.1;
    rows.push({
      key: `${family}:n=${n}`, family, n, m, degeneracy: d, maxDegree: d + 2, averageDegree: d - 0.5,
      surplusLower: surplus, surplusUpper: surplus + gap, exact: gap === 0,
      bestCut: m / 2 + surplus, sdpBound: m / 2 + surplus + gap + 1, vectorGuarantee: m / 2 + surplus / 3, edwardsBound: m / 2 + (n - 1) / 4,
      degrees: Array.from({ length: n }, (_, v) => d - 1 + (v % 3)),
    });
  }
});
const fit = { law: "surplus = c·(m/√d)^a", response: "surplusLower", predict: (x) => { const e = 0.31 * x ** 0.98; return { estimate: e, lower: e * 0.85, upper: e * 1.15 }; } };
const exponents = families.map((family, i) => ({ family, name: "exponent of m/√d", estimate: 0.95 + 0.03 * i, lower: 0.85 + 0.03 * i, upper: 1.05 + 0.03 * i, conjectured: 1 }));
const build = () => [
  { name: "surplus", figure: surplusScalingFigure(rows, { fits: fit, conjecture: { constant: 0.3 } }) },
  { name: "ratio", figure: normalisedRatioFigure(rows, { conjecture: { constant: 0.3 } }) },
  { name: "exponents", figure: exponentFigure(exponents) },
  { name: "bounds", figure: boundTightnessFigure(rows.slice(0, 30)) },
  { name: "degrees", figure: degreeDistributionFigure(rows, { family: "gnp" }) },
];

const out = [];
const b = timeBest(build, 5);
out.push({ case: "build the five figures (80 rows)", ms: +b.ms.toFixed(1) });
const figures = b.result;
const dir = mkdtempSync(join(tmpdir(), "halfplus-bench-plot-"));
try {
  let best = Infinity;
  for (let i = 0; i < 3; i++) {
    const t0 = process.hrtime.bigint();
    await exportFigures({ figures, dir, formats: ["html", "tex", "csv"] });
    best = Math.min(best, Number(process.hrtime.bigint() - t0) / 1e6);
  }
  out.push({ case: "HTML + pgfplots + CSV, five figures (no browser)", ms: +best.toFixed(1) });

  if (existsSync(CHROMIUM_PATH)) {
    // The whole batch through the public batch writer, one launch, for the headline number.
    let bestAll = Infinity;
    for (let i = 0; i < 3; i++) {
      const t0 = process.hrtime.bigint();
      await exportFigures({ figures, dir, formats: ["svg", "png", "pdf"] });
      bestAll = Math.min(bestAll, Number(process.hrtime.bigint() - t0) / 1e6);
    }
    out.push({ case: "exportFigures: five figures to SVG + PNG + PDF, one launch (best of 3)", ms: +bestAll.toFixed(0), target: "a few seconds" });
  }
  if (!existsSync(CHROMIUM_PATH)) {
    out.push({ case: "SVG + PNG + PDF batch", ms: null, note: `no Chromium at ${CHROMIUM_PATH}: skipped` });
  } else {
    const batches = [];
    for (let i = 0; i < 3; i++) {
      const t0 = process.hrtime.bigint();
      const exporter = await openImageExporter();
      const t1 = process.hrtime.bigint();
      const per = { svg: 0, png: 0, pdf: 0 };
      for (const { name, figure } of figures) {
        // As exportFigures does it: the PDF prints the SVG just made.
        let s = process.hrtime.bigint();
        const svg = await exporter.svg(figure);
        per.svg += Number(process.hrtime.bigint() - s) / 1e6;
        s = process.hrtime.bigint();
        await exporter.png(figure);
        per.png += Number(process.hrtime.bigint() - s) / 1e6;
        s = process.hrtime.bigint();
        await exporter.pdfFromSvg(svg);
        per.pdf += Number(process.hrtime.bigint() - s) / 1e6;
      }
      await exporter.close();
      const t2 = process.hrtime.bigint();
      batches.push({ launch: Number(t1 - t0) / 1e6, total: Number(t2 - t0) / 1e6, ...per });
    }
    const bestBatch = batches.reduce((a, c) => (c.total < a.total ? c : a));
    out.push({ case: "the same, step by step (best of 3): total", ms: +bestBatch.total.toFixed(0) });
    out.push({ case: "  of which: launch Chromium and load plotly", ms: +bestBatch.launch.toFixed(0) });
    for (const f of ["svg", "png", "pdf"]) out.push({ case: `  of which: ${f.toUpperCase()} ×5${f === "pdf" ? " (printing the SVG)" : ""}`, ms: +bestBatch[f].toFixed(0) });
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
report("plot", out);
