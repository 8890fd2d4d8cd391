// Fit tables as text (one table per family, our own layout) and as a LaTeX booktabs fragment.
// Pure functions of the fits' table rows: no fitting happens here.

import type { FitTableRow, Tabulable } from "./types.js";

/** A fixed-point number for text tables; scientific outside [1e-3, 1e5). */
export function formatNumber(x: number | null, decimals = 4): string {
  if (x === null) return "—";
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return "0";
  const a = Math.abs(x);
  if (a >= 1e5 || a < 10 ** -decimals) return x.toExponential(2);
  return x.toFixed(decimals);
}

function formatP(p: number | null): string {
  if (p === null) return "—";
  return p < 1e-4 ? p.toExponential(1) : p.toFixed(4);
}

function percent(level: number): string {
  return `${+(level * 100).toFixed(2)} %`;
}

interface Column {
  header: string;
  align: "left" | "right";
  cells: string[];
}

/** Columns padded to their widest cell, two spaces apart, each line indented by `indent`. */
function layout(columns: Column[], indent = "  "): string[] {
  const widths = columns.map((c) => Math.max(c.header.length, ...c.cells.map((s) => s.length)));
  const line = (cells: string[]): string =>
    indent +
    cells
      .map((s, j) => (columns[j].align === "left" ? s.padEnd(widths[j]) : s.padStart(widths[j])))
      .join("  ")
      .trimEnd();
  const out = [line(columns.map((c) => c.header))];
  const rows = columns[0]?.cells.length ?? 0;
  for (let i = 0; i < rows; i++) out.push(line(columns.map((c) => c.cells[i])));
  return out;
}

function intervalText(lo: number | null, hi: number | null): string {
  return lo === null || hi === null ? "—" : `[${formatNumber(lo)}, ${formatNumber(hi)}]`;
}

/**
 * Table columns for a list of rows; `withFit` adds law/response/fixed columns (several fits in one
 * table). A single fit's table still gets a response column when its rows come from several ends.
 */
function rowColumns(rows: readonly FitTableRow[], withFit: boolean): Column[] {
  const level = rows[0]?.level ?? 0.95;
  const cols: Column[] = [];
  if (withFit) {
    cols.push({ header: "law", align: "left", cells: rows.map((r) => r.law) });
    cols.push({ header: "response", align: "left", cells: rows.map((r) => r.response) });
    if (rows.some((r) => r.fixed !== null)) cols.push({ header: "held fixed", align: "left", cells: rows.map((r) => r.fixed ?? "") });
  } else if (new Set(rows.map((r) => r.response)).size > 1) {
    cols.push({ header: "response", align: "left", cells: rows.map((r) => r.response) });
  }
  cols.push({ header: "term", align: "left", cells: rows.map((r) => r.term) });
  cols.push({ header: "estimate", align: "right", cells: rows.map((r) => formatNumber(r.estimate)) });
  cols.push({ header: "std. error", align: "right", cells: rows.map((r) => formatNumber(r.standardError)) });
  cols.push({ header: `${percent(level)} t-interval`, align: "left", cells: rows.map((r) => intervalText(r.lower, r.upper)) });
  if (rows.some((r) => r.bootstrapLower !== null)) {
    cols.push({ header: `${percent(level)} bootstrap`, align: "left", cells: rows.map((r) => intervalText(r.bootstrapLower, r.bootstrapUpper)) });
  }
  cols.push({ header: "conjectured", align: "right", cells: rows.map((r) => (r.conjectured === null ? "—" : String(r.conjectured))) });
  cols.push({ header: "t", align: "right", cells: rows.map((r) => (r.t === null ? "—" : r.t.toFixed(2))) });
  cols.push({ header: "p", align: "right", cells: rows.map((r) => formatP(r.pValue)) });
  if (withFit) {
    cols.push({ header: "rows", align: "right", cells: rows.map((r) => String(r.rows)) });
    cols.push({ header: "R²", align: "right", cells: rows.map((r) => (r.rSquared === null ? "—" : r.rSquared.toFixed(4))) });
  }
  return cols;
}

/** One fit's readable summary: a headline, a table of its terms, then footer lines. */
export function describeFitText(headline: string, rows: readonly FitTableRow[], footer: readonly string[]): string {
  return [headline, ...layout(rowColumns(rows, false)), ...footer.map((f) => `  ${f}`)].join("\n") + "\n";
}

/** A family's fits that could not be made, as fitByFamily reports them. */
export interface SkippedFamily {
  family: string;
  rows: number;
  reason: string;
}

type FitCollection = Iterable<Tabulable> | ReadonlyMap<string, Tabulable>;

function collectRows(fits: FitCollection, level: number | undefined): FitTableRow[] {
  const list: Tabulable[] = fits instanceof Map ? [...(fits as ReadonlyMap<string, Tabulable>).values()] : [...(fits as Iterable<Tabulable>)];
  return list.flatMap((f) => f.tableRows(level));
}

/** Rows grouped by family in order of first appearance (rows without a family under null). */
function byFamily(rows: readonly FitTableRow[]): Map<string | null, FitTableRow[]> {
  const groups = new Map<string | null, FitTableRow[]>();
  for (const r of rows) {
    const g = groups.get(r.family);
    if (g === undefined) groups.set(r.family, [r]);
    else g.push(r);
  }
  return groups;
}

