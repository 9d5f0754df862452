/**
 * Stream numbers for `deriveSeed(studySeed, participant, stream)`: each part of a plan draws from its own
 * stream, so changing one task's settings never changes the draws of the other.
 */
export const STREAM_CATEGORISATION = 1;
export const STREAM_SIMILARITY = 2;
