// The extremal search's frontier: the best certified objective value per number of edges m
// (surplus/(m/√d), surplus/m^α or the surplus at fixed m) against m, as a line of points, beside
// the known constructions on the same n certified the same way (one marker each) and a dotted
// line at the best of them.

import { InputError } from "../../errors.js";
import { DASH, INK, seriesStyle } from "../palette.js";
import { texEscape } from "../tex.js";
import { axis, baseLayout, emptyNote, shortNumber } from "../theme.js";
import type { PlotFigure, PlotTrace } from "../types.js";

/** A frontier graph as the figure needs it (the hunt's `FrontierEntry` and the store's rows both fit). */
export interface HuntFrontierPoint {
  m: number;
  value: number;
  start?: string;
}

/** A reference construction, certified like the frontier. */
export interface HuntReferencePoint {
  label: string;
  m: number;
  value: number;
}

export interface HuntFrontierOptions {
  /** The objective's name for the y axis (default "surplus/(m/√d)"). */
  objective?: string;
  /** The objective in TeX for pgfplots (default: `objective` escaped). */
  objectiveTex?: string;
  /** n and H, for the title. */
  n?: number;
  pattern?: string;
  title?: string;
}

const OWNER = "huntFrontierFigure";

function checkPoint(what: string, i: number, p: { m: unknown; value: unknown }): void {
  if (!(typeof p.m === "number" && Number.isInteger(p.m) && p.m > 0)) throw new InputError(`${OWNER}: ${what} ${i + 1}: \`m\` should be a positive integer (got ${String(p.m)})`);
  if (!(typeof p.value === "number" && Number.isFinite(p.value))) throw new InputError(`${OWNER}: ${what} ${i + 1}: \`value\` should be a finite number (got ${String(p.value)})`);
}

/** Frontier value against m (the line broken where no m was reached), the reference constructions as markers, a dotted line at their best value. */
export function huntFrontierFigure(frontier: readonly HuntFrontierPoint[], references: readonly HuntReferencePoint[] = [], options: HuntFrontierOptions = {}): PlotFigure {
  frontier.forEach((p, i) => checkPoint("frontier point", i, p));
  references.forEach((p, i) => checkPoint("reference", i, p));
  const objective = options.objective ?? "surplus/(m/√d)";
  const tex = options.objectiveTex ?? texEscape(objective);
  const pts = [...frontier].sort((a, b) => a.m - b.m);
  const data: PlotTrace[] = [];
  const hunt = seriesStyle(0);
  if (pts.length > 0) {
    // A gap in m (no graph found there) breaks the line rather than bridging it.
    const x: (number | null)[] = [], y: (number | null)[] = [], text: string[] = [];
    pts.forEach((p, i) => {
      if (i > 0 && p.m > pts[i - 1].m + 1) {
        x.push(null);
        y.push(null);
        text.push("");
      }
      x.push(p.m);
      y.push(p.value);
      text.push(p.start ?? "");
    });
    data.push({
      type: "scatter",
      uid: "frontier",
      name: "hunt frontier",
      mode: "lines+markers",
      x,
      y,
      text,
      hovertemplate: `m = %{x}<br>${objective} ≤ %{y:.4g}<br>%{text}<extra>frontier</extra>`,
      marker: { symbol: hunt.symbol, color: hunt.colour, size: hunt.size - 2, line: { color: hunt.outline, width: 1 } },
      line: { color: hunt.colour, width: 1.4, dash: "solid" },
      meta: { role: "points", tex: "hunt frontier" },
    });
  }
  references.forEach((r, i) => {
    const style = seriesStyle(i + 1);
    data.push({
      type: "scatter",
      uid: `reference-${i}`,
      name: r.label,
      mode: "markers",
      x: [r.m],
      y: [r.value],
      hovertemplate: `${r.label}<br>m = %{x}<br>${objective} ≤ %{y:.4g}<extra></extra>`,
      marker: { symbol: style.symbol, color: style.colour, size: style.size + 2, line: { color: style.outline, width: 1 } },
      meta: { role: "points", tex: texEscape(r.label) },
    });
  });
  const xs = [...pts.map((p) => p.m), ...references.map((r) => r.m)];
  const notes: string[] = ["every value is certified: the surplus is the bracket's proven upper end"];
  if (references.length > 0) {
    const best = references.reduce((a, b) => (b.value < a.value ? b : a));
    data.push({
      type: "scatter",
      uid: "reference-best",
      name: `best construction (${shortNumber(best.value)})`,
      mode: "lines",
      x: [Math.min(...xs), Math.max(...xs)],
      y: [best.value, best.value],
      line: { color: INK.conjecture, width: 1.2, dash: DASH.reference },
      hovertemplate: `${best.label}: ${shortNumber(best.value)}<extra></extra>`,
      meta: { role: "reference", tex: `best construction (${texEscape(best.label)})` },
    });
  } else notes.push("no known construction on this n is free of H");
  const where = [options.pattern === undefined ? null : `${options.pattern}-free`, options.n === undefined ? null : `n = ${options.n}`].filter((s) => s !== null).join(", ");
  const layout = baseLayout(
    options.title ?? `Smallest certified ${objective} per m${where === "" ? "" : ` (${where})`}`,
    axis("m  (edges)", "linear"),
    axis(`${objective}  (certified upper bound)`, "linear"),
    { figure: "hunt-frontier", notes, tex: { x: "$m$ (edges)", y: tex }, columns: { x: "m", y: "objective" } },
  );
  if (xs.length === 0) layout.annotations = [emptyNote("No frontier graphs and no reference constructions")];
  return { data, layout };
}
