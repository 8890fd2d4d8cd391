// The figure builders, checked as data: axes, one trace per family, bars equal to the given
// brackets and intervals, bands sampled from the fit, distinct styles, empty and single inputs,
// and one-line errors for bad rows and options. No browser here.
import { describe, expect, it } from "vitest";
import {
  boundTightnessFigure,
  degreeDistributionFigure,
  exponentFigure,
  normalisedRatioFigure,
  surplusScalingFigure,
} from "../src/plot/figures/index.js";
import type { PlotFigure, PlotTrace, SurplusRow } from "../src/plot/types.js";
import { expectInputError } from "./helpers/errors.js";
import { FAMILIES, sampleExponents, sampleFit, sampleRows } from "./helpers/plot-data.js";

const role = (f: PlotFigure, r: string) => f.data.filter((t) => t.meta.role === r);
const rowByKey = (rows: SurplusRow[]) => new Map(rows.map((r) => [r.key!, r]));
// Bars are stored as distances from the point; their ends must give back the inputs up to rounding
// (common practice, no source: a relative 1e-12 covers one subtraction and one addition).
const close = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(b)));

function expectBarsEqualBrackets(t: PlotTrace, rows: SurplusRow[], scale: (r: SurplusRow) => number = () => 1) {
  const byKey = rowByKey(rows);
  t.y.forEach((y, i) => {
    const r = byKey.get(t.text![i])!;
    close(y! - t.error_y!.arrayminus[i], r.surplusLower / scale(r));
    close(y! + t.error_y!.array[i], r.surplusUpper / scale(r));
  });
}

