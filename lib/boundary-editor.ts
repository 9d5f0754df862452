// Client-safe helpers for the boundary panel: colours by side, angles from the pointer, keys for new boundaries.
import { classifyStimuli } from './boundary/classify-stimuli';
import { boundarySummary } from './boundary/boundary-summary';
import { normalizeBoundaryAngle } from './boundary/normalize-boundary-angle';
import { snapToSpokes } from './boundary/snap-to-spokes';
import type { Boundary, BoundarySide, BoundarySummary, StimulusClassification } from './boundary/types';
import type { PositionedStimulus } from './boundary/types';
import type { BoundaryValue } from './schemas/boundary';

/** Okabe & Ito's colour-blind-safe pair for the two sides; stimuli on the boundary stay neutral. */
export const SIDE_COLOURS: Record<BoundarySide, string> = { A: '#D55E00', B: '#0072B2', on: '#8A8780' };
export const SIDE_NAMES: Record<BoundarySide, string> = { A: 'side A', B: 'side B', on: 'on the boundary' };

/** The core's boundary from a stored or edited one. */
export function toCoreBoundary(b: BoundaryValue): Boundary {
  return { key: b.key, ...(b.label ? { label: b.label } : {}), angleDeg: b.angleDeg, ...(b.prototypeDistance === null ? {} : { prototypeDistance: b.prototypeDistance }) };
}

/** Classification of every stimulus by every boundary, or null while a boundary is invalid (mid-edit). */
export function classify(stimuli: readonly PositionedStimulus[], boundaries: readonly BoundaryValue[], extent: number): readonly StimulusClassification[] | null {
  try {
    return classifyStimuli(stimuli, boundaries.map(toCoreBoundary), extent);
  } catch {
    return null;
  }
}

export function summarize(stimuli: readonly PositionedStimulus[], boundary: BoundaryValue, extent: number): BoundarySummary | null {
  try {
    return boundarySummary(stimuli, toCoreBoundary(boundary), extent);
  } catch {
    return null;
  }
}

/**
 * The boundary angle (degrees, [0, 180)) of the diameter through the centre and a pointer at (dx, dy) CSS px
 * from it (y down on screen, b up in the space), snapped to the spokes of a Rings layout when asked.
 */
export function angleFromPointer(dx: number, dy: number, snapSpokes: number | null): number {
  const deg = normalizeBoundaryAngle((Math.atan2(-dy, dx) * 180) / Math.PI);
  const snapped = snapSpokes ? snapToSpokes(deg, snapSpokes) : deg;
  return Math.round(snapped * 100) / 100;
}

/** Turns a boundary by `delta` degrees, wrapping into [0, 180). */
export function turn(angleDeg: number, delta: number): number {
  return Math.round(normalizeBoundaryAngle(angleDeg + delta) * 100) / 100;
}

/** The next free key `boundary-N`. */
export function nextBoundaryKey(existing: readonly BoundaryValue[]): string {
  for (let i = 1; ; i++) if (!existing.some((b) => b.key === `boundary-${i}`)) return `boundary-${i}`;
}
