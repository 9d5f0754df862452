import { checkDescriptorTerms } from './check-descriptor-terms';
import { ShapeError } from './errors';
import { sampleCurve } from './sample-curve';
import type { ShapeDescriptor, ShapeMoments } from './types';

/**
 * The integrands below are trigonometric polynomials of degree ≤ 5·K (a fourth power of x times y'), where K
 * is the highest complex harmonic; the trapezoid rule on M > 5K points integrates them exactly, so M = 8K + 64
 * leaves a margin and a floor for tiny K.
 */
const SAMPLES_PER_HARMONIC = 8;
const MIN_SAMPLES = 64;

/**
 * Exact area, area centroid and central second and third area moments of the region a descriptor's curve
 * encloses: Green's theorem ∫∫ x^p y^q dA = ∮ x^{p+1} y^q/(p+1) y'(t) dt, evaluated by the trapezoid rule on
 * the analytic curve (exact, as the integrands are trigonometric polynomials). Signs follow the direction.
 */
export function descriptorMoments(descriptor: ShapeDescriptor): ShapeMoments {
  checkDescriptorTerms(descriptor);
  const probe = sampleCurve(descriptor, MIN_SAMPLES);
  const samples = Math.max(MIN_SAMPLES, SAMPLES_PER_HARMONIC * probe.highestComplexHarmonic + MIN_SAMPLES);
  const { x, y, dy } = samples === MIN_SAMPLES ? probe : sampleCurve(descriptor, samples);
  const dt = (2 * Math.PI) / samples;
  // Phase 1: area and first moments.
  let area = 0;
  let sx = 0;
  let sy = 0;
  for (let j = 0; j < samples; j++) {
    const xj = x[j] as number;
    const w = (dy[j] as number) * dt;
    area += xj * w;
    sx += ((xj * xj) / 2) * w;
    sy += xj * (y[j] as number) * w;
  }
  if (area === 0 || !Number.isFinite(area)) {
    throw new ShapeError('degenerate-shape', `the ${descriptor.family} descriptor encloses no area`, { family: descriptor.family, value: area });
  }
  const cx = sx / area;
  const cy = sy / area;
  // Phase 2: central second and third moments.
  let xx = 0, xy = 0, yy = 0, xxx = 0, xxy = 0, xyy = 0, yyy = 0;
  for (let j = 0; j < samples; j++) {
    const u = (x[j] as number) - cx;
    const v = (y[j] as number) - cy;
    const w = (dy[j] as number) * dt;
    const u2 = u * u;
    xx += (u2 * u * w) / 3;
    xy += (u2 * v * w) / 2;
    yy += u * v * v * w;
    xxx += (u2 * u2 * w) / 4;
    xxy += (u2 * u * v * w) / 3;
    xyy += (u2 * v * v * w) / 2;
    yyy += u * v * v * v * w;
  }
  return { area, centroid: [cx, cy], xx, xy, yy, xxx, xxy, xyy, yyy };
}