describe("surplus against m/√d", () => {
  const rows = sampleRows();
  const fig = surplusScalingFigure(rows, { fits: sampleFit(), conjecture: { constant: 0.3, lower: 0.28, upper: 0.32 } });

  it("uses log axes on both sides with titles", () => {
    expect(fig.layout.xaxis.type).toBe("log");
    expect(fig.layout.yaxis.type).toBe("log");
    expect(fig.layout.xaxis.title.text).toContain("m / √d");
    expect(fig.layout.yaxis.title.text).toContain("surplus");
  });

  it("draws one trace per family with every row, at x = m/√(degeneracy)", () => {
    const points = role(fig, "points");
    expect(points.map((t) => t.name).sort()).toEqual([...FAMILIES].sort());
    expect(points.reduce((k, t) => k + t.x.length, 0)).toBe(rows.length);
    const byKey = rowByKey(rows);
    for (const t of points)
      t.x.forEach((x, i) => {
        const r = byKey.get(t.text![i])!;
        expect(r.family).toBe(t.name);
        close(x!, r.m / Math.sqrt(r.degeneracy));
        close(t.y[i]!, r.surplusLower);
      });
  });

  it("gives every family its own colour and its own marker shape", () => {
    const points = role(fig, "points");
    expect(new Set(points.map((t) => t.marker!.symbol)).size).toBe(points.length);
    expect(new Set(points.map((t) => t.marker!.color)).size).toBe(points.length);
  });

  it("draws each graph's bracket as its error bar", () => {
    for (const t of role(fig, "points")) expectBarsEqualBrackets(t, rows);
  });

  it("puts the marker at the midpoint or the upper end when asked, the bar still spanning the bracket", () => {
    const mid = surplusScalingFigure(rows, { point: "midpoint" });
    const byKey = rowByKey(rows);
    for (const t of role(mid, "points")) {
      expectBarsEqualBrackets(t, rows);
      t.y.forEach((y, i) => close(y!, (byKey.get(t.text![i])!.surplusLower + byKey.get(t.text![i])!.surplusUpper) / 2));
    }
  });

  it("has the fitted curve with its 95 % band, sampled from predict over the plotted range", () => {
    const [lo, hi, curve] = [role(fig, "band-lower"), role(fig, "band-upper"), role(fig, "fit")];
    expect([lo.length, hi.length, curve.length]).toEqual([1, 1, 1]);
    // The upper edge fills down to the lower edge, which must come right before it.
    expect(hi[0].fill).toBe("tonexty");
    expect(fig.data.indexOf(hi[0])).toBe(fig.data.indexOf(lo[0]) + 1);
    expect(hi[0].name).toContain("95 % band");
    const xs = role(fig, "points").flatMap((t) => t.x as number[]);
    expect(curve[0].x[0]).toBe(Math.min(...xs));
    expect(curve[0].x[curve[0].x.length - 1]).toBe(Math.max(...xs));
    const fit = sampleFit();
    curve[0].x.forEach((x, i) => {
      const p = fit.predict(x!, 0.95);
      expect(curve[0].y[i]).toBe(p.estimate);
      expect(lo[0].y[i]).toBe(p.lower);
      expect(hi[0].y[i]).toBe(p.upper);
    });
  });

  it("draws the conjectured slope-1 line y = c·x and names its constant", () => {
    const [line] = role(fig, "conjecture");
    expect(line.name).toContain("c = 0.3 [0.28, 0.32]");
    line.x.forEach((x, i) => close(line.y[i]!, 0.3 * x!));
    // Slope 1 on log–log axes.
    const slope = Math.log(line.y[1]! / line.y[0]!) / Math.log(line.x[1]! / line.x[0]!);
    close(slope, 1);
  });

  it("reads c from a fit of the slope-1 law as its prediction at x = 1", () => {
    const law = { law: "surplus = c·m/√d", response: "surplusLower", predict: (x: number | { m: number; d: number }) => {
      const v = typeof x === "number" ? x : x.m / Math.sqrt(x.d);
      return { estimate: 0.25 * v, lower: 0.2 * v, upper: 0.3 * v };
    } };
    const f = surplusScalingFigure(rows, { conjecture: law });
    expect(role(f, "conjecture")[0].name).toContain("c = 0.25 [0.2, 0.3]");
  });

  it("uses the selected degree measure for d", () => {
    for (const field of ["maxDegree", "averageDegree"] as const) {
      const f = surplusScalingFigure(rows, { degree: field });
      expect(f.layout.xaxis.title.text).toContain(field === "maxDegree" ? "maximum degree" : "average degree");
      const byKey = rowByKey(rows);
      for (const t of role(f, "points")) t.x.forEach((x, i) => close(x!, byKey.get(t.text![i])!.m / Math.sqrt(byKey.get(t.text![i])![field])));
    }
  });

  it("a family fit takes that family's colour and spans that family's points", () => {
    const f = surplusScalingFigure(rows, { fits: sampleFit("polarity") });
    const polarity = role(f, "points").find((t) => t.name === "polarity")!;
    const curve = role(f, "fit")[0];
    expect(curve.line!.color).toBe(polarity.marker!.color);
    expect(curve.x[0]).toBe(Math.min(...(polarity.x as number[])));
  });

  it("handles empty input: no traces, log axes, a note on the canvas", () => {
    const f = surplusScalingFigure([], { fits: sampleFit(), conjecture: { constant: 0.3 } });
    expect(role(f, "points")).toHaveLength(0);
    expect(f.layout.xaxis.type).toBe("log");
    expect(f.layout.annotations?.[0].text).toBe("No graphs to plot");
    expect(f.layout.meta.notes.join(" ")).toMatch(/not drawn/);
  });

  it("handles a single graph: one point, and the curves span a factor 1.5 either side", () => {
    const one = [rows[7]];
    const f = surplusScalingFigure(one, { fits: sampleFit(), conjecture: { constant: 0.3 } });
    const pts = role(f, "points");
    expect(pts).toHaveLength(1);
    expect(pts[0].x).toHaveLength(1);
    const x = one[0].m / Math.sqrt(one[0].degeneracy);
    const curve = role(f, "fit")[0];
    close(curve.x[0]!, x / 1.5);
    close(curve.x[curve.x.length - 1]!, x * 1.5);
  });

  it("leaves out rows a log axis cannot show and says how many", () => {
    const bad: SurplusRow[] = [
      { ...rows[0], key: "zero-degree", degeneracy: 0 },
      { ...rows[1], key: "no-surplus", surplusLower: 0 },
      rows[2],
    ];
    const f = surplusScalingFigure(bad);
    expect(role(f, "points").reduce((k, t) => k + t.x.length, 0)).toBe(1);
    expect(f.layout.meta.notes).toContain("1 row left out: degeneracy 0 (no m/√d)");
    expect(f.layout.meta.notes).toContain("1 row left out: surplus lower end ≤ 0 (log axis)");
  });

  it("keeps family styles fixed by familyOrder across figures", () => {
    const order = ["gnp", "kneser", "polarity", "triangle-free-process"];
    const a = surplusScalingFigure(rows, { familyOrder: order });
    const b = normalisedRatioFigure(rows.filter((r) => r.family !== "kneser"), { familyOrder: order });
    const style = (f: PlotFigure, fam: string) => role(f, "points").find((t) => t.name === fam)!.marker;
    expect(style(b, "polarity")).toEqual(style(a, "polarity"));
    expect(style(b, "gnp")).toEqual(style(a, "gnp"));
  });

  it("is plain data: a JSON round trip gives it back unchanged", () => {
    expect(JSON.parse(JSON.stringify(fig))).toEqual(fig);
  });

  it("refuses bad rows and options with one line naming the row or the parameter", () => {
    expectInputError(() => surplusScalingFigure([{ ...rows[0], m: Number.NaN }]), "row 1 (kneser:n=16): `m`");
    expectInputError(() => surplusScalingFigure([rows[0], { ...rows[1], surplusLower: 9, surplusUpper: 3 }]), "row 2");
    expectInputError(() => surplusScalingFigure(rows, { degree: "median" as never }), "`degree`");
    expectInputError(() => surplusScalingFigure(rows, { level: 1.5 }), "`level`");
    expectInputError(() => surplusScalingFigure(rows, { point: "top" as never }), "`point`");
    try {
      surplusScalingFigure([{ ...rows[0], family: "" }]);
    } catch (e) {
      expect((e as Error).message).not.toContain("\n");
    }
  });
});

