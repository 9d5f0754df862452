/**
 * Growth rates below this fraction of the fastest are rounding noise (a pure rotation leaves ~1e-15 of
 * distance), so the direction counts as not changing the contour at all.
 */
const RATE_NOISE = 1e-9;

/**
 * The anisotropy index from per-direction growth rates: largest / smallest. 1 for an isotropic space; +∞ when
 * some direction does not change the contour (its rate is 0 within rounding) while another does; NaN when there
 * is no direction, or none changes the contour.
 */
export function anisotropyFromRates(rates: readonly number[]): number {
  if (rates.length === 0) return NaN;
  const largest = Math.max(...rates);
  if (!(largest > 0)) return NaN;
  const smallest = Math.min(...rates);
  return smallest <= RATE_NOISE * largest ? Infinity : largest / smallest;
}
