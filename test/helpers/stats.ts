// Goodness-of-fit statistic for the suites' distribution checks.

/** Pearson's chi-square statistic Σ (O − E)² / E (common practice, no source). */
export function chiSquare(observed: number[], expected: number[]): number {
  let s = 0;
  for (let i = 0; i < observed.length; i++) s += (observed[i] - expected[i]) ** 2 / expected[i];
  return s;
}
