// Our own pgfplots emitter: a figure as a TikZ picture that typesets in the paper's fonts —
// coordinates, asymmetric error bars, log axes, axis options, legend, and a band either filled
// between its edges or as two dashed lines. Pure string building: same figure, same bytes.

import { InputError } from "../../errors.js";
import { hexToRgb } from "../colour.js";
import { INK } from "../palette.js";
import { texEscape } from "../tex.js";
import type { AxisLayout, ErrorBars, LineDash, MarkerSymbol, PlotFigure, PlotTrace } from "../types.js";

export interface PgfplotsOptions {
  /** Width and height of one axis, as TeX dimensions (default 11cm × 7cm). */
  width?: string;
  height?: string;
  /** A band as a filled area (default) or as its two edges dashed. */
  band?: "fill" | "dashed";
  /** Put the figure's title above the axes (default false: the paper's caption says it). */
  title?: boolean;
  /** Legend placement: outside right (default), inside top left, or none. */
  legend?: "outside" | "inside" | "none";
}

/** pgfplots marks for our marker symbols (plotmarks library names). */
const MARKS: Record<MarkerSymbol, { mark: string; rotate?: number; filled: boolean }> = {
  circle: { mark: "*", filled: true },
  square: { mark: "square*", filled: true },
  diamond: { mark: "diamond*", filled: true },
  "triangle-up": { mark: "triangle*", filled: true },
  "triangle-down": { mark: "triangle*", rotate: 180, filled: true },
  pentagon: { mark: "pentagon*", filled: true },
  cross: { mark: "+", filled: false },
  x: { mark: "x", filled: false },
  "circle-open": { mark: "o", filled: false },
  "square-open": { mark: "square", filled: false },
  "diamond-open": { mark: "diamond", filled: false },
  "triangle-up-open": { mark: "triangle", filled: false },
  "triangle-down-open": { mark: "triangle", rotate: 180, filled: false },
  "pentagon-open": { mark: "pentagon", filled: false },
  "asterisk-open": { mark: "asterisk", filled: false },
  "star-open": { mark: "star", filled: false },
};

const DASHES: Record<LineDash, string> = {
  solid: "solid",
  dash: "dashed",
  dot: "dotted",
  dashdot: "dashdotted",
  longdash: "loosely dashed",
};

/** A number as pgfplots reads it (shortest round-trip decimal, so the coordinates are exact). */
export function texNumber(v: number): string {
  return String(v);
}

/** A TeX dimension times a factor ("11cm" × 0.46 → "5.06cm"); other forms are scaled by TeX. */
function scaleDimension(dim: string, factor: number): string {
  const m = /^(\d+(?:\.\d+)?)([a-z]{2})$/.exec(dim.trim());
  return m ? `${Number((Number(m[1]) * factor).toFixed(3))}${m[2]}` : `${factor}${dim}`;
}

