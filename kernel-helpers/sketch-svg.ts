// A light SVG of a figure, drawn on the server without a browser: the static picture `show` uses
// when Chromium is not installed. It draws what our figure builders emit (scatter traces: markers
// in the palette's shapes, lines with dashes, filled bands, error bars; linear and log axes, up to
// two subplots side by side; title, axis titles, legend) and nothing more. Pure string building:
// the same figure gives the same bytes.

import { FIGURE_SIZE, INK, TYPOGRAPHY, htmlEscape, type AxisLayout, type PlotFigure, type PlotTrace } from "halfplus";

export interface SketchOptions {
  width?: number;
  height?: number;
}

interface Scale {
  log: boolean;
  lo: number;
  hi: number;
  a: number;
  b: number;
  map(v: number): number;
  ticks: number[];
}

const f = (v: number) => (Math.round(v * 100) / 100).toString();

function niceStep(span: number, count: number): number {
  const raw = span / Math.max(1, count);
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 5 ? 5 : 10) * p;
}

function makeScale(values: number[], axis: AxisLayout | undefined, a: number, b: number, flip: boolean): Scale {
  const log = axis?.type === "log";
  const usable = values.filter((v) => Number.isFinite(v) && (!log || v > 0));
  let lo = usable.length ? Math.min(...usable) : log ? 1 : 0;
  let hi = usable.length ? Math.max(...usable) : log ? 10 : 1;
  if (!log && axis?.rangemode === "tozero") lo = Math.min(lo, 0), (hi = Math.max(hi, 0));
  let ticks: number[];
  if (log) {
    let l = Math.log10(lo), h = Math.log10(hi);
    if (h - l < 1e-9) (l -= 0.5), (h += 0.5);
    const pad = (h - l) * 0.05;
    l -= pad;
    h += pad;
    lo = 10 ** l;
    hi = 10 ** h;
    ticks = [];
    const mults = h - l < 2.5 ? [1, 2, 5] : [1];
    for (let e = Math.floor(l); e <= Math.ceil(h); e++) for (const m of mults) {
      const t = m * 10 ** e;
      if (t >= lo && t <= hi) ticks.push(t);
    }
  } else {
    if (hi - lo < 1e-12) (lo -= 0.5), (hi += 0.5);
    const pad = (hi - lo) * 0.05;
    if (!(axis?.rangemode === "tozero" && lo === 0)) lo -= pad;
    hi += pad;
    const step = niceStep(hi - lo, 5);
    ticks = [];
    for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step) ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  }
  if (axis?.tickvals && axis.tickvals.length > 0) ticks = axis.tickvals.filter((t) => t >= lo && t <= hi);
  const [u0, u1] = log ? [Math.log10(lo), Math.log10(hi)] : [lo, hi];
  const map = (v: number) => {
    const t = ((log ? Math.log10(v) : v) - u0) / (u1 - u0);
    return flip ? b - t * (b - a) : a + t * (b - a);
  };
  return { log, lo, hi, a, b, map, ticks };
}

function tickLabel(v: number, axis: AxisLayout | undefined): string {
  const i = axis?.tickvals?.indexOf(v) ?? -1;
  if (i >= 0 && axis?.ticktext?.[i] !== undefined) return axis.ticktext[i];
  if (v === 0) return "0";
  const abs = Math.abs(v);
  if (abs >= 1e5 || abs < 1e-3) {
    const e = Math.floor(Math.log10(abs));
    const m = v / 10 ** e;
    return Math.abs(m - 1) < 1e-9 ? `10^${e}` : `${Number(m.toPrecision(2))}·10^${e}`;
  }
  return String(Number(v.toPrecision(4)));
}

function marker(symbol: string, x: number, y: number, size: number, fill: string, stroke: string): string {
  const open = symbol.endsWith("-open");
  const shape = symbol.replace(/-open$/, "");
  const r = size / 2;
  const paint = `fill="${open ? "none" : fill}" stroke="${open ? fill : stroke}" stroke-width="1"`;
  switch (shape) {
    case "square":
      return `<rect x="${f(x - r)}" y="${f(y - r)}" width="${f(2 * r)}" height="${f(2 * r)}" ${paint}/>`;
    case "diamond":
      return `<path d="M${f(x)},${f(y - r * 1.3)}L${f(x + r * 1.3)},${f(y)}L${f(x)},${f(y + r * 1.3)}L${f(x - r * 1.3)},${f(y)}Z" ${paint}/>`;
    case "triangle-up":
      return `<path d="M${f(x)},${f(y - r * 1.2)}L${f(x + r * 1.2)},${f(y + r * 0.8)}L${f(x - r * 1.2)},${f(y + r * 0.8)}Z" ${paint}/>`;
    case "triangle-down":
      return `<path d="M${f(x)},${f(y + r * 1.2)}L${f(x + r * 1.2)},${f(y - r * 0.8)}L${f(x - r * 1.2)},${f(y - r * 0.8)}Z" ${paint}/>`;
    case "cross":
    case "x":
    case "asterisk": {
      const d = shape === "cross" ? `M${f(x - r)},${f(y)}H${f(x + r)}M${f(x)},${f(y - r)}V${f(y + r)}` : `M${f(x - r)},${f(y - r)}L${f(x + r)},${f(y + r)}M${f(x - r)},${f(y + r)}L${f(x + r)},${f(y - r)}`;
      return `<path d="${d}" fill="none" stroke="${fill}" stroke-width="2"/>`;
    }
    default:
      return `<circle cx="${f(x)}" cy="${f(y)}" r="${f(r)}" ${paint}/>`;
  }
}

