// SVG, PNG and PDF through headless Chromium from Debian, driven by playwright-core: one browser
// per batch (open an exporter, export many figures, close it). Plotly.toImage makes the SVG and
// PNG; the PDF is Chromium printing that SVG on one page of exactly the figure's size, so it stays
// vector. Plotly's random element ids come from Math.random, which the render page seeds afresh
// for every figure, so the same figure gives the same SVG bytes.

import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { InputError } from "../../errors.js";
import { FIGURE_SIZE } from "../palette.js";
import type { PlotFigure } from "../types.js";
import { htmlEscape, plotlyBundlePath } from "./html.js";

/** Where Debian installs Chromium. */
export const CHROMIUM_PATH = "/usr/bin/chromium";
/** How to get it. */
export const CHROMIUM_INSTALL = "apt-get install -y --no-install-recommends chromium";

/** Flags for a quiet, offline, throwaway browser (the profile directory is made fresh per exporter). */
export const CHROMIUM_FLAGS: readonly string[] = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-quic",
  "--no-first-run",
  "--disable-background-networking",
  "--disable-component-update",
  "--disable-sync",
];

export interface ImageExporterOptions {
  /** Chromium binary (default /usr/bin/chromium). A downloaded browser is never used. */
  executablePath?: string;
  /** Milliseconds allowed for the browser to start (default 60000). */
  launchTimeoutMs?: number;
}

export interface ImageSize {
  /** CSS pixels (default 720 × 460). */
  width?: number;
  height?: number;
  /** PNG only: device pixels per CSS pixel (default 2). */
  scale?: number;
}

export interface ImageExporter {
  svg(figure: PlotFigure, size?: ImageSize): Promise<string>;
  png(figure: PlotFigure, size?: ImageSize): Promise<Buffer>;
  /** A one-page vector PDF of exactly the figure's size. */
  pdf(figure: PlotFigure, size?: ImageSize): Promise<Buffer>;
  /** The same from an SVG this exporter made at the same size (saves rendering twice). */
  pdfFromSvg(svg: string, size?: ImageSize): Promise<Buffer>;
  /** The browser's version string, for provenance. */
  readonly browserVersion: string;
  close(): Promise<void>;
}

/** The one-line message when Chromium is not there. */
export function chromiumMissingMessage(path: string): string {
  return `figure export to SVG/PNG/PDF needs Chromium, not found at ${path}: install it with \`${CHROMIUM_INSTALL}\``;
}

function checkSize(size: ImageSize | undefined): Required<ImageSize> {
  const s = { width: FIGURE_SIZE.width, height: FIGURE_SIZE.height, scale: 2, ...size };
  for (const k of ["width", "height"] as const)
    if (!(Number.isInteger(s[k]) && s[k] >= 50 && s[k] <= 10_000)) throw new InputError(`figure export: invalid \`${k}\`: an integer from 50 to 10000 pixels (got ${JSON.stringify(s[k])})`);
  if (!(typeof s.scale === "number" && s.scale > 0 && s.scale <= 8)) throw new InputError(`figure export: invalid \`scale\`: a number in (0, 8] (got ${JSON.stringify(s.scale)})`);
  return s;
}

// The render page: plotly from the installed package (a file URL, faster than pushing 4.8 MB
// through the protocol) and a seedable Math.random for plotly's element ids.
function renderPageHtml(): string {
  return `<!doctype html><html><head><meta charset="utf-8">
<script>
window.__hpSeed = function (seed) {
  var s = seed >>> 0;
  Math.random = function () {
    s = (s + 0x6D2B79F5) >>> 0;
    var t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
};
</script>
<script src="${htmlEscape(pathToFileURL(plotlyBundlePath()).href)}"></script>
</head><body></body></html>`;
}

/**
 * Attributes of every start tag in alphabetical order. The browser serialises attributes in the
 * order they were set, and plotly sets some in a different order on a page's first legend than
 * on later ones; sorting makes the bytes depend on the figure alone. Safe on serialised SVG:
 * every value is double-quoted with quotes and angle brackets escaped.
 */
export function canonicalSvg(svg: string): string {
  return svg.replace(/<([A-Za-z][\w:.-]*)((?:\s+[\w:.-]+="[^"]*")+)\s*(\/?)>/g, (_m, name: string, attrs: string, close: string) => {
    const list = attrs.match(/[\w:.-]+="[^"]*"/g) ?? [];
    list.sort((a, b) => {
      const ka = a.slice(0, a.indexOf("="));
      const kb = b.slice(0, b.indexOf("="));
      return ka < kb ? -1 : ka > kb ? 1 : 0;
    });
    return `<${name} ${list.join(" ")}${close}>`;
  });
}

/** The SVG a Plotly data URL holds, as a file's text. */
function svgFromDataUrl(url: string): string {
  const comma = url.indexOf(",");
  const svg = canonicalSvg(decodeURIComponent(url.slice(comma + 1)));
  return svg.endsWith("\n") ? svg : svg + "\n";
}

/**
 * Chromium stamps the PDF with the time it was printed; the stamp is replaced by the Unix epoch,
 * character for character (same length, so the cross-reference offsets stay right), so the same
 * figure gives the same PDF bytes.
 */
