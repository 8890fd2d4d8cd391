// Fitted curves as traces: a fit sampled along x with its band (two boundary traces, the upper
// filled down to the lower), and the conjectured slope-1 line y = c·x with its fitted constant.

import { InputError } from "../errors.js";
import { withAlpha } from "./colour.js";
import { BAND_OPACITY, DASH, INK, type SeriesStyle } from "./palette.js";
import { shortNumber } from "./theme.js";
import { texEscape } from "./tex.js";
import type { ConjectureLine, CurveFit, PlotTrace } from "./types.js";

/** `count` points spaced evenly in log x from lo to hi (both > 0), ends included exactly. */
export function logSpaced(lo: number, hi: number, count: number): number[] {
  if (count < 2 || lo === hi) return [lo];
  const a = Math.log(lo);
  const b = Math.log(hi);
  const xs: number[] = [];
  for (let i = 0; i < count; i++) xs.push(i === 0 ? lo : i === count - 1 ? hi : Math.exp(a + ((b - a) * i) / (count - 1)));
  return xs;
}

/** The x range a curve spans: the plotted points' range, or a factor 1.5 either side of a single x. */
export function curveRange(xs: readonly number[]): [number, number] | null {
  if (xs.length === 0) return null;
  const lo = Math.min(...xs);
  const hi = Math.max(...xs);
  return lo === hi ? [lo / 1.5, hi * 1.5] : [lo, hi];
}

function isConjectureLine(c: ConjectureLine | CurveFit): c is ConjectureLine {
  return typeof (c as ConjectureLine).constant === "number";
}

/**
 * The fitted constant c of a slope-1 law: given directly, or read from a fit of y = c·x as its
 * prediction at x = 1 (with that prediction's interval).
 */
export function conjectureConstant(c: ConjectureLine | CurveFit, level: number): { constant: number; lower?: number; upper?: number } {
  if (isConjectureLine(c)) return c;
  if (typeof c.predict !== "function") throw new InputError("conjecture: should be { constant } or a fit with predict(x)");
  const p = c.predict(1, level);
  return { constant: p.estimate, lower: p.lower, upper: p.upper };
}

/** Legend text for the conjectured line, e.g. "conjectured slope 1: c = 0.412 [0.39, 0.43]". */
export function conjectureLabel(k: { constant: number; lower?: number; upper?: number }, family?: string, what = "conjectured slope 1"): { text: string; tex: string } {
  const interval = k.lower !== undefined && k.upper !== undefined ? ` [${shortNumber(k.lower)}, ${shortNumber(k.upper)}]` : "";
  const who = family ? ` (${family})` : "";
  return {
    text: `${what}${who}: c = ${shortNumber(k.constant)}${interval}`,
    tex: `${texEscape(what)}${texEscape(who)}: $c = ${shortNumber(k.constant)}$${interval}`,
  };
}

export interface CurveTracesInput {
  fit: CurveFit;
  range: [number, number];
  level: number;
  samples: number;
  style?: SeriesStyle;
  /** Position of this fit among the figure's fits, for unique trace ids. */
  index: number;
  logY: boolean;
}

/**
 * A fit sampled at `samples` log-spaced x: the band (lower boundary, then upper boundary filled
 * down to it) and the fitted curve on top. Points a log axis cannot show are dropped and counted.
 */
export function fitTraces(input: CurveTracesInput): { traces: PlotTrace[]; dropped: number } {
  const { fit, range, level, samples, style, index, logY } = input;
  const colour = style?.colour ?? INK.fit;
  const xs: number[] = [];
  const est: number[] = [];
  const lo: number[] = [];
  const hi: number[] = [];
  let dropped = 0;
  for (const x of logSpaced(range[0], range[1], samples)) {
    const p = fit.predict(x, level);
    const ok = [p.estimate, p.lower, p.upper].every((v) => Number.isFinite(v) && (!logY || v > 0));
    if (!ok) {
      dropped++;
      continue;
    }
    xs.push(x);
    est.push(p.estimate);
    lo.push(p.lower);
    hi.push(p.upper);
  }
  const pct = shortNumber(level * 100);
  const who = fit.family ? ` (${fit.family})` : "";
  const group = `fit-${index}`;
  const edge = { color: colour, width: 0, dash: DASH.fit };
  const traces: PlotTrace[] = [
    {
      type: "scatter",
      uid: `${group}-lo`,
      name: `${pct} % band${who}, lower edge`,
      mode: "lines",
      x: xs,
      y: lo,
      line: edge,
      showlegend: false,
      legendgroup: group,
      hovertemplate: `${pct} % band lower edge: %{y:.4g}<extra></extra>`,
      meta: { role: "band-lower", tex: `${pct}\\,\\% band${texEscape(who)}`, family: fit.family },
    },
    {
      type: "scatter",
      uid: `${group}-hi`,
      name: `${pct} % band${who}`,
      mode: "lines",
      x: xs,
      y: hi,
      line: edge,
      fill: "tonexty",
      fillcolor: withAlpha(colour, BAND_OPACITY),
      legendgroup: group,
      hovertemplate: `${pct} % band upper edge: %{y:.4g}<extra></extra>`,
      meta: { role: "band-upper", tex: `${pct}\\,\\% band${texEscape(who)}`, family: fit.family },
    },
    {
      type: "scatter",
      uid: `${group}-curve`,
      name: `fit${who}: ${fit.law}`,
      mode: "lines",
      x: xs,
      y: est,
      line: { color: colour, width: 2, dash: DASH.fit },
      legendgroup: group,
      hovertemplate: `fit: %{y:.4g} at %{x:.4g}<extra></extra>`,
      meta: { role: "fit", tex: `fit${texEscape(who)}: ${texEscape(fit.law)}`, family: fit.family },
    },
  ];
  return { traces, dropped };
}

/** The line y = c·x over a range (two points are the whole line on log–log axes). */
export function conjectureTrace(
  k: { constant: number; lower?: number; upper?: number },
  range: [number, number],
  index: number,
  family: string | undefined,
  style: SeriesStyle | undefined,
): PlotTrace {
  const label = conjectureLabel(k, family);
  return {
    type: "scatter",
    uid: `conjecture-${index}`,
    name: label.text,
    mode: "lines",
    x: [range[0], range[1]],
    y: [k.constant * range[0], k.constant * range[1]],
    line: { color: style?.colour ?? INK.conjecture, width: 1.6, dash: DASH.conjecture },
    hovertemplate: `c·m/√d with c = ${shortNumber(k.constant)}<extra></extra>`,
    meta: { role: "conjecture", tex: label.tex, family },
  };
}

/** A list from one item, a list, or nothing. */
export function asList<T>(v: T | readonly T[] | undefined): T[] {
  if (v === undefined) return [];
  return Array.isArray(v) ? [...(v as readonly T[])] : [v as T];
}
