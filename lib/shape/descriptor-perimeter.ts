import { checkDescriptorTerms } from './check-descriptor-terms';
import { sampleCurve } from './sample-curve';
import type { ShapeDescriptor } from './types';

/**
 * |z'(t)| is smooth and periodic, so the trapezoid rule converges geometrically; 32 points per cycle of the
 * highest harmonic (at least 4096) reach ~1e-12 relative on the shapes in the tests (ellipse check values).
 */
const SAMPLES_PER_HARMONIC = 32;
const MIN_SAMPLES = 4096;

/** Arc length of a descriptor's curve, ∫₀^{2π} |z'(t)| dt, by the periodic trapezoid rule, in shape units. */
export function descriptorPerimeter(descriptor: ShapeDescriptor): number {
  checkDescriptorTerms(descriptor);
  const probe = sampleCurve(descriptor, 8);
  const samples = Math.max(MIN_SAMPLES, SAMPLES_PER_HARMONIC * probe.highestComplexHarmonic);
  const { dx, dy } = sampleCurve(descriptor, samples);
  let sum = 0;
  for (let j = 0; j < samples; j++) sum += Math.hypot(dx[j] as number, dy[j] as number);
  return (sum * 2 * Math.PI) / samples;
}
