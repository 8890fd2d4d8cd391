// Fit tables (src/fit/format.ts): pure functions of table rows, text and LaTeX booktabs.
import { describe, expect, it } from "vitest";
import { fitsToLatex, formatFitTable, formatNumber, latexEscape, type FitTableRow, type Tabulable } from "../src/fit/index.js";

function row(over: Partial<FitTableRow>): FitTableRow {
  return {
    family: "polarity",
    law: "m-over-sqrt-d",
    response: "lower",
    degree: "degeneracy",
    term: "slope",
    estimate: 0.8312,
    standardError: 0.0123,
    level: 0.95,
    lower: 0.8034,
    upper: 0.859,
    bootstrapLower: 0.8051,
    bootstrapUpper: 0.8577,
    conjectured: 1,
    t: -13.72,
    pValue: 3.1e-7,
    fixed: null,
    rows: 10,
    df: 8,
    rSquared: 0.9991,
    ...over,
  };
}

const fit = (rows: FitTableRow[]): Tabulable => ({ tableRows: () => rows });

describe("formatFitTable", () => {
  it("prints one table per family, in order of first appearance, with one line per term", () => {
    const fits = [
      fit([row({ term: "constant", estimate: -1.25, conjectured: null, t: null, pValue: null }), row({})]),
      fit([row({ family: "gnp_sparse", estimate: 0.97, pValue: 0.21, t: -1.3 })]),
      fit([row({ response: "upper", estimate: 0.85 })]),
    ];
    const text = formatFitTable(fits);
    const lines = text.trimEnd().split("\n");
    expect(lines[0]).toBe("family polarity · d = degeneracy");
    expect(lines[1]).toMatch(/^ {2}law +response +term +estimate +std\. error +95 % t-interval +95 % bootstrap +conjectured +t +p +rows +R²$/);
    expect(lines[2]).toMatch(/^ {2}m-over-sqrt-d +lower +constant +-1\.2500 +0\.0123 +\[0\.8034, 0\.8590\] .* +— +— +— +10 +0\.9991$/);
    expect(lines[3]).toContain("3.1e-7");
    expect(lines[4]).toMatch(/^ {2}m-over-sqrt-d +upper +slope +0\.8500/);
    expect(lines[5]).toBe("");
    expect(lines[6]).toBe("family gnp_sparse · d = degeneracy");
    expect(lines[8]).toMatch(/-1\.30 +0\.2100 +10 +0\.9991$/);
    expect(lines).toHaveLength(9);
    // Columns line up: every row of a table has the header's width or less (trailing blanks trimmed).
    expect(lines[2].indexOf("[")).toBe(lines[1].indexOf("95 % t-interval"));
  });

  it("lists families that were not fitted, and prints a fixed-exponent column only when needed", () => {
    const text = formatFitTable([fit([row({ term: "constant", fixed: "slope = 1", conjectured: null, t: null, pValue: null })])], {
      skipped: [{ family: "kneser", rows: 2, reason: "needs at least 3 usable rows" }],
    });
    expect(text).toContain("held fixed");
    expect(text).toContain("slope = 1");
    expect(text.trimEnd().split("\n").at(-1)).toBe("not fitted: family kneser (2 rows): needs at least 3 usable rows");
    expect(formatFitTable([])).toBe("no fits\n");
    expect(formatFitTable([fit([row({ family: null })])])).toMatch(/^all rows \(no family\) · d = degeneracy\n/);
    // The law "m" does not use d, so its table does not name a degree measure.
    expect(formatFitTable([fit([row({ law: "m" })])])).toMatch(/^family polarity\n/);
  });

  it("formats numbers in fixed point inside [1e-3, 1e5) and in scientific notation outside", () => {
    expect(formatNumber(0.5)).toBe("0.5000");
    expect(formatNumber(-12345.678)).toBe("-12345.6780");
    expect(formatNumber(123456)).toBe("1.23e+5");
    expect(formatNumber(2e-6)).toBe("2.00e-6");
    expect(formatNumber(null)).toBe("—");
  });
});

describe("fitsToLatex", () => {
  it("emits a booktabs tabular with one block per family and escaped text", () => {
    // booktabs rules \toprule, \midrule, \bottomrule (S. Fear, the booktabs package documentation).
    const tex = fitsToLatex([
      fit([
        row({ family: "gnp_p=0.1 & more", law: "m", term: "constant", estimate: -1.25, conjectured: null, t: null, pValue: null }),
        row({ family: "gnp_p=0.1 & more", law: "m" }),
      ]),
      fit([row({ estimate: 1.01, pValue: 0.41 })]),
    ]);
    const lines = tex.trimEnd().split("\n");
    expect(lines[0]).toBe("% needs \\usepackage{booktabs}");
    expect(lines[1]).toBe("\\begin{tabular}{lllrrllrr}");
    expect(lines[2]).toBe("\\toprule");
    expect(lines[4]).toBe("\\midrule");
    expect(lines[5]).toBe("gnp\\_p=0.1 \\& more & lower & $\\ln C$ & $-1.250$ & $0.012$ & [$0.803$, $0.859$] & [$0.805$, $0.858$] & -- & -- \\\\");
    expect(lines[6]).toBe(" & lower & exponent of $m$ & $0.831$ & $0.012$ & [$0.803$, $0.859$] & [$0.805$, $0.858$] & $1$ & $3.10\\times 10^{-7}$ \\\\");
    expect(lines[7]).toBe("\\midrule");
    expect(lines[8]).toContain("polarity & lower & exponent of $m/\\sqrt{d}$ & $1.010$");
    expect(lines.slice(-2)).toEqual(["\\bottomrule", "\\end{tabular}"]);
    // Every body line has nine cells.
    for (const l of [lines[3], lines[5], lines[6], lines[8]]) expect(l.split(" & ")).toHaveLength(9);
    expect(fitsToLatex([fit([row({})])], { digits: 2 })).toContain("$0.83$");
  });

  it("escapes every LaTeX special character", () => {
    expect(latexEscape("a_b%c$d#e{f}g&h~i^j\\k")).toBe("a\\_b\\%c\\$d\\#e\\{f\\}g\\&h\\textasciitilde{}i\\textasciicircum{}j\\textbackslash{}k");
  });
});