describe("normalised surplus against m", () => {
  const rows = sampleRows();
  const fig = normalisedRatioFigure(rows, { conjecture: { constant: 0.3 } });

  it("plots surplus/(m/√d) against m with bars equal to the bracket over m/√d", () => {
    expect(fig.layout.xaxis.type).toBe("log");
    expect(fig.layout.yaxis.type).toBe("linear");
    const scale = (r: SurplusRow) => r.m / Math.sqrt(r.degeneracy);
    const byKey = rowByKey(rows);
    const points = role(fig, "points");
    expect(points).toHaveLength(FAMILIES.length);
    for (const t of points) {
      t.x.forEach((m, i) => expect(m).toBe(byKey.get(t.text![i])!.m));
      expectBarsEqualBrackets(t, rows, scale);
    }
  });

  it("draws the conjectured constant as a horizontal line", () => {
    const [line] = role(fig, "conjecture");
    expect(line.y).toEqual([0.3, 0.3]);
    expect(line.name).toContain("c = 0.3");
  });

  it("handles empty input", () => {
    const f = normalisedRatioFigure([]);
    expect(f.data).toHaveLength(0);
    expect(f.layout.annotations).toHaveLength(1);
  });
});

describe("fitted exponents", () => {
  const estimates = sampleExponents();

  it("one trace per family, bars equal to each interval, one row per estimate", () => {
    const fig = exponentFigure(estimates);
    const points = role(fig, "points");
    expect(points.map((t) => t.name).sort()).toEqual(["gnp", "kneser", "polarity"]);
    expect(fig.layout.yaxis.ticktext).toHaveLength(estimates.length);
    for (const t of points)
      t.x.forEach((x, i) => {
        const e = estimates.find((e) => `${e.family} · ${e.name}` === t.text![i])!;
        expect(x).toBe(e.estimate);
        close(x! - t.error_x!.arrayminus[i], e.lower);
        close(x! + t.error_x!.array[i], e.upper);
        expect(fig.layout.yaxis.ticktext![t.y[i]!]).toBe(t.text![i]);
      });
  });

  it("a single conjectured value is a vertical line across every row; mixed values are marks", () => {
    const same = exponentFigure(estimates.slice(0, 3));
    const [line] = role(same, "conjecture");
    expect(line.x).toEqual([1, 1]);
    expect(line.y).toEqual([-0.5, 2.5]);
    const mixed = exponentFigure(estimates);
    const [marks] = role(mixed, "reference");
    expect([...marks.x].sort()).toEqual([-0.5, 1, 1, 1]);
  });

  it("handles no estimates, and refuses an interval that misses its estimate", () => {
    expect(exponentFigure([]).layout.annotations?.[0].text).toBe("No fitted exponents to plot");
    expectInputError(() => exponentFigure([{ name: "a", estimate: 2, lower: 0, upper: 1, conjectured: null }]), "estimate 1 (a)");
  });
});

