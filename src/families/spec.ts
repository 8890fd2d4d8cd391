// Family spec strings: `name` or `name:key=value,key=value`. The same string is accepted by
// the CLI, `family()`, sweep plans and stored results, so parsing lives only here.

import { InputError, echo, invalidParameter } from "../errors.js";
import { parseDecimal } from "../decimal.js";
import { MAX_SEED } from "../random/seed.js";
import type { FamilyDefinition, ParamSpec, ParamValue, Params } from "./types.js";

export interface RawSpec {
  name: string;
  values: Map<string, string>;
}

const NAME_RE = /^[a-z][a-z0-9-]*$/;

/** Does this look like a family spec (as opposed to a file path)? */
export function looksLikeSpec(s: string): boolean {
  const colon = s.indexOf(":");
  const name = colon < 0 ? s : s.slice(0, colon);
  return NAME_RE.test(name) && !s.includes("/") && !/\.[a-z0-9]+$/i.test(name);
}

/** Split on `sep` outside square brackets; unbalanced brackets are an error. */
export function splitTopLevel(whole: string, body: string, sep: string): string[] {
  const parts: string[] = [];
  let depth = 0;
  let start = 0;
  for (let i = 0; i < body.length; i++) {
    const c = body[i];
    if (c === "[") depth++;
    else if (c === "]") {
      depth--;
      if (depth < 0) throw new InputError(`family spec ${echo(whole)}: unmatched ]`);
    } else if (c === sep && depth === 0) {
      parts.push(body.slice(start, i));
      start = i + 1;
    }
  }
  if (depth !== 0) throw new InputError(`family spec ${echo(whole)}: unmatched [`);
  parts.push(body.slice(start));
  return parts;
}

/** `[spec]` → `spec`; for parameters of type "spec" and "spec-list". */
function unbracket(owner: string, name: string, item: string): string {
  const t = item.trim();
  if (!t.startsWith("[") || !t.endsWith("]")) throw invalidParameter(owner, name, "should be a family spec in brackets, e.g. [petersen]", item);
  return t.slice(1, -1);
}

/** Deepest nesting of bracketed specs (`complement:of=[blowup:of=[...],t=2]`): each level builds a graph. */
export const MAX_SPEC_DEPTH = 32;

/** Refuse specs nested deeper than MAX_SPEC_DEPTH, in one pass, before any level is parsed. */
function checkDepth(spec: string): void {
  let depth = 0;
  for (let i = 0; i < spec.length; i++) {
    const c = spec.charCodeAt(i);
    if (c === 91 && ++depth > MAX_SPEC_DEPTH) {
      throw new InputError(`family spec ${echo(spec)}: nested more than ${MAX_SPEC_DEPTH} levels deep (at most ${MAX_SPEC_DEPTH} levels of [...] are supported)`);
    } else if (c === 93) depth--;
  }
}

export function parseRawSpec(spec: string): RawSpec {
  if (typeof spec !== "string") throw new InputError(`family spec should be a string (got ${echo(spec)})`);
  checkDepth(spec);
  const colon = spec.indexOf(":");
  const name = (colon < 0 ? spec : spec.slice(0, colon)).trim();
  if (!NAME_RE.test(name)) throw new InputError(`family spec ${echo(spec)}: bad family name ${echo(name)}`);
  const values = new Map<string, string>();
  if (colon >= 0) {
    const body = spec.slice(colon + 1);
    // Lists use `+` inside a value (e.g. `circulant:n=13,s=1+5`); a nested spec is wrapped in
    // brackets (`blow-up:of=[kneser:n=8,k=3],t=2`), so only top-level commas separate parameters.
    let last: string | undefined;
    for (const part of splitTopLevel(spec, body, ",")) {
      if (part.trim() === "") continue;
      const eq = part.indexOf("=");
      // Pattern names such as K2,3 contain a comma: a bare number continues the previous value.
      if (eq < 0 && last !== undefined && /^\s*\d+\s*$/.test(part)) {
        values.set(last, `${values.get(last)},${part.trim()}`);
        continue;
      }
      if (eq <= 0) throw new InputError(`family spec ${echo(spec)}: expected key=value, got ${echo(part)}`);
      const key = part.slice(0, eq).trim();
      if (values.has(key)) throw new InputError(`family spec ${echo(spec)}: parameter \`${key}\` given twice`);
      values.set(key, part.slice(eq + 1).trim());
      last = key;
    }
  }
  return { name, values };
}