const DASHES: Record<string, string> = { dash: "6,4", dot: "2,3", dashdot: "6,3,2,3", longdash: "10,4" };

/** The figure as a standalone SVG document. */
export function sketchSvg(figure: PlotFigure, options: SketchOptions = {}): string {
  const W = options.width ?? FIGURE_SIZE.width;
  const H = options.height ?? FIGURE_SIZE.height;
  const layout = figure.layout;
  const legendItems = figure.data.filter((t) => t.showlegend !== false && t.name);
  const legendWidth = legendItems.length > 0 ? Math.min(220, 34 + 6.4 * Math.max(...legendItems.map((t) => t.name.length))) : 0;
  const plot = { l: 70, r: W - 18 - legendWidth, t: 48, b: H - 56 };
  const out: string[] = [];
  const font = TYPOGRAPHY.family.replace(/"/g, "'");
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="${font}" font-size="${TYPOGRAPHY.tickSize}">`);
  out.push(`<rect width="${W}" height="${H}" fill="${INK.paper}"/>`);
  if (layout.title?.text) out.push(`<text x="${plot.l}" y="26" font-size="${TYPOGRAPHY.titleSize}" fill="${INK.text}">${htmlEscape(layout.title.text)}</text>`);

  const pairs = new Map<string, PlotTrace[]>();
  for (const t of figure.data) {
    const k = `${t.xaxis ?? "x"}|${t.yaxis ?? "y"}`;
    pairs.set(k, [...(pairs.get(k) ?? []), t]);
  }
  if (pairs.size === 0) pairs.set("x|y", []);
  for (const [key, traces] of pairs) {
    const [xa, ya] = key.split("|");
    const xAxis = (xa === "x2" ? layout.xaxis2 : layout.xaxis) as AxisLayout | undefined;
    const yAxis = (ya === "y2" ? layout.yaxis2 : layout.yaxis) as AxisLayout | undefined;
    const dom = xAxis?.domain ?? [0, 1];
    const gap = dom[0] > 0 ? 56 : 0;
    const x0 = plot.l + dom[0] * (plot.r - plot.l) + gap;
    const x1 = plot.l + dom[1] * (plot.r - plot.l);
    const xs: number[] = [];
    const ys: number[] = [];
    for (const t of traces) {
      t.x.forEach((v, i) => {
        if (v === null) return;
        xs.push(v - (t.error_x?.arrayminus[i] ?? 0), v + (t.error_x?.array[i] ?? 0));
      });
      t.y.forEach((v, i) => {
        if (v === null) return;
        ys.push(v - (t.error_y?.arrayminus[i] ?? 0), v + (t.error_y?.array[i] ?? 0));
      });
    }
    const sx = makeScale(xs, xAxis, x0, x1, false);
    const sy = makeScale(ys, yAxis, plot.t, plot.b, true);
    // Grid, frame, ticks.
    for (const t of sx.ticks) out.push(`<line x1="${f(sx.map(t))}" x2="${f(sx.map(t))}" y1="${plot.t}" y2="${plot.b}" stroke="${INK.grid}"/>`);
    for (const t of sy.ticks) out.push(`<line x1="${f(x0)}" x2="${f(x1)}" y1="${f(sy.map(t))}" y2="${f(sy.map(t))}" stroke="${INK.grid}"/>`);
    out.push(`<rect x="${f(x0)}" y="${plot.t}" width="${f(x1 - x0)}" height="${plot.b - plot.t}" fill="none" stroke="${INK.axis}"/>`);
    for (const t of sx.ticks) out.push(`<text x="${f(sx.map(t))}" y="${plot.b + 15}" text-anchor="middle" fill="${INK.muted}">${htmlEscape(tickLabel(t, xAxis))}</text>`);
    for (const t of sy.ticks) out.push(`<text x="${f(x0 - 6)}" y="${f(sy.map(t) + 4)}" text-anchor="end" fill="${INK.muted}">${htmlEscape(tickLabel(t, yAxis))}</text>`);
    if (xAxis?.title?.text) out.push(`<text x="${f((x0 + x1) / 2)}" y="${plot.b + 36}" text-anchor="middle" font-size="${TYPOGRAPHY.axisTitleSize}" fill="${INK.text}">${htmlEscape(xAxis.title.text)}</text>`);
    if (yAxis?.title?.text) out.push(`<text transform="translate(${f(x0 - 50)},${f((plot.t + plot.b) / 2)}) rotate(-90)" text-anchor="middle" font-size="${TYPOGRAPHY.axisTitleSize}" fill="${INK.text}">${htmlEscape(yAxis.title.text)}</text>`);

    const ok = (x: number | null, y: number | null): boolean => x !== null && y !== null && Number.isFinite(x) && Number.isFinite(y) && (!sx.log || x > 0) && (!sy.log || y > 0);
    const pts = (t: PlotTrace) => t.x.map((x, i) => (ok(x, t.y[i]) ? [sx.map(x!), sy.map(t.y[i]!)] : null));
    out.push("<g>");
    let previous: PlotTrace | null = null;
    for (const t of traces) {
      const colour = t.line?.color ?? t.marker?.color ?? INK.text;
      if (t.fill === "tonexty" && previous !== null) {
        const upper = pts(t).filter((p): p is number[] => p !== null);
        const lower = pts(previous).filter((p): p is number[] => p !== null).reverse();
        if (upper.length > 1 && lower.length > 1) out.push(`<path d="M${[...upper, ...lower].map(([x, y]) => `${f(x)},${f(y)}`).join("L")}Z" fill="${t.fillcolor ?? colour}" stroke="none"/>`);
      }
      if (t.mode.includes("lines")) {
        const width = t.line?.width ?? 1.5;
        if (width > 0) {
          let d = "";
          let pen = false;
          let prevPt: number[] | null = null;
          for (const p of pts(t)) {
            if (p === null) {
              pen = false;
              continue;
            }
            if (pen && t.line?.shape === "hv" && prevPt) d += `H${f(p[0])}`;
            d += `${pen ? "L" : "M"}${f(p[0])},${f(p[1])}`;
            pen = true;
            prevPt = p;
          }
          const dash = DASHES[t.line?.dash ?? "solid"];
          if (d) out.push(`<path d="${d}" fill="none" stroke="${colour}" stroke-width="${width}"${dash ? ` stroke-dasharray="${dash}"` : ""}/>`);
        }
      }
      const bars = (horizontal: boolean) => {
        const e = horizontal ? t.error_x : t.error_y;
        if (!e) return;
        t.x.forEach((x, i) => {
          const y = t.y[i];
          if (!ok(x, y)) return;
          const [lo, hi] = horizontal ? [x! - e.arrayminus[i], x! + e.array[i]] : [y! - e.arrayminus[i], y! + e.array[i]];
          if (!(horizontal ? ok(lo, y) && ok(hi, y) : ok(x, lo) && ok(x, hi))) return;
          const w = e.width;
          if (horizontal) {
            const py = sy.map(y!), a = sx.map(lo), b = sx.map(hi);
            out.push(`<path d="M${f(a)},${f(py)}H${f(b)}M${f(a)},${f(py - w)}V${f(py + w)}M${f(b)},${f(py - w)}V${f(py + w)}" stroke="${e.color}" stroke-width="${e.thickness}" fill="none"/>`);
          } else {
            const px = sx.map(x!), a = sy.map(lo), b = sy.map(hi);
            out.push(`<path d="M${f(px)},${f(a)}V${f(b)}M${f(px - w)},${f(a)}H${f(px + w)}M${f(px - w)},${f(b)}H${f(px + w)}" stroke="${e.color}" stroke-width="${e.thickness}" fill="none"/>`);
          }
        });
      };
      bars(false);
      bars(true);
      if (t.mode.includes("markers") && t.marker)
        for (const p of pts(t)) if (p) out.push(marker(t.marker.symbol, p[0], p[1], t.marker.size, t.marker.color, t.marker.line.color));
      previous = t;
    }
    out.push("</g>");
  }

  // Legend: one row per named series, its marker or line as the swatch.
  let ly = plot.t + 4;
  const lx = W - legendWidth - 4;
  if (legendItems.length > 0) out.push(`<rect x="${lx}" y="${plot.t - 6}" width="${legendWidth}" height="${legendItems.length * 18 + 8}" fill="${INK.paper}" stroke="${INK.grid}"/>`);
  for (const t of legendItems) {
    const colour = t.marker?.color ?? t.line?.color ?? INK.text;
    if (t.fill === "tonexty") out.push(`<rect x="${lx + 6}" y="${ly}" width="20" height="9" fill="${t.fillcolor ?? colour}"/>`);
    else if (t.mode.includes("lines") && !t.mode.includes("markers")) {
      const dash = DASHES[t.line?.dash ?? "solid"];
      out.push(`<line x1="${lx + 6}" x2="${lx + 26}" y1="${ly + 4}" y2="${ly + 4}" stroke="${colour}" stroke-width="${t.line?.width ?? 1.5}"${dash ? ` stroke-dasharray="${dash}"` : ""}/>`);
    } else if (t.marker) out.push(marker(t.marker.symbol, lx + 16, ly + 4, t.marker.size, t.marker.color, t.marker.line.color));
    out.push(`<text x="${lx + 32}" y="${ly + 8}" font-size="${TYPOGRAPHY.legendSize}" fill="${INK.text}">${htmlEscape(t.name)}</text>`);
    ly += 18;
  }
  out.push("</svg>");
  return out.join("\n") + "\n";
}
