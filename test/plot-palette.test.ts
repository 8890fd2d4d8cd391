// The palette's promises: distinct grey levels in greyscale print, distinct colours for
// simulated deuteranopes and protanopes, distinct marker shapes, and codes of our own.
import { describe, expect, it } from "vitest";
import {
  deltaE76,
  greyLevel,
  hexToLab,
  relativeLuminance,
  simulateDeficiency,
  type VisionDeficiency,
} from "../src/plot/colour.js";
import { MARKER_SYMBOLS, STRATA_PALETTE, familyStyles, seriesStyle } from "../src/plot/palette.js";
import { expectInputError } from "./helpers/errors.js";

const hexes = STRATA_PALETTE.map((c) => c.hex);

function minPairwise(values: string[], dist: (a: string, b: string) => number): number {
  let min = Infinity;
  for (let i = 0; i < values.length; i++) for (let j = 0; j < i; j++) min = Math.min(min, dist(values[i], values[j]));
  return min;
}

describe("colour arithmetic against published values", () => {
  it("CIELAB of white, black and sRGB primaries", () => {
    // CIE 15:2004 with the D65 white: white is L* = 100, a* = b* = 0; black is L* = 0.
    const white = hexToLab("#FFFFFF");
    expect(white[0]).toBeCloseTo(100, 2);
    expect(Math.abs(white[1])).toBeLessThan(0.01);
    expect(Math.abs(white[2])).toBeLessThan(0.01);
    expect(hexToLab("#000000")[0]).toBeCloseTo(0, 6);
    // sRGB red is L* 53.24, a* 80.09, b* 67.20 (D65; from memory, as tabulated by colour calculators
    // such as Bruce Lindbloom's).
    const red = hexToLab("#FF0000");
    expect(red[0]).toBeCloseTo(53.24, 1);
    expect(red[1]).toBeCloseTo(80.09, 0);
    expect(red[2]).toBeCloseTo(67.2, 0);
  });

  it("relative luminance matches WCAG 2's contrast examples", () => {
    // WCAG 2.x: contrast (L1 + 0.05)/(L2 + 0.05); #767676 on white is 4.54:1 (from memory: the
    // well-known lightest grey passing AA for body text).
    const contrast = (1 + 0.05) / (relativeLuminance("#767676") + 0.05);
    expect(contrast).toBeCloseTo(4.54, 2);
  });

  it("the deficiency simulation leaves greys grey and merges red with green", () => {
    // Machado, Oliveira & Fernandes (2009): each severity-1 matrix's rows sum to 1, so neutral
    // colours map to themselves; for a deuteranope or protanope, pure red and pure green become
    // far closer than they are for normal vision (the defining confusion of both).
    for (const kind of ["deuteranopia", "protanopia"] as VisionDeficiency[]) {
      for (const grey of ["#FFFFFF", "#808080", "#000000"]) expect(simulateDeficiency(grey, kind)).toBe(grey);
      const normal = deltaE76(hexToLab("#FF0000"), hexToLab("#00FF00"));
      const seen = deltaE76(hexToLab(simulateDeficiency("#FF0000", kind)), hexToLab(simulateDeficiency("#00FF00", kind)));
      expect(seen).toBeLessThan(normal / 2);
    }
  });

  it("bad colour codes are refused naming the value", () => {
    expectInputError(() => hexToLab("#12345"), "#12345");
  });
});

