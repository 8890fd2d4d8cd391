// The look of halfplus output in a notebook: inline styles only (notebook front-ends sanitise or
// scope <style> elements differently; inline styles render the same in JupyterLab, the classic
// Notebook and nbconvert's HTML), built from the project's palette and typography.

import { INK, STRATA_PALETTE, TYPOGRAPHY, htmlEscape } from "halfplus";

export { htmlEscape };

/** A CSS declaration list from an object: style({ color: "#000", "font-size": "12px" }). */
export function style(decl: Record<string, string | number>): string {
  return Object.entries(decl)
    .map(([k, v]) => `${k}:${v}`)
    .join(";");
}

/** Accent colours for badges: proven (navy), probable (bronze), estimate/open (plum). */
export const ACCENT = {
  proven: STRATA_PALETTE[0].hex,
  probable: STRATA_PALETTE[4].hex,
  open: STRATA_PALETTE[2].hex,
  bar: STRATA_PALETTE[3].hex,
} as const;

export const FONT = TYPOGRAPHY.family.replace(/"/g, "'");
export const MONO = "'DejaVu Sans Mono', monospace";

/** The frame every helper's HTML sits in. */
export function frame(inner: string, kind: string): string {
  const s = style({
    "font-family": FONT,
    "font-size": "13px",
    "line-height": "1.45",
    color: INK.text,
    background: INK.paper,
    border: `1px solid ${INK.grid}`,
    "border-left": `3px solid ${STRATA_PALETTE[0].hex}`,
    "border-radius": "4px",
    padding: "8px 12px",
    margin: "4px 0",
    "max-width": "760px",
    "box-sizing": "border-box",
    "overflow-x": "auto",
  });
  return `<div class="hp-nb hp-nb-${kind}" style="${s}">${inner}</div>`;
}

/** A small caption line above a block. */
export function caption(text: string): string {
  return `<div style="${style({ color: INK.muted, "font-size": "12px", "letter-spacing": "0.02em", margin: "0 0 4px" })}">${htmlEscape(text)}</div>`;
}

/** A coloured word in a rounded box. */
export function badge(text: string, colour: string): string {
  return `<span style="${style({ display: "inline-block", padding: "0 7px", "border-radius": "9px", border: `1px solid ${colour}`, color: colour, "font-size": "11.5px", "font-weight": "600", "margin-left": "6px", "vertical-align": "1px" })}">${htmlEscape(text)}</span>`;
}

export const CELL_STYLE = style({ padding: "3px 10px", "border-bottom": `1px solid ${INK.grid}`, "text-align": "right", "font-variant-numeric": "tabular-nums", "white-space": "nowrap" });
export const CELL_LEFT_STYLE = style({ padding: "3px 10px", "border-bottom": `1px solid ${INK.grid}`, "text-align": "left", "white-space": "nowrap" });
export const HEAD_STYLE = style({ padding: "4px 10px", "border-bottom": `2px solid ${INK.axis}`, "text-align": "right", "font-weight": "600", "white-space": "nowrap" });
export const HEAD_LEFT_STYLE = style({ padding: "4px 10px", "border-bottom": `2px solid ${INK.axis}`, "text-align": "left", "font-weight": "600", "white-space": "nowrap" });
export const TABLE_STYLE = style({ "border-collapse": "collapse", "font-size": "12.5px", margin: "2px 0" });
