// One standalone offline HTML page with every figure (plotly embedded once), tables given as rows
// (the fit table, say) and a provenance block saying how the numbers were made.

import { InputError } from "../../errors.js";
import type { PlotFigure } from "../types.js";
import { figureElements, htmlEscape, standalonePage } from "./html.js";

export type ReportValue = string | number | boolean | null | undefined | readonly (string | number)[];

export interface ReportFigure {
  figure: PlotFigure;
  /** A sentence under the figure; the figure's own notes follow it. */
  caption?: string;
  /** File name offered by the figure's camera button (default: the figure's kind). */
  name?: string;
}

export interface ReportTable {
  title: string;
  rows: readonly Record<string, ReportValue>[];
  /** Column order (default: keys in first-seen order across rows). */
  columns?: readonly string[];
  caption?: string;
}

export interface ReportInput {
  title: string;
  /** A paragraph under the title: what question the page answers. */
  intro?: string;
  figures: readonly (ReportFigure | PlotFigure)[];
  tables?: readonly ReportTable[];
  /** Versions, seeds, store path, command: shown as given, in the given order. */
  provenance: Readonly<Record<string, ReportValue>>;
}

/** A cell's text: numbers to six significant digits, booleans as yes/no, lists joined. */
export function cellText(v: ReportValue): string {
  if (v === null || v === undefined) return "";
  if (typeof v === "number") return Number.isInteger(v) ? String(v) : String(Number(v.toPrecision(6)));
  if (typeof v === "boolean") return v ? "yes" : "no";
  if (Array.isArray(v)) return v.map((x) => (typeof x === "number" ? cellText(x) : x)).join(", ");
  return String(v);
}

function isPlotFigure(f: ReportFigure | PlotFigure): f is PlotFigure {
  return Array.isArray((f as PlotFigure).data) && (f as PlotFigure).layout !== undefined;
}

/** Rows as an HTML table; numeric columns are right-aligned by the page's style. */
export function tableHtml(t: ReportTable): string {
  const columns = t.columns ?? [...new Set(t.rows.flatMap((r) => Object.keys(r)))];
  const head = `<tr>${columns.map((c) => `<th scope="col">${htmlEscape(c)}</th>`).join("")}</tr>`;
  const body = t.rows.map((r) => `<tr>${columns.map((c) => `<td>${htmlEscape(cellText(r[c]))}</td>`).join("")}</tr>`).join("\n");
  const caption = t.caption ? `<caption>${htmlEscape(t.caption)}</caption>` : "";
  return `<div class="hp-table-wrap"><table>${caption}\n<thead>${head}</thead>\n<tbody>\n${body}\n</tbody></table></div>`;
}

/** The report page. Same input, same bytes. */
export function reportHtml(input: ReportInput): string {
  if (typeof input?.title !== "string" || input.title === "") throw new InputError("reportHtml: `title` should be a non-empty string");
  if (!Array.isArray(input.figures)) throw new InputError("reportHtml: `figures` should be an array");
  if (input.provenance === null || typeof input.provenance !== "object") throw new InputError("reportHtml: `provenance` should be an object of name → value");
  const parts: string[] = ["<main>", `<h1>${htmlEscape(input.title)}</h1>`];
  if (input.intro) parts.push(`<p class="lede">${htmlEscape(input.intro)}</p>`);
  if (input.figures.length > 0) parts.push('<section id="figures">');
  input.figures.forEach((f, i) => {
    const rf: ReportFigure = isPlotFigure(f) ? { figure: f } : f;
    if (!rf.figure || !isPlotFigure(rf.figure)) throw new InputError(`reportHtml: figure ${i + 1} should be a figure { data, layout } or { figure, caption }`);
    const notes = rf.figure.layout.meta?.notes ?? [];
    const caption =
      rf.caption || notes.length > 0
        ? `<figcaption>${rf.caption ? htmlEscape(rf.caption) : ""}${notes.length > 0 ? `<ul>${notes.map((n) => `<li>${htmlEscape(n)}</li>`).join("")}</ul>` : ""}</figcaption>`
        : "";
    parts.push(`<figure>\n${figureElements({ id: `hp-figure-${i + 1}`, figure: rf.figure, filename: rf.name ?? rf.figure.layout.meta.figure })}\n${caption}</figure>`);
  });
  if (input.figures.length > 0) parts.push("</section>");
  for (const t of input.tables ?? []) {
    if (!Array.isArray(t.rows)) throw new InputError(`reportHtml: table ${JSON.stringify(t.title)}: \`rows\` should be an array`);
    parts.push(`<section class="hp-table"><h2>${htmlEscape(t.title)}</h2>\n${tableHtml(t)}</section>`);
  }
  const prov = Object.entries(input.provenance)
    .map(([k, v]) => `<dt>${htmlEscape(k)}</dt><dd>${htmlEscape(cellText(v))}</dd>`)
    .join("\n");
  parts.push(`<section id="provenance"><h2>Provenance</h2>\n<dl class="hp-provenance">\n${prov}\n</dl></section>`, "</main>");
  return standalonePage(input.title, parts.join("\n"));
}