/** "#RRGGBB" or "rgba(r,g,b,a)" → hex digits and opacity. */
function parseColour(c: string): { hex: string; alpha: number } {
  if (/^#[0-9a-fA-F]{6}$/.test(c)) return { hex: c.slice(1).toUpperCase(), alpha: 1 };
  const m = /^rgba?\((\d+),\s*(\d+),\s*(\d+)(?:,\s*([\d.]+))?\)$/.exec(c);
  if (!m) throw new InputError(`pgfplots export: unsupported colour ${JSON.stringify(c)} (use #RRGGBB or rgba())`);
  const hex = [m[1], m[2], m[3]].map((x) => Number(x).toString(16).padStart(2, "0")).join("").toUpperCase();
  return { hex, alpha: m[4] === undefined ? 1 : Number(m[4]) };
}

const colourName = (hex: string) => `hp${hex}`;

class Colours {
  readonly used = new Set<string>();
  name(c: string): { name: string; alpha: number } {
    const { hex, alpha } = parseColour(c);
    hexToRgb(`#${hex}`); // validates
    this.used.add(hex);
    return { name: colourName(hex), alpha };
  }
}

type AxisPair = { x: "x" | "x2"; y: "y" | "y2" };

function axisOptions(figure: PlotFigure, pair: AxisPair, traces: PlotTrace[], opts: Required<PgfplotsOptions>, colours: Colours, first: boolean, legendHere: boolean, width: string): string[] {
  const lx = (pair.x === "x" ? figure.layout.xaxis : figure.layout.xaxis2) as AxisLayout;
  const ly = (pair.y === "y" ? figure.layout.yaxis : figure.layout.yaxis2) as AxisLayout;
  const tex = figure.layout.meta.tex;
  const out: string[] = [`width=${width}`, `height=${opts.height}`, "scale only axis"];
  if (lx.type === "log") out.push("xmode=log", "log basis x=10");
  if (ly.type === "log") out.push("ymode=log", "log basis y=10");
  const xlabel = tex[pair.x] ?? texEscape(lx.title.text);
  const ylabel = tex[pair.y] ?? texEscape(ly.title.text);
  if (xlabel) out.push(`xlabel={${xlabel}}`);
  if (ylabel) out.push(`ylabel={${ylabel}}`);
  if (opts.title && first && figure.layout.title?.text) out.push(`title={${tex.title ?? texEscape(figure.layout.title.text)}}`);
  for (const [a, l] of [["x", lx], ["y", ly]] as const) {
    if (l.tickvals) {
      out.push(`${a}tick={${l.tickvals.map(texNumber).join(",")}}`);
      if (l.ticktext) out.push(`${a}ticklabels={${l.ticktext.map((t) => `{${texEscape(t)}}`).join(",")}}`);
    }
    const range = l.range as [number, number] | undefined;
    if (l.autorange === "reversed" || (range && range[0] > range[1])) out.push(`${a} dir=reverse`);
    if (typeof l.tickangle === "number" && l.tickangle !== 0)
      out.push(`${a}ticklabel style={rotate=${-l.tickangle}, anchor=${a === "x" ? "north east" : "east"}, font=\\footnotesize}`);
    if (range && l.type === "linear") out.push(`${a}min=${texNumber(Math.min(...range))}`, `${a}max=${texNumber(Math.max(...range))}`);
    if (l.type === "linear" && !l.tickvals) out.push(`scaled ${a} ticks=false`, `${a}ticklabel style={/pgf/number format/fixed, /pgf/number format/precision=4}`);
    if (l.rangemode === "tozero" && l.type === "linear" && traces.every((t) => (a === "x" ? t.x : t.y).every((v) => v === null || v >= 0)))
      out.push(`${a}min=0`);
    if (l.showgrid === false) out.push(`${a}majorgrids=false`);
  }
  const grid = colours.name(INK.grid).name;
  out.push("grid=major", `major grid style={draw=${grid}}`, "tick align=outside", "axis line style={draw=black!75}");
  out.push("legend cell align=left");
  if (opts.legend === "outside" && legendHere) out.push(`legend style={at={(1.03,1)}, anchor=north west, font=\\footnotesize, draw=${grid}}`);
  else if (opts.legend === "inside" && legendHere) out.push(`legend style={at={(0.02,0.98)}, anchor=north west, font=\\footnotesize, draw=${grid}, fill=white, fill opacity=0.9, text opacity=1}`);
  if (traces.length === 0) {
    // pgfplots needs limits when an axis has nothing on it.
    out.push(lx.type === "log" ? "xmin=1, xmax=10" : "xmin=0, xmax=1", ly.type === "log" ? "ymin=1, ymax=10" : "ymin=0, ymax=1");
  }
  return out;
}

function point(x: number, y: number, ex: ErrorBars | undefined, ey: ErrorBars | undefined, i: number, floorY: number | null, cut: { n: number }): string {
  let s = `(${texNumber(x)},${texNumber(y)})`;
  if (ex || ey) {
    const xp = ex ? ex.array[i] : 0;
    const xm = ex ? ex.arrayminus[i] : 0;
    const yp = ey ? ey.array[i] : 0;
    let ym = ey ? ey.arrayminus[i] : 0;
    if (floorY !== null && y - ym <= 0) {
      // A log axis cannot reach 0: the bar is drawn down to the floor and the cut is reported.
      ym = y - floorY;
      cut.n++;
    }
    s += ` += (${texNumber(xp)},${texNumber(yp)}) -= (${texNumber(xm)},${texNumber(ym)})`;
  }
  return s;
}

function coordinates(t: PlotTrace, floorY: number | null, cut: { n: number }): string[] {
  const lines: string[] = [];
  for (let i = 0; i < t.x.length; i++) {
    const x = t.x[i];
    const y = t.y[i];
    if (x === null || y === null || !Number.isFinite(x) || !Number.isFinite(y)) continue;
    lines.push(`  ${point(x, y, t.error_x, t.error_y, i, floorY, cut)}`);
  }
  return lines;
}

function plotOptions(t: PlotTrace, colours: Colours, forget: boolean): string[] {
  const o: string[] = [];
  const hasMarks = t.mode !== "lines" && t.marker;
  const hasLine = t.mode !== "markers" && t.line && t.line.width > 0;
  const colour = colours.name(t.marker?.color ?? t.line?.color ?? INK.text).name;
  o.push(`color=${colour}`);
  if (!hasLine) o.push("only marks");
  else o.push(`line width=${texNumber(Math.round(t.line!.width * 0.75 * 100) / 100)}pt`, DASHES[t.line!.dash]);
  if (hasMarks) {
    const m = MARKS[t.marker!.symbol];
    const outline = colours.name(t.marker!.line.color).name;
    const markOpts = [`solid`, m.filled ? `fill=${colour}, draw=${outline}` : `draw=${colour}`];
    if (m.rotate) markOpts.push(`rotate=${m.rotate}`);
    o.push(`mark=${m.mark}`, `mark size=${texNumber(Math.round(t.marker!.size * 0.28 * 100) / 100)}pt`, `mark options={${markOpts.join(", ")}}`);
  } else o.push("no marks");
  if (t.error_x || t.error_y) {
    const bars = ["error bars/.cd"];
    if (t.error_y) bars.push("y dir=both", "y explicit");
    if (t.error_x) bars.push("x dir=both", "x explicit");
    const barColour = colours.name((t.error_y ?? t.error_x)!.color).name;
    o.push(`error bars/error bar style={draw=${barColour}, line width=0.5pt, solid}`, `error bars/error mark options={draw=${barColour}, rotate=90, mark size=1.5pt}`);
    o.push(...bars);
  }
  if (forget) o.push("forget plot");
  return o;
}

/** Smallest positive y (values and bar ends) on a log axis, halved: where bars reaching 0 stop. */
function logFloor(traces: PlotTrace[]): number {
  let min = Infinity;
  for (const t of traces)
    t.y.forEach((y, i) => {
      if (y === null || !(y > 0)) return;
      min = Math.min(min, y);
      const low = t.error_y ? y - t.error_y.arrayminus[i] : y;
      if (low > 0) min = Math.min(min, low);
    });
  return Number.isFinite(min) ? min / 2 : 1;
}

function axisBody(
  figure: PlotFigure,
  pair: AxisPair,
  traces: PlotTrace[],
  opts: Required<PgfplotsOptions>,
  colours: Colours,
  panel: { first: boolean; legendHere: boolean; panels: number; width: string; placement: string },
): string[] {
  const ly = (pair.y === "y" ? figure.layout.yaxis : figure.layout.yaxis2) as AxisLayout;
  const floorY = ly.type === "log" ? logFloor(traces) : null;
  const cut = { n: 0 };
  const body: string[] = [];
  const legend = opts.legend !== "none" && panel.legendHere;
  // With several panels the legend sits by the last one and names every series drawn there.
  const shown = (t: PlotTrace) => panel.panels > 1 || t.showlegend !== false;
  let band = 0;
  for (let k = 0; k < traces.length; k++) {
    const t = traces[k];
    const entry = legend && shown(t);
    if (t.meta.role === "band-lower" && traces[k + 1]?.meta.role === "band-upper") {
      const upper = traces[k + 1];
      k++;
      band++;
      const fillColour = colours.name(upper.fillcolor ?? upper.line?.color ?? INK.fit);
      const edge = colours.name(upper.line?.color ?? INK.fit).name;
      const lo = `hpband${band}lo`;
      const hi = `hpband${band}hi`;
      if (opts.band === "fill") {
        body.push(`\\addplot[draw=none, no marks, forget plot, name path=${lo}] coordinates {`, ...coordinates(t, floorY, cut), "};");
        body.push(`\\addplot[draw=none, no marks, forget plot, name path=${hi}] coordinates {`, ...coordinates(upper, floorY, cut), "};");
        body.push(`\\addplot[fill=${fillColour.name}, fill opacity=${texNumber(fillColour.alpha)}, draw=none${!shown(upper) || !legend ? ", forget plot" : ""}] fill between[of=${hi} and ${lo}];`);
      } else {
        body.push(`\\addplot[color=${edge}, line width=0.6pt, dashed, no marks, forget plot] coordinates {`, ...coordinates(t, floorY, cut), "};");
        body.push(`\\addplot[color=${edge}, line width=0.6pt, dashed, no marks${!shown(upper) || !legend ? ", forget plot" : ""}] coordinates {`, ...coordinates(upper, floorY, cut), "};");
      }
      if (legend && shown(upper)) body.push(`\\addlegendentry{${upper.meta.tex}}`);
      continue;
    }
    body.push(`\\addplot[${plotOptions(t, colours, !entry).join(", ")}] coordinates {`, ...coordinates(t, floorY, cut), "};");
    if (entry) body.push(`\\addlegendentry{${t.meta.tex}}`);
  }
  const notes = (figure.layout.annotations ?? []).filter((a) => a.xref === "paper" && typeof a.text === "string");
  for (const a of notes) body.push(`\\node[font=\\small, text=black!60] at (rel axis cs:0.5,0.5) {${texEscape(String(a.text))}};`);
  const options = axisOptions(figure, pair, traces, opts, colours, panel.first, panel.legendHere, panel.width);
  options.unshift(panel.placement);
  const head = [`\\begin{axis}[`, ...options.map((o, i) => `  ${o}${i < options.length - 1 ? "," : ""}`), "]"];
  const cutNote = cut.n > 0 ? [`% ${cut.n} error bars reach 0 or below; on this log axis they stop at ${texNumber(floorY!)}`] : [];
  return [...cutNote, ...head, ...body, "\\end{axis}"];
}

/**
 * The figure as a `tikzpicture` with pgfplots axes, ready to `\input` into a paper that loads
 * pgfplots and its fillbetween library (see `pgfplotsDocument` for a complete file).
 */
export function figureToPgfplots(figure: PlotFigure, options: PgfplotsOptions = {}): string {
  const opts: Required<PgfplotsOptions> = { width: "11cm", height: "7cm", band: "fill", title: false, legend: "outside", ...options };
  if (!["fill", "dashed"].includes(opts.band)) throw new InputError(`pgfplots export: invalid \`band\`: one of fill, dashed (got ${JSON.stringify(opts.band)})`);
  if (!["outside", "inside", "none"].includes(opts.legend)) throw new InputError(`pgfplots export: invalid \`legend\`: one of outside, inside, none (got ${JSON.stringify(opts.legend)})`);
  const colours = new Colours();
  const pairs: AxisPair[] = [{ x: "x", y: "y" }];
  if (figure.layout.xaxis2 && figure.layout.yaxis2) pairs.push({ x: "x2", y: "y2" });
  const parts: string[] = [];
  // Panels share the width; each further panel sits right of the one before, leaving room for
  // its tick labels and axis title. The legend goes by the last panel.
  const width = pairs.length === 1 ? opts.width : scaleDimension(opts.width, 0.46);
  pairs.forEach((pair, i) => {
    const traces = figure.data.filter((t) => (t.xaxis ?? "x") === pair.x && (t.yaxis ?? "y") === pair.y);
    const placement = i === 0 ? "name=hppanel1" : `name=hppanel${i + 1}, at={(hppanel${i}.east)}, anchor=west, xshift=1.9cm`;
    parts.push(...axisBody(figure, pair, traces, opts, colours, { first: i === 0, legendHere: i === pairs.length - 1, panels: pairs.length, width, placement }));
  });
  const defs = [...colours.used].sort().map((hex) => `\\definecolor{${colourName(hex)}}{HTML}{${hex}}`);
  const title = figure.layout.title?.text ?? "";
  return [
    `% halfplus figure "${figure.layout.meta.figure}"${title ? `: ${title.replace(/[\r\n]/g, " ")}` : ""}`,
    "% needs \\usepackage{pgfplots} and \\usepgfplotslibrary{fillbetween}",
    "\\begin{tikzpicture}",
    ...defs,
    ...parts,
    "\\end{tikzpicture}",
    "",
  ].join("\n");
}

/** A complete LaTeX file (article class, so only texlive-latex-base and texlive-pictures are needed). */
export function pgfplotsDocument(figure: PlotFigure, options: PgfplotsOptions = {}): string {
  return [
    "\\documentclass{article}",
    "\\usepackage[margin=1cm,landscape]{geometry}",
    "\\usepackage{pgfplots}",
    "\\usepgfplotslibrary{fillbetween}",
    "\\pgfplotsset{compat=1.16}",
    "\\pagestyle{empty}",
    "\\begin{document}",
    "\\noindent",
    figureToPgfplots(figure, options).trimEnd(),
    "\\end{document}",
    "",
  ].join("\n");
}
