/** Slack for floating-point sums of onsets, far below a millisecond: 0.999999999999 s after an onset is still 1 s. */
const TIME_TOLERANCE_S = 1e-9;
/** WCAG 2.3.1 counts flashes in any one-second period. */
const WINDOW_S = 1;

/**
 * The highest rate of onsets, per second: the most onsets that fall in any half-open window [t, t + 1 s), as in
 * WCAG 2.3.1 ("no more than three flashes in any one-second period"). `onsets` in seconds, in any order; an
 * empty list gives 0. Two-pointer sweep over the sorted onsets, O(m log m).
 */
export function peakOnsetRate(onsets: readonly number[]): number {
  const sorted = [...onsets].sort((a, b) => a - b);
  let peak = 0;
  let first = 0;
  for (let last = 0; last < sorted.length; last++) {
    while ((sorted[last] as number) - (sorted[first] as number) >= WINDOW_S - TIME_TOLERANCE_S) first++;
    peak = Math.max(peak, last - first + 1);
  }
  return peak / WINDOW_S;
}
