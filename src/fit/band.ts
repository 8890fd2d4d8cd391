// The exponent band under a bracket: fit the lower end, the upper end and (where closed) the exact
// surplus separately and report how far apart their exponents are. An exponent claim is only as
// good as the bracket under it.

import { InputError } from "../errors.js";
import { describeFitText, fitsToLatex, formatNumber, type LatexOptions } from "./format.js";
import { powerLawTerms } from "./laws.js";
import { checkLevel } from "./options.js";
import { commonFamily, powerLawFromScreened, resolvePowerLawOptions, type PowerLawFit, type PowerLawOptions } from "./power-law.js";
import { lawNeedsDegree, screenRows, type DroppedRow, type FitRow, type ScreenedRows } from "./rows.js";
import type { FitTableRow, Tabulable } from "./types.js";

/** One term's band: the spread of the end fits' estimates, and that spread widened by their intervals. */
export interface ExponentBand {
  name: string;
  level: number;
  lowerEnd: number;
  upperEnd: number;
  /** The closed-bracket fit's estimate, or null when there were too few closed brackets. */
  exact: number | null;
  /** Smallest and largest of the estimates above. */
  low: number;
  high: number;
  /** Smallest lower and largest upper t-interval end among the fits: the band a claim can rest on. */
  widenedLow: number;
  widenedHigh: number;
  conjectured: number | null;
}

export type SurplusBandOptions = Omit<PowerLawOptions, "response">;

/** Three fits of one law over one set of rows, and the band between their exponents. */
export class SurplusBand implements Tabulable {
  readonly law: string;
  readonly family?: string;
  readonly terms: readonly string[];
  /** Fit of the lower ends; `upper` uses exactly the same rows. */
  readonly lower: PowerLawFit;
  readonly upper: PowerLawFit;
  /** Fit of the closed brackets only, or null (then `exactProblem` says why). */
  readonly exact: PowerLawFit | null;
  readonly exactProblem: string | null;
  readonly level: number;

  constructor(lower: PowerLawFit, upper: PowerLawFit, exact: PowerLawFit | null, exactProblem: string | null, family?: string) {
    this.law = lower.law;
    if (family !== undefined) this.family = family;
    this.terms = lower.terms;
    this.lower = lower;
    this.upper = upper;
    this.exact = exact;
    this.exactProblem = exactProblem;
    this.level = lower.level;
  }

  /** The band for one term (default level: the fits' level). */
  band(name: string, level?: number): ExponentBand {
    const lv = level === undefined ? this.level : checkLevel("SurplusBand", level);
    const fits = [this.lower, this.upper, ...(this.exact === null ? [] : [this.exact])];
    const est = fits.map((f) => f.coefficient(name).estimate);
    const ivs = fits.map((f) => f.interval(name, lv));
    return {
      name,
      level: lv,
      lowerEnd: est[0],
      upperEnd: est[1],
      exact: this.exact === null ? null : est[2],
      low: Math.min(...est),
      high: Math.max(...est),
      widenedLow: Math.min(...ivs.map((i) => i.lower)),
      widenedHigh: Math.max(...ivs.map((i) => i.upper)),
      conjectured: this.lower.conjectured(name),
    };
  }

  /** Bands of every term. */
  bands(level?: number): ExponentBand[] {
    return this.terms.map((t) => this.band(t, level));
  }

  /** All three fits' table rows (their `response` column tells them apart). */
  tableRows(level?: number): FitTableRow[] {
    return [this.lower, this.upper, ...(this.exact === null ? [] : [this.exact])].flatMap((f) => f.tableRows(level));
  }

  summary(level?: number): string {
    const lines: string[] = [];
    for (const b of this.bands(level)) {
      if (b.name === "constant") continue;
      const conj = b.conjectured === null ? "" : `; conjectured ${b.conjectured}`;
      lines.push(
        `band ${b.name}: estimates ${formatNumber(b.low)} .. ${formatNumber(b.high)} ` +
          `(lower end ${formatNumber(b.lowerEnd)}, upper end ${formatNumber(b.upperEnd)}, exact ${formatNumber(b.exact)}); ` +
          `with ${+(b.level * 100).toFixed(2)} % intervals ${formatNumber(b.widenedLow)} .. ${formatNumber(b.widenedHigh)}${conj}`,
      );
    }
    if (this.exactProblem !== null) lines.push(`no exact fit: ${this.exactProblem}`);
    const fam = this.family === undefined ? "" : `family ${this.family}: `;
    return describeFitText(`${fam}exponent band of the surplus bracket, law "${this.law}"`, this.tableRows(level), lines);
  }

