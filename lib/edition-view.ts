// Client-safe helpers for edition pages: outlines of frozen stimuli, short hashes, state badges.
import { thumbnailPath } from './shape/measure-shape';
import type { ShapeDescriptor } from './shape/types';
import { stimulusContour } from './space/stimulus-contour';
import type { Stimulus } from './space/types';
import type { EditionState } from './schemas/edition';

interface FrozenStimulus {
  descriptor: unknown;
  contourOffset: readonly [number, number];
}

/** SVG path data (shape units, y flipped) of a frozen stimulus, or null when the engine refuses it. */
export function frozenPath(stimulus: FrozenStimulus, samples = 128): string | null {
  try {
    const s = { descriptor: stimulus.descriptor as ShapeDescriptor, contourOffset: stimulus.contourOffset } as unknown as Stimulus;
    return thumbnailPath(stimulusContour(s, samples));
  } catch {
    return null;
  }
}

export const shortHash = (hash: string) => hash.slice(0, 12);

/** Badge classes per state: words carry the meaning, colour only supports it. */
export const STATE_BADGE: Record<EditionState, string> = {
  draft: 'border-rule-strong text-graphite-soft',
  in_review: 'border-caution text-graphite',
  approved: 'border-accent bg-accent-soft text-graphite',
  returned: 'border-danger text-graphite',
};
