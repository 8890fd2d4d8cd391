// Figure 2: the normalised surplus, surplus/(m/√d), against m per family — does it level off,
// fall or grow? Each bar is the surplus bracket divided by m/√d; the conjectured constant c,
// when given, is a horizontal line.

import { asList, conjectureConstant, conjectureLabel, curveRange } from "../curves.js";
import { DASH, INK, familyStyles } from "../palette.js";
import { DEGREE_MEASURES, DEGREE_WORDS } from "../../experiment/rows.js";
import { LeftOut, checkChoice, checkLevel, checkRows, familiesOf } from "../rows.js";
import { axis, baseLayout, emptyNote, shortNumber } from "../theme.js";
import type { ConjectureLine, CurveFit, DegreeMeasure, PlotFigure, PlotTrace, SurplusRow } from "../types.js";
import { pointsTrace } from "./points.js";
import { surplusAt, type SurplusPoint } from "./surplus-scaling.js";

export interface NormalisedRatioOptions {
  degree?: DegreeMeasure;
  point?: SurplusPoint;
  /** Draw c of the conjectured law as a horizontal line. */
  conjecture?: ConjectureLine | CurveFit | readonly (ConjectureLine | CurveFit)[];
  level?: number;
  familyOrder?: readonly string[];
  /** m axis: "log" (default) or "linear". */
  mAxis?: "log" | "linear";
  title?: string;
}

const OWNER = "normalisedRatioFigure";

/** surplus/(m/√d) against m, one trace per family. */
export function normalisedRatioFigure(rows: readonly SurplusRow[], options: NormalisedRatioOptions = {}): PlotFigure {
  checkRows(OWNER, rows);
  const degree = checkChoice(OWNER, "degree", options.degree, DEGREE_MEASURES, "degeneracy");
  const point = checkChoice<SurplusPoint>(OWNER, "point", options.point, ["lower", "midpoint", "upper"], "lower");
  const mAxis = checkChoice<"log" | "linear">(OWNER, "mAxis", options.mAxis, ["log", "linear"], "log");
  const level = checkLevel(OWNER, options.level);
  const words = DEGREE_WORDS[degree];
  const leftOut = new LeftOut();
  const kept = new Map<string, { row: SurplusRow; scale: number }[]>();
  for (const row of rows) {
    const d = row[degree];
    if (!(d > 0)) leftOut.add(`${words} 0 (no m/√d)`);
    else if (!(row.m > 0)) leftOut.add("no edges");
    else {
      const list = kept.get(row.family) ?? [];
      list.push({ row, scale: row.m / Math.sqrt(d) });
      kept.set(row.family, list);
    }
  }
  const conjectures = asList(options.conjecture);
  const styled = familyStyles([...familiesOf(rows), ...conjectures.flatMap((c) => (c.family ? [c.family] : []))], options.familyOrder);
  const data: PlotTrace[] = [];
  const allM: number[] = [];
  for (const [family, style] of styled.styles) {
    const pts = kept.get(family);
    if (!pts) continue;
    allM.push(...pts.map((p) => p.row.m));
    const y = pts.map((p) => surplusAt(p.row, point) / p.scale);
    data.push(
      pointsTrace(
        `points-${data.length}`,
        family,
        style,
        {
          x: pts.map((p) => p.row.m),
          y,
          yLow: pts.map((p) => p.row.surplusLower / p.scale),
          yHigh: pts.map((p) => p.row.surplusUpper / p.scale),
          text: pts.map((p) => p.row.key ?? `${family} n=${p.row.n}`),
          customdata: pts.map((p) => [p.row.surplusLower, p.row.surplusUpper, p.scale]),
        },
        `%{text}<br>m = %{x}<br>surplus/(m/√d) = %{y:.4g}<br>surplus in [%{customdata[0]:.4g}, %{customdata[1]:.4g}], m/√d = %{customdata[2]:.4g}<extra>${family}</extra>`,
        family,
      ),
    );
  }
  const notes = [...leftOut.notes(), ...styled.notes, `markers at the surplus bracket's ${point === "midpoint" ? "midpoint" : `${point} end`}; bars span the bracket`];
  conjectures.forEach((c, i) => {
    const ms = c.family ? (kept.get(c.family) ?? []).map((p) => p.row.m) : allM;
    const range = curveRange(ms);
    if (!range) {
      notes.push(`conjectured constant ${i + 1} not drawn: no plotted points to span`);
      return;
    }
    const k = conjectureConstant(c, level);
    const label = conjectureLabel(k, c.family, "conjectured constant");
    const colour = c.family ? (styled.styles.get(c.family)?.colour ?? INK.conjecture) : INK.conjecture;
    data.push({
      type: "scatter",
      uid: `conjecture-${i}`,
      name: label.text,
      mode: "lines",
      x: [range[0], range[1]],
      y: [k.constant, k.constant],
      line: { color: colour, width: 1.6, dash: DASH.conjecture },
      hovertemplate: `c = ${shortNumber(k.constant)}<extra></extra>`,
      meta: { role: "conjecture", tex: label.tex, family: c.family },
    });
  });
  const layout = baseLayout(
    options.title ?? "Normalised surplus against m",
    axis("m  (edges)", mAxis),
    axis(`surplus / (m/√d)   (d = ${words})`, "linear", { rangemode: "tozero" }),
    {
      figure: "normalised-ratio",
      notes,
      tex: { x: "$m$ (edges)", y: `surplus$/(m/\\sqrt{d})$ ($d$ = ${words})` },
      columns: { x: "m", y: "surplus_over_m_over_sqrt_d" },
    },
  );
  if (allM.length === 0) layout.annotations = [emptyNote(rows.length === 0 ? "No graphs to plot" : "No graph can be drawn here: see the notes")];
  return { data, layout };
}