export function fixPdfDates(pdf: Buffer): Buffer {
  const text = pdf.toString("latin1");
  const fixed = text.replace(/\/(CreationDate|ModDate) \(D:\d{14}([^)]*)\)/g, (_m, key: string, zone: string) => `/${key} (D:19700101000000${zone.replace(/\d/g, "0")})`);
  return fixed.length === text.length ? Buffer.from(fixed, "latin1") : pdf;
}

/**
 * Opens headless Chromium once; export as many figures as needed, then `close()`.
 * Throws a one-line InputError with the install command when Chromium is missing.
 */
export async function openImageExporter(options: ImageExporterOptions = {}): Promise<ImageExporter> {
  const executablePath = options.executablePath ?? CHROMIUM_PATH;
  if (!existsSync(executablePath)) throw new InputError(chromiumMissingMessage(executablePath));
  const { chromium } = await import("playwright-core");
  const work = mkdtempSync(join(tmpdir(), "halfplus-chromium-"));
  const cleanup = () => rmSync(work, { recursive: true, force: true });
  const pagePath = join(work, "render.html");
  writeFileSync(pagePath, renderPageHtml());
  let context;
  try {
    context = await chromium.launchPersistentContext(join(work, "profile"), {
      executablePath,
      headless: true,
      args: [...CHROMIUM_FLAGS],
      timeout: options.launchTimeoutMs ?? 60_000,
      offline: true,
    });
  } catch (e) {
    cleanup();
    const first = String((e as Error)?.message ?? e).split("\n")[0];
    throw new InputError(`figure export: Chromium at ${executablePath} did not start (${first}); reinstall it with \`${CHROMIUM_INSTALL}\``);
  }
  const ctx = context;
  try {
    const render = ctx.pages()[0] ?? (await ctx.newPage());
    await render.goto(pathToFileURL(pagePath).href);
    await render.waitForFunction(() => typeof (globalThis as unknown as { Plotly?: unknown }).Plotly === "object", undefined, { timeout: 60_000 });
    const agent = await render.evaluate(() => (globalThis as unknown as { navigator: { userAgent: string } }).navigator.userAgent);
    const browserVersion = /(?:HeadlessChrome|Chrome|Chromium)\/([\d.]+)/.exec(agent)?.[1] ?? "unknown";
    const print = await ctx.newPage();

    // One export at a time: each reseeds Math.random, so calls must not interleave.
    let queue: Promise<unknown> = Promise.resolve();
    const serial = <T>(job: () => Promise<T>): Promise<T> => {
      const next = queue.then(job, job);
      queue = next.catch(() => undefined);
      return next;
    };
    let closed = false;
    const image = (figure: PlotFigure, format: "svg" | "png", s: Required<ImageSize>) =>
      serial(async () => {
        if (closed) throw new InputError("figure export: this exporter is closed; open a new one");
        const spec = { data: figure.data, layout: figure.layout };
        return render.evaluate(
          async ({ spec, format, s }) => {
            const w = globalThis as unknown as { __hpSeed(seed: number): void; Plotly: { toImage(fig: unknown, opts: unknown): Promise<string> } };
            w.__hpSeed(20240607);
            return w.Plotly.toImage({ data: spec.data, layout: spec.layout, config: { staticPlot: true } }, { format, width: s.width, height: s.height, scale: format === "png" ? s.scale : 1 });
          },
          { spec, format, s },
        );
      });

    const exporter: ImageExporter = {
      browserVersion,
      async svg(figure, size) {
        return svgFromDataUrl(await image(figure, "svg", checkSize(size)));
      },
      async png(figure, size) {
        const url = await image(figure, "png", checkSize(size));
        return Buffer.from(url.slice(url.indexOf(",") + 1), "base64");
      },
      async pdf(figure, size) {
        return exporter.pdfFromSvg(await exporter.svg(figure, size), size);
      },
      async pdfFromSvg(svg, size) {
        const s = checkSize(size);
        return serial(async () => {
          if (closed) throw new InputError("figure export: this exporter is closed; open a new one");
          await print.setContent(
            `<!doctype html><html><head><meta charset="utf-8"><style>@page { size: ${s.width}px ${s.height}px; margin: 0 } html, body { margin: 0; padding: 0; overflow: hidden; } svg { display: block; }</style></head><body>${svg}</body></html>`,
          );
          return fixPdfDates(await print.pdf({ width: `${s.width}px`, height: `${s.height}px`, printBackground: true, margin: { top: "0", right: "0", bottom: "0", left: "0" }, pageRanges: "1" }));
        });
      },
      async close() {
        if (closed) return;
        closed = true;
        try {
          await queue;
          await ctx.close();
        } finally {
          cleanup();
        }
      },
    };
    return exporter;
  } catch (e) {
    await ctx.close().catch(() => undefined);
    cleanup();
    throw e;
  }
}

/** Runs `job` with a freshly opened exporter and always closes it. */
export async function withImageExporter<T>(job: (exporter: ImageExporter) => Promise<T>, options: ImageExporterOptions = {}): Promise<T> {
  const exporter = await openImageExporter(options);
  try {
    return await job(exporter);
  } finally {
    await exporter.close();
  }
}
