import type { DisplayProfile } from './types';

/**
 * Pixel density of a display, px per cm: the profile's own `pixelsPerCm`, else the horizontal resolution over
 * the physical width. NaN when neither is usable (see `checkDisplayProfile`).
 */
export function pixelsPerCm(profile: DisplayProfile): number {
  if (profile.pixelsPerCm !== null && profile.pixelsPerCm !== undefined) return profile.pixelsPerCm;
  if (profile.widthCm !== null && profile.widthCm !== undefined) return profile.resolutionPx.width / profile.widthCm;
  return Number.NaN;
}
