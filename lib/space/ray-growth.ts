import { slopeThroughOrigin } from './slope-through-origin';
import { spectrumDistance } from './spectrum-distance';
import type { ContourSpectrum, LayoutRay, RayGrowth, Stimulus } from './types';

/**
 * How fast contour distance from the centre grows along one ray: the contour distance (`spectrumDistance`) of
 * each stimulus on the ray from the centre shape, against its designed ρ, and the least-squares slope through
 * the origin of distance on ρ (`slopeThroughOrigin`), in contour units per axis unit. `spectrumOf(i)` gives
 * stimulus i's spectrum (so callers can compute only the ones needed).
 */
export function rayGrowth(
  ray: LayoutRay,
  stimuli: readonly Pick<Stimulus, 'id' | 'polar'>[],
  spectrumOf: (index: number) => ContourSpectrum,
  centre: ContourSpectrum,
): RayGrowth {
  const rho = ray.members.map((i) => (stimuli[i] as Pick<Stimulus, 'polar'>).polar.rho);
  const distance = ray.members.map((i) => spectrumDistance(centre, spectrumOf(i)));
  return {
    label: ray.label,
    angle: ray.angle,
    ids: ray.members.map((i) => (stimuli[i] as Pick<Stimulus, 'id'>).id),
    rho,
    distance,
    rate: slopeThroughOrigin(rho, distance),
  };
}
