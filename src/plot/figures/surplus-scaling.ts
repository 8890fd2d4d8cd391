// Figure 1: surplus against m/√d on log–log axes — one colour and marker shape per family, each
// graph's surplus bracket as an error bar, fitted curves with their bands, and the conjectured
// slope-1 line surplus = c·m/√d with its fitted constant.

import { InputError } from "../../errors.js";
import { asList, conjectureConstant, conjectureTrace, curveRange, fitTraces } from "../curves.js";
import { familyStyles } from "../palette.js";
import { DEGREE_MEASURES, DEGREE_WORDS } from "../../experiment/rows.js";
import { LeftOut, checkChoice, checkLevel, checkRows, familiesOf } from "../rows.js";
import { axis, baseLayout, emptyNote } from "../theme.js";
import type { ConjectureLine, CurveFit, DegreeMeasure, PlotFigure, PlotTrace, SurplusRow } from "../types.js";
import { pointsTrace } from "./points.js";

export type SurplusPoint = "lower" | "midpoint" | "upper";
const POINTS: readonly SurplusPoint[] = ["lower", "midpoint", "upper"];

export interface SurplusScalingOptions {
  /** d in m/√d: "degeneracy" (default), "maxDegree" or "averageDegree" (the row fields). */
  degree?: DegreeMeasure;
  /** Where a graph's marker sits inside its bracket; the bar always spans the whole bracket. Default "lower" (the best cut found). */
  point?: SurplusPoint;
  /** Fitted curves, evaluated by `predict(m/√d, level)`; a fit with `family` takes that family's style and x range. */
  fits?: CurveFit | readonly CurveFit[];
  /** The conjectured law surplus = c·m/√d: its fitted constant c, or a fit of it (c = predict(1)). */
  conjecture?: ConjectureLine | CurveFit | readonly (ConjectureLine | CurveFit)[];
  /** Confidence level of the bands (default 0.95). */
  level?: number;
  /** Family order for styles; keep it the same across a report's figures. */
  familyOrder?: readonly string[];
  /** Points per fitted curve (default 64). */
  samples?: number;
  title?: string;
}

const OWNER = "surplusScalingFigure";

/** Where the marker of a row sits for a choice of `point`. */
export function surplusAt(row: SurplusRow, point: SurplusPoint): number {
  return point === "lower" ? row.surplusLower : point === "upper" ? row.surplusUpper : (row.surplusLower + row.surplusUpper) / 2;
}

/**
 * Surplus against m/√d, log–log. The law under study says surplus ≥ c·m/√d for H-free
 * d-degenerate graphs (see the project README); a family following it lies along a line of
 * slope 1 here.
 */
export function surplusScalingFigure(rows: readonly SurplusRow[], options: SurplusScalingOptions = {}): PlotFigure {
  checkRows(OWNER, rows);
  const degree = checkChoice(OWNER, "degree", options.degree, DEGREE_MEASURES, "degeneracy");
  const point = checkChoice(OWNER, "point", options.point, POINTS, "lower");
  const level = checkLevel(OWNER, options.level);
  const samples = options.samples ?? 64;
  if (!Number.isInteger(samples) || samples < 2 || samples > 10_000) throw new InputError(`${OWNER}: invalid \`samples\`: an integer from 2 to 10000 (got ${JSON.stringify(options.samples)})`);
  const words = DEGREE_WORDS[degree];
  const leftOut = new LeftOut();

  const kept = new Map<string, { row: SurplusRow; x: number; y: number; d: number }[]>();
  for (const row of rows) {
    const d = row[degree];
    const y = surplusAt(row, point);
    if (!(d > 0)) leftOut.add(`${words} 0 (no m/√d)`);
    else if (!(row.m > 0)) leftOut.add("no edges");
    else if (!(y > 0)) leftOut.add(`surplus ${point === "midpoint" ? "midpoint" : `${point} end`} ≤ 0 (log axis)`);
    else {
      const list = kept.get(row.family) ?? [];
      list.push({ row, x: row.m / Math.sqrt(d), y, d });
      kept.set(row.family, list);
    }
  }

  const fits = asList(options.fits);
  const conjectures = asList(options.conjecture);
  const families = familiesOf(rows);
  const styled = familyStyles([...families, ...fits.flatMap((f) => (f.family ? [f.family] : [])), ...conjectures.flatMap((c) => (c.family ? [c.family] : []))], options.familyOrder);
  const data: PlotTrace[] = [];
  const allX: number[] = [];
  for (const [family, style] of styled.styles) {
    const pts = kept.get(family);
    if (!pts) continue;
    allX.push(...pts.map((p) => p.x));
    data.push(
      pointsTrace(
        `points-${data.length}`,
        family,
        style,
        {
          x: pts.map((p) => p.x),
          y: pts.map((p) => p.y),
          yLow: pts.map((p) => p.row.surplusLower),
          yHigh: pts.map((p) => p.row.surplusUpper),
          text: pts.map((p) => p.row.key ?? `${family} n=${p.row.n}`),
          customdata: pts.map((p) => [p.row.surplusLower, p.row.surplusUpper, p.row.n, p.row.m, p.d, p.row.exact ? "exact" : "bracket"]),
        },
        `%{text}<br>m/√d = %{x:.4g}<br>surplus in [%{customdata[0]:.4g}, %{customdata[1]:.4g}] (%{customdata[5]})<br>n = %{customdata[2]}, m = %{customdata[3]}, d = %{customdata[4]:.4g}<extra>${family}</extra>`,
        family,
      ),
    );
  }

  const notes = [...leftOut.notes(), ...styled.notes];
  notes.push(`markers at the surplus bracket's ${point === "midpoint" ? "midpoint" : `${point} end`}; bars span the bracket`);
  const rangeFor = (family: string | undefined) => curveRange(family === undefined ? allX : (kept.get(family) ?? []).map((p) => p.x));
  fits.forEach((fit, i) => {
    const range = rangeFor(fit.family);
    if (!range) {
      notes.push(`fit ${i + 1} (${fit.law}) not drawn: no plotted points to span`);
      return;
    }
    const { traces, dropped } = fitTraces({ fit, range, level, samples, style: fit.family ? styled.styles.get(fit.family) : undefined, index: i, logY: true });
    if (dropped > 0) notes.push(`fit ${i + 1}: ${dropped} of ${samples} curve points ≤ 0 not drawn (log axis)`);
    data.push(...traces);
  });
  conjectures.forEach((c, i) => {
    const range = rangeFor(c.family);
    const k = conjectureConstant(c, level);
    if (!range || !(k.constant > 0)) {
      notes.push(`conjectured line ${i + 1} not drawn: ${range ? "constant ≤ 0" : "no plotted points to span"}`);
      return;
    }
    data.push(conjectureTrace(k, range, i, c.family, c.family ? styled.styles.get(c.family) : undefined));
  });

  const layout = baseLayout(
    options.title ?? "Surplus against m/√d",
    axis(`m / √d   (d = ${words})`, "log"),
    axis("surplus  (max cut − m/2)", "log"),
    {
      figure: "surplus-scaling",
      notes,
      tex: { x: `$m/\\sqrt{d}$ ($d$ = ${words})`, y: "surplus $\\mathrm{mc}(G) - m/2$" },
      columns: { x: "m_over_sqrt_d", y: "surplus" },
    },
  );
  if (allX.length === 0) layout.annotations = [emptyNote(rows.length === 0 ? "No graphs to plot" : "No graph can be drawn here: see the notes")];
  return { data, layout };
}
