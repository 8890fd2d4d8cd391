// Standalone offline HTML: the minified plotly.js embedded once per file, each figure's data as
// JSON in the page, drawn when the page opens. Nothing is fetched, nothing depends on the clock,
// so the same figures give the same bytes.

import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { INK, TYPOGRAPHY } from "../palette.js";
import type { PlotFigure } from "../types.js";

/** Path of the minified plotly.js bundle this package depends on. */
export function plotlyBundlePath(): string {
  return createRequire(import.meta.url).resolve("plotly.js-dist-min/plotly.min.js");
}

/** The bundle's text and version (read from its header line "plotly.js vX.Y.Z"). */
export function plotlyBundle(): { source: string; version: string } {
  const source = readFileSync(plotlyBundlePath(), "utf8");
  const version = /plotly\.js v(\d+\.\d+\.\d+)/.exec(source.slice(0, 200))?.[1] ?? "unknown";
  return { source, version };
}

/** Text for HTML element content and attribute values. */
export function htmlEscape(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}

/** JSON that is safe inside a <script> element (no "</script", no HTML comment openers). */
export function scriptJson(value: unknown): string {
  return JSON.stringify(value).replace(/</g, "\\u003c").replace(/\u2028/g, "\\u2028").replace(/\u2029/g, "\\u2029");
}

/** Plotly's interactive options for our pages: no logo, no lasso tools, SVG from the camera button. */
export function plotConfig(filename: string): Record<string, unknown> {
  return {
    displaylogo: false,
    responsive: true,
    modeBarButtonsToRemove: ["lasso2d", "select2d"],
    toImageButtonOptions: { format: "svg", filename },
  };
}

/** The style sheet of our pages (figures and reports). */
export const PAGE_CSS = `
:root { color-scheme: light; }
body { margin: 0; background: #F6F7F9; color: ${INK.text}; font-family: ${TYPOGRAPHY.family}; font-size: 15px; line-height: 1.5; }
main { max-width: 1040px; margin: 0 auto; padding: 28px 28px 48px; }
h1 { font-size: 24px; font-weight: 600; margin: 0 0 6px; letter-spacing: 0.01em; }
h2 { font-size: 18px; font-weight: 600; margin: 36px 0 8px; padding-top: 12px; border-top: 1px solid ${INK.grid}; }
p.lede { color: ${INK.muted}; margin: 0 0 18px; }
figure { margin: 16px 0 8px; background: ${INK.paper}; border: 1px solid ${INK.grid}; border-radius: 6px; padding: 8px; }
figure .hp-plot { width: 100%; height: 460px; }
figcaption { color: ${INK.muted}; font-size: 13px; padding: 6px 6px 2px; }
figcaption ul { margin: 4px 0 0; padding-left: 18px; }
table { border-collapse: collapse; font-size: 13px; background: ${INK.paper}; margin: 10px 0; font-variant-numeric: tabular-nums; }
th, td { padding: 5px 10px; border-bottom: 1px solid ${INK.grid}; text-align: right; }
th { font-weight: 600; border-bottom: 2px solid ${INK.axis}; }
th:first-child, td:first-child { text-align: left; }
.hp-table-wrap { overflow-x: auto; }
dl.hp-provenance { display: grid; grid-template-columns: max-content 1fr; gap: 4px 18px; font-size: 13px; background: ${INK.paper}; border: 1px solid ${INK.grid}; border-radius: 6px; padding: 12px 16px; }
dl.hp-provenance dt { color: ${INK.muted}; }
dl.hp-provenance dd { margin: 0; font-family: "DejaVu Sans Mono", monospace; white-space: pre-wrap; word-break: break-all; }
`;

export interface PlacedFigure {
  /** Element id, unique within the page. */
  id: string;
  figure: PlotFigure;
  /** File name offered by the camera button (no extension). */
  filename: string;
}

/** The <div> a figure draws into and the JSON it draws from. */
export function figureElements(p: PlacedFigure): string {
  const spec = { data: p.figure.data, layout: p.figure.layout, config: plotConfig(p.filename) };
  return `<div class="hp-plot" id="${htmlEscape(p.id)}" data-hp-figure="${htmlEscape(p.figure.layout.meta.figure)}"></div>\n<script type="application/json" id="${htmlEscape(p.id)}-spec">${scriptJson(spec)}</script>`;
}

/** Draws every figure element on the page once plotly has loaded. */
const RENDER_SCRIPT = `<script>
(function () {
  var plots = document.querySelectorAll("div.hp-plot");
  for (var i = 0; i < plots.length; i++) {
    var spec = JSON.parse(document.getElementById(plots[i].id + "-spec").textContent);
    Plotly.newPlot(plots[i], spec.data, spec.layout, spec.config);
  }
})();
</script>`;

/** A whole page: head with plotly embedded once, the body as given, then the drawing script. */
export function standalonePage(title: string, body: string): string {
  const { source, version } = plotlyBundle();
  // The bundle has no "</script" today; guard anyway so an update cannot break the page silently.
  const safe = source.replace(/<\/script/gi, "<\\/script");
  return [
    "<!doctype html>",
    '<html lang="en">',
    "<head>",
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    '<meta name="generator" content="halfplus">',
    `<title>${htmlEscape(title)}</title>`,
    `<style>${PAGE_CSS}</style>`,
    `<script>/* plotly.js ${version}, MIT licence, embedded so the page works offline */\n${safe}\n</script>`,
    "</head>",
    "<body>",
    body,
    RENDER_SCRIPT,
    "</body>",
    "</html>",
    "",
  ].join("\n");
}

export interface FigureHtmlOptions {
  /** Page title (default: the figure's own title). */
  title?: string;
  /** File name offered by the camera button (default: the figure's kind). */
  filename?: string;
}

/** One figure as a standalone offline HTML page. */
export function figureHtml(figure: PlotFigure, options: FigureHtmlOptions = {}): string {
  const title = options.title ?? figure.layout.title?.text ?? "halfplus figure";
  const filename = options.filename ?? figure.layout.meta.figure;
  const body = `<main>\n<figure>\n${figureElements({ id: "hp-figure-1", figure, filename })}\n</figure>\n</main>`;
  return standalonePage(title, body);
}
