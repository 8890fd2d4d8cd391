// `show(figure)`: a plotly figure inline in the notebook, as one output carrying
// - text/html: the interactive figure (plotly.js embedded once per kernel session, in the first
//   figure's output, so the notebook and its nbconvert HTML work offline), drawn over a static
//   picture that stays visible wherever scripts do not run;
// - image/svg+xml: the same static picture, for viewers that show images but not HTML;
// - text/plain: the title and the series, for terminals.
//
// The static picture: when Debian's Chromium is present, the SVG src/plot's exporter makes
// (plotly's own rendering, the same bytes as the paper export); otherwise our own light SVG
// (sketch-svg.ts: points, lines, bands, error bars, axes, legend). `static: "auto"` picks the
// first that works; the choice is recorded in the HTML as data-hp-static.

import { createHash } from "node:crypto";
import { CHROMIUM_PATH, FIGURE_SIZE, InputError, openImageExporter, plotConfig, plotlyBundle, scriptJson, type ImageExporter, type PlotFigure } from "halfplus";
import { existsSync } from "node:fs";
import { displayOutput, type MimeBundle } from "./channel.js";
import { sketchSvg } from "./sketch-svg.js";
import { htmlEscape } from "./style.js";

/** Where the static picture comes from. */
export type StaticPicture = "auto" | "chromium" | "sketch" | "none";

export interface ShowOptions {
  /** Static picture source (default "auto": Chromium when present, else the sketch). */
  static?: StaticPicture;
  /** Size in CSS pixels (default 720 × 460, the export size). */
  width?: number;
  height?: number;
  /** File name offered by the camera button (default: the figure's kind). */
  filename?: string;
}

export interface FigureBundle extends MimeBundle {
  "text/html": string;
}

interface SessionState {
  plotlyEmbedded: boolean;
  figures: number;
  exporter: Promise<ImageExporter> | null;
  idle: ReturnType<typeof setTimeout> | null;
}

// Per kernel session (the module is loaded once per kernel): whether plotly.js has been sent, a
// counter for element ids, and a Chromium kept open between figures for a moment, then closed so
// the kernel can exit when asked.
const session: SessionState = { plotlyEmbedded: false, figures: 0, exporter: null, idle: null };
const EXPORTER_IDLE_MS = 1500;

function checkFigure(figure: PlotFigure): void {
  if (figure === null || typeof figure !== "object" || !Array.isArray(figure.data) || figure.layout === null || typeof figure.layout !== "object")
    throw new InputError("show: `figure` should be a figure { data, layout } from one of the figure builders");
}

function checkSize(name: "width" | "height", v: number | undefined, fallback: number): number {
  const s = v ?? fallback;
  if (!(Number.isInteger(s) && s >= 100 && s <= 4000)) throw new InputError(`show: invalid \`${name}\`: an integer from 100 to 4000 pixels (got ${JSON.stringify(v)})`);
  return s;
}

const STATIC_CHOICES: readonly StaticPicture[] = ["auto", "chromium", "sketch", "none"];

async function withExporter<T>(job: (e: ImageExporter) => Promise<T>): Promise<T> {
  if (session.idle !== null) clearTimeout(session.idle);
  session.idle = null;
  if (session.exporter === null) session.exporter = openImageExporter();
  const pending = session.exporter;
  try {
    return await job(await pending);
  } catch (e) {
    if (session.exporter === pending) session.exporter = null;
    (await pending.catch(() => null))?.close().catch(() => undefined);
    throw e;
  } finally {
    if (session.exporter === pending)
      session.idle = setTimeout(() => {
        session.exporter = null;
        session.idle = null;
        void pending.then((e) => e.close()).catch(() => undefined);
      }, EXPORTER_IDLE_MS);
  }
}

/** The static picture and where it came from. */
async function staticPicture(figure: PlotFigure, choice: StaticPicture, width: number, height: number): Promise<{ svg: string; source: "chromium" | "sketch" } | null> {
  if (choice === "none") return null;
  if (choice === "chromium" || (choice === "auto" && existsSync(CHROMIUM_PATH))) {
    try {
      return { svg: await withExporter((e) => e.svg(figure, { width, height })), source: "chromium" };
    } catch (e) {
      if (choice === "chromium") throw e;
    }
  }
  return { svg: sketchSvg(figure, { width, height }), source: "sketch" };
}

/** The figure's title and series, one line each. */
export function figureText(figure: PlotFigure): string {
  const title = figure.layout.title?.text ?? figure.layout.meta?.figure ?? "figure";
  const series = figure.data.filter((t) => t.showlegend !== false && t.name).map((t) => `  ${t.name} (${t.x.length} points)`);
  return [`figure: ${title} — ${figure.data.length} trace${figure.data.length === 1 ? "" : "s"}`, ...series].join("\n");
}

