// Colour arithmetic for checking the palette: sRGB ↔ linear light, relative luminance, CIELAB,
// the CIE76 colour difference, a greyscale level, and colour-vision-deficiency simulation.
// Used by the palette's own tests and by anyone who adds colours: a new colour must keep the
// lightness steps and the simulated-deficiency distances the palette comment promises.

import { InputError } from "../errors.js";

export type Rgb = readonly [number, number, number];
export type Lab = readonly [number, number, number];

/** "#RRGGBB" → sRGB components in [0, 1]. */
export function hexToRgb(hex: string): Rgb {
  if (!/^#[0-9a-fA-F]{6}$/.test(hex)) throw new InputError(`colour: invalid \`hex\`: should be "#RRGGBB" (got ${JSON.stringify(hex)})`);
  return [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255) as unknown as Rgb;
}

/** sRGB components in [0, 1] → "#RRGGBB" (clamped, rounded). */
export function rgbToHex(rgb: Rgb): string {
  return "#" + rgb.map((c) => Math.round(Math.min(1, Math.max(0, c)) * 255).toString(16).padStart(2, "0")).join("").toUpperCase();
}

/** The sRGB transfer function inverted (IEC 61966-2-1:1999): encoded value → linear light. */
export function srgbToLinear(c: number): number {
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** The sRGB transfer function (IEC 61966-2-1:1999): linear light → encoded value. */
export function linearToSrgb(c: number): number {
  return c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055;
}

/** Relative luminance Y of an sRGB colour (Rec. ITU-R BT.709 primaries, as in WCAG 2's definition). */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = hexToRgb(hex).map(srgbToLinear);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

// sRGB (D65) linear → CIE XYZ: IEC 61966-2-1's primaries to seven places (as tabulated by
// Lindbloom), so white lands on the D65 white point and has a* = b* = 0.
const RGB_TO_XYZ = [
  [0.4124564, 0.3575761, 0.1804375],
  [0.2126729, 0.7151522, 0.072175],
  [0.0193339, 0.119192, 0.9503041],
] as const;
const D65 = [0.95047, 1, 1.08883] as const;

function labF(t: number): number {
  // CIE 15:2004: cube root above (6/29)^3, a linear segment below.
  return t > 216 / 24389 ? Math.cbrt(t) : ((24389 / 27) * t + 16) / 116;
}

/** CIELAB (D65 white) of a colour given in linear-light sRGB. */
export function linearRgbToLab(rgb: Rgb): Lab {
  const xyz = RGB_TO_XYZ.map((row) => row[0] * rgb[0] + row[1] * rgb[1] + row[2] * rgb[2]);
  const [fx, fy, fz] = xyz.map((v, i) => labF(v / D65[i]));
  return [116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)];
}

/** CIELAB (D65 white) of "#RRGGBB". */
export function hexToLab(hex: string): Lab {
  return linearRgbToLab(hexToRgb(hex).map(srgbToLinear) as unknown as Rgb);
}

/** CIE76 colour difference ΔE*ab: Euclidean distance in CIELAB. */
export function deltaE76(a: Lab, b: Lab): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/**
 * The grey a colour prints as on a greyscale device that keeps luminance: CIE L* in [0, 100]
 * (0 black, 100 white), the perceptual lightness of Y.
 */
export function greyLevel(hex: string): number {
  return 116 * labF(relativeLuminance(hex)) - 16;
}

export type VisionDeficiency = "deuteranopia" | "protanopia";

/**
 * Machado, Oliveira & Fernandes, "A physiologically-based model for simulation of color vision
 * deficiency", IEEE TVCG 15(6), 2009: the severity-1.0 matrices of their Table, applied to
 * linear-light sRGB.
 */
const CVD_MATRICES: Record<VisionDeficiency, readonly (readonly [number, number, number])[]> = {
  deuteranopia: [
    [0.367322, 0.860646, -0.227968],
    [0.280085, 0.672501, 0.047413],
    [-0.01182, 0.04294, 0.968881],
  ],
  protanopia: [
    [0.152286, 1.052583, -0.204868],
    [0.114503, 0.786281, 0.099216],
    [-0.003882, -0.048116, 1.051998],
  ],
};

/** How "#RRGGBB" looks to a dichromat (Machado et al. 2009, severity 1), as "#RRGGBB". */
export function simulateDeficiency(hex: string, kind: VisionDeficiency): string {
  const lin = hexToRgb(hex).map(srgbToLinear);
  const m = CVD_MATRICES[kind];
  const out = m.map((row) => Math.min(1, Math.max(0, row[0] * lin[0] + row[1] * lin[1] + row[2] * lin[2])));
  return rgbToHex(out.map(linearToSrgb) as unknown as Rgb);
}

/** Mix a colour toward black (t > 0) in linear light; used for marker outlines one step darker. */
export function darken(hex: string, t: number): string {
  const lin = hexToRgb(hex).map(srgbToLinear);
  return rgbToHex(lin.map((c) => linearToSrgb(c * (1 - t))) as unknown as Rgb);
}

/** "#RRGGBB" with an opacity, as CSS rgba() (plotly's fill colours). */
export function withAlpha(hex: string, alpha: number): string {
  const [r, g, b] = hexToRgb(hex).map((c) => Math.round(c * 255));
  return `rgba(${r},${g},${b},${alpha})`;
}