describe("the strata palette", () => {
  it("has eight colours and every pair is at least 5 L* apart in greyscale print", () => {
    // Greyscale conversion that keeps luminance (CIE L* of Y): the palette comment promises steps of
    // about 6.6; 5 leaves room for rounding to 8-bit codes.
    expect(hexes).toHaveLength(8);
    const levels = hexes.map(greyLevel).sort((a, b) => a - b);
    for (let i = 1; i < levels.length; i++) expect(levels[i] - levels[i - 1]).toBeGreaterThanOrEqual(5);
    // Not too light to see on white paper, not so dark it reads as black text.
    expect(levels[0]).toBeGreaterThan(25);
    expect(levels[levels.length - 1]).toBeLessThan(80);
  });

  it("consecutive colours alternate dark and light, so the first families differ most", () => {
    const levels = hexes.map(greyLevel);
    for (let i = 1; i < levels.length; i++) expect(Math.abs(levels[i] - levels[i - 1])).toBeGreaterThanOrEqual(15);
  });

  it("stays distinct for normal vision, simulated deuteranopia and protanopia (ΔE*ab ≥ 25)", () => {
    // Simulation: Machado, Oliveira & Fernandes (2009), severity 1; distance: CIE76 ΔE*ab.
    const lab = (h: string) => hexToLab(h);
    expect(minPairwise(hexes, (a, b) => deltaE76(lab(a), lab(b)))).toBeGreaterThanOrEqual(25);
    for (const kind of ["deuteranopia", "protanopia"] as VisionDeficiency[]) {
      const seen = hexes.map((h) => simulateDeficiency(h, kind));
      expect(minPairwise(seen, (a, b) => deltaE76(lab(a), lab(b)))).toBeGreaterThanOrEqual(25);
    }
  });

  it("copies no well-known palette: every colour is over 10 ΔE*ab from each of their codes", () => {
    // The codes of palettes in wide use (common practice, no source; from memory): Okabe & Ito's
    // colour-universal design set, Paul Tol's bright/vibrant/muted sets, matplotlib's tab10,
    // ColorBrewer Dark2 and Set1, plotly's default cycle, viridis stops, Tableau 10.
    const known = `#E69F00 #56B4E9 #009E73 #F0E442 #0072B2 #D55E00 #CC79A7
      #4477AA #EE6677 #228833 #CCBB44 #66CCEE #AA3377 #BBBBBB
      #332288 #88CCEE #44AA99 #117733 #999933 #DDCC77 #CC6677 #882255 #AA4499
      #0077BB #33BBEE #009988 #EE7733 #CC3311 #EE3377
      #1F77B4 #FF7F0E #2CA02C #D62728 #9467BD #8C564B #E377C2 #7F7F7F #BCBD22 #17BECF
      #1B9E77 #D95F02 #7570B3 #E7298A #66A61E #E6AB02 #A6761D #666666
      #E41A1C #377EB8 #4DAF4A #984EA3 #FF7F00 #FFFF33 #A65628 #F781BF #999999
      #636EFA #EF553B #00CC96 #AB63FA #FFA15A #19D3F3 #FF6692 #B6E880 #FF97FF #FECB52
      #440154 #31688E #35B779 #FDE725 #21918C #3B528B #5EC962
      #4E79A7 #F28E2B #E15759 #76B7B2 #59A14F #EDC948 #B07AA1 #FF9DA7 #9C755F #BAB0AC`.split(/\s+/);
    for (const h of hexes) for (const k of known) expect(deltaE76(hexToLab(h), hexToLab(k)), `${h} vs ${k}`).toBeGreaterThan(10);
  });

  it("gives sixteen distinct marker shapes and never the same colour and shape twice in sixteen series", () => {
    expect(new Set(MARKER_SYMBOLS).size).toBe(16);
    const styles = Array.from({ length: 16 }, (_, i) => seriesStyle(i));
    expect(new Set(styles.map((s) => `${s.colour}/${s.symbol}`)).size).toBe(16);
    expect(new Set(styles.slice(0, 8).map((s) => s.colour)).size).toBe(8);
  });

  it("keeps a family's style across figures when the same order is given", () => {
    const order = ["a", "b", "c"];
    const all = familyStyles(["a", "b", "c"], order).styles;
    const some = familyStyles(["c", "a"], order).styles;
    expect(some.get("c")).toEqual(all.get("c"));
    expect(some.get("a")).toEqual(all.get("a"));
    const many = familyStyles(Array.from({ length: 18 }, (_, i) => `f${i}`));
    expect(many.notes[0]).toMatch(/repeat/);
  });
});
