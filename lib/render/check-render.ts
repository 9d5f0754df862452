import { checkDisplayProfile } from './check-display-profile';
import { contrastFigures } from './contrast-figures';
import { degreesToPixels } from './degrees-to-pixels';
import { parseSrgbColour } from './parse-srgb-colour';
import { pixelsPerCm } from './pixels-per-cm';
import { pixelsPerDegree } from './pixels-per-degree';
import { RENDER_LIMITS } from './render-limits';
import type { ContrastFigures, DerivedSizes, DisplayProfile, RenderCheck, RenderIssue, RenderOptions } from './types';

const SIZE_MEASURES: ReadonlySet<unknown> = new Set(['equal-area-diameter', 'max-extent']);
const STYLES: ReadonlySet<unknown> = new Set(['silhouette', 'outline']);
/** Visual angles at or beyond a half-turn have no size on a flat screen. */
const MAX_DEGREES = 180;
const MM_PER_CM = 10;

const isPositiveNumber = (value: unknown): value is number => typeof value === 'number' && Number.isFinite(value) && value > 0;

/** Stage: issues of the options alone (types and ranges), before any size is derived. */
function optionIssues(options: RenderOptions): RenderIssue[] {
  const issues: RenderIssue[] = [];
  for (const field of ['sizeDeg', 'canvasDeg'] as const) {
    const value = options[field];
    if (!isPositiveNumber(value) || value >= MAX_DEGREES) {
      issues.push({ field, code: 'size-invalid', message: `${field === 'sizeDeg' ? 'The stimulus size' : 'The canvas size'} must be above 0° and below 180° of visual angle; got ${String(value)}.` });
    }
  }
  if (!SIZE_MEASURES.has(options.sizeMeasure)) {
    issues.push({ field: 'sizeMeasure', code: 'measure-invalid', message: 'The size measures either the equal-area diameter or the maximum extent.' });
  }
  if (!STYLES.has(options.style)) {
    issues.push({ field: 'style', code: 'style-invalid', message: 'A stimulus is drawn as a filled silhouette or as an outline.' });
  } else if (options.style === 'outline' && !isPositiveNumber(options.strokeArcmin)) {
    issues.push({ field: 'strokeArcmin', code: 'stroke-invalid', message: `An outline needs a stroke width above 0 arc-minutes; got ${String(options.strokeArcmin)}.` });
  }
  for (const field of ['fill', 'background'] as const) {
    if (!parseSrgbColour(options[field])) {
      issues.push({ field, code: 'colour-invalid', message: `The ${field} colour must be #rrggbb or a grey level from 0 to 255; got ${String(options[field])}.` });
    }
  }
  for (const field of ['antiAlias', 'transparent'] as const) {
    if (typeof options[field] !== 'boolean') issues.push({ field, code: 'flag-invalid', message: `${field} is on or off (true or false).` });
  }
  const { minSamples, maxSamples } = RENDER_LIMITS;
  if (!Number.isInteger(options.samples) || options.samples < minSamples || options.samples > maxSamples) {
    issues.push({ field: 'samples', code: 'samples-invalid', message: `Contour samples are a whole number from ${minSamples} to ${maxSamples}; got ${String(options.samples)}.` });
  }
  return issues;
}

/** Stage: the sizes in pixels, with the issues of too small or too large a result. */
function deriveSizes(profile: DisplayProfile, options: RenderOptions): { sizes: DerivedSizes; issues: RenderIssue[] } {
  const { minPx, maxPx } = RENDER_LIMITS;
  const stimulusPx = degreesToPixels(options.sizeDeg, profile);
  const canvasPx = Math.round(degreesToPixels(options.canvasDeg, profile));
  const strokePx = options.style === 'outline' ? degreesToPixels((options.strokeArcmin ?? 0) / 60, profile) : 0;
  const density = pixelsPerCm(profile);
  const sizes: DerivedSizes = {
    pixelsPerCm: density,
    pixelsPerDegree: pixelsPerDegree(profile),
    stimulusPx,
    canvasPx,
    canvasMm: (canvasPx / density) * MM_PER_CM,
    strokePx,
  };
  const issues: RenderIssue[] = [];
  const shown = (px: number): string => px.toFixed(1);
  if (stimulusPx < minPx) {
    issues.push({ field: 'sizeDeg', code: 'size-too-small', message: `${options.sizeDeg}° is ${shown(stimulusPx)} px on this display; a stimulus needs at least ${minPx} px.` });
  }
  if (stimulusPx > maxPx) {
    issues.push({ field: 'sizeDeg', code: 'size-too-large', message: `${options.sizeDeg}° is ${shown(stimulusPx)} px on this display; at most ${maxPx} px.` });
  }
  if (canvasPx < minPx) {
    issues.push({ field: 'canvasDeg', code: 'size-too-small', message: `A canvas of ${options.canvasDeg}° is ${canvasPx} px on this display; at least ${minPx} px.` });
  } else if (canvasPx > maxPx) {
    issues.push({ field: 'canvasDeg', code: 'size-too-large', message: `A canvas of ${options.canvasDeg}° is ${canvasPx} px on this display; images are at most ${maxPx} px a side.` });
  }
  if (options.canvasDeg < options.sizeDeg) {
    issues.push({ field: 'canvasDeg', code: 'canvas-too-small', message: `The canvas (${options.canvasDeg}°) must be at least the stimulus size (${options.sizeDeg}°).` });
  }
  return { sizes, issues };
}

/** Stage: the zero-contrast warning. */
function contrastWarnings(contrast: ContrastFigures): RenderIssue[] {
  if (contrast.fillLuminance !== contrast.backgroundLuminance) return [];
  return [{
    field: 'fill',
    code: 'zero-contrast',
    message: 'Fill and background have the same nominal luminance: there is no luminance contrast (the shape shows only by colour, or not at all if the colours are equal).',
  }];
}

/**
 * Checks a display profile and render options together and derives what follows from them: px/cm, pixels per
 * degree, the stimulus size and the square PNG side in pixels (θ = 2·atan(S / 2D), S = 2D·tan(θ/2)), the canvas
 * in mm, the outline stroke in pixels (arc-minutes / 60 → degrees → px), and the nominal sRGB contrast. Errors:
 * any `checkDisplayProfile` issue; a size under 8 px or over 4096 px (`RENDER_LIMITS`); a canvas smaller than the
 * stimulus; a bad measure, style, stroke, colour, flag or sample count. Warning: zero luminance contrast. Pure.
 */
export function checkRender(profile: DisplayProfile, options: RenderOptions): RenderCheck {
  const errors: RenderIssue[] = [...checkDisplayProfile(profile).map((i) => ({ ...i, field: `profile.${i.field}` })), ...optionIssues(options)];
  const fill = parseSrgbColour(options.fill);
  const background = parseSrgbColour(options.background);
  const contrast = fill && background ? contrastFigures(fill.hex, background.hex) : null;
  const warnings = contrast ? contrastWarnings(contrast) : [];
  // Sizes need a sound profile and sound numbers; a broken style or colour does not stop them.
  const sizeFields = new Set(['sizeDeg', 'canvasDeg', 'strokeArcmin']);
  const canDerive = !errors.some((i) => i.field.startsWith('profile.') || sizeFields.has(i.field));
  let sizes: DerivedSizes | null = null;
  if (canDerive) {
    const derived = deriveSizes(profile, options);
    sizes = derived.sizes;
    errors.push(...derived.issues);
  }
  return { ok: errors.length === 0, errors, warnings, sizes, contrast };
}