/**
 * Text tables for one or more fits, one table per family: a title line naming the family and the
 * degree measure, then one line per fitted term (law, response, estimate, standard error, t and
 * bootstrap intervals, conjectured value, t and p against it, rows, R²). Families that could not
 * be fitted (`skipped`, or a collection carrying a `skipped` list) are listed at the end.
 */
export function formatFitTable(fits: FitCollection, options: { level?: number; skipped?: readonly SkippedFamily[] } = {}): string {
  const rows = collectRows(fits, options.level);
  const out: string[] = [];
  for (const [family, group] of byFamily(rows)) {
    if (out.length > 0) out.push("");
    // The law "m" does not read d, so only the other laws' rows say which degree measure they used.
    const degrees = [...new Set(group.filter((r) => r.law !== "m").map((r) => r.degree))];
    const title = family === null ? "all rows (no family)" : `family ${family}`;
    out.push(degrees.length === 0 ? title : `${title} · d = ${degrees.join(", ")}`);
    out.push(...layout(rowColumns(group, true)));
  }
  const skipped = options.skipped ?? (fits as { skipped?: readonly SkippedFamily[] }).skipped ?? [];
  if (skipped.length > 0) {
    if (out.length > 0) out.push("");
    for (const s of skipped) out.push(`not fitted: family ${s.family} (${s.rows} rows): ${s.reason}`);
  }
  return out.length === 0 ? "no fits\n" : out.join("\n") + "\n";
}

export interface LatexOptions {
  /** Interval level (default: each fit's own). */
  level?: number;
  /** Decimals for numbers (default 3). */
  digits?: number;
}

/** Escapes LaTeX's special characters in running text. */
export function latexEscape(s: string): string {
  return s.replace(/[\\{}$&#^_%~]/g, (c) => {
    switch (c) {
      case "\\":
        return "\\textbackslash{}";
      case "^":
        return "\\textasciicircum{}";
      case "~":
        return "\\textasciitilde{}";
      default:
        return `\\${c}`;
    }
  });
}

function latexNumber(x: number | null, digits: number): string {
  if (x === null || !Number.isFinite(x)) return "--";
  if (x === 0) return "$0$";
  const a = Math.abs(x);
  if (a >= 1e5 || a < 10 ** -digits) {
    const [mant, exp] = x.toExponential(2).split("e");
    return `$${mant}\\times 10^{${Number(exp)}}$`;
  }
  return `$${x.toFixed(digits)}$`;
}

function latexInterval(lo: number | null, hi: number | null, digits: number): string {
  if (lo === null || hi === null) return "--";
  return `[${latexNumber(lo, digits)}, ${latexNumber(hi, digits)}]`;
}

function latexTerm(r: FitTableRow): string {
  const fixed = r.fixed === null ? "" : ` (${latexEscape(r.fixed)})`;
  switch (r.term) {
    case "constant":
      return `$\\ln C$${fixed}`;
    case "C":
      return `$C$${fixed}`;
    case "mExponent":
      return "exponent of $m$";
    case "dExponent":
      return "exponent of $d$";
    case "slope":
      return r.law === "m-over-sqrt-d" ? "exponent of $m/\\sqrt{d}$" : "exponent of $m$";
    default:
      return latexEscape(r.term);
  }
}

/**
 * A booktabs `tabular` fragment (needs \usepackage{booktabs}) with one block per family, separated
 * by \midrule: bracket end, term, estimate, standard error, t-interval, bootstrap interval,
 * conjectured value and the p-value against it.
 */
export function fitsToLatex(fits: FitCollection, options: LatexOptions = {}): string {
  const digits = options.digits ?? 3;
  const rows = collectRows(fits, options.level);
  const level = rows[0]?.level ?? options.level ?? 0.95;
  const pct = `${+(level * 100).toFixed(2)}\\,\\%`;
  const out: string[] = [];
  out.push("% needs \\usepackage{booktabs}");
  out.push("\\begin{tabular}{lllrrllrr}");
  out.push("\\toprule");
  out.push(`Family & Bracket end & Term & Estimate & Std.\\ error & ${pct} $t$-interval & ${pct} bootstrap & Conjectured & $p$ \\\\`);
  out.push("\\midrule");
  let first = true;
  for (const [family, group] of byFamily(rows)) {
    if (!first) out.push("\\midrule");
    first = false;
    group.forEach((r, i) => {
      const cells = [
        i === 0 ? (family === null ? "all" : latexEscape(family)) : "",
        r.response,
        latexTerm(r),
        latexNumber(r.estimate, digits),
        latexNumber(r.standardError, digits),
        latexInterval(r.lower, r.upper, digits),
        latexInterval(r.bootstrapLower, r.bootstrapUpper, digits),
        r.conjectured === null ? "--" : `$${r.conjectured}$`,
        r.pValue === null ? "--" : r.pValue < 1e-4 ? latexNumber(r.pValue, 4) : `$${r.pValue.toFixed(4)}$`,
      ];
      out.push(`${cells.join(" & ")} \\\\`);
    });
  }
  out.push("\\bottomrule");
  out.push("\\end{tabular}");
  return out.join("\n") + "\n";
}
