// Seeds: the one range every seed lives in (graph seeds and solver seeds alike) and the one
// check of it, so a bad seed is the same one-line InputError wherever it is given.

import { invalidParameter } from "../errors.js";

/** Largest seed accepted anywhere a seed is a parameter: seeds are 32-bit words. */
export const MAX_SEED = 0xffffffff;

/** True for an integer in [0, MAX_SEED]. */
export function isSeed(value: unknown): value is number {
  return typeof value === "number" && Number.isInteger(value) && value >= 0 && value <= MAX_SEED;
}

/** `value`, or `fallback` when it is undefined; anything but an integer in [0, MAX_SEED] is bad input named `owner: name`. */
export function checkSeed(owner: string, name: string, value: unknown, fallback = 0): number {
  const s = value === undefined ? fallback : value;
  if (!isSeed(s)) throw invalidParameter(owner, name, `should be an integer between 0 and ${MAX_SEED}`, value);
  return s;
}
