import { ShapeError } from './errors';
import { radialMinimumRadius } from './radial-minimum-radius';
import type { RadialDescriptor } from './types';

/**
 * Throws `radius-not-positive` unless r(θ) > 0 for every θ. Σ|A_k| < 1 is sufficient and checked first
 * (O(K)); otherwise the dense-grid search of `radialMinimumRadius` decides. The error names the angle of the
 * lowest radius, its value, and the harmonic that pulls r down most there.
 * Assumes a well-formed descriptor (see `checkDescriptorTerms`).
 */
export function assertPositiveRadius(descriptor: RadialDescriptor): void {
  let amplitudeSum = 0;
  for (const term of descriptor.terms) amplitudeSum += Math.abs(term.amplitude);
  if (amplitudeSum < 1) return;
  const minimum = radialMinimumRadius(descriptor);
  if (minimum.radius > 0) return;
  let culprit = descriptor.terms[0];
  let lowest = Infinity;
  for (const term of descriptor.terms) {
    const contribution = term.amplitude * Math.cos(term.k * minimum.angle + term.phase);
    if (contribution < lowest) {
      lowest = contribution;
      culprit = term;
    }
  }
  const harmonic = culprit?.k;
  throw new ShapeError(
    'radius-not-positive',
    `radius falls to ${minimum.radius.toPrecision(6)} at θ = ${minimum.angle.toFixed(6)} rad` +
      (harmonic === undefined ? '' : `; harmonic k = ${harmonic} (amplitude ${culprit?.amplitude}) pulls it down most`) +
      `; Σ|A_k| = ${amplitudeSum.toPrecision(6)}`,
    { family: 'radial', harmonic, field: 'amplitude', value: minimum.radius, angle: minimum.angle },
  );
}
