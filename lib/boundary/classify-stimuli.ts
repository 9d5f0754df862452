import { BOUNDARY_LIMITS } from './boundary-limits';
import { checkBoundaries } from './check-boundaries';
import { checkExtent } from './check-extent';
import { signedDistance } from './signed-distance';
import type { Boundary, BoundaryPlacement, PositionedStimulus, StimulusClassification } from './types';

/**
 * Where every stimulus lies with respect to every boundary: side ('A' along the normal, 'B' against it, 'on'
 * within `BOUNDARY_LIMITS.onTolerance` — ambiguous), signed distance in axis units and as a fraction of ρmax
 * (`extent`, axis units, > 0). Stimuli and boundaries keep their order. Throws `BoundaryError` for a bad
 * boundary, a repeated key or a bad extent.
 */
export function classifyStimuli(
  stimuli: readonly PositionedStimulus[],
  boundaries: readonly Boundary[],
  extent: number,
): readonly StimulusClassification[] {
  checkBoundaries(boundaries);
  checkExtent(extent);
  const tolerance = BOUNDARY_LIMITS.onTolerance;
  return stimuli.map((stimulus) => ({
    id: stimulus.id,
    placements: boundaries.map((boundary): BoundaryPlacement => {
      const distance = signedDistance(stimulus.position, boundary);
      const side = distance > tolerance ? 'A' : distance < -tolerance ? 'B' : 'on';
      return { boundaryKey: boundary.key, side, distance, fraction: distance / extent, isAmbiguous: side === 'on' };
    }),
  }));
}
