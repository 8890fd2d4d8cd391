// `halfplus fit <store>`: growth-law fits of the stored surplus brackets, one per family: by
// default the exponent band (lower end, upper end and closed brackets fitted separately), or a
// single bracket end; as text tables, one JSON object, or a booktabs table for a paper.
import { existsSync } from "node:fs";
import { InputError } from "../../errors.js";
import { parseDecimal } from "../../decimal.js";
import type { CommandSpec } from "../args.js";
import { ENDS, fitHelp } from "./help/fit.js";
import { fitRowsFromStore, openStore } from "../../experiment/index.js";
import {
  fitBandsByFamily,
  fitByFamily,
  fitsToLatex,
  formatFitTable,
  powerLawTerms,
  type BootstrapOptions,
  type DegreeMeasure,
  type FitRow,
  type PowerLaw,
  type SurplusResponse,
} from "../../fit/index.js";
import { writeLine } from "../output.js";

type End = (typeof ENDS)[number];

/** `mExponent=1,dExponent=-0.5` → conjectured values; a term the law does not have is refused. */
export function parseConjecture(text: string, law: PowerLaw): Record<string, number> {
  const terms = powerLawTerms(law);
  const out: Record<string, number> = {};
  for (const part of text.split(",")) {
    const item = part.trim();
    if (item === "") continue;
    const eq = item.indexOf("=");
    const name = eq < 0 ? item : item.slice(0, eq).trim();
    const raw = eq < 0 ? "" : item.slice(eq + 1).trim();
    if (!terms.includes(name)) {
      throw new InputError(`--conjecture: the law "${law}" has no term ${JSON.stringify(name)}; its terms are ${terms.join(", ")}`);
    }
    const value = parseDecimal(raw); // the project's number rule: "-0.5", "1", "0.8333"
    if (!Number.isFinite(value)) throw new InputError(`--conjecture: ${name} needs a number, e.g. ${name}=1 (got ${JSON.stringify(raw)})`);
    out[name] = value;
  }
  return out;
}

export const fitCommand: CommandSpec = {
  ...fitHelp,
  async run(args, io) {
    const o = args.options;
    const path = args.positionals[0];
    if (o["json"] === true && o["latex"] === true) throw new InputError("--json and --latex cannot both be given: pick one output");
    if (!existsSync(path)) throw new InputError(`${path}: no such results store`);
    const law = o["law"] as PowerLaw;
    const end = o["end"] as End;
    const degree = o["degree"] as DegreeMeasure;
    const level = o["level"] as number;
    const bootstrap: BootstrapOptions | false =
      o["bootstrap"] === false ? false : { resamples: o["resamples"] as number, ...(o["solver-seed"] === undefined ? {} : { solverSeed: o["solver-seed"] as number }) };
    const conjecture = o["conjecture"] === undefined ? undefined : parseConjecture(o["conjecture"] as string, law);
    const families = o["family"] === undefined ? null : (o["family"] as string).split(",").map((f) => f.trim()).filter((f) => f !== "");
    if (families !== null && families.length === 0) throw new InputError("--family needs at least one family label");

    const store = openStore(path, { readonly: true });
    let rows: FitRow[];
    try {
      rows = fitRowsFromStore(store);
    } finally {
      store.close();
    }
    if (families !== null) {
      const present = new Set(rows.map((r) => r.family));
      const absent = families.filter((f) => !present.has(f));
      if (absent.length > 0) {
        const have = [...present].sort();
        throw new InputError(`--family: ${path} has no rows of ${absent.join(", ")} (families there: ${have.length === 0 ? "none" : have.join(", ")})`);
      }
      const keep = new Set(families);
      rows = rows.filter((r) => keep.has(r.family as string));
    }
    if (rows.length === 0) throw new InputError(`${path}: the store holds no rows to fit`);

    const common = { law, degree, level, bootstrap, ...(conjecture === undefined ? {} : { conjecture }) };
    const bands = end === "band" ? fitBandsByFamily(rows, common) : null;
    const fits = bands ?? fitByFamily(rows, { ...common, response: end as SurplusResponse });
    if (fits.size === 0) {
      throw new InputError(`${path}: no family could be fitted (${fits.skipped.map((s) => `${s.family}: ${s.reason}`).join("; ")})`);
    }

    if (o["json"] === true) {
      await writeLine(io.stdout, JSON.stringify({ kind: "halfplus/fit-report", version: 1, store: path, rows: rows.length, law, end, degree, level, ...fits.toJSON() }));
    } else if (o["latex"] === true) {
      await writeLine(io.stdout, fitsToLatex(fits, { level }).trimEnd());
    } else {
      const head = `${rows.length} row${rows.length === 1 ? "" : "s"} from ${path}; law ${law}${law === "m" ? "" : `, d = ${degree}`}`;
      const body =
        bands !== null ? [...bands.values()].map((b) => b.summary(level)).join("\n") : formatFitTable(fits, { level, skipped: [] });
      const skipped = fits.skipped.map((s) => `not fitted: family ${s.family} (${s.rows} rows): ${s.reason}`);
      await writeLine(io.stdout, [head, "", body.trimEnd(), ...(skipped.length > 0 ? ["", ...skipped] : [])].join("\n"));
    }
    return 0;
  },
};
