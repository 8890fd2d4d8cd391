// Expected sizes of operations on nested specs (blow-up, union, ...): the shape of the
// nested spec comes from the registry through a `ShapeContext`, when the caller passes one.

import type { ExpectedShape } from "../types.js";

/**
 * Lets an operation's `expected` ask for the predicted shape of a nested spec. The registry
 * cannot be imported here (registry → catalog → operation is an import cycle), so it has to
 * pass this as a second argument of `expected` (requested from the lead).
 */
export interface ShapeContext {
  expectedOf: (spec: string) => ExpectedShape;
}

/**
 * Returned when no context is available: sizes unknown (NaN) until the nested graph is
 * built; each operation then checks its exact output size before allocating it.
 */
export function unknownShape(): ExpectedShape {
  return { n: Number.NaN, m: Number.NaN, mExact: false };
}
