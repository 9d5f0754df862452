/**
 * Limits of a shape space.
 * - `maxStimuli`: 2,000 (the bound): a 441-stimulus space already fills a screen with thumbnails, and the
 *   audit's RDMs grow with the square of the count (2,000 stimuli → 2 million pairs).
 * - `idDigits`: every index in an id is written with at least two digits (`r03-s07`), a fixed width that does not
 *   depend on the layout's size, so an id never changes when rings or spokes are added.
 */
export const SPACE_LIMITS = {
  maxStimuli: 2000,
  idDigits: 2,
} as const;
