import { checkDescriptorTerms } from './check-descriptor-terms';
import { sampleCurve } from './sample-curve';
import type { ShapeDescriptor } from './types';

/**
 * |z'(t)| is smooth and periodic, so the trapezoid rule converges geometrically; 32 points per cycle of the
 * highest harmonic (at least 4096) reach ~1e-12 relative on the shapes in the tests (ellipse check values).
 * That is the most samples taken; most shapes converge long before.
 */
const SAMPLES_PER_HARMONIC = 32;
const MIN_SAMPLES = 4096;
/** The first rule tried: 256 points, or 8 per cycle of the highest harmonic. */
const FIRST_SAMPLES = 256;
/**
 * Two rules, N and 2N points, that agree to this fraction have converged: the error of N points is about their
 * difference, and that of 2N points is about its square (geometric convergence), so 2N's sum is kept.
 */
const AGREEMENT = 1e-13;

function trapezoid(descriptor: ShapeDescriptor, samples: number): number {
  const { dx, dy } = sampleCurve(descriptor, samples);
  let sum = 0;
  for (let j = 0; j < samples; j++) sum += Math.hypot(dx[j] as number, dy[j] as number);
  return (sum * 2 * Math.PI) / samples;
}

/**
 * Arc length of a descriptor's curve, ∫₀^{2π} |z'(t)| dt, by the periodic trapezoid rule, in shape units: the
 * number of points doubled from 256 until two rules agree to 1e-13 (or up to max(4096, 32 per cycle of the
 * highest harmonic)).
 */
export function descriptorPerimeter(descriptor: ShapeDescriptor): number {
  checkDescriptorTerms(descriptor);
  const highest = sampleCurve(descriptor, 8).highestComplexHarmonic;
  const most = Math.max(MIN_SAMPLES, SAMPLES_PER_HARMONIC * highest);
  let samples = Math.min(most, Math.max(FIRST_SAMPLES, 8 * highest));
  let previous = trapezoid(descriptor, samples);
  while (samples < most) {
    samples *= 2;
    const current = trapezoid(descriptor, samples);
    if (Math.abs(current - previous) <= AGREEMENT * Math.abs(current)) return current;
    previous = current;
  }
  return previous;
}
