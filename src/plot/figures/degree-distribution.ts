// Figure 5: a family's degree and degeneracy distributions, side by side — left, the share of
// vertices with each degree (all of the family's graphs pooled, from the rows' `degrees`);
// right, how many of the family's graphs have each degeneracy. One trace per family and panel.

import { InputError } from "../../errors.js";
import { familyStyles } from "../palette.js";
import { checkRows, familiesOf } from "../rows.js";
import { axis, baseLayout, emptyNote } from "../theme.js";
import type { PlotFigure, PlotTrace, SurplusRow } from "../types.js";

export interface DegreeDistributionOptions {
  /** The family or families to show (default: every family in the rows). */
  family?: string | readonly string[];
  familyOrder?: readonly string[];
  title?: string;
}

const OWNER = "degreeDistributionFigure";

/** value → count, as sorted parallel arrays. */
function histogram(values: Iterable<number>): { values: number[]; counts: number[] } {
  const counts = new Map<number, number>();
  for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
  const keys = [...counts.keys()].sort((a, b) => a - b);
  return { values: keys, counts: keys.map((k) => counts.get(k)!) };
}

/** Degree and degeneracy distributions of one or more families, two panels. */
export function degreeDistributionFigure(rows: readonly SurplusRow[], options: DegreeDistributionOptions = {}): PlotFigure {
  checkRows(OWNER, rows);
  const all = familiesOf(rows);
  const wanted = options.family === undefined ? all : typeof options.family === "string" ? [options.family] : [...options.family];
  for (const f of wanted)
    if (!all.includes(f)) throw new InputError(`${OWNER}: invalid \`family\`: no rows of family ${JSON.stringify(f)} (families present: ${all.join(", ") || "none"})`);
  const styled = familyStyles(wanted, options.familyOrder);
  const data: PlotTrace[] = [];
  const notes = [...styled.notes];
  for (const [family, style] of styled.styles) {
    const graphs = rows.filter((r) => r.family === family);
    const withDegrees = graphs.filter((r) => r.degrees !== undefined);
    const marker = { symbol: style.symbol, color: style.colour, size: style.size - 1, line: { color: style.outline, width: 1 } };
    const line = { color: style.colour, width: 1.4, dash: "solid" as const };
    if (withDegrees.length < graphs.length) notes.push(`${family}: ${graphs.length - withDegrees.length} of ${graphs.length} graphs have no per-vertex degrees (left panel uses the rest)`);
    if (withDegrees.length > 0) {
      const h = histogram(withDegrees.flatMap((r) => r.degrees as number[]));
      const total = h.counts.reduce((a, b) => a + b, 0);
      data.push({
        type: "scatter",
        uid: `degrees-${data.length}`,
        name: family,
        mode: "lines+markers",
        x: h.values,
        y: h.counts.map((c) => c / total),
        xaxis: "x",
        yaxis: "y",
        customdata: h.counts.map((c) => [c]),
        hovertemplate: `degree %{x}: %{y:.3p} of vertices (%{customdata[0]})<extra>${family}</extra>`,
        marker,
        line,
        legendgroup: family,
        meta: { role: "distribution", tex: family, family },
      });
    }
    const g = histogram(graphs.map((r) => r.degeneracy));
    data.push({
      type: "scatter",
      uid: `degeneracy-${data.length}`,
      name: `${family} (degeneracy)`,
      mode: "lines+markers",
      x: g.values,
      y: g.counts,
      xaxis: "x2",
      yaxis: "y2",
      hovertemplate: `degeneracy %{x}: %{y} graphs<extra>${family}</extra>`,
      marker,
      line,
      legendgroup: family,
      showlegend: withDegrees.length === 0,
      meta: { role: "distribution", tex: family, family },
    });
  }
  const layout = baseLayout(
    options.title ?? (wanted.length === 1 ? `Degrees and degeneracy: ${wanted[0]}` : "Degrees and degeneracy"),
    axis("vertex degree", "linear", { domain: [0, 0.45], anchor: "y" }),
    axis("share of vertices", "linear", { anchor: "x", rangemode: "tozero" }),
    {
      figure: "degree-distribution",
      notes,
      tex: { x: "vertex degree", y: "share of vertices", x2: "degeneracy", y2: "graphs" },
      columns: { x: "degree", y: "share_of_vertices", x2: "degeneracy", y2: "graphs" },
    },
    {
      xaxis2: axis("degeneracy", "linear", { domain: [0.57, 1], anchor: "y2" }),
      yaxis2: axis("graphs", "linear", { anchor: "x2", rangemode: "tozero" }),
    },
  );
  if (data.length === 0) layout.annotations = [emptyNote("No graphs to plot")];
  return { data, layout };
}
