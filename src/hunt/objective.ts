// What the hunt minimises, evaluated on a surplus (an upper bound, so a small value is a proven
// small surplus): surplus/(m/√d) with d the degeneracy, surplus/m^α, or the surplus itself at a
// fixed number of edges m.

import { invalidParameter } from "../errors.js";

export type HuntObjective =
  | { kind: "ratio" }
  | { kind: "power"; alpha: number }
  | { kind: "surplus"; m: number };

export const OBJECTIVE_KINDS = ["ratio", "power", "surplus"] as const;

/** Check an objective's parameters (α in (0, 2], m ≥ 1 and at most n(n−1)/2). */
export function checkObjective(owner: string, o: HuntObjective, n: number): HuntObjective {
  if (o.kind === "power" && !(Number.isFinite(o.alpha) && o.alpha > 0 && o.alpha <= 2)) throw invalidParameter(owner, "alpha", "should be a number in (0, 2]", o.alpha);
  if (o.kind === "surplus" && !(Number.isInteger(o.m) && o.m >= 1 && o.m <= (n * (n - 1)) / 2)) throw invalidParameter(owner, "m", `should be an integer between 1 and n(n−1)/2 = ${(n * (n - 1)) / 2}`, o.m);
  if (!(OBJECTIVE_KINDS as readonly string[]).includes(o.kind)) throw invalidParameter(owner, "objective", `should be one of ${OBJECTIVE_KINDS.join(", ")}`, o.kind);
  return o;
}

/**
 * The objective at surplus s of a graph with m edges and degeneracy d: s/(m/√d) (the normalisation
 * of the conjectured law surplus ≥ c·m/√d), s/m^α, or s. +∞ where it is undefined (no edges, or
 * the wrong m for a fixed-m hunt), so such graphs never enter the frontier.
 */
export function objectiveValue(o: HuntObjective, surplus: number, m: number, degeneracy: number): number {
  if (m <= 0) return Infinity;
  switch (o.kind) {
    case "ratio":
      return degeneracy > 0 ? surplus / (m / Math.sqrt(degeneracy)) : Infinity;
    case "power":
      return surplus / m ** o.alpha;
    case "surplus":
      return m === o.m ? surplus : Infinity;
  }
}

/** A short name for records and figures: "surplus/(m/√d)", "surplus/m^0.75", "surplus at m = 60". */
export function objectiveLabel(o: HuntObjective): string {
  switch (o.kind) {
    case "ratio":
      return "surplus/(m/√d)";
    case "power":
      return `surplus/m^${o.alpha}`;
    case "surplus":
      return `surplus at m = ${o.m}`;
  }
}

/** The objective as the store keeps it (hunt_frontier's `objective`): "ratio", "power:<α>", "surplus:<m>". */
export function objectiveKey(o: HuntObjective): string {
  return o.kind === "ratio" ? "ratio" : o.kind === "power" ? `power:${o.alpha}` : `surplus:${o.m}`;
}

/** The objective back from its stored key (the inverse of objectiveKey); null when the text is not one. */
export function parseObjectiveKey(key: string): HuntObjective | null {
  if (key === "ratio") return { kind: "ratio" };
  const m = /^(power|surplus):(.+)$/.exec(key);
  if (m === null) return null;
  const x = Number(m[2]);
  if (!Number.isFinite(x) || String(x) !== m[2]) return null;
  if (m[1] === "power") return x > 0 && x <= 2 ? { kind: "power", alpha: x } : null;
  return Number.isInteger(x) && x >= 1 ? { kind: "surplus", m: x } : null;
}
