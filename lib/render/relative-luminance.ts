import { parseSrgbColourOrThrow } from './parse-srgb-colour';
import { srgbToLinear } from './srgb-to-linear';
import type { SrgbColour } from './types';

/** Largest 8-bit channel value. */
const MAX_LEVEL = 255;

/**
 * Relative luminance of an sRGB colour (WCAG 2.x, Rec. 709 primaries): L = 0.2126R + 0.7152G + 0.0722B of the
 * linear channels (`srgbToLinear`), 0 for black to 1 for white. Nominal sRGB, not a photometer reading.
 */
export function relativeLuminance(colour: SrgbColour): number {
  const { r, g, b } = parseSrgbColourOrThrow(colour);
  return 0.2126 * srgbToLinear(r / MAX_LEVEL) + 0.7152 * srgbToLinear(g / MAX_LEVEL) + 0.0722 * srgbToLinear(b / MAX_LEVEL);
}