  latex(options: LatexOptions = {}): string {
    return fitsToLatex([this], options);
  }

  /** Plain JSON-ready record (kind "halfplus/fit-band"): the bands and the three fits' records. */
  toJSON(): Record<string, unknown> {
    return {
      kind: "halfplus/fit-band",
      version: 1,
      law: this.law,
      family: this.family ?? null,
      level: this.level,
      bands: this.bands(),
      lower: this.lower.toJSON(),
      upper: this.upper.toJSON(),
      exact: this.exact === null ? null : this.exact.toJSON(),
      exactProblem: this.exactProblem,
    };
  }
}

/** Keep only the rows in `keep`; others get `reason` (rows already dropped keep their own reason). */
function restrict(s: ScreenedRows, keep: ReadonlySet<number>, reasonFor: (index: number) => string): ScreenedRows {
  const used = [];
  const logM = [];
  const logD = [];
  const logS = [];
  const dropped: DroppedRow[] = [...s.dropped];
  for (let i = 0; i < s.used.length; i++) {
    const u = s.used[i];
    if (keep.has(u.index)) {
      used.push(u);
      logM.push(s.logM[i]);
      logD.push(s.logD[i]);
      logS.push(s.logSurplus[i]);
    } else {
      dropped.push(u.key === undefined ? { index: u.index, reason: reasonFor(u.index) } : { index: u.index, key: u.key, reason: reasonFor(u.index) });
    }
  }
  dropped.sort((a, b) => a.index - b.index);
  return { used, dropped, logM: Float64Array.from(logM), logD: Float64Array.from(logD), logSurplus: Float64Array.from(logS) };
}

/**
 * Fits the law to the bracket's lower ends, its upper ends (over exactly the same rows, so the two
 * exponents are comparable) and, where at least p + 1 brackets are closed, to the exact surplus;
 * reports each term's band between the fits' estimates and between their intervals.
 */
export function fitSurplusBand(rows: readonly FitRow[], options: SurplusBandOptions = {}): SurplusBand {
  const owner = "fitSurplusBand";
  if (options !== null && typeof options === "object" && "response" in options) {
    throw new InputError(`${owner}: unknown option \`response\`: the band fits every bracket end itself`);
  }
  const o = resolvePowerLawOptions(owner, options, ["law", "degree", "level", "bootstrap", "conjecture"]);
  const family = commonFamily(rows);
  const base = { degree: o.degree, needsDegree: lawNeedsDegree(o.law), owner };
  const lo = screenRows(rows, { ...base, response: "lower" });
  const hi = screenRows(rows, { ...base, response: "upper" });
  const loSet = new Set(lo.used.map((u) => u.index));
  const hiSet = new Set(hi.used.map((u) => u.index));
  const both = new Set([...loSet].filter((i) => hiSet.has(i)));
  const loReason = new Map(lo.dropped.map((d) => [d.index, d.reason]));
  const hiReason = new Map(hi.dropped.map((d) => [d.index, d.reason]));
  const lower = powerLawFromScreened(owner, restrict(lo, both, (i) => `upper end unusable (${hiReason.get(i)}); both ends use the same rows`), { ...o, response: "lower" }, family);
  const upper = powerLawFromScreened(owner, restrict(hi, both, (i) => `lower end unusable (${loReason.get(i)}); both ends use the same rows`), { ...o, response: "upper" }, family);

  const ex = screenRows(rows, { ...base, response: "exact" });
  const p = powerLawTerms(o.law).length;
  let exact: PowerLawFit | null = null;
  let exactProblem: string | null = null;
  if (ex.used.length < p + 1) {
    exactProblem = `${ex.used.length} closed bracket${ex.used.length === 1 ? "" : "s"} usable; the law "${o.law}" needs at least ${p + 1}`;
  } else {
    try {
      exact = powerLawFromScreened(owner, ex, { ...o, response: "exact" }, family);
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      exactProblem = e.message.replace(`${owner}: `, "");
    }
  }
  return new SurplusBand(lower, upper, exact, exactProblem, family);
}