/** The script that embeds plotly.js in the page (and tells figures waiting for it). */
function plotlyEmbedHtml(): string {
  const { source, version } = plotlyBundle();
  const safe = source.replace(/<\/script/gi, "<\\/script");
  return `<script>/* plotly.js ${version}, MIT licence, embedded once so the notebook works offline */\n${safe}\n;window.dispatchEvent(new Event("halfplus-plotly-ready"));</script>`;
}

/** The figure's HTML: static picture first, replaced by the interactive plot when plotly runs. */
function figureHtmlFragment(figure: PlotFigure, id: string, picture: { svg: string; source: string } | null, width: number, height: number, filename: string, embed: boolean): string {
  const spec = { data: figure.data, layout: figure.layout, config: plotConfig(filename) };
  const title = figure.layout.title?.text ?? figure.layout.meta?.figure ?? "figure";
  const img = picture
    ? `<img alt="${htmlEscape(`${title} (static picture)`)}" src="data:image/svg+xml;base64,${Buffer.from(picture.svg, "utf8").toString("base64")}" style="width:100%;height:100%;object-fit:contain;display:block">`
    : `<div style="padding:12px;color:#586070;font-size:13px">${htmlEscape(title)}: the interactive figure needs JavaScript</div>`;
  const draw = `<script>(function () {
  var id = ${scriptJson(id)};
  function draw() {
    var el = document.getElementById(id), specEl = document.getElementById(id + "-spec");
    if (!el || !specEl || el.getAttribute("data-hp-drawn")) return;
    var spec = JSON.parse(specEl.textContent);
    el.setAttribute("data-hp-drawn", "1");
    el.textContent = "";
    window.Plotly.newPlot(el, spec.data, spec.layout, spec.config);
  }
  if (window.Plotly && window.Plotly.newPlot) draw();
  else window.addEventListener("halfplus-plotly-ready", draw);
})();</script>`;
  return [
    embed ? plotlyEmbedHtml() : "",
    `<div class="hp-nb hp-nb-figure" style="max-width:${width}px;margin:4px 0">`,
    `<div class="hp-plot" id="${htmlEscape(id)}" data-hp-figure="${htmlEscape(figure.layout.meta?.figure ?? "figure")}" data-hp-static="${picture?.source ?? "none"}" style="width:100%;height:${height}px">${img}</div>`,
    `<script type="application/json" id="${htmlEscape(id)}-spec">${scriptJson(spec)}</script>`,
    draw,
    "</div>",
  ].join("\n");
}

/**
 * The bundle `show` sends. `embedPlotly` puts plotly.js into this output (show() does that for
 * the first figure of a kernel session).
 */
export async function figureBundle(figure: PlotFigure, options: ShowOptions & { embedPlotly?: boolean; id?: string } = {}): Promise<FigureBundle> {
  checkFigure(figure);
  const choice = options.static ?? "auto";
  if (!STATIC_CHOICES.includes(choice)) throw new InputError(`show: invalid \`static\`: one of ${STATIC_CHOICES.join(", ")} (got ${JSON.stringify(options.static)})`);
  const width = checkSize("width", options.width, FIGURE_SIZE.width);
  const height = checkSize("height", options.height, FIGURE_SIZE.height);
  const picture = await staticPicture(figure, choice, width, height);
  const id = options.id ?? `hp-fig-${createHash("sha256").update(JSON.stringify(figure)).digest("hex").slice(0, 10)}`;
  const filename = options.filename ?? figure.layout.meta?.figure ?? "figure";
  const bundle: FigureBundle = {
    "text/plain": figureText(figure),
    "text/html": figureHtmlFragment(figure, id, picture, width, height, filename, options.embedPlotly === true),
  };
  if (picture) bundle["image/svg+xml"] = picture.svg;
  return bundle;
}

/**
 * Shows a figure inline: interactive where scripts run (JupyterLab, the classic Notebook,
 * nbconvert HTML), a static SVG elsewhere. Await it: the static picture is made asynchronously.
 */
export async function show(figure: PlotFigure, options: ShowOptions = {}): Promise<void> {
  session.figures++;
  const embed = !session.plotlyEmbedded;
  const seq = session.figures;
  const bundle = await figureBundle(figure, {
    ...options,
    embedPlotly: embed,
    id: `hp-fig-${seq}-${createHash("sha256").update(JSON.stringify(figure)).digest("hex").slice(0, 8)}`,
  });
  displayOutput(bundle);
  if (embed) session.plotlyEmbedded = true;
}
