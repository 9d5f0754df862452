/**
 * The participant's screen check in numbers: pixels per millimetre from a card held to the screen, and the
 * viewing distance from where a sweeping dot vanishes into the blind spot. Pure; the component measures, this
 * computes.
 */

/** ID-1 card (ISO/IEC 7810): 85.60 × 53.98 mm. */
export const CARD_WIDTH_MM = 85.6;
export const CARD_HEIGHT_MM = 53.98;
/**
 * Angle between fixation and the centre of the blind spot, 15.5° temporal (Rohrschneider 2004, IOVS 45:3257), as
 * used by blind-spot distance estimates in the browser (Li, Joo, Yeatman & Reinecke 2020).
 */
export const BLIND_SPOT_DEG = 15.5;
/** Typed or estimated distances outside this range (cm) are refused as implausible for a desk screen. */
export const DISTANCE_RANGE_CM = { min: 20, max: 200 } as const;

/** Screen pixels per millimetre when a card `cardWidthPx` wide on screen matches the real card. */
export function pixelsPerMm(cardWidthPx: number): number {
  return cardWidthPx / CARD_WIDTH_MM;
}

/**
 * Viewing distance (cm) from the on-screen separations (px) between the fixation mark and the dot at the moment
 * it vanished, one per sweep: D = s / tan 15.5°, s the mean separation in mm. Null without a sweep.
 */
export function distanceFromBlindSpotCm(separationsPx: readonly number[], pxPerMm: number): number | null {
  if (separationsPx.length === 0 || !(pxPerMm > 0)) return null;
  const meanMm = separationsPx.reduce((sum, s) => sum + s, 0) / separationsPx.length / pxPerMm;
  return meanMm / Math.tan((BLIND_SPOT_DEG * Math.PI) / 180) / 10;
}

/** Whether a distance (cm) is one the session accepts. */
export function isPlausibleDistanceCm(cm: number | null): cm is number {
  return cm !== null && Number.isFinite(cm) && cm >= DISTANCE_RANGE_CM.min && cm <= DISTANCE_RANGE_CM.max;
}
