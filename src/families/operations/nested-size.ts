// Predicted sizes of operations on nested specs (blow-up, disjoint union, ...): the size of the
// nested spec comes from the registry through a `SizeContext`, when the caller passes one.

import type { PredictedSize } from "../types.js";


/**
 * Returned when no context is available: sizes unknown (NaN) until the nested graph is
 * built; each operation then checks its exact output size before allocating it.
 */
export function unknownSize(): PredictedSize {
  return { n: Number.NaN, m: Number.NaN, mExact: false };
}
