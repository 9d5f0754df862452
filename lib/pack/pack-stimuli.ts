import { boundaryPrototypes } from '../boundary/boundary-prototypes';
import type { Boundary } from '../boundary/types';
import { cartesianToPolar } from '../space/cartesian-to-polar';
import { compileAxes } from '../space/compile-axes';
import { equalizationMap } from '../space/equalization-map';
import { generateSpace } from '../space/generate-space';
import { normalizeStimulus } from '../space/normalize-stimulus';
import type { PolarPosition, SpaceDefinition, SpacePosition } from '../space/types';
import type { Point, ShapeDescriptor } from '../shape/types';

/** A stimulus of a pack: a layout position or a category prototype, with its normalised descriptor. */
export interface PackStimulus {
  readonly id: string;
  readonly kind: 'layout' | 'prototype';
  readonly prototypeOf: { readonly boundaryKey: string; readonly side: 'A' | 'B' } | null;
  readonly position: SpacePosition;
  readonly polar: PolarPosition;
  readonly descriptor: ShapeDescriptor;
  readonly contourOffset: Point;
}

/**
 * The stimuli of a pack: the space's layout stimuli in layout order (`generateSpace`), then each boundary's two
 * prototypes (`boundaryPrototypes`, side A then B), made exactly as layout stimuli are — seed + a′·axisA +
 * b′·axisB with the equalisation's stretch, then normalised (`normalizeStimulus`). Raises `SpaceError` or
 * `BoundaryError` for definitions or boundaries that cannot be generated.
 */
export function packStimuli(definition: SpaceDefinition, boundaries: readonly Boundary[]): PackStimulus[] {
  const layout = generateSpace(definition).stimuli.map(
    (s): PackStimulus => ({ id: s.id, kind: 'layout', prototypeOf: null, position: s.position, polar: s.polar, descriptor: s.descriptor, contourOffset: s.contourOffset }),
  );
  const descriptorAt = compileAxes(definition.seed, definition.axes);
  const mapRadius = equalizationMap(definition.equalization);
  const prototypes = boundaries.flatMap((boundary) =>
    boundaryPrototypes(boundary, definition.extent).map((p): PackStimulus => {
      const polar = cartesianToPolar(p.position);
      // The same stretch generateSpace applies, so a prototype on a layout position is that stimulus.
      const stretch = polar.rho === 0 || !definition.equalization ? 1 : mapRadius(polar.rho, polar.angle) / polar.rho;
      const { descriptor, contourOffset } = normalizeStimulus(descriptorAt(p.position.a * stretch, p.position.b * stretch), definition.normalization);
      return { id: p.id, kind: 'prototype', prototypeOf: { boundaryKey: p.boundaryKey, side: p.side }, position: p.position, polar, descriptor, contourOffset };
    }),
  );
  return [...layout, ...prototypes];
}
