import { descriptorArea } from '../shape/descriptor-area';
import { descriptorMoments } from '../shape/descriptor-moments';
import { ShapeError } from '../shape/errors';
import { normalizeComplexHarmonics } from '../shape/normalize-complex-harmonics';
import { normalizeEllipticHarmonics } from '../shape/normalize-elliptic-harmonics';
import { normalizeRadialHarmonics } from '../shape/normalize-radial-harmonics';
import type { Point, ShapeDescriptor } from '../shape/types';
import type { NormalizedStimulus, SpaceNormalization } from './types';

const NO_OFFSET: Point = [0, 0];

function normalizeRadial(descriptor: Extract<ShapeDescriptor, { family: 'radial' }>, normalization: SpaceNormalization): NormalizedStimulus {
  // lib/shape decides the scale; the terms are kept as the axes made them (the engine's canonical form would
  // fold negative amplitudes into phases, hiding the seed + a·A + b·B structure), and rotation is never applied.
  const scaled =
    normalization.scale === 'none'
      ? descriptor
      : { ...descriptor, baseRadius: normalizeRadialHarmonics(descriptor, { scale: normalization.scale, orientation: 'none' }).baseRadius };
  if (!normalization.centroid) return { descriptor: scaled, contourOffset: NO_OFFSET };
  const [cx, cy] = descriptorMoments(scaled).centroid;
  return { descriptor: scaled, contourOffset: [-cx, -cy] };
}

function normalizeHarmonics(descriptor: Exclude<ShapeDescriptor, { family: 'radial' }>, normalization: SpaceNormalization): ShapeDescriptor {
  const options = { scale: normalization.scale, orientation: 'none' } as const;
  const result = descriptor.family === 'elliptic' ? normalizeEllipticHarmonics(descriptor, options) : normalizeComplexHarmonics(descriptor, options);
  if (normalization.centroid) return result;
  // lib/shape always centres: without centroid normalisation the scaled centroid s·m is put back, which makes
  // the whole step a scaling about the frame's origin, as for radial descriptors.
  const [mx, my] = descriptorMoments(descriptor).centroid;
  const s = Math.sqrt(Math.abs(descriptorArea(result) / descriptorArea(descriptor)));
  const keep: Point = [s * mx, s * my];
  if (result.family === 'elliptic') return { ...result, center: [result.center[0] + keep[0], result.center[1] + keep[1]] };
  const hasCentre = result.terms.some((t) => t.k === 0);
  const terms = hasCentre
    ? result.terms.map((t) => (t.k === 0 ? { k: 0, re: t.re + keep[0], im: t.im + keep[1] } : t))
    : [...result.terms, { k: 0, re: keep[0], im: keep[1] }].sort((p, q) => p.k - q.k);
  return { family: 'complex', terms };
}

/**
 * Stage of `generateSpace`: normalises one stimulus's size and position through `lib/shape`, never its rotation
 * or start point, so every stimulus stays aligned with the axes.
 * - Scale (`equal-area-radius`, `area`, `max-radius`, `perimeter`): the factor `lib/shape`'s normaliser finds
 *   (unit equal-area radius √(A/π), unit area, unit largest distance from the area centroid, unit perimeter),
 *   applied about the origin of the descriptor's frame; `none` leaves the size alone.
 * - Centroid: elliptic and complex descriptors are translated so the area centroid is at the origin (without it
 *   the centroid stays where it was). Radial descriptors are drawn about their polar origin and cannot be
 *   translated, so the translation is returned as `contourOffset` (minus the area centroid) for the contour.
 * - Elliptic and complex curves running clockwise come back counter-clockwise (`lib/shape`'s first stage).
 * A descriptor the engine refuses (r ≤ 0, zero area) is returned unchanged with no offset: `checkSpace` reports
 * it, and synthesising it raises the engine's error.
 */
export function normalizeStimulus(descriptor: ShapeDescriptor, normalization: SpaceNormalization): NormalizedStimulus {
  if (normalization.scale === 'none' && !normalization.centroid) return { descriptor, contourOffset: NO_OFFSET };
  try {
    if (descriptor.family === 'radial') return normalizeRadial(descriptor, normalization);
    return { descriptor: normalizeHarmonics(descriptor, normalization), contourOffset: NO_OFFSET };
  } catch (error) {
    if (error instanceof ShapeError) return { descriptor, contourOffset: NO_OFFSET };
    throw error;
  }
}
