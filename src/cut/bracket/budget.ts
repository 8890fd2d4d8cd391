// The bracket's budget: a wall-clock time limit or a deterministic work limit (units of
// work-units.ts), and the account of where it went, per stage. Every decision the bracket takes
// about its budget goes through `position`, `left` and `cost`, so under a work budget none of them
// reads the clock: the same graph, seed and settings give the same record on any machine or load.

import { nowSeconds } from "../exact/common.js";

/** Which limit governs a bracket: `time` (seconds, wall clock) or `work` (deterministic units). */
export type BudgetKind = "time" | "work";
export const BUDGET_KINDS: readonly BudgetKind[] = ["time", "work"];

/** What one stage of the bracket spent. */
export interface BudgetStage {
  /** The stage: a method id (`local-search`, `breakout`, `sdp-mixing`, `exact-search`, …). */
  stage: string;
  /** Work units, counted the same way under either budget (src/cut/bracket/work-units.ts). */
  workUsed: number;
  /** Wall-clock seconds: timing only, differs from run to run. */
  secondsUsed: number;
}

/**
 * The record's `budget` section. Timing-only fields are named `seconds…`/`…Seconds` (see
 * `withoutTiming` in record.ts); everything else is identical run to run under a work budget.
 */
export interface BracketBudget {
  governing: BudgetKind;
  /** The time limit (time budget), else null. */
  secondsLimit: number | null;
  /** The work limit in units (work budget), else null. */
  workLimit: number | null;
  /** Units spent by all stages (may pass the limit by the last indivisible step, e.g. a started proof). */
  workUsed: number;
  /** Wall-clock seconds of the whole bracket: timing only. */
  secondsUsed: number;
  /** Per stage, in the order the stages first ran. */
  stages: BudgetStage[];
}

export class BudgetMeter {
  private readonly t0 = nowSeconds();
  private used = 0;
  private readonly stages = new Map<string, { work: number; seconds: number }>();

  constructor(
    readonly governing: BudgetKind,
    /** Seconds (time) or units (work). */
    readonly limit: number,
  ) {}

  get isWork(): boolean {
    return this.governing === "work";
  }

  /** Where the run stands in the governing currency: seconds since the start, or units spent. */
  position(): number {
    return this.isWork ? this.used : nowSeconds() - this.t0;
  }

  /** What is left in the governing currency (may be negative). */
  left(): number {
    return this.limit - this.position();
  }

  /** A cost in the governing currency: `units` under a work budget, the seconds estimate under a time budget. */
  cost(units: number, seconds: number): number {
    return this.isWork ? units : seconds;
  }

  /** Units spent so far. */
  workUsed(): number {
    return this.used;
  }

  /** Units a stage spent so far. */
  stageWork(stage: string): number {
    return this.stages.get(stage)?.work ?? 0;
  }

  elapsed(): number {
    return nowSeconds() - this.t0;
  }

  /** Book a stage's work (whole units) and its wall-clock seconds. */
  charge(stage: string, units: number, seconds: number): void {
    const u = Math.max(0, Math.ceil(units));
    this.used += u;
    const s = this.stages.get(stage);
    if (s === undefined) this.stages.set(stage, { work: u, seconds });
    else {
      s.work += u;
      s.seconds += seconds;
    }
  }

  record(): BracketBudget {
    return {
      governing: this.governing,
      secondsLimit: this.isWork ? null : this.limit,
      workLimit: this.isWork ? this.limit : null,
      workUsed: this.used,
      secondsUsed: this.elapsed(),
      stages: [...this.stages].map(([stage, s]) => ({ stage, workUsed: s.work, secondsUsed: s.seconds })),
    };
  }
}
