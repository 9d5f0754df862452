import { SHAPE_LIMITS } from './shape-limits';
import type { DescriptorFamily } from './types';

/**
 * Measured at N = 1024 (scripts/bench-shape.ts and an interleaved A/B run): the direct radial kernel sums four
 * terms per pass and beats the FFT up to four terms (~72k vs ~55k shapes/s); from five terms it needs a second
 * pass and the FFT wins (~45k vs ~50k). So the FFT is worth about 4.5 terms at log2 N = 10. Elliptic and
 * complex terms do about twice the arithmetic of a radial one.
 */
const FFT_COST_IN_TERMS_PER_LOG2 = 0.45;
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
