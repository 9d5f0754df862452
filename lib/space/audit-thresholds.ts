import type { AuditThresholds } from './types';

/**
 * Default thresholds of the confound audit (common practice, not published limits; every one can be changed
 * per audit):
 * - area, perimeter, compactness CV 5 %: a spread that small is hard to use as a cue on its own, while a larger
 *   one is the first thing a reviewer of a shape study asks to see controlled;
 * - Spearman ρ 0.7 between each pair of RDMs: below it, designed, contour and silhouette distances rank the pairs
 *   differently enough that the design's similarity structure is not what the outlines or pixels show;
 * - spacing CV 10 %: neighbours along a spoke or diameter should be about equally far apart in contour distance;
 * - anisotropy 1.1: contour distance should not grow more than 10 % faster in one direction than in another
 *   (equalisation brings it to ~1).
 */
export const DEFAULT_AUDIT_THRESHOLDS: AuditThresholds = {
  areaCv: 0.05,
  perimeterCv: 0.05,
  compactnessCv: 0.05,
  designContour: 0.7,
  designSilhouette: 0.7,
  contourSilhouette: 0.7,
  spacingCv: 0.1,
  anisotropy: 1.1,
};
