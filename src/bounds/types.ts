// The record every closed-form max-cut lower bound returns: the bound as a cut value and as a
// surplus over W/2, whether it applies to the graph at hand, and why (or why not).

export interface LowerBoundRecord {
  /** Short identifier, e.g. "edwards-edges". */
  name: string;
  /** The bound on max cut (W/2 + surplus), or null when it does not apply. */
  value: number | null;
  /** The bound on the surplus maxcut − W/2, or null when it does not apply. */
  surplus: number | null;
  applies: boolean;
  /** The statement used, or why it does not apply. */
  reason: string;
}

export function boundApplies(name: string, totalWeight: number, surplus: number, reason: string): LowerBoundRecord {
  return { name, value: totalWeight / 2 + surplus, surplus, applies: true, reason };
}

export function boundDoesNotApply(name: string, reason: string): LowerBoundRecord {
  return { name, value: null, surplus: null, applies: false, reason };
}
