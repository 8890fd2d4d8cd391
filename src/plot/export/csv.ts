// CSV of exactly what a figure plots: one line per drawn point of every trace (band edges and
// reference lines included), with each error bar's absolute ends. Columns are named after the
// figure's axes; a two-panel figure gets a `panel` column naming the panel by its x quantity.

import type { PlotFigure, PlotTrace } from "../types.js";

/** One CSV field (RFC 4180: quoted when it holds a comma, a quote or a line break). */
export function csvField(v: string | number | null | undefined): string {
  if (v === null || v === undefined) return "";
  const s = typeof v === "number" ? String(v) : v;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The figure's plotted data as CSV text (ends with a newline). */
export function figureToCsv(figure: PlotFigure): string {
  const cols = figure.layout.meta.columns;
  const twoPanels = figure.layout.xaxis2 !== undefined;
  const hasX = (t: PlotTrace) => t.error_x !== undefined;
  const hasY = (t: PlotTrace) => t.error_y !== undefined;
  const xBars = figure.data.some(hasX);
  const yBars = figure.data.some(hasY);
  const xName = twoPanels ? "x" : (cols.x ?? "x");
  const yName = twoPanels ? "y" : (cols.y ?? "y");
  const header = [
    ...(twoPanels ? ["panel"] : []),
    "series",
    "role",
    "label",
    xName,
    yName,
    ...(yBars ? [`${yName}_low`, `${yName}_high`] : []),
    ...(xBars ? [`${xName}_low`, `${xName}_high`] : []),
  ];
  const lines = [header.join(",")];
  for (const t of figure.data) {
    const panel = (t.xaxis ?? "x") === "x2" ? (cols.x2 ?? "x2") : (cols.x ?? "x");
    for (let i = 0; i < t.x.length; i++) {
      const x = t.x[i];
      const y = t.y[i];
      if (x === null || y === null) continue;
      const row: (string | number | null)[] = [...(twoPanels ? [panel] : []), t.name, t.meta.role, t.text?.[i] ?? null, x, y];
      if (yBars) row.push(t.error_y ? y - t.error_y.arrayminus[i] : null, t.error_y ? y + t.error_y.array[i] : null);
      if (xBars) row.push(t.error_x ? x - t.error_x.arrayminus[i] : null, t.error_x ? x + t.error_x.array[i] : null);
      lines.push(row.map(csvField).join(","));
    }
  }
  return lines.join("\n") + "\n";
}