describe("bound tightness", () => {
  const rows = sampleRows().slice(0, 8);

  it("four series, each value drawn as its surplus (value − m/2) on a log axis", () => {
    const fig = boundTightnessFigure(rows);
    expect(fig.layout.yaxis.type).toBe("log");
    expect(fig.data.map((t) => t.name)).toEqual(["SDP upper bound", "best cut found", "vector rounding guarantee", "Edwards bound"]);
    expect(new Set(fig.data.map((t) => t.marker!.symbol)).size).toBe(4);
    const field = { "SDP upper bound": "sdpBound", "best cut found": "bestCut", "vector rounding guarantee": "vectorGuarantee", "Edwards bound": "edwardsBound" } as const;
    for (const t of fig.data)
      t.x.forEach((x, i) => {
        const r = rows[x!];
        close(t.y[i]!, r[field[t.name as keyof typeof field]]! - r.m / 2);
      });
    expect(fig.layout.xaxis.ticktext).toEqual(rows.map((r) => r.key));
  });

  it("notes bounds that are missing and sorts by family when asked", () => {
    const partial = rows.map((r, i) => (i % 2 ? { ...r, vectorGuarantee: undefined } : r));
    const fig = boundTightnessFigure(partial, { familyOrder: ["polarity", "kneser"] });
    expect(fig.layout.meta.notes).toContain("vector rounding guarantee: not given for 4 of 8 graphs");
    expect(fig.layout.xaxis.ticktext![0]).toMatch(/^polarity/);
  });

  it("handles empty input", () => {
    expect(boundTightnessFigure([]).data).toHaveLength(0);
  });
});

describe("degree and degeneracy distributions", () => {
  const rows = sampleRows();

  it("left panel: shares of vertices by degree summing to 1; right panel: graphs by degeneracy", () => {
    const fig = degreeDistributionFigure(rows, { family: "gnp" });
    const left = fig.data.filter((t) => (t.xaxis ?? "x") === "x");
    const right = fig.data.filter((t) => t.xaxis === "x2");
    expect(left).toHaveLength(1);
    expect(right).toHaveLength(1);
    const gnp = rows.filter((r) => r.family === "gnp");
    close(left[0].y.reduce<number>((a, b) => a + b!, 0), 1);
    // Degrees of the sample rows are d−1, d, d+1 in turn, so the pooled histogram is known.
    const all = gnp.flatMap((r) => r.degrees!);
    left[0].x.forEach((deg, i) => close(left[0].y[i]!, all.filter((d) => d === deg).length / all.length));
    expect(right[0].y.reduce<number>((a, b) => a + b!, 0)).toBe(gnp.length);
    expect(right[0].x).toEqual(gnp.map((r) => r.degeneracy).sort((a, b) => a - b));
    expect(fig.layout.xaxis2?.title.text).toBe("degeneracy");
  });

  it("one trace per family and panel when several families are shown", () => {
    const fig = degreeDistributionFigure(rows);
    expect(fig.data).toHaveLength(2 * FAMILIES.length);
    expect(new Set(fig.data.map((t) => t.marker!.symbol)).size).toBe(FAMILIES.length);
  });

  it("refuses a family with no rows, naming the families present", () => {
    expectInputError(() => degreeDistributionFigure(rows, { family: "paley" }), "families present: kneser, polarity");
  });
});
