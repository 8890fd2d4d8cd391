// The shapes the figure builders read (rows as the results store hands them, declared in
// src/experiment/rows.ts; fitted curves and exponents in the shapes src/fit defines, imported as
// types only, so any object with those fields can be plotted) and the shape they return (a plain
// plotly figure: traces and a layout, never a DOM node).

import type { CurveFit, ExponentEstimate } from "../fit/index.js";
import type { DegreeMeasure, SurplusRow } from "../experiment/rows.js";
export type { CurveFit, DegreeMeasure, ExponentEstimate, SurplusRow };

/**
 * The conjectured law surplus = c·m/√d as a line of slope 1 on log–log axes, with its fitted
 * constant c (and c's interval when known).
 */
export interface ConjectureLine {
  constant: number;
  lower?: number;
  upper?: number;
  /** The family the constant was fitted on, if one. */
  family?: string;
}

/** Plotly marker symbols the palette uses (a subset with a pgfplots mark for each). */
export type MarkerSymbol =
  | "circle"
  | "square"
  | "diamond"
  | "triangle-up"
  | "triangle-down"
  | "pentagon"
  | "cross"
  | "x"
  | "circle-open"
  | "square-open"
  | "diamond-open"
  | "triangle-up-open"
  | "triangle-down-open"
  | "pentagon-open"
  | "asterisk-open"
  | "star-open";

export type LineDash = "solid" | "dash" | "dot" | "dashdot" | "longdash";

/** What a trace is for, so the exporters (pgfplots, CSV) know how to write it. */
export type TraceRole = "points" | "fit" | "band-lower" | "band-upper" | "conjecture" | "reference" | "distribution";

export interface ErrorBars {
  type: "data";
  symmetric: false;
  /** Distance above (or right of) each point. */
  array: number[];
  /** Distance below (or left of) each point. */
  arrayminus: number[];
  visible: true;
  color: string;
  thickness: number;
  width: number;
}

/** A scatter trace as our builders emit it: the plotly attributes we use, typed. */
export interface PlotTrace {
  type: "scatter";
  uid: string;
  name: string;
  mode: "markers" | "lines" | "lines+markers";
  x: (number | null)[];
  y: (number | null)[];
  xaxis?: "x" | "x2";
  yaxis?: "y" | "y2";
  text?: string[];
  customdata?: (number | string | null)[][];
  hovertemplate?: string;
  marker?: { symbol: MarkerSymbol; color: string; size: number; line: { color: string; width: number } };
  line?: { color: string; width: number; dash: LineDash; shape?: "linear" | "hv" };
  error_x?: ErrorBars;
  error_y?: ErrorBars;
  fill?: "none" | "tonexty";
  fillcolor?: string;
  showlegend?: boolean;
  legendgroup?: string;
  /** Ours: the trace's role and its name in TeX; plotly carries `meta` through untouched. */
  meta: { role: TraceRole; tex: string; family?: string };
}

export interface AxisLayout {
  title: { text: string; standoff?: number; font?: { size: number; color: string } };
  type: "linear" | "log";
  domain?: [number, number];
  anchor?: "x" | "y" | "x2" | "y2";
  autorange?: boolean | "reversed";
  tickvals?: number[];
  ticktext?: string[];
  tickangle?: number;
  rangemode?: "normal" | "tozero";
  exponentformat?: "power" | "none" | "e";
  [key: string]: unknown;
}

/** What the exporters need beyond plotly's own attributes (kept under layout.meta). */
export interface FigureMeta {
  /** Which builder made it, e.g. "surplus-scaling". */
  figure: string;
  /** Things a reader should know: rows left out and why, styles reused. */
  notes: string[];
  /** Axis titles in TeX for the pgfplots emitter, per axis id ("x", "y", "x2", "y2"). */
  tex: Partial<Record<"title" | "x" | "y" | "x2" | "y2", string>>;
  /** Column names for the CSV export, per axis id. */
  columns: Partial<Record<"x" | "y" | "x2" | "y2", string>>;
}

export interface PlotLayout {
  title?: { text: string; x?: number; xanchor?: string; font?: Record<string, unknown> };
  xaxis: AxisLayout;
  yaxis: AxisLayout;
  xaxis2?: AxisLayout;
  yaxis2?: AxisLayout;
  annotations?: Record<string, unknown>[];
  meta: FigureMeta;
  [key: string]: unknown;
}

/** A plotly figure: `Plotly.newPlot(div, figure.data, figure.layout)` draws it. */
export interface PlotFigure {
  data: PlotTrace[];
  layout: PlotLayout;
}
