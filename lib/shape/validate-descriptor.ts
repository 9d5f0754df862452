import { assertPositiveRadius } from './assert-positive-radius';
import { checkDescriptorTerms } from './check-descriptor-terms';
import { contourArea } from './contour-area';
import { contourCentroid } from './contour-centroid';
import { ShapeError } from './errors';
import { SHAPE_LIMITS } from './shape-limits';
import { synthesizeContour } from './synthesize-contour';
import type { ShapeDescriptor } from './types';

/** Elliptic and complex curves are checked for crossings on at least this many samples. */
const MIN_CHECK_SAMPLES = 1024;
/** …and at least this many per cycle of the highest harmonic (the issue asks for a grid of ≥ 8 × k_max). */
const CHECK_SAMPLES_PER_CYCLE = 16;

/**
 * Throws a `ShapeError` unless the descriptor describes a usable stimulus outline: well-formed terms
 * (integer harmonics in range, no repeats, finite numbers); radial: r(θ) > 0 everywhere (Σ|A_k| < 1, else a
 * dense-grid search reporting the angle of the lowest radius); elliptic and complex: non-zero area and no
 * self-intersection of the curve sampled at max(1024, 16·k_max) points (exact sweep test). Every family: the
 * sampled outline's area and centroid are finite and non-zero, so a scale that under- or overflows double
 * precision (a base radius of 1e-200, say) is refused here rather than breaking every later measurement.
 */
export function validateDescriptor(descriptor: ShapeDescriptor): void {
  const { highestHarmonic } = checkDescriptorTerms(descriptor);
  const isRadial = descriptor.family === 'radial';
  if (isRadial) assertPositiveRadius(descriptor);
  const wanted = Math.max(MIN_CHECK_SAMPLES, CHECK_SAMPLES_PER_CYCLE * highestHarmonic);
  const samples = Math.min(SHAPE_LIMITS.maxFftSamples, 2 ** Math.ceil(Math.log2(wanted)));
  const contour = synthesizeContour(descriptor, samples, { checkSimple: !isRadial });
  const area = contourArea(contour);
  if (!(Number.isFinite(area) && area !== 0)) {
    throw new ShapeError('degenerate-shape', `the ${descriptor.family} descriptor's outline has no measurable area at double precision`, { family: descriptor.family, value: area });
  }
  const [cx, cy] = contourCentroid(contour);
  if (!(Number.isFinite(cx) && Number.isFinite(cy))) {
    throw new ShapeError('degenerate-shape', `the ${descriptor.family} descriptor's outline has no measurable centroid at double precision`, { family: descriptor.family });
  }
}
