/**
 * Where the audit's progress stands after each phase, as fractions of the whole. Shares follow measured time on
 * 441-stimulus Rings spaces (radial and elliptic seeds, ~1.2 s in all): checking every stimulus ~15 %, metrics,
 * spectra and outlines ~15 %, the contour RDM ~15 %, the silhouette RDM ~40 %, the three Spearman correlations
 * ~12 %, spacing and anisotropy the rest.
 */
export const AUDIT_PROGRESS = {
  checked: 0.15,
  prepared: 0.3,
  contour: 0.45,
  silhouette: 0.85,
  correlations: 0.97,
} as const;
