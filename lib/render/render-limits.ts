/**
 * Limits of rendering.
 * - `minPx` 8: below eight pixels across, a shape is a blob of edge pixels and its outline cannot be judged.
 * - `maxPx` 4096: the largest canvas side; larger images exceed common GPU texture limits of experiment software
 *   and a 1,000-stimulus pack would run to gigabytes.
 * - `minSamples` / `maxSamples`: `lib/shape`'s synthesis range.
 * - `maxDistanceCm` 10,000 (100 m): anything beyond is a typing error, not a display.
 */
export const RENDER_LIMITS = {
  minPx: 8,
  maxPx: 4096,
  minSamples: 64,
  maxSamples: 8192,
  maxDistanceCm: 10_000,
  maxResolutionPx: 65_536,
} as const;
