import { checkWholeNumber } from './check-whole-number';

/** Largest k·n for the exact formula: (k!)^(k^(n−1)) grows so fast that beyond this the BigInt would be gigabytes. */
const MAX_FORMULA_SYMBOLS = 4_096;

/**
 * The number of distinct de Bruijn cycles B(k, n), counted up to rotation: (k!)^(k^(n−1)) / kⁿ
 * (van Aardenne-Ehrenfest & de Bruijn 1951, from the BEST theorem). Exact, as a BigInt; k ≥ 1, n ≥ 1 and
 * k^(n−1) ≤ 4,096. B(2,3) → 2, B(2,4) → 16, B(3,2) → 24, B(4,2) → 20736.
 */
export function countDeBruijnCycles(k: number, n: number): bigint {
  checkWholeNumber('k', k, 1);
  checkWholeNumber('n', n, 1);
  checkWholeNumber('k^(n−1)', k ** (n - 1), 1, MAX_FORMULA_SYMBOLS);
  let factorial = 1n;
  for (let i = 2n; i <= BigInt(k); i++) factorial *= i;
  return factorial ** BigInt(k ** (n - 1)) / BigInt(k) ** BigInt(n);
}
