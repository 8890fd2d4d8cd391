// halfplus's own palette ("strata"), marker shapes, neutral inks and typography, and the rule
// that gives each family one colour and one marker shape for every figure.
//
// Why these eight colours. They were found by a seeded search over CIELAB (D65) and then fixed:
// - Lightness carries identity in greyscale print: L* is pinned to eight evenly spaced levels
//   from 30 to 76 (6.6 apart), handed out as 30, 56, 37, 63, 43, 69, 50, 76 so consecutive
//   series always differ by about 20. Checked: test/plot-palette.test.ts converts to grey (CIE L*
//   of the relative luminance) and asserts every pair is at least 5 L* apart.
// - Hue and chroma were searched to maximise the smallest pairwise CIE76 distance seen by normal
//   vision and by simulated deuteranopes and protanopes (Machado, Oliveira & Fernandes 2009,
//   severity 1): about 29 ΔE*ab for every pair under all three (the test asserts ≥ 25).
// - Chroma stays between 32 and 75 so no colour shouts on screen, and no code lies within 10
//   ΔE*ab of a widely used library or published palette (the test lists those it compares with).
// Colour is never the only cue: each series also has its own marker shape (filled for the first
// eight series, open for the next eight) and markers carry a darker outline of their own hue so
// the light colours stay visible on white.

import { darken } from "./colour.js";
import type { LineDash, MarkerSymbol } from "./types.js";

/** The eight series colours in the order they are handed out, with our names for them. */
export const STRATA_PALETTE: readonly { name: string; hex: string }[] = [
  { name: "navy", hex: "#353D95" },
  { name: "sage", hex: "#669263" },
  { name: "plum", hex: "#853D66" },
  { name: "cerulean", hex: "#3EA3C7" },
  { name: "bronze", hex: "#7F620D" },
  { name: "gold", hex: "#D1A335" },
  { name: "azure", hex: "#0571F1" },
  { name: "mint", hex: "#64CDBC" },
];

/** Marker shapes in the order they are handed out: filled first, then open outlines. */
export const MARKER_SYMBOLS: readonly MarkerSymbol[] = [
  "circle",
  "square",
  "diamond",
  "triangle-up",
  "triangle-down",
  "pentagon",
  "cross",
  "x",
  "circle-open",
  "square-open",
  "diamond-open",
  "triangle-up-open",
  "triangle-down-open",
  "pentagon-open",
  "asterisk-open",
  "star-open",
];

/** Neutral colours: text, axes, grid, the paper, and the fit/reference lines. */
export const INK = {
  text: "#1D2230",
  muted: "#586070",
  axis: "#3A4050",
  grid: "#E2E5EB",
  paper: "#FFFFFF",
  /** Fitted curves drawn for all families together. */
  fit: "#1D2230",
  /** The conjectured law's line. */
  conjecture: "#586070",
} as const;

/** Dash patterns: fitted curves solid, the conjecture dashed, other references dotted. */
export const DASH: Record<"fit" | "conjecture" | "reference", LineDash> = {
  fit: "solid",
  conjecture: "dash",
  reference: "dot",
};

/** Opacity of a confidence band's fill. */
export const BAND_OPACITY = 0.16;

/**
 * Typography: one sans-serif stack led by DejaVu Sans (present on Debian, so headless exports
 * look the same on every machine), sizes on a short scale so a figure shrunk to a column width
 * stays readable.
 */
export const TYPOGRAPHY = {
  family: '"DejaVu Sans", "Bitstream Vera Sans", "Liberation Sans", Arial, sans-serif',
  size: 13,
  titleSize: 16,
  axisTitleSize: 13,
  tickSize: 11,
  legendSize: 11.5,
  noteSize: 12,
} as const;

/** Default size of an exported figure in CSS pixels (about 6.2 × 3.9 in at 96 px/in). */
export const FIGURE_SIZE = { width: 720, height: 460 } as const;

/** How one series is drawn. */
export interface SeriesStyle {
  colour: string;
  outline: string;
  symbol: MarkerSymbol;
  size: number;
}

/** Style of the i-th series (0-based); after sixteen series the styles repeat. */
export function seriesStyle(i: number): SeriesStyle {
  const colour = STRATA_PALETTE[i % STRATA_PALETTE.length].hex;
  const symbol = MARKER_SYMBOLS[i % MARKER_SYMBOLS.length];
  const open = symbol.endsWith("-open");
  return { colour, outline: open ? colour : darken(colour, 0.45), symbol, size: open ? 9 : 8 };
}

/**
 * One style per family, handed out in the order given (keep the same `order` across figures of
 * one report so a family keeps its colour and shape); families not in `order` follow in sorted
 * order. Returns the styles and a note when styles had to repeat.
 */
export function familyStyles(families: Iterable<string>, order: readonly string[] = []): { styles: Map<string, SeriesStyle>; notes: string[] } {
  const present = new Set(families);
  const listed = order.filter((f, i) => present.has(f) && order.indexOf(f) === i);
  const rest = [...present].filter((f) => !order.includes(f)).sort();
  const styles = new Map<string, SeriesStyle>();
  // A listed family is styled by its position in `order`, so it keeps its style in a figure
  // where another listed family is absent; the rest follow after the whole list.
  const index = new Map<string, number>();
  for (const f of listed) index.set(f, order.indexOf(f));
  rest.forEach((f, k) => index.set(f, order.length + k));
  for (const [f, i] of index) styles.set(f, seriesStyle(i));
  const slots = new Set([...index.values()].map((i) => i % MARKER_SYMBOLS.length));
  const notes =
    slots.size < index.size
      ? [`${index.size} families share ${MARKER_SYMBOLS.length} distinct styles: some styles repeat`]
      : [];
  return { styles, notes };
}
