// A bracket record as a compact card: lower ≤ maxcut ≤ upper, the surplus bracket, the method
// behind each end and how far the upper end can be trusted (`upperKind`). Reads the record
// structurally (a `halfplus cut --json` line, a `bracket()` result or a store row turned record).

import { INK, sourceLabel, type GraphSource, type UpperKind } from "halfplus";
import { displayOutput, type MimeBundle } from "./channel.js";
import { ACCENT, MONO, badge, frame, htmlEscape, style } from "./style.js";

/** What the card reads from a bracket record; every field but the four numbers is optional. */
export interface BracketLike {
  lower: number;
  upper: number;
  surplusLower: number;
  surplusUpper: number;
  n?: number;
  m?: number;
  totalWeight?: number;
  exact?: boolean;
  /** How far `upper` can be trusted; a record without it is treated as an estimate. */
  upperKind?: UpperKind;
  lowerMethod?: string;
  upperMethod?: string;
  seconds?: number;
  effort?: string;
  solverSeed?: number | null;
  graphHash?: string;
  source?: GraphSource;
  /** Set when SIGINT/SIGTERM stopped the run: the best bracket found before that. */
  interrupted?: boolean;
}

export interface BracketCardOptions {
  /** Heading (default: the record's source spec, or its file and position). */
  label?: string;
}

/** How sure the upper end is: closed by proof, else the record's upperKind (an estimate when it says nothing). */
export function bracketStatus(r: BracketLike): "exact" | UpperKind {
  if (r.exact === true) return "exact";
  return r.upperKind === "proven" || r.upperKind === "probable" ? r.upperKind : "estimate";
}

function label(r: BracketLike, options: BracketCardOptions): string {
  return options.label ?? sourceLabel(r.source);
}

function num(v: number): string {
  return Number.isInteger(v) ? String(v) : String(Number(v.toPrecision(8)));
}

const WORDS = {
  exact: "exact: both ends meet",
  proven: "upper end proven",
  probable: "upper end probable",
  estimate: "upper end estimated",
} as const;

/** The bundle `bracketCard` shows. */
export function bracketCardBundle(r: BracketLike, options: BracketCardOptions = {}): MimeBundle {
  const status = bracketStatus(r);
  const head = label(r, options);
  const size = r.n !== undefined && r.m !== undefined ? `n = ${r.n}, m = ${r.m}` : "";
  const seed = r.solverSeed;
  const facts = [
    r.interrupted === true ? "interrupted" : "",
    r.effort !== undefined ? `effort ${r.effort}` : "",
    seed !== undefined && seed !== null ? `solver seed ${seed}` : "",
    r.seconds !== undefined ? `${r.seconds.toFixed(1)} s` : "",
  ].filter((s) => s !== "");
  const colour = status === "exact" || status === "proven" ? ACCENT.proven : status === "probable" ? ACCENT.probable : ACCENT.open;

  const muted = style({ color: INK.muted, "font-size": "12px" });
  const big = style({ "font-size": "17px", "font-variant-numeric": "tabular-nums", margin: "4px 0 2px" });
  const end = (value: number, method: string | undefined, side: string) =>
    `<span style="display:inline-block;text-align:center;min-width:64px"><b>${htmlEscape(num(value))}</b><br><span style="${muted}">${htmlEscape(method ?? side)}</span></span>`;
  const html = frame(
    [
      `<div><b>${htmlEscape(head)}</b>${size ? ` <span style="${muted}">${htmlEscape(size)}</span>` : ""}${badge(WORDS[status], colour)}</div>`,
      `<div style="${big}">${end(r.lower, r.lowerMethod, "lower")} <span style="vertical-align:top">≤ max cut ≤</span> ${end(r.upper, r.upperMethod, "upper")}</div>`,
      `<div>surplus (max cut − ${r.totalWeight !== undefined && r.totalWeight !== r.m ? "W" : "m"}/2) ∈ <b>[${htmlEscape(num(r.surplusLower))}, ${htmlEscape(num(r.surplusUpper))}]</b>${r.exact ? "" : ` <span style="${muted}">gap ${htmlEscape(num(r.upper - r.lower))}</span>`}</div>`,
      facts.length > 0 || r.graphHash ? `<div style="${muted}">${htmlEscape(facts.join(" · "))}${r.graphHash ? ` <span style="font-family:${MONO}">${htmlEscape(r.graphHash.slice(0, 19))}…</span>` : ""}</div>` : "",
    ].join(""),
    "bracket",
  );
  const text = [
    `${head}${size ? ` (${size})` : ""}: ${WORDS[status]}`,
    `  ${num(r.lower)} ≤ max cut ≤ ${num(r.upper)}   [lower: ${r.lowerMethod ?? "?"}, upper: ${r.upperMethod ?? "?"}]`,
    `  surplus ∈ [${num(r.surplusLower)}, ${num(r.surplusUpper)}]`,
    facts.length > 0 ? `  ${facts.join(", ")}` : "",
  ]
    .filter((s) => s !== "")
    .join("\n");
  return { "text/plain": text, "text/html": html };
}

/** Shows one bracket record as a card. */
export function bracketCard(record: BracketLike, options: BracketCardOptions = {}): void {
  displayOutput(bracketCardBundle(record, options));
}
