// A family described for a reader (`halfplus families`, a notebook's table of families): its
// parameters with types, defaults and ranges, and — at given parameter values or the defaults —
// the canonical spec, the predicted size and what the graphs are proven free of, with citations.

import { InputError } from "../errors.js";
import { allParams, formatSpec, resolveParams } from "./spec.js";
import type { FamilyDefinition, FreeOfClaim, ParamSpec, ParamValue, Params, PredictedSize } from "./types.js";

export interface FamilyParamReport {
  name: string;
  type: string;
  description: string;
  default: ParamValue | null;
  min: number | null;
  max: number | null;
  choices: readonly string[] | null;
}

/** A family evaluated at some parameter values; `problem` says why it could not be evaluated. */
export interface FamilyReport {
  name: string;
  aliases: readonly string[];
  summary: string;
  random: boolean;
  params: FamilyParamReport[];
  /** The canonical spec the size and freeOf were evaluated at, or null. */
  spec: string | null;
  predictedSize: PredictedSize | null;
  freeOf: FreeOfClaim[] | null;
  notes: readonly string[];
  problem: string | null;
}

function paramReport(p: ParamSpec): FamilyParamReport {
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

/** Evaluate a family at its defaults, overridden by `given` (e.g. the values of a spec). Bad values become `problem`. */
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
    aliases: def.aliases ?? [],
    summary: def.summary,
    random: def.random,
    params: allParams(def).map(paramReport),
    spec: params === null ? null : formatSpec(def, params),
    predictedSize: params === null ? null : def.predictedSize(params),
    freeOf: params === null ? null : def.freeOf(params),
    notes: def.notes,
    problem,
  };
}
