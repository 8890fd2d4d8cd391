// One fit per family: rows grouped by their `family`, each group fitted on its own with the same
// options; families that cannot be fitted are listed with the reason instead of stopping the rest.

import { InputError } from "../errors.js";
import type { SkippedFamily } from "./format.js";
import { powerLawFromScreened, resolvePowerLawOptions, type PowerLawFit, type PowerLawOptions } from "./power-law.js";
import { lawNeedsDegree, screenRows, type FitRow } from "./rows.js";
import { fitSurplusBand, type SurplusBand, type SurplusBandOptions } from "./band.js";

/** Rows without a `family` are fitted together under this name. */
export const NO_FAMILY = "(no family)";

/** Fits keyed by family (in alphabetical order), and the families that could not be fitted. */
export class FamilyFits extends Map<string, PowerLawFit> {
  readonly skipped: SkippedFamily[] = [];

  /** Plain JSON-ready record: each family's fit record, then the families not fitted. */
  toJSON(): { fits: Record<string, unknown>[]; skipped: SkippedFamily[] } {
    return { fits: [...this.values()].map((f) => f.toJSON()), skipped: this.skipped };
  }
}

/** Rows grouped by family (alphabetical), each group with the rows' positions in the input array. */
function groupByFamily(owner: string, rows: readonly FitRow[]): [string, { rows: FitRow[]; positions: number[] }][] {
  if (!Array.isArray(rows)) throw new InputError(`${owner}: invalid \`rows\`: should be an array of rows (got ${typeof rows})`);
  const groups = new Map<string, { rows: FitRow[]; positions: number[] }>();
  rows.forEach((r, i) => {
    const f = r !== null && typeof r === "object" && typeof r.family === "string" ? r.family : NO_FAMILY;
    let g = groups.get(f);
    if (g === undefined) groups.set(f, (g = { rows: [], positions: [] }));
    g.rows.push(r);
    g.positions.push(i);
  });
  return [...groups.keys()].sort().map((f) => [f, groups.get(f)!]);
}

/** Runs `fit` on each family; a family whose fit refuses its rows (InputError) is listed in `skipped`. */
function eachFamily<T, C extends Map<string, T> & { skipped: SkippedFamily[] }>(owner: string, rows: readonly FitRow[], out: C, fit: (family: string, g: { rows: FitRow[]; positions: number[] }) => T): C {
  for (const [family, g] of groupByFamily(owner, rows)) {
    try {
      out.set(family, fit(family, g));
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      out.skipped.push({ family, rows: g.rows.length, reason: e.message.replace(`${owner}: family ${family}: `, "").replace(`${owner}: `, "") });
    }
  }
  return out;
}

/**
 * fitPowerLaw for each family separately (same options, same bootstrap seed for each). Row indices
 * in each fit's `used` and `dropped` refer to positions in `rows`, not within the family.
 */
export function fitByFamily(rows: readonly FitRow[], options: PowerLawOptions = {}): FamilyFits {
  const owner = "fitByFamily";
  const o = resolvePowerLawOptions(owner, options);
  return eachFamily(owner, rows, new FamilyFits(), (family, g) => {
    const screened = screenRows(g.rows, { response: o.response, degree: o.degree, needsDegree: lawNeedsDegree(o.law), owner, positions: g.positions });
    return powerLawFromScreened(`${owner}: family ${family}`, screened, o, family);
  });
}

/** Exponent bands keyed by family (alphabetical), and the families that could not be fitted. */
export class FamilyBands extends Map<string, SurplusBand> {
  readonly skipped: SkippedFamily[] = [];

  /** Plain JSON-ready record: each family's band record, then the families not fitted. */
  toJSON(): { bands: Record<string, unknown>[]; skipped: SkippedFamily[] } {
    return { bands: [...this.values()].map((b) => b.toJSON()), skipped: this.skipped };
  }
}

/**
 * fitSurplusBand for each family separately: the lower end, the upper end and (where closed) the
 * exact surplus of each family fitted on their own, with the band between their exponents. Row
 * indices in the fits refer to positions within the family's rows.
 */
export function fitBandsByFamily(rows: readonly FitRow[], options: SurplusBandOptions = {}): FamilyBands {
  const owner = "fitBandsByFamily";
  return eachFamily(owner, rows, new FamilyBands(), (_family, g) => fitSurplusBand(g.rows, options));
}
