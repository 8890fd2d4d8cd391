// Expected sizes of operations on nested specs (blow-up, union, ...): the shape of the
// nested spec comes from the registry through a `ShapeContext`, when the caller passes one.

import type { ExpectedShape } from "../types.js";
export type { ShapeContext } from "../types.js";

/**
 * Returned when no context is available: sizes unknown (NaN) until the nested graph is
 * built; each operation then checks its exact output size before allocating it.
 */
export function unknownShape(): ExpectedShape {
  return { n: Number.NaN, m: Number.NaN, mExact: false };
}
