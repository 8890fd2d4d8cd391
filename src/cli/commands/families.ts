// `halfplus families [name | spec]`: the family catalogue — parameters with types, defaults and
// ranges, what each family is proven free of, and its predicted size at the defaults (or a spec).

import { InputError } from "../../errors.js";
import { familyReport, type FamilyParamReport, type FamilyReport } from "../../families/report.js";
import { getFamily, listFamilies, renamedFamily } from "../../families/registry.js";
import { parseRawSpec } from "../../families/spec.js";
import type { ParamValue, PredictedSize } from "../../families/types.js";
import type { CommandSpec } from "../args.js";
import { familiesHelp } from "./help/families.js";
import { formatNumber as num } from "../format.js";
import { writeLine } from "../output.js";

/** A value written the way a spec takes it: lists joined by +, nested specs in brackets. */
function valueText(type: string, v: ParamValue): string {
  if (type === "spec") return `[${String(v)}]`;
  if (type === "spec-list") return (v as string[]).map((x) => `[${x}]`).join("+");
  return Array.isArray(v) ? v.join("+") : typeof v === "number" ? num(v) : String(v);
}

function rangeText(p: FamilyParamReport): string {
  if (p.choices !== null) return `one of ${p.choices.join(" | ")}`;
  if (p.min !== null && p.max !== null) return `${num(p.min)} ≤ ${p.name} ≤ ${num(p.max)}`;
  if (p.min !== null) return `${p.name} ≥ ${num(p.min)}`;
  if (p.max !== null) return `${p.name} ≤ ${num(p.max)}`;
  return "";
}

function sizeText(e: PredictedSize): string {
  const edges = e.mExact ? `${num(e.m)} edges` : `about ${num(e.m)} edges (expected value)`;
  let degrees = "";
  if (e.minDegree !== undefined && e.maxDegree !== undefined) {
    degrees = e.minDegree === e.maxDegree ? `, ${num(e.minDegree)}-regular` : `, degrees ${num(e.minDegree)} to ${num(e.maxDegree)}`;
  }
  return `${num(e.n)} vertices, ${edges}${degrees}`;
}

/** Plain-text block for one family; `detailed` adds citations, notes and an example call. */
export function formatFamilyReport(r: FamilyReport, detailed: boolean): string {
  const lines = [`${r.name}${r.random ? " (random)" : ""} — ${r.summary}`];
  if (r.aliases.length > 0) lines.push(`  also called: ${r.aliases.join(", ")}`);
  if (r.params.length === 0) lines.push("    takes no parameters");
  const w = Math.max(0, ...r.params.map((p) => p.name.length));
  for (const p of r.params) {
    const parts = [p.type, rangeText(p), p.default === null ? "required" : `default ${valueText(p.type, p.default)}`].filter((x) => x !== "");
    lines.push(`    ${p.name.padEnd(w)}  ${parts.join(", ")}: ${p.description}`);
  }
  if (r.predictedSize !== null && r.spec !== null) {
    lines.push(`  predicted size at ${r.spec}: ${sizeText(r.predictedSize)}`);
    const free = r.freeOf ?? [];
    if (free.length === 0) lines.push("  proven free of: nothing listed");
    else if (detailed) {
      lines.push("  proven free of:");
      for (const f of free) lines.push(`    ${f.pattern}  (${f.citation})`);
    } else lines.push(`  proven free of: ${free.map((f) => f.pattern).join(", ")}`);
  } else if (r.problem !== null) {
    const required = r.params.filter((p) => p.default === null).map((p) => p.name);
    lines.push(
      required.length > 0
        ? `  predicted size: set ${required.join(", ")} to see it, e.g. halfplus families ${r.name}:${required.map((k) => `${k}=…`).join(",")}`
        : `  predicted size: ${r.problem}`,
    );
  }
  if (detailed) for (const n of r.notes) lines.push(`  note: ${n}`);
  if (detailed && r.spec !== null) lines.push(`  try: halfplus graph ${r.spec}`);
  return lines.join("\n");
}

export const familiesCommand: CommandSpec = {
  ...familiesHelp,
  async run(args, io) {
    const json = args.options["json"] === true;
    const target = args.positionals[0];
    let reports: FamilyReport[];
    if (target === undefined) {
      reports = listFamilies().map((d) => familyReport(d));
    } else {
      const raw = parseRawSpec(target);
      const def = getFamily(raw.name);
      if (def === undefined) {
        const now = renamedFamily(raw.name);
        throw new InputError(`no family called ${JSON.stringify(raw.name)} (${now === undefined ? "run halfplus families for the list" : `it is now called ${now}`})`);
      }
      const r = familyReport(def, raw.values);
      // A spec the user typed must be valid: report its error instead of a partial entry.
      if (raw.values.size > 0 && r.problem !== null) throw new InputError(r.problem);
      reports = [r];
    }
    const detailed = target !== undefined;
    for (let i = 0; i < reports.length; i++) {
      const r = reports[i];
      await writeLine(io.stdout, json ? JSON.stringify(r) : (i > 0 ? "\n" : "") + formatFamilyReport(r, detailed));
    }
    return 0;
  },
};
