// One fit per family: rows grouped by their `family`, each group fitted on its own with the same
// options; families that cannot be fitted are listed with the reason instead of stopping the rest.

import { InputError } from "../errors.js";
import type { SkippedFamily } from "./format.js";
import { powerLawFromScreened, resolvePowerLawOptions, type PowerLawFit, type PowerLawOptions } from "./power-law.js";
import { lawNeedsDegree, screenRows, type FitRow } from "./rows.js";

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

/**
 * fitPowerLaw for each family separately (same options, same bootstrap seed for each). Row indices
 * in each fit's `used` and `dropped` refer to positions in `rows`, not within the family.
 */
export function fitByFamily(rows: readonly FitRow[], options: PowerLawOptions = {}): FamilyFits {
  const owner = "fitByFamily";
  const o = resolvePowerLawOptions(owner, options);
  if (!Array.isArray(rows)) throw new InputError(`${owner}: invalid \`rows\`: should be an array of rows (got ${typeof rows})`);
  const groups = new Map<string, { rows: FitRow[]; positions: number[] }>();
  rows.forEach((r, i) => {
    const f = r !== null && typeof r === "object" && typeof r.family === "string" ? r.family : NO_FAMILY;
    let g = groups.get(f);
    if (g === undefined) groups.set(f, (g = { rows: [], positions: [] }));
    g.rows.push(r);
    g.positions.push(i);
  });
  const out = new FamilyFits();
  for (const family of [...groups.keys()].sort()) {
    const g = groups.get(family)!;
    const screened = screenRows(g.rows, { response: o.response, degree: o.degree, needsDegree: lawNeedsDegree(o.law), owner, positions: g.positions });
    try {
      out.set(family, powerLawFromScreened(`${owner}: family ${family}`, screened, o, family));
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      out.skipped.push({ family, rows: g.rows.length, reason: e.message.replace(`${owner}: family ${family}: `, "") });
    }
  }
  return out;
}
