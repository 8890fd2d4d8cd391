// Figure 4: how tight the bounds are, graph by graph — the best cut found, the certified SDP
// upper bound, the explicit vector rounding's guarantee and the Edwards bound, all as surplus
// (value − W/2) on a log axis, one column of marks per graph.

import { familyStyles, seriesStyle, type SeriesStyle } from "../palette.js";
import { checkRows } from "../rows.js";
import { axis, baseLayout, emptyNote } from "../theme.js";
import type { PlotFigure, PlotTrace, SurplusRow } from "../types.js";
import { pointsTrace } from "./points.js";

export interface BoundTightnessOptions {
  /** Order graphs by family (in this order, then sorted) and by m within a family; default keeps the input order. */
  familyOrder?: readonly string[];
  sortByFamily?: boolean;
  title?: string;
}

type BoundField = "bestCut" | "sdpBound" | "vectorGuarantee" | "edwardsBound";

/** The four series, each with a fixed style (these are kinds of bound, not families). */
export const BOUND_SERIES: readonly { field: BoundField; name: string; style: SeriesStyle }[] = [
  { field: "sdpBound", name: "SDP upper bound", style: { ...seriesStyle(0), symbol: "triangle-down" } },
  { field: "bestCut", name: "best cut found", style: { ...seriesStyle(6), symbol: "circle" } },
  { field: "vectorGuarantee", name: "vector rounding guarantee", style: { ...seriesStyle(5), symbol: "diamond" } },
  { field: "edwardsBound", name: "Edwards bound", style: { ...seriesStyle(4), symbol: "square" } },
];

const OWNER = "boundTightnessFigure";
/** Show at most this many graph labels on the axis; the rest stay on hover. */
const MAX_TICK_LABELS = 40;

/** Each graph's bounds as surplus on a log axis. */
export function boundTightnessFigure(rows: readonly SurplusRow[], options: BoundTightnessOptions = {}): PlotFigure {
  checkRows(OWNER, rows);
  let graphs = [...rows];
  if (options.sortByFamily || options.familyOrder) {
    const order = [...familyStyles(rows.map((r) => r.family), options.familyOrder).styles.keys()];
    graphs = graphs
      .map((r, i) => ({ r, i }))
      .sort((a, b) => order.indexOf(a.r.family) - order.indexOf(b.r.family) || a.r.m - b.r.m || a.i - b.i)
      .map((e) => e.r);
  }
  const labels = graphs.map((r, i) => r.key ?? `${r.family} #${i + 1}`);
  const notes: string[] = [];
  const data: PlotTrace[] = [];
  for (const series of BOUND_SERIES) {
    const xs: number[] = [];
    const ys: number[] = [];
    const text: string[] = [];
    let missing = 0;
    let nonPositive = 0;
    graphs.forEach((r, i) => {
      const v = r[series.field];
      if (v === undefined) return void missing++;
      const surplus = v - (r.totalWeight ?? r.m) / 2;
      if (!(surplus > 0)) return void nonPositive++;
      xs.push(i);
      ys.push(surplus);
      text.push(labels[i]);
    });
    if (missing > 0 && missing < graphs.length) notes.push(`${series.name}: not given for ${missing} of ${graphs.length} graphs`);
    if (missing === graphs.length && graphs.length > 0) notes.push(`${series.name}: not given for any graph`);
    if (nonPositive > 0) notes.push(`${series.name}: ${nonPositive} surplus values ≤ 0 not drawn (log axis)`);
    if (xs.length === 0) continue;
    data.push(pointsTrace(`bound-${data.length}`, series.name, series.style, { x: xs, y: ys, text }, `%{text}<br>${series.name}: surplus %{y:.4g}<extra></extra>`));
  }
  const step = Math.max(1, Math.ceil(graphs.length / MAX_TICK_LABELS));
  const ticks = graphs.map((_, i) => i).filter((i) => i % step === 0);
  if (step > 1) notes.push(`axis labels on every ${step}th graph; hover names every graph`);
  const layout = baseLayout(
    options.title ?? "How tight the bounds are",
    axis("graph", "linear", { tickvals: ticks, ticktext: ticks.map((i) => labels[i]), tickangle: -40, showgrid: false, range: [-0.6, Math.max(graphs.length - 0.4, 0.4)] }),
    axis("surplus  (value − W/2)", "log"),
    {
      figure: "bound-tightness",
      notes,
      tex: { x: "graph", y: "surplus (value $- W/2$)" },
      columns: { x: "graph_index", y: "surplus" },
    },
  );
  if (data.length === 0) layout.annotations = [emptyNote(rows.length === 0 ? "No graphs to plot" : "No bound can be drawn here: see the notes")];
  return { data, layout };
}
