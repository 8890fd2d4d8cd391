// Checks of option values shared by every layer (time budgets, counts), each failing with a
// one-line InputError that names the option, so no solver writes its own.

import { invalidParameter } from "./errors.js";

/** A wall-clock budget in seconds: `value`, or `fallback` when undefined; must be positive and finite. */
export function checkSeconds(owner: string, value: unknown, fallback: number): number {
  const s = value === undefined ? fallback : value;
  if (typeof s !== "number" || !(s > 0) || !Number.isFinite(s)) throw invalidParameter(owner, "seconds", "should be a positive finite number of seconds", value);
  return s;
}

/** An integer option in [min, max]: `value`, or `fallback` when undefined. */
export function checkInteger(owner: string, name: string, value: unknown, fallback: number, min: number, max: number): number {
  const v = value === undefined ? fallback : value;
  if (typeof v !== "number" || !Number.isInteger(v) || v < min || v > max) throw invalidParameter(owner, name, `should be an integer between ${min} and ${max}`, value);
  return v;
}
