import { pixelsPerCm } from './pixels-per-cm';
import { visualAngle } from './visual-angle';
import type { DisplayProfile } from './types';

/** Visual angle, degrees, of `pixels` centred on the line of sight of a display: 2·atan((px / (px/cm)) / 2D). */
export function pixelsToDegrees(pixels: number, profile: DisplayProfile): number {
  return visualAngle(pixels / pixelsPerCm(profile), profile.viewingDistanceCm);
}
