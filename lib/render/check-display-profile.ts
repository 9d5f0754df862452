import { RENDER_LIMITS } from './render-limits';
import type { DisplayProfile, RenderIssue } from './types';

const isPositiveNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value) && value > 0;
const isPresent = (value: unknown): boolean => value !== null && value !== undefined;

/**
 * Every problem with a display profile, as field-level issues (empty when it is usable): a name, a whole-pixel
 * resolution, exactly one of physical width (cm) and px/cm, each > 0, and a viewing distance > 0 cm
 * (≤ 100 m). Takes `unknown` fields at run time, so forms can show the messages before the profile is complete.
 */
export function checkDisplayProfile(profile: DisplayProfile): RenderIssue[] {
  const issues: RenderIssue[] = [];
  if (typeof profile.name !== 'string' || profile.name.trim() === '') {
    issues.push({ field: 'name', code: 'name-missing', message: 'Give the display profile a name.' });
  }
  const { width, height } = profile.resolutionPx ?? { width: Number.NaN, height: Number.NaN };
  for (const [field, value] of [['resolutionPx.width', width], ['resolutionPx.height', height]] as const) {
    if (!Number.isInteger(value) || value < 1 || value > RENDER_LIMITS.maxResolutionPx) {
      issues.push({ field, code: 'resolution-invalid', message: `The screen resolution is a whole number of pixels from 1 to ${RENDER_LIMITS.maxResolutionPx}; got ${String(value)}.` });
    }
  }
  const hasWidth = isPresent(profile.widthCm);
  const hasDensity = isPresent(profile.pixelsPerCm);
  if (!hasWidth && !hasDensity) {
    issues.push({ field: 'widthCm', code: 'pitch-missing', message: 'Give the physical screen width in cm, or the pixels per cm.' });
  } else if (hasWidth && hasDensity) {
    issues.push({ field: 'pixelsPerCm', code: 'pitch-ambiguous', message: 'Give either the physical screen width or the pixels per cm, not both.' });
  } else if (hasWidth && !isPositiveNumber(profile.widthCm)) {
    issues.push({ field: 'widthCm', code: 'pitch-invalid', message: `The physical screen width must be above 0 cm; got ${String(profile.widthCm)}.` });
  } else if (hasDensity && !isPositiveNumber(profile.pixelsPerCm)) {
    issues.push({ field: 'pixelsPerCm', code: 'pitch-invalid', message: `The pixels per cm must be above 0; got ${String(profile.pixelsPerCm)}.` });
  }
  const distance = profile.viewingDistanceCm;
  if (!isPositiveNumber(distance) || distance > RENDER_LIMITS.maxDistanceCm) {
    issues.push({
      field: 'viewingDistanceCm',
      code: 'distance-invalid',
      message: `The viewing distance must be above 0 cm (and at most ${RENDER_LIMITS.maxDistanceCm} cm); got ${String(distance)}.`,
    });
  }
  return issues;
}
