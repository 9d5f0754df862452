/**
 * One draw from Binomial(n, p) (n a non-negative integer, p in [0, 1]) as the sum of n Bernoulli trials from
 * `random` (uniform on [0, 1)). O(n), exact, and cheap for the trial counts of a psychophysics level (tens to
 * hundreds).
 */
export function drawBinomial(n: number, p: number, random: () => number): number {
  let count = 0;
  for (let i = 0; i < n; i++) if (random() < p) count++;
  return count;
}
