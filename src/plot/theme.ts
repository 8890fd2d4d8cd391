// The look every figure shares: fonts, axes, legend, margins and the "nothing to plot" note,
// built from the palette and typography so each builder only says what is particular to it.

import { INK, TYPOGRAPHY } from "./palette.js";
import type { AxisLayout, FigureMeta, PlotLayout } from "./types.js";

/** One axis in the house style. `title` is plain text (Unicode allowed); TeX goes in the meta. */
export function axis(title: string, type: "linear" | "log", extra: Partial<AxisLayout> = {}): AxisLayout {
  return {
    title: { text: title, standoff: 8, font: { size: TYPOGRAPHY.axisTitleSize, color: INK.text } },
    type,
    showline: true,
    linecolor: INK.axis,
    linewidth: 1,
    mirror: true,
    ticks: "outside",
    ticklen: 4,
    tickcolor: INK.axis,
    tickfont: { size: TYPOGRAPHY.tickSize, color: INK.muted },
    showgrid: true,
    gridcolor: INK.grid,
    zeroline: false,
    exponentformat: "power",
    automargin: true,
    ...extra,
  };
}

/** The layout around the axes: title, fonts, legend, margins, and our meta for the exporters. */
export function baseLayout(title: string, xaxis: AxisLayout, yaxis: AxisLayout, meta: FigureMeta, extra: Partial<PlotLayout> = {}): PlotLayout {
  return {
    title: { text: title, x: 0.01, xanchor: "left", font: { size: TYPOGRAPHY.titleSize, color: INK.text } },
    font: { family: TYPOGRAPHY.family, size: TYPOGRAPHY.size, color: INK.text },
    paper_bgcolor: INK.paper,
    plot_bgcolor: INK.paper,
    margin: { l: 70, r: 24, t: 56, b: 62 },
    showlegend: true,
    legend: {
      x: 1.02,
      xanchor: "left",
      y: 1,
      yanchor: "top",
      bgcolor: INK.paper,
      bordercolor: INK.grid,
      borderwidth: 1,
      font: { size: TYPOGRAPHY.legendSize, color: INK.text },
    },
    hoverlabel: { font: { family: TYPOGRAPHY.family, size: TYPOGRAPHY.tickSize } },
    xaxis,
    yaxis,
    meta,
    ...extra,
  };
}

/** A centred note on an empty figure, saying why there is nothing to see. */
export function emptyNote(text: string): Record<string, unknown> {
  return {
    text,
    xref: "paper",
    yref: "paper",
    x: 0.5,
    y: 0.5,
    showarrow: false,
    font: { size: TYPOGRAPHY.noteSize, color: INK.muted },
  };
}

/** A number for a legend or a label: three significant digits, no trailing zeros. */
export function shortNumber(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  return String(Number(v.toPrecision(3)));
}
