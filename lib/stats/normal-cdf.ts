/** 1/√(2π), the standard normal density at 0. */
export const INV_SQRT_2PI = 0.3989422804014327;

/** Beyond |z| = 37 the tail e^(−z²/2)/… underflows double precision; Φ is then exactly 0 or 1. */
const UNDERFLOW_Z = 37;
/**
 * Switch to the continued fraction at |z| = 3: the rational approximation holds a relative error near 1e−14 up
 * to 3 but drifts to ~1e−10 by 5 and ~1e−8 near West's own switch point 10/√2.
 */
const RATIONAL_LIMIT = 3;
/** Terms of the continued fraction: at |z| = 3, 60 terms reach double precision (30 leave ~1e−12). */
const CONTINUED_FRACTION_TERMS = 60;

/**
 * The standard normal cumulative distribution Φ(z), unitless z, result in [0, 1]. Double-precision algorithm of
 * Hart (1968, algorithm 5666) as given by W. J. West (2005), "Better approximations to cumulative normal functions",
 * Wilmott Magazine, for |z| < 3, and beyond it Laplace's continued fraction for the Mills ratio
 * Q(z) = φ(z)/(z + 1/(z + 2/(z + 3/…))) with 60 terms (West truncates it after four terms from 10/√2, which costs
 * relative accuracy in the tail). Both compute the tail and reflect it, so Φ(−z) keeps a relative error of about
 * 1e−14 far into the lower tail instead of losing it to 1 − Φ(z) cancellation.
 */
export function normalCdf(z: number): number {
  if (Number.isNaN(z)) return Number.NaN;
  const a = Math.abs(z);
  let tail: number;
  if (a > UNDERFLOW_Z) {
    tail = 0;
  } else {
    const e = Math.exp((-a * a) / 2);
    if (a < RATIONAL_LIMIT) {
      let num = 3.52624965998911e-2 * a + 0.700383064443688;
      num = num * a + 6.37396220353165;
      num = num * a + 33.912866078383;
      num = num * a + 112.079291497871;
      num = num * a + 221.213596169931;
      num = num * a + 220.206867912376;
      let den = 8.83883476483184e-2 * a + 1.75566716318264;
      den = den * a + 16.064177579207;
      den = den * a + 86.7807322029461;
      den = den * a + 296.564248779674;
      den = den * a + 637.333633378831;
      den = den * a + 793.826512519948;
      den = den * a + 440.413735824752;
      tail = (e * num) / den;
    } else {
      // Laplace's continued fraction for the Mills ratio, evaluated from the back.
      let cf = a;
      for (let j = CONTINUED_FRACTION_TERMS; j >= 1; j--) cf = a + j / cf;
      tail = (e * INV_SQRT_2PI) / cf;
    }
  }
  return z > 0 ? 1 - tail : tail;
}
