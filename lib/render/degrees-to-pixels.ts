import { pixelsPerCm } from './pixels-per-cm';
import { sizeForVisualAngle } from './size-for-visual-angle';
import type { DisplayProfile } from './types';

/**
 * Pixels (fractional) that a size of `degrees` spans centred on the line of sight of a display:
 * 2D·tan(θ/2)·(px/cm). Exact, not θ × pixels-per-degree, which drifts for large angles.
 */
export function degreesToPixels(degrees: number, profile: DisplayProfile): number {
  return sizeForVisualAngle(degrees, profile.viewingDistanceCm) * pixelsPerCm(profile);
}
