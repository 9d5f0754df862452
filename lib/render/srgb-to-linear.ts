/** IEC 61966-2-1 breakpoint of the encoded value between the linear segment and the power law. */
const SRGB_BREAKPOINT = 0.04045;

/**
 * Decodes one sRGB channel (IEC 61966-2-1): V in [0, 1] → linear light, V/12.92 for V ≤ 0.04045, else
 * ((V + 0.055)/1.055)^2.4. Nominal: it describes an ideal sRGB display, not a measured one.
 */
export function srgbToLinear(encoded: number): number {
  return encoded <= SRGB_BREAKPOINT ? encoded / 12.92 : ((encoded + 0.055) / 1.055) ** 2.4;
}
