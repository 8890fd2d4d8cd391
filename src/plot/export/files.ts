// Writing a batch of figures to files in the formats asked for: HTML, pgfplots and CSV need no
// browser; SVG, PNG and PDF share one Chromium opened for the whole batch.

import { mkdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { InputError } from "../../errors.js";
import type { PlotFigure } from "../types.js";
import { openImageExporter, type ImageExporter, type ImageExporterOptions, type ImageSize } from "./chromium.js";
import { figureToCsv } from "./csv.js";
import { figureHtml } from "./html.js";
import { figureToPgfplots, type PgfplotsOptions } from "./pgfplots.js";

export type FigureFormat = "html" | "svg" | "png" | "pdf" | "tex" | "csv";
export const FIGURE_FORMATS: readonly FigureFormat[] = ["html", "svg", "png", "pdf", "tex", "csv"];
const BROWSER_FORMATS: readonly FigureFormat[] = ["svg", "png", "pdf"];

export interface NamedFigure {
  /** File name without extension: letters, digits, dot, dash, underscore. */
  name: string;
  figure: PlotFigure;
}

export interface ExportFiguresOptions extends ImageExporterOptions {
  figures: readonly NamedFigure[];
  /** Folder to write into (made if missing). */
  dir: string;
  formats: readonly FigureFormat[];
  size?: ImageSize;
  pgfplots?: PgfplotsOptions;
  /** An exporter already open (left open); otherwise one is opened and closed here if needed. */
  exporter?: ImageExporter;
  /** Called after each file is written. */
  onProgress?: (done: number, total: number, path: string) => void;
}

/** Writes every figure in every format; returns the paths in the order written. */
export async function exportFigures(options: ExportFiguresOptions): Promise<string[]> {
  const { figures, dir, formats } = options;
  for (const f of formats) if (!FIGURE_FORMATS.includes(f)) throw new InputError(`exportFigures: invalid \`formats\`: each one of ${FIGURE_FORMATS.join(", ")} (got ${JSON.stringify(f)})`);
  const names = new Set<string>();
  for (const { name } of figures) {
    if (!/^[A-Za-z0-9._-]+$/.test(name) || name.startsWith(".")) throw new InputError(`exportFigures: invalid figure \`name\` ${JSON.stringify(name)}: letters, digits, ".", "-", "_" only`);
    if (names.has(name)) throw new InputError(`exportFigures: figure name ${JSON.stringify(name)} used twice`);
    names.add(name);
  }
  mkdirSync(dir, { recursive: true });
  const needsBrowser = formats.some((f) => BROWSER_FORMATS.includes(f)) && figures.length > 0;
  const exporter = needsBrowser ? (options.exporter ?? (await openImageExporter(options))) : undefined;
  const written: string[] = [];
  const total = figures.length * formats.length;
  try {
    for (const { name, figure } of figures) {
      let svg: string | undefined;
      for (const format of formats) {
        const path = join(dir, `${name}.${format}`);
        let content: string | Buffer;
        switch (format) {
          case "html":
            content = figureHtml(figure, { filename: name });
            break;
          case "tex":
            content = figureToPgfplots(figure, options.pgfplots);
            break;
          case "csv":
            content = figureToCsv(figure);
            break;
          case "svg":
            content = svg = await exporter!.svg(figure, options.size);
            break;
          case "png":
            content = await exporter!.png(figure, options.size);
            break;
          case "pdf":
            // Print the SVG already made for this figure when there is one.
            content = svg ? await exporter!.pdfFromSvg(svg, options.size) : await exporter!.pdf(figure, options.size);
            break;
        }
        writeFileSync(path, content);
        written.push(path);
        options.onProgress?.(written.length, total, path);
      }
    }
  } finally {
    if (exporter && !options.exporter) await exporter.close();
  }
  return written;
}
