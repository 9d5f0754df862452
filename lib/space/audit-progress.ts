/**
 * Where the audit's progress stands after each phase, as fractions of the whole. Shares follow measured time on
 * a 441-stimulus Rings space (scripts/bench-space.ts): outlines and spectra are quick, the contour and silhouette
 * RDMs take most of it, the rest is small.
 */
export const AUDIT_PROGRESS = {
  prepared: 0.05,
  contour: 0.5,
  silhouette: 0.9,
  correlations: 0.97,
} as const;
