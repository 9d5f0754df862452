import type { SpacePosition } from '../space/types';

/**
 * A category boundary: a diameter of the circular space, through the centre, at `angleDeg` degrees
 * counter-clockwise from +a (Axis A) towards +b (Axis B), in [0, 180) — a diameter at θ and at θ + 180° is the
 * same line, so the range is half a turn. Its normal points at θ + 90°; side 'A' is the side the normal points
 * to (see `boundaryNormal`, `signedDistance`).
 */
export interface Boundary {
  /** Stable key, lowercase letters, digits and hyphens (`BOUNDARY_KEY_PATTERN`); names the prototypes' ids. */
  readonly key: string;
  readonly label?: string;
  /** Degrees in [0, 180). */
  readonly angleDeg: number;
  /** Distance of the prototypes from the centre along the normal, in axis units; default 0.75·ρmax. */
  readonly prototypeDistance?: number;
}

/** The side of a boundary a position lies on: 'A' along the normal, 'B' against it, 'on' within the tolerance. */
export type BoundarySide = 'A' | 'B' | 'on';

/** A unit vector in the (a, b) plane. */
export interface PlaneVector {
  readonly a: number;
  readonly b: number;
}

/** Anything with an id and a position in the space, such as a `Stimulus`. */
export interface PositionedStimulus {
  readonly id: string;
  readonly position: SpacePosition;
}

/** Where one stimulus lies with respect to one boundary. */
export interface BoundaryPlacement {
  readonly boundaryKey: string;
  readonly side: BoundarySide;
  /** Signed distance in axis units, positive on side 'A'. */
  readonly distance: number;
  /** `distance` / ρmax, in [−1, 1] for stimuli inside the space. */
  readonly fraction: number;
  /** True on the boundary (side 'on'): the stimulus belongs to neither category. */
  readonly isAmbiguous: boolean;
}

/** Where one stimulus lies with respect to each boundary, in the order of the boundaries. */
export interface StimulusClassification {
  readonly id: string;
  readonly placements: readonly BoundaryPlacement[];
}

/** One category prototype: an extra stimulus at ±d along a boundary's normal. */
export interface BoundaryPrototype {
  /** `p-<boundaryKey>-a` (side 'A', at +d·normal) or `p-<boundaryKey>-b` (side 'B', at −d·normal). */
  readonly id: string;
  readonly boundaryKey: string;
  readonly side: 'A' | 'B';
  readonly position: SpacePosition;
  /** d, axis units. */
  readonly distance: number;
}

/** Counts per side of one boundary and how even they are. */
export interface BoundarySummary {
  readonly boundaryKey: string;
  readonly countA: number;
  readonly countB: number;
  readonly countOn: number;
  /**
   * (countA − countB) / (countA + countB), in [−1, 1]: 0 is balanced, +1 all on side 'A', −1 all on side 'B';
   * stimuli on the boundary do not count. Null when no stimulus is off the boundary.
   */
  readonly balance: number | null;
}
