import { pixelsPerCm } from './pixels-per-cm';
import { sizeForVisualAngle } from './size-for-visual-angle';
import type { DisplayProfile } from './types';

/**
 * Pixels per degree at the centre of the screen: the pixels spanned by 1° centred on the line of sight,
 * 2D·tan(0.5°)·(px/cm), D the viewing distance in cm (θ = 2·atan(S / 2D)). Away from the centre a degree
 * spans more pixels; stimuli are drawn at the centre.
 */
export function pixelsPerDegree(profile: DisplayProfile): number {
  return sizeForVisualAngle(1, profile.viewingDistanceCm) * pixelsPerCm(profile);
}
