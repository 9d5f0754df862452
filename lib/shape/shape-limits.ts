/**
 * Limits shared by every family.
 * - `maxHarmonic`: 128. Radial-frequency stimuli use low frequencies; 128 harmonics already resolve detail
 *   finer than one pixel on a 512-px stimulus, and 4 × 128 = 512 samples keep the rule below satisfiable.
 * - `aliasFactor`: N ≥ 4 × highest harmonic, so every harmonic gets at least four samples per cycle and the
 *   polygon does not alias the curve.
 * - FFT sizes are the powers of two from 64 to 8192; direct evaluation accepts any N from 3 to 65,536.
 */
export const SHAPE_LIMITS = {
  maxHarmonic: 128,
  aliasFactor: 4,
  minFftSamples: 64,
  maxFftSamples: 8192,
  minSamples: 3,
  maxSamples: 65_536,
} as const;
