import { SHAPE_LIMITS } from './shape-limits';
import type { DescriptorFamily } from './types';

/**
 * Measured with scripts/bench-shape.ts at N = 1024: an inverse FFT (≈ 22 µs with de-interleaving) costs as
 * much as ≈ 5 direct radial terms (≈ 3.4 µs each) on top of the fixed 5 µs, i.e. 0.5 terms per log2 N.
 * Elliptic and complex terms do about twice the arithmetic of a radial one.
 */
const FFT_COST_IN_TERMS_PER_LOG2 = 0.5;
const TERM_WEIGHT: Readonly<Record<DescriptorFamily, number>> = { radial: 1, elliptic: 2, complex: 2 };

/** True for the FFT sizes fft.js is used with: powers of two from 64 to 8192. */
export function isFftSize(samples: number): boolean {
  return (
    Number.isInteger(samples) &&
    samples >= SHAPE_LIMITS.minFftSamples &&
    samples <= SHAPE_LIMITS.maxFftSamples &&
    (samples & (samples - 1)) === 0
  );
}

/**
 * The cheaper synthesis path: a direct table sum costs ∝ N · terms, an inverse FFT ∝ N log2 N, so the FFT
 * wins once the number of non-zero terms passes a multiple of log2 N (and only at FFT sizes).
 */
export function chooseSynthesisMethod(family: DescriptorFamily, activeTerms: number, samples: number): 'direct' | 'fft' {
  if (!isFftSize(samples)) return 'direct';
  const directCost = activeTerms * (TERM_WEIGHT[family] ?? 1);
  const fftCost = FFT_COST_IN_TERMS_PER_LOG2 * Math.log2(samples);
  return directCost > fftCost ? 'fft' : 'direct';
}
