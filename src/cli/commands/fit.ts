// `halfplus fit <store>`: growth-law fits of the stored surplus brackets, one per family: by
// default the exponent band (lower end, upper end and closed brackets fitted separately), or a
// single bracket end; as text tables, one JSON object, or a booktabs table for a paper.
import { existsSync } from "node:fs";
import { InputError } from "../../errors.js";
import { parseDecimal } from "../../decimal.js";
import type { CommandSpec } from "../args.js";
import { COMMAND_SUMMARIES } from "./summaries.js";
import { fitRowsFromStore, openStore } from "../../experiment/index.js";
import {
  DEFAULT_LEVEL,
  DEGREE_MEASURES,
  DEFAULT_RESAMPLES,
  fitBandsByFamily,
  fitByFamily,
  fitsToLatex,
  formatFitTable,
  MAX_RESAMPLES,
  MIN_RESAMPLES,
  POWER_LAWS,
  powerLawTerms,
  SURPLUS_RESPONSES,
  type BootstrapOptions,
  type DegreeMeasure,
  type FitRow,
  type PowerLaw,
  type SurplusResponse,
} from "../../fit/index.js";
import { writeLine } from "../output.js";

const ENDS = ["band", ...SURPLUS_RESPONSES] as const;
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
  name: "fit",
  summary: COMMAND_SUMMARIES["fit"],
  positionals: "<store.db>",
  minPositionals: 1,
  maxPositionals: 1,
  description: [
    "Fits are least squares on the log scale with t-intervals and a seeded bootstrap. By default each family gets three fits, " +
      "of the bracket's lower ends, its upper ends and the closed brackets, and the band between their exponents: an exponent " +
      "claim is only as good as the bracket under it. Rows with a surplus bound ≤ 0 or missing are left out and counted.",
  ],
  options: [
    { name: "family", type: "string", description: "only these families (comma-separated labels)", placeholder: "NAMES" },
    { name: "law", type: "string", description: "m-and-d: C·m^a·d^b; m: C·m^a; m-over-sqrt-d: C·(m/√d)^a", default: "m-and-d", choices: POWER_LAWS, placeholder: "LAW" },
    { name: "end", type: "string", description: "band: lower, upper and exact fits with the band between them; or one bracket end", default: "band", choices: ENDS, placeholder: "END" },
    { name: "degree", type: "string", description: "what d is", default: "degeneracy", choices: DEGREE_MEASURES, placeholder: "MEASURE" },
    { name: "level", type: "number", description: "level of the intervals", default: DEFAULT_LEVEL, min: 0.5, max: 0.9999, placeholder: "P" },
    { name: "resamples", type: "integer", description: "bootstrap resamples", default: DEFAULT_RESAMPLES, min: MIN_RESAMPLES, max: MAX_RESAMPLES, placeholder: "N" },
    { name: "solver-seed", type: "integer", description: "seed of the bootstrap's resampling (default 0)", min: 0, max: 4294967295, placeholder: "N" },
    { name: "bootstrap", type: "boolean", description: "bootstrap intervals beside the t-intervals (--no-bootstrap skips them)", default: true },
    { name: "conjecture", type: "string", description: "conjectured values to test, e.g. mExponent=1,dExponent=-0.5 (defaults: those two; slope=1 for m-over-sqrt-d)", placeholder: "TERM=X,..." },
    { name: "json", type: "boolean", description: "print one JSON object (every fit's record)" },
    { name: "latex", type: "boolean", description: "print a booktabs tabular for a paper (needs \\usepackage{booktabs})" },
  ],
  examples: [
    "halfplus fit results/halfplus.db",
    "halfplus fit results/halfplus.db --family polarity --json",
    "halfplus fit results/halfplus.db --latex > table.tex",
    "halfplus fit results/halfplus.db --law m --end exact --conjecture slope=0.8333",
  ],
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
