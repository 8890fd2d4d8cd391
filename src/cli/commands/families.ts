// `halfplus families [name | spec]`: the family catalogue — parameters with types, defaults and ranges,
// what each family is proven free of, and its predicted size evaluated at the defaults (or at a given spec).

import { InputError } from "../../errors.js";
import { getFamily, listFamilies } from "../../families/registry.js";
import { allParams, formatSpec, parseRawSpec, resolveParams } from "../../families/spec.js";
import type { ExpectedShape, FamilyDefinition, ParamSpec, ParamValue, Params } from "../../families/types.js";
import type { CommandSpec } from "../args.js";
import { writeLine } from "../output.js";

/** A family evaluated at some parameter values; `problem` says why it could not be evaluated. */
export interface FamilyReport {
  name: string;
  summary: string;
  random: boolean;
  params: {
    name: string;
    type: string;
    description: string;
    default: ParamValue | null;
    min: number | null;
    max: number | null;
    choices: readonly string[] | null;
  }[];
  /** The canonical spec the size and freeOf lines were evaluated at, or null. */
  evaluatedAt: string | null;
  expected: ExpectedShape | null;
  freeOf: { pattern: string; source: string }[] | null;
  notes: string | null;
  problem: string | null;
}

function paramRecord(p: ParamSpec): FamilyReport["params"][number] {
  return {
    name: p.name,
    type: p.type,
    description: p.description,
    default: p.default ?? null,
    min: p.min ?? null,
    max: p.max ?? null,
    choices: p.choices ?? null,
  };
}

/** Evaluate a family at its defaults, overridden by `given` (e.g. from a spec on the command line). */
export function familyReport(def: FamilyDefinition, given: Map<string, string> | Params = {}): FamilyReport {
  let params: Params | null = null;
  let problem: string | null = null;
  try {
    params = resolveParams(def, given).params;
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    problem = e.message;
  }
  return {
    name: def.name,
    summary: def.summary,
    random: def.random,
    params: allParams(def).map(paramRecord),
    evaluatedAt: params === null ? null : formatSpec(def, params),
    expected: params === null ? null : def.expected(params),
    freeOf: params === null ? null : def.freeOf(params),
    notes: def.notes ?? null,
    problem,
  };
}

/** A value written the way a spec takes it: lists joined by +, nested specs in brackets. */
function valueText(type: string, v: ParamValue): string {
  if (type === "spec") return `[${String(v)}]`;
  if (type === "spec-list") return (v as string[]).map((x) => `[${x}]`).join("+");
  return Array.isArray(v) ? v.join("+") : String(v);
}

function rangeText(p: FamilyReport["params"][number]): string {
  if (p.choices !== null) return `one of ${p.choices.join(" | ")}`;
  if (p.min !== null && p.max !== null) return `${p.min} ≤ ${p.name} ≤ ${p.max}`;
  if (p.min !== null) return `${p.name} ≥ ${p.min}`;
  if (p.max !== null) return `${p.name} ≤ ${p.max}`;
  return "";
}

function sizeText(e: ExpectedShape): string {
  const edges = e.mExact ? `${e.m} edges` : `about ${Math.round(e.m)} edges (expected value)`;
  let degrees = "";
  if (e.minDegree !== undefined && e.maxDegree !== undefined) {
    degrees = e.minDegree === e.maxDegree ? `, ${e.minDegree}-regular` : `, degrees ${e.minDegree} to ${e.maxDegree}`;
  }
  return `${e.n} vertices, ${edges}${degrees}`;
}

/** Plain-text block for one family; `detailed` adds sources, notes and an example call. */
export function formatFamilyReport(r: FamilyReport, detailed: boolean): string {
  const lines = [`${r.name}${r.random ? " (random)" : ""} — ${r.summary}`];
  if (r.params.length === 0) lines.push("    takes no parameters");
  const w = Math.max(0, ...r.params.map((p) => p.name.length));
  for (const p of r.params) {
    const parts = [p.type, rangeText(p), p.default === null ? "required" : `default ${valueText(p.type, p.default)}`].filter((x) => x !== "");
    lines.push(`    ${p.name.padEnd(w)}  ${parts.join(", ")}: ${p.description}`);
  }
  if (r.expected !== null && r.evaluatedAt !== null) {
    lines.push(`  size at ${r.evaluatedAt}: ${sizeText(r.expected)}`);
    const free = r.freeOf ?? [];
    if (free.length === 0) lines.push("  proven free of: nothing listed");
    else if (detailed) {
      lines.push("  proven free of:");
      for (const f of free) lines.push(`    ${f.pattern}  (${f.source})`);
    } else lines.push(`  proven free of: ${free.map((f) => f.pattern).join(", ")}`);
  } else if (r.problem !== null) {
    const required = r.params.filter((p) => p.default === null).map((p) => p.name);
    lines.push(
      required.length > 0
        ? `  size: set ${required.join(", ")} to see it, e.g. halfplus families ${r.name}:${required.map((k) => `${k}=…`).join(",")}`
        : `  size: ${r.problem}`,
    );
  }
  if (detailed && r.notes !== null) lines.push(`  notes: ${r.notes}`);
  if (detailed && r.evaluatedAt !== null) lines.push(`  try: halfplus graph ${r.evaluatedAt}`);
  return lines.join("\n");
}

export const familiesCommand: CommandSpec = {
  name: "families",
  summary: "list graph families: parameters, proven forbidden subgraphs, predicted size",
  positionals: "[name | spec]",
  minPositionals: 0,
  maxPositionals: 1,
  options: [{ name: "json", type: "boolean", description: "one JSON object per family, one per line" }],
  examples: ["halfplus families", "halfplus families polarity", "halfplus families kneser:n=9,k=4 --json"],
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
        throw new InputError(`no family called ${JSON.stringify(raw.name)} (run halfplus families for the list)`);
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
