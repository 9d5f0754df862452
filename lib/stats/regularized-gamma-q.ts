import { logGamma } from './log-gamma';

/** Iteration cap of the series and the continued fraction; both converge in well under 100 terms for a ≤ 1e3. */
const MAX_TERMS = 1000;
/** Relative convergence tolerance, near double precision. */
const EPSILON = 1e-15;
/** Guard against division by zero in the modified Lentz method. */
const TINY = 1e-300;

/**
 * The regularised upper incomplete gamma function Q(a, x) = Γ(a, x)/Γ(a), a > 0, x ≥ 0, result in [0, 1]: the
 * power series of P(a, x) for x < a + 1 and Legendre's continued fraction for Q by the modified Lentz method
 * otherwise (Press et al., Numerical Recipes, 3rd ed., §6.2). NaN for invalid arguments.
 */
export function regularizedGammaQ(a: number, x: number): number {
  if (!(a > 0) || !(x >= 0) || !Number.isFinite(a)) return Number.NaN;
  if (x === 0) return 1;
  if (x === Number.POSITIVE_INFINITY) return 0;
  const logPrefactor = -x + a * Math.log(x) - logGamma(a);
  if (x < a + 1) {
    // Series: P = e^(−x) x^a / Γ(a + 1) Σ x^n / ((a + 1)…(a + n)).
    let term = 1 / a;
    let sum = term;
    for (let n = 1; n < MAX_TERMS; n++) {
      term *= x / (a + n);
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * EPSILON) break;
    }
    return Math.max(0, 1 - sum * Math.exp(logPrefactor));
  }
  // Continued fraction for Q (modified Lentz).
  let b = x + 1 - a;
  let c = 1 / TINY;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < MAX_TERMS; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < TINY) d = TINY;
    c = b + an / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < EPSILON) break;
  }
  return Math.exp(logPrefactor) * h;
}
