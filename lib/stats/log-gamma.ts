/** Lanczos (1964) coefficients for g = 7, n = 9 (as tabulated by Godfrey; relative error ~1e−15). */
const LANCZOS_G = 7;
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
  12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
] as const;
/** ln √(2π). */
const LN_SQRT_2PI = 0.9189385332046728;

/**
 * ln Γ(a) for a > 0 by the Lanczos approximation (Lanczos 1964, SIAM J. Numer. Anal. B 1:86), with the reflection
 * formula below a = 0.5. Relative error about 1e−15.
 */
export function logGamma(a: number): number {
  if (a < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * a))) - logGamma(1 - a);
  const z = a - 1;
  let sum = LANCZOS[0];
  for (let i = 1; i < LANCZOS.length; i++) sum += (LANCZOS[i] as number) / (z + i);
  const t = z + LANCZOS_G + 0.5;
  return LN_SQRT_2PI + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}
