// How `halfplus verify` shows verdicts, for record files and results stores alike: the verdict
// line with its checks, the JSON verdict, the closing tally and the exit status. The verdict itself
// (verified / estimate / rejected) and the exit status rule come from src/cut/bracket/verify.ts.

import type { BracketRecord, BracketVerdict, VerdictWord } from "../cut/bracket/index.js";
import { verifyExitStatus } from "../cut/bracket/index.js";
import { formatRows } from "./format.js";

/** Longest source label shown in a verdict line (a nested spec can be kilobytes long). */
const MAX_LABEL = 80;

/** A label cut to MAX_LABEL characters. */
export function shortLabel(label: string): string {
  return label.length > MAX_LABEL ? `${label.slice(0, MAX_LABEL)}...` : label;
}

/** The verdict line of one record (`what` e.g. "record 2 (petersen)") followed by one line per check. */
export function verdictText(what: string, record: Pick<BracketRecord, "exact" | "lower" | "upper">, v: BracketVerdict): string {
  const range = !record.exact ? `in [${record.lower}, ${record.upper}]` : record.upper > record.lower ? `= ${record.lower} (within ${record.upper - record.lower})` : `= ${record.lower}`;
  const head =
    v.verdict === "verified"
      ? `verified: max cut ${range}`
      : v.verdict === "estimate"
        ? `estimate: max cut in [${record.lower}, ${record.upper}]; the upper end is an estimate, not a proof`
        : v.verdict === "probable"
          ? `probable: max cut in [${record.lower}, ${record.upper}]; the upper end fails with probability at most ${v.failureProbability}`
        : `REJECTED (${v.checks.filter((c) => !c.ok).map((c) => c.name).join(", ")})`;
  const rows = formatRows(v.checks.map((c) => [`${c.ok ? "pass" : "FAIL"}  ${c.name}`, c.message] as const));
  return [`${what}: ${head}`, ...rows].join("\n");
}

/** The verdict line of a census row (no bracket: verified or REJECTED) followed by one line per check. */
export function checkedText(what: string, verifiedHead: string, v: { verdict: VerdictWord; checks: BracketVerdict["checks"] }): string {
  const head = v.verdict === "rejected" ? `REJECTED (${v.checks.filter((c) => !c.ok).map((c) => c.name).join(", ")})` : `${v.verdict}: ${verifiedHead}`;
  const rows = formatRows(v.checks.map((c) => [`${c.ok ? "pass" : "FAIL"}  ${c.name}`, c.message] as const));
  return [`${what}: ${head}`, ...rows].join("\n");
}

/** The JSON fields of a verdict, after the fields that say which record it is. */
export function verdictJson(v: BracketVerdict): { ok: boolean; verdict: VerdictWord; upperKind: BracketVerdict["upperKind"]; failureProbability?: number; checks: BracketVerdict["checks"] } {
  return { ok: v.ok, verdict: v.verdict, upperKind: v.upperKind, ...(v.failureProbability === undefined ? {} : { failureProbability: v.failureProbability }), checks: v.checks };
}

/** Counts of verdicts over a run: the closing line and the exit status. */
export class VerdictTally {
  verified = 0;
  estimate = 0;
  probable = 0;
  rejected = 0;

  add(v: Pick<BracketVerdict, "verdict">): void {
    this[v.verdict]++;
  }

  get total(): number {
    return this.verified + this.probable + this.estimate + this.rejected;
  }

  /** "3 of 4 records verified (1 with an estimated upper end)"; `noun` is plural ("records", "stored rows"). */
  summary(noun: string, tail = ""): string {
    const extra = [this.probable > 0 ? `${this.probable} with a probable upper end` : "", this.estimate > 0 ? `${this.estimate} with an estimated upper end` : "", this.rejected > 0 ? `${this.rejected} rejected` : ""].filter(Boolean);
    return `${this.verified} of ${this.total} ${noun} verified${extra.length > 0 ? ` (${extra.join(", ")})` : ""}${tail}`;
  }

  exitStatus(acceptEstimates: boolean): number {
    return verifyExitStatus(this, acceptEstimates);
  }
}
