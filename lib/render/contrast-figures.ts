import { relativeLuminance } from './relative-luminance';
import type { ContrastFigures, SrgbColour } from './types';

/** WCAG 2.x flare term added to both luminances of the contrast ratio. */
const FLARE = 0.05;

/**
 * Nominal contrast of a fill on a background from sRGB decoding (IEC 61966-2-1) and relative luminance:
 * luminance ratio (L1 + 0.05)/(L2 + 0.05) with L1 the lighter (WCAG 2.x), Weber (L_fill − L_bg)/L_bg and
 * Michelson (L_max − L_min)/(L_max + L_min). Computed from nominal sRGB values, not measured luminance.
 */
export function contrastFigures(fill: SrgbColour, background: SrgbColour): ContrastFigures {
  const fillLuminance = relativeLuminance(fill);
  const backgroundLuminance = relativeLuminance(background);
  const lighter = Math.max(fillLuminance, backgroundLuminance);
  const darker = Math.min(fillLuminance, backgroundLuminance);
  return {
    fillLuminance,
    backgroundLuminance,
    luminanceRatio: (lighter + FLARE) / (darker + FLARE),
    weber: backgroundLuminance === 0 ? null : (fillLuminance - backgroundLuminance) / backgroundLuminance,
    michelson: lighter + darker === 0 ? null : (lighter - darker) / (lighter + darker),
  };
}