function convert(owner: string, p: ParamSpec, raw: string): ParamValue {
  switch (p.type) {
    case "string":
      if (p.choices && !p.choices.includes(raw)) throw invalidParameter(owner, p.name, `should be one of ${p.choices.join(", ")}`, raw);
      return raw;
    case "boolean":
      if (raw === "true" || raw === "1") return true;
      if (raw === "false" || raw === "0") return false;
      throw invalidParameter(owner, p.name, "should be true or false", raw);
    case "spec":
      return unbracket(owner, p.name, raw);
    case "spec-list":
      return splitTopLevel(raw, raw, "+").map((x) => unbracket(owner, p.name, x));
    case "integer-list": {
      const items = raw.split(/[+;]/).filter((x) => x !== "");
      const out = items.map((x) => parseDecimal(x));
      if (out.length === 0 || out.some((x) => !Number.isInteger(x))) {
        throw invalidParameter(owner, p.name, "should be integers separated by +", raw);
      }
      return out;
    }
    default: {
      // Plain decimal notation only (src/decimal.ts): Number() would also take "0x3" or "" without a word.
      const x = parseDecimal(raw);
      if (Number.isNaN(x)) throw invalidParameter(owner, p.name, "should be a number", raw);
      return x;
    }
  }
}

/** Check a value against its spec's type and range; shared by spec strings and typed calls. */
export function checkParam(owner: string, p: ParamSpec, v: ParamValue): void {
  const range =
    p.min !== undefined && p.max !== undefined
      ? `between ${p.min} and ${p.max}`
      : p.min !== undefined
        ? `at least ${p.min}`
        : p.max !== undefined
          ? `at most ${p.max}`
          : "";
  if (p.type === "integer" || p.type === "number") {
    if (typeof v !== "number" || !Number.isFinite(v)) throw invalidParameter(owner, p.name, "should be a number", v);
    if (p.type === "integer" && !Number.isInteger(v)) throw invalidParameter(owner, p.name, `should be an integer${range ? " " + range : ""}`, v);
    if ((p.min !== undefined && v < p.min) || (p.max !== undefined && v > p.max)) {
      throw invalidParameter(owner, p.name, `should be a${p.type === "integer" ? "n integer" : " number"} ${range}`, v);
    }
  } else if (p.type === "integer-list") {
    if (!Array.isArray(v) || v.some((x) => !Number.isInteger(x))) throw invalidParameter(owner, p.name, "should be a list of integers", v);
  } else if (p.type === "spec") {
    if (typeof v !== "string" || v === "") throw invalidParameter(owner, p.name, "should be a family spec", v);
  } else if (p.type === "spec-list") {
    if (!Array.isArray(v) || v.length === 0 || v.some((x) => typeof x !== "string")) throw invalidParameter(owner, p.name, "should be a list of family specs", v);
  } else if (p.type === "string") {
    if (typeof v !== "string" || (p.choices && !p.choices.includes(v))) {
      throw invalidParameter(owner, p.name, p.choices ? `should be one of ${p.choices.join(", ")}` : "should be a string", v);
    }
  } else if (typeof v !== "boolean") throw invalidParameter(owner, p.name, "should be true or false", v);
}

/** The implicit parameter of random families: the graph seed, which random graph is built. */
export const SEED_PARAM: ParamSpec = {
  name: "seed",
  type: "integer",
  description: "graph seed: which random graph is built (the xoshiro128** generator is seeded with it)",
  default: 0,
  min: 0,
  max: MAX_SEED,
};

/** All parameters of a family, including the implicit seed of random families. */
export function allParams(def: FamilyDefinition): readonly ParamSpec[] {
  return def.random ? [...def.params, SEED_PARAM] : def.params;
}

/**
 * Resolve raw values (strings from a spec, or typed values from TypeScript) against a
 * definition: apply defaults, convert, check ranges, run the family's own validation.
 */
export function resolveParams(def: FamilyDefinition, given: Map<string, string> | Params): { params: Params; defaulted: string[] } {
  const owner = def.name;
  const specs = allParams(def);
  const known = new Set(specs.map((p) => p.name));
  const entries = given instanceof Map ? [...given.keys()] : Object.keys(given);
  for (const k of entries) {
    if (!known.has(k)) {
      throw new InputError(`${owner}: unknown parameter \`${k}\` (parameters: ${specs.map((p) => p.name).join(", ") || "none"})`);
    }
  }
  const params: Params = {};
  const defaulted: string[] = [];
  for (const p of specs) {
    const raw = given instanceof Map ? given.get(p.name) : given[p.name];
    let v: ParamValue;
    if (raw === undefined) {
      if (p.default === undefined) throw new InputError(`${owner}: missing parameter \`${p.name}\` (${p.description})`);
      v = p.default;
      defaulted.push(p.name);
    } else if (given instanceof Map) v = convert(owner, p, raw as string);
    else v = raw as ParamValue;
    checkParam(owner, p, v);
    params[p.name] = v;
  }
  def.validate?.(params);
  return { params, defaulted };
}

/** The canonical spec: every parameter in declaration order, lists joined by `+`. */
export function formatSpec(def: FamilyDefinition, params: Params): string {
  const parts = allParams(def).map((p) => {
    const v = params[p.name];
    if (p.type === "spec") return `${p.name}=[${String(v)}]`;
    if (p.type === "spec-list") return `${p.name}=${(v as string[]).map((x) => `[${x}]`).join("+")}`;
    return `${p.name}=${Array.isArray(v) ? v.join("+") : String(v)}`;
  });
  return parts.length === 0 ? def.name : `${def.name}:${parts.join(",")}`;
}
