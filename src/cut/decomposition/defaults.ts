// The decomposition cut's defaults, apart from the cut itself so that `halfplus bounds --help` can
// show them without loading it.

/**
 * Default triangle factor c = 1/(3π): with T ≤ m√Δ/(3π) the few-triangles form with ε = 1/√Δ,
 * m/(π√Δ) − 3T/(2Δ), keeps at least half of its triangle-free value m/(π√Δ).
 */
export const DEFAULT_TRIANGLE_FACTOR = 1 / (3 * Math.PI);

/**
 * Default size up to which a piece is cut exactly: the Gray-code search's own default range
 * (measured: a 24-vertex piece takes a few milliseconds).
 */
export const DEFAULT_EXACT_VERTICES = 24;
