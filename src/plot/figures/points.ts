// A family's points as one trace: markers in the family's style, and error bars drawn from
// absolute ends (the bar runs from low to high whatever the point is).

import type { SeriesStyle } from "../palette.js";
import { texEscape } from "../tex.js";
import type { ErrorBars, PlotTrace } from "../types.js";

export interface PointSet {
  x: number[];
  y: number[];
  /** Absolute ends of each point's vertical bar (omit for none). */
  yLow?: number[];
  yHigh?: number[];
  /** Absolute ends of each point's horizontal bar (omit for none). */
  xLow?: number[];
  xHigh?: number[];
  text: string[];
  customdata?: (number | string | null)[][];
}

/** Error bars whose ends are the given absolute values around the points. */
export function barsFromEnds(centre: readonly number[], low: readonly number[], high: readonly number[], colour: string): ErrorBars {
  return {
    type: "data",
    symmetric: false,
    array: centre.map((c, i) => high[i] - c),
    arrayminus: centre.map((c, i) => c - low[i]),
    visible: true,
    color: colour,
    thickness: 1.2,
    width: 3,
  };
}

export function pointsTrace(uid: string, name: string, style: SeriesStyle, points: PointSet, hovertemplate: string, family?: string): PlotTrace {
  const barColour = style.outline === style.colour ? style.colour : style.outline;
  const trace: PlotTrace = {
    type: "scatter",
    uid,
    name,
    mode: "markers",
    x: points.x,
    y: points.y,
    text: points.text,
    hovertemplate,
    marker: { symbol: style.symbol, color: style.colour, size: style.size, line: { color: style.outline, width: 1 } },
    meta: { role: "points", tex: texEscape(name), family },
  };
  if (points.customdata) trace.customdata = points.customdata;
  if (points.yLow && points.yHigh) trace.error_y = barsFromEnds(points.y, points.yLow, points.yHigh, barColour);
  if (points.xLow && points.xHigh) trace.error_x = barsFromEnds(points.x, points.xLow, points.xHigh, barColour);
  return trace;
}

