// lib/boundary — category boundaries across a circular shape space: diameters at an angle in degrees, signed
// distances, sides, prototypes and per-side counts. Pure and deterministic; builds on lib/space's (a, b) plane.

export type {
  Boundary,
  BoundaryPlacement,
  BoundaryPrototype,
  BoundarySide,
  BoundarySummary,
  PlaneVector,
  PositionedStimulus,
  StimulusClassification,
} from './types';
export { BoundaryError, type BoundaryErrorCode } from './boundary-error';
export { BOUNDARY_LIMITS, BOUNDARY_KEY_PATTERN, MAX_BOUNDARY_KEY_LENGTH } from './boundary-limits';
export { checkBoundaryAngle } from './check-boundary-angle';
export { checkBoundary } from './check-boundary';
export { checkBoundaries } from './check-boundaries';
export { normalizeBoundaryAngle } from './normalize-boundary-angle';
export { snapToSpokes } from './snap-to-spokes';
export { boundaryNormal } from './boundary-normal';
export { signedDistance } from './signed-distance';
export { sideOf } from './side-of';
export { classifyStimuli } from './classify-stimuli';
export { boundaryPrototypes } from './boundary-prototypes';
export { boundarySummary } from './boundary-summary';
