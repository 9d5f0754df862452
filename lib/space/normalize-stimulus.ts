import { descriptorArea } from '../shape/descriptor-area';
import { descriptorMaxRadius } from '../shape/descriptor-max-radius';
import { descriptorPerimeter } from '../shape/descriptor-perimeter';
import { ShapeError } from '../shape/errors';
import type { Point, ShapeDescriptor } from '../shape/types';
import { descriptorCentroid } from './descriptor-centroid';
import type { NormalizedStimulus, SpaceNormalization } from './types';

const NO_OFFSET: Point = [0, 0];

/** Stage: the factor that brings the shape to unit size in the chosen measure (`lib/shape`'s definitions). */
function scaleFactor(descriptor: ShapeDescriptor, scale: SpaceNormalization['scale'], centroid: Point): number {
  switch (scale) {
    case 'equal-area-radius':
      return 1 / Math.sqrt(Math.abs(descriptorArea(descriptor)) / Math.PI);
    case 'area':
      return 1 / Math.sqrt(Math.abs(descriptorArea(descriptor)));
    case 'max-radius':
      return 1 / descriptorMaxRadius(descriptor, centroid);
    case 'perimeter':
      return 1 / descriptorPerimeter(descriptor);
    case 'none':
      return 1;
  }
}

/** Stage: z ↦ s·(z − w), exact on the coefficients, keeping the family, terms and their order. */
function transform(descriptor: ShapeDescriptor, s: number, w: Point): ShapeDescriptor {
  switch (descriptor.family) {
    case 'radial':
      return { ...descriptor, baseRadius: s * descriptor.baseRadius };
    case 'elliptic':
      return {
        family: 'elliptic',
        center: [s * (descriptor.center[0] - w[0]), s * (descriptor.center[1] - w[1])],
        terms: descriptor.terms.map(({ n, a, b, c, d }) => ({ n, a: s * a, b: s * b, c: s * c, d: s * d })),
      };
    case 'complex': {
      const terms = descriptor.terms.map(({ k, re, im }) => (k === 0 ? { k, re: s * (re - w[0]), im: s * (im - w[1]) } : { k, re: s * re, im: s * im }));
      const hasCentre = descriptor.terms.some((t) => t.k === 0);
      if (!hasCentre && (w[0] !== 0 || w[1] !== 0)) terms.push({ k: 0, re: -s * w[0], im: -s * w[1] });
      return { family: 'complex', terms };
    }
  }
}

/**
 * Stage of `generateSpace`: normalises one stimulus's size and position, never its rotation, start point or
 * direction, so every stimulus stays aligned with the axes. The quantities are `lib/shape`'s — exact area
 * (`descriptorArea`), largest distance from the area centroid (`descriptorMaxRadius`), perimeter
 * (`descriptorPerimeter`) — and for counter-clockwise curves the result equals `lib/shape`'s normalisers with
 * `orientation: 'none'` (checked in the tests; they also re-trace clockwise curves, which this leaves to
 * synthesis, as it draws every curve counter-clockwise anyway), but is applied straight to the coefficients with an exact, cheap centroid
 * (`descriptorCentroid`), ~30× faster, as the live view normalises every stimulus on every slider move.
 * - Scale: unit equal-area radius √(A/π), unit area, unit largest distance from the area centroid, unit
 *   perimeter, or `none`.
 * - Centroid: the area centroid moves to the origin. Radial descriptors are drawn about their polar origin and
 *   cannot carry a translation, so for them it is returned as `contourOffset` (minus the scaled centroid).
 *   Without it, the scaling is about the frame's origin.
 * A descriptor that cannot be measured (zero area, r ≤ 0 making the measures meaningless) is returned unchanged
 * with no offset: `checkSpace` reports it, and synthesising it raises the engine's error.
 */
export function normalizeStimulus(descriptor: ShapeDescriptor, normalization: SpaceNormalization): NormalizedStimulus {
  if (normalization.scale === 'none' && !normalization.centroid) return { descriptor, contourOffset: NO_OFFSET };
  try {
    if (!(descriptorArea(descriptor) !== 0)) return { descriptor, contourOffset: NO_OFFSET };
    const centroid = descriptorCentroid(descriptor);
    const s = scaleFactor(descriptor, normalization.scale, centroid);
    if (!Number.isFinite(s) || !(s > 0) || !Number.isFinite(centroid[0]) || !Number.isFinite(centroid[1])) return { descriptor, contourOffset: NO_OFFSET };
    const shift = normalization.centroid && descriptor.family !== 'radial' ? centroid : NO_OFFSET;
    const normalized = transform(descriptor, s, shift);
    const contourOffset: Point = normalization.centroid && descriptor.family === 'radial' ? [-s * centroid[0], -s * centroid[1]] : NO_OFFSET;
    return { descriptor: normalized, contourOffset };
  } catch (error) {
    if (error instanceof ShapeError) return { descriptor, contourOffset: NO_OFFSET };
    throw error;
  }
}
