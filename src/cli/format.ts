// The one rule for every number the CLI prints as text: integers as they are; other numbers to at
// most 4 decimals with trailing zeros dropped (47.94, 0.1235); very large or very small ones in
// exponent notation with 4 significant digits. JSON output keeps full precision.

export function formatNumber(x: number): string {
  if (Number.isNaN(x)) return "NaN";
  if (!Number.isFinite(x)) return x > 0 ? "∞" : "−∞";
  if (Number.isInteger(x)) return Object.is(x, -0) ? "0" : String(x);
  const a = Math.abs(x);
  if (a >= 1e-4 && a < 1e15) {
    const s = x.toFixed(4).replace(/\.?0+$/, "");
    return s === "-0" ? "0" : s;
  }
  return x.toExponential(3).replace(/\.?0+e/, "e");
}

/** Rows of `label  value`, labels padded to one width, each indented by two spaces. */
export function formatRows(rows: readonly (readonly [string, string])[]): string[] {
  const w = Math.max(0, ...rows.map((r) => r[0].length));
  return rows.map(([k, v]) => `  ${k.padEnd(w)}  ${v}`);
}

/** A table: every column padded to its widest cell (the last one left ragged), rows indented by two spaces. */
export function formatTable(rows: readonly (readonly string[])[]): string[] {
  const widths: number[] = [];
  for (const r of rows) r.forEach((c, i) => (widths[i] = Math.max(widths[i] ?? 0, c.length)));
  return rows.map((r) => `  ${r.map((c, i) => (i === r.length - 1 ? c : c.padEnd(widths[i]))).join("  ")}`.trimEnd());
}
