import type { ComplexDescriptor } from './types';

/** A similarity transform of a curve and a shift of its parameter. */
export interface HarmonicTransform {
  /** Added to the curve before rotation and scaling, in shape units. Default [0, 0]. */
  readonly translation?: readonly [number, number];
  /** Counter-clockwise rotation about the origin, radians. Default 0. */
  readonly rotation?: number;
  /** Uniform scale about the origin, > 0. Default 1. */
  readonly scale?: number;
  /** New start point: the curve is re-parametrised as t ↦ t + startShift (radians). Default 0. */
  readonly startShift?: number;
}

/**
 * Applies z'(t) = s·e^{iα}·(z(t + τ) + w) to complex harmonics: c_0 ↦ s e^{iα}(c_0 + w) and
 * c_k ↦ s e^{i(α + kτ)} c_k. Exact in the coefficients; no resampling.
 */
export function transformComplexHarmonics(descriptor: ComplexDescriptor, transform: HarmonicTransform): ComplexDescriptor {
  const [wx, wy] = transform.translation ?? [0, 0];
  const alpha = transform.rotation ?? 0;
  const scale = transform.scale ?? 1;
  const tau = transform.startShift ?? 0;
  let hasCenter = false;
  const terms = descriptor.terms.map(({ k, re, im }) => {
    let r = re;
    let i = im;
    if (k === 0) {
      hasCenter = true;
      r += wx;
      i += wy;
    }
    const angle = alpha + k * tau;
    const c = Math.cos(angle) * scale;
    const s = Math.sin(angle) * scale;
    return { k, re: r * c - i * s, im: r * s + i * c };
  });
  if (!hasCenter && (wx !== 0 || wy !== 0)) {
    const c = Math.cos(alpha) * scale;
    const s = Math.sin(alpha) * scale;
    terms.push({ k: 0, re: wx * c - wy * s, im: wx * s + wy * c });
    terms.sort((p, q) => p.k - q.k);
  }
  return { family: 'complex', terms };
}
