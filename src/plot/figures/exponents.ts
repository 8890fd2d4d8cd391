// Figure 3: fitted exponents with their intervals, one row per estimate (grouped by family, in
// the family's style), against the conjectured value: a vertical line when every estimate has
// the same conjectured value, an open mark on each row otherwise.

import { InputError } from "../../errors.js";
import { DASH, INK, familyStyles } from "../palette.js";
import { axis, baseLayout, emptyNote, shortNumber } from "../theme.js";
import { texEscape } from "../tex.js";
import type { ExponentEstimate, PlotFigure, PlotTrace } from "../types.js";
import { pointsTrace } from "./points.js";

export interface ExponentOptions {
  familyOrder?: readonly string[];
  /** Axis title for the exponent (default "fitted exponent"). */
  valueTitle?: string;
  title?: string;
}

const OWNER = "exponentFigure";
/** Rows without a family are grouped under this name. */
const NO_FAMILY = "all families";

function checkEstimates(estimates: readonly ExponentEstimate[]): void {
  if (!Array.isArray(estimates)) throw new InputError(`${OWNER}: \`estimates\` should be an array (got ${typeof estimates})`);
  estimates.forEach((e, i) => {
    const at = `${OWNER}: estimate ${i + 1}${e && typeof e.name === "string" ? ` (${e.name})` : ""}`;
    if (e === null || typeof e !== "object" || typeof e.name !== "string") throw new InputError(`${at}: should be an object with a string \`name\``);
    for (const f of ["estimate", "lower", "upper"] as const)
      if (!(typeof e[f] === "number" && Number.isFinite(e[f]))) throw new InputError(`${at}: \`${f}\` should be a finite number (got ${JSON.stringify(e[f])})`);
    if (!(e.lower <= e.estimate && e.estimate <= e.upper)) throw new InputError(`${at}: interval [${e.lower}, ${e.upper}] does not contain the estimate ${e.estimate}`);
    if (e.conjectured !== null && !(typeof e.conjectured === "number" && Number.isFinite(e.conjectured)))
      throw new InputError(`${at}: \`conjectured\` should be a finite number or null (got ${JSON.stringify(e.conjectured)})`);
  });
}

/** Fitted exponents with intervals against their conjectured values. */
export function exponentFigure(estimates: readonly ExponentEstimate[], options: ExponentOptions = {}): PlotFigure {
  checkEstimates(estimates);
  const familyOf = (e: ExponentEstimate) => e.family ?? NO_FAMILY;
  const styled = familyStyles(estimates.map(familyOf), options.familyOrder);
  // Rows top to bottom: families in style order, estimates in input order within a family.
  const ordered = [...styled.styles.keys()].flatMap((f) => estimates.filter((e) => familyOf(e) === f));
  const labelOf = (e: ExponentEstimate) => (e.family ? `${e.family} · ${e.name}` : e.name);
  const position = new Map(ordered.map((e, i) => [e, i]));
  const data: PlotTrace[] = [];
  for (const [family, style] of styled.styles) {
    const es = ordered.filter((e) => familyOf(e) === family);
    data.push(
      pointsTrace(
        `estimates-${data.length}`,
        family,
        style,
        {
          x: es.map((e) => e.estimate),
          y: es.map((e) => position.get(e)!),
          xLow: es.map((e) => e.lower),
          xHigh: es.map((e) => e.upper),
          text: es.map(labelOf),
        },
        `%{text}: %{x:.4g}<extra>${family}</extra>`,
        family,
      ),
    );
  }
  const conj = ordered.filter((e) => e.conjectured !== null);
  const values = [...new Set(conj.map((e) => e.conjectured as number))];
  if (values.length === 1) {
    const v = values[0];
    data.push({
      type: "scatter",
      uid: "conjectured",
      name: `conjectured value ${shortNumber(v)}`,
      mode: "lines",
      x: [v, v],
      y: [-0.5, ordered.length - 0.5],
      line: { color: INK.conjecture, width: 1.6, dash: DASH.conjecture },
      hovertemplate: `conjectured: ${shortNumber(v)}<extra></extra>`,
      meta: { role: "conjecture", tex: `conjectured value $${shortNumber(v)}$` },
    });
  } else if (values.length > 1) {
    data.push({
      type: "scatter",
      uid: "conjectured",
      name: "conjectured value",
      mode: "markers",
      x: conj.map((e) => e.conjectured as number),
      y: conj.map((e) => position.get(e)!),
      text: conj.map(labelOf),
      marker: { symbol: "diamond-open", color: INK.text, size: 10, line: { color: INK.text, width: 1.5 } },
      hovertemplate: `%{text}: conjectured %{x:.4g}<extra></extra>`,
      meta: { role: "reference", tex: "conjectured value" },
    });
  }
  const layout = baseLayout(
    options.title ?? "Fitted exponents",
    axis(options.valueTitle ?? "fitted exponent", "linear"),
    axis("", "linear", {
      tickvals: ordered.map((_, i) => i),
      ticktext: ordered.map(labelOf),
      // Reversed (first row on top), and exactly half a row beyond the ends so the conjectured line spans the axis.
      autorange: false,
      range: [Math.max(ordered.length, 1) - 0.5, -0.5],
      showgrid: false,
      ticks: "",
    }),
    {
      figure: "exponents",
      notes: [...styled.notes, `bars span each estimate's interval${values.length > 1 ? "; open diamonds mark the conjectured values" : ""}`],
      tex: { x: texEscape(options.valueTitle ?? "fitted exponent"), y: "" },
      columns: { x: "exponent", y: "row" },
    },
  );
  if (ordered.length === 0) layout.annotations = [emptyNote("No fitted exponents to plot")];
  return { data, layout };
}
