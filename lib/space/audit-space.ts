import { anisotropyMeasure } from './anisotropy-measure';
import { AUDIT_PROGRESS } from './audit-progress';
import { DEFAULT_AUDIT_THRESHOLDS } from './audit-thresholds';
import { centreStimulus } from './centre-stimulus';
import { checkSpace } from './check-space';
import { correlationMeasure } from './correlation-measure';
import { descriptorSpectrum } from './descriptor-spectrum';
import { designRdm } from './design-rdm';
import { generateSpace } from './generate-space';
import { layoutRays } from './layout-rays';
import { lineSpacing } from './line-spacing';
import { rayGrowth } from './ray-growth';
import { DEFAULT_SILHOUETTE_RESOLUTION, silhouetteRdm } from './silhouette-rdm';
import { SpaceError } from './space-error';
import { spacingMeasure } from './spacing-measure';
import { spectrumRdm } from './spectrum-rdm';
import { spreadMeasure } from './spread-measure';
import { stimulusContour } from './stimulus-contour';
import { stimulusMetrics } from './stimulus-metrics';
import type { AuditMeasure, AuditThresholds, ConfoundAudit, SpaceDefinition } from './types';

/** Default samples per outline for the silhouettes: the live view's own thumbnails. */
const DEFAULT_AUDIT_SAMPLES = 256;

/** Options of `auditSpace`. */
export interface AuditOptions {
  /** Samples per outline for rasterising silhouettes (default 256). */
  readonly samples?: number;
  /** Silhouette raster, pixels per side (default 256). */
  readonly resolution?: number;
  /** Overrides of `DEFAULT_AUDIT_THRESHOLDS`. */
  readonly thresholds?: Partial<AuditThresholds>;
  /** Called with the fraction done, in [0, 1], non-decreasing, ending with 1 (for a web worker's progress bar). */
  readonly onProgress?: (fraction: number) => void;
}

/** A progress callback for the part of the work between `from` and `to`. */
function stage(onProgress: ((fraction: number) => void) | undefined, from: number, to: number): ((fraction: number) => void) | undefined {
  return onProgress && ((fraction) => onProgress(from + (to - from) * fraction));
}

/**
 * The confound audit of a shape space: the low-level differences a reviewer of a vision study asks about, each
 * with a threshold and a plain-language flag.
 * - Spread of area, perimeter and compactness (`stimulusMetrics`, exact from the descriptors) as coefficients
 *   of variation.
 * - Three RDMs: designed distance in (a, b) (`designRdm`), contour distance (RMS corresponding-point distance
 *   after the best translation, rotation and start point, exact from the descriptors: `spectrumRdm` of
 *   `descriptorSpectrum`s), silhouette distance (1 − IoU on a common raster at `resolution`, outlines at
 *   `samples`: `silhouetteRdm`); Spearman's ρ between each pair.
 * - Spacing uniformity: along every spoke, diameter or lattice line through the centre (`layoutRays`), the CV of
 *   the contour distances between neighbours.
 * - Anisotropy: the largest / smallest least-squares rate (through the origin) at which contour distance from the
 *   centre grows with designed ρ, across the layout's rays (lattice: the eight compass directions for odd n,
 *   the four diagonals for even n).
 * Raises `SpaceError` (`invalid-space`) unless `checkSpace` passes. `onProgress` is called as the work proceeds.
 */
export function auditSpace(definition: SpaceDefinition, options: AuditOptions = {}): ConfoundAudit {
  const samples = options.samples ?? DEFAULT_AUDIT_SAMPLES;
  const resolution = options.resolution ?? DEFAULT_SILHOUETTE_RESOLUTION;
  const thresholds: AuditThresholds = { ...DEFAULT_AUDIT_THRESHOLDS, ...options.thresholds };
  const report = options.onProgress;
  // Phase 1: a valid space, its stimuli, outlines, metrics and spectra.
  const check = checkSpace(definition);
  if (!check.ok) throw new SpaceError('invalid-space', `the space has problems to fix before an audit: ${check.failures.map((f) => `${f.id}: ${f.reason}`).join('; ')}`, check.failures);
  report?.(AUDIT_PROGRESS.checked);
  const { stimuli } = generateSpace(definition);
  const metrics = stimuli.map(stimulusMetrics);
  const spectra = stimuli.map((s) => descriptorSpectrum(s.descriptor));
  const contours = stimuli.map((s) => stimulusContour(s, samples));
  report?.(AUDIT_PROGRESS.prepared);
  // Phase 2: the three RDMs.
  const design = designRdm(stimuli);
  const contour = spectrumRdm(spectra, { onProgress: stage(report, AUDIT_PROGRESS.prepared, AUDIT_PROGRESS.contour) });
  const silhouette = silhouetteRdm(contours, { resolution, onProgress: stage(report, AUDIT_PROGRESS.contour, AUDIT_PROGRESS.silhouette) });
  // Phase 3: correlations, spacing, anisotropy.
  const correlations = {
    designContour: correlationMeasure(contour, design, ['contour', 'designed'], thresholds.designContour),
    designSilhouette: correlationMeasure(silhouette, design, ['silhouette', 'designed'], thresholds.designSilhouette),
    contourSilhouette: correlationMeasure(contour, silhouette, ['contour', 'silhouette'], thresholds.contourSilhouette),
  };
  report?.(AUDIT_PROGRESS.correlations);
  const geometry = layoutRays(definition.layout, stimuli);
  const spectrumOf = (i: number) => spectra[i] as (typeof spectra)[number];
  const centre = descriptorSpectrum(centreStimulus(definition).descriptor);
  const spacing = spacingMeasure(geometry.lines.map((line) => lineSpacing(line, stimuli, spectrumOf)), thresholds.spacingCv);
  const anisotropy = anisotropyMeasure(geometry.rays.map((ray) => rayGrowth(ray, stimuli, spectrumOf, centre)), thresholds.anisotropy);
  const spread = {
    area: spreadMeasure('area', metrics.map((m) => m.area), thresholds.areaCv),
    perimeter: spreadMeasure('perimeter', metrics.map((m) => m.perimeter), thresholds.perimeterCv),
    compactness: spreadMeasure('compactness', metrics.map((m) => m.compactness), thresholds.compactnessCv),
  };
  const panel: [string, AuditMeasure][] = [
    ['area', spread.area],
    ['perimeter', spread.perimeter],
    ['compactness', spread.compactness],
    ['designContour', correlations.designContour],
    ['designSilhouette', correlations.designSilhouette],
    ['contourSilhouette', correlations.contourSilhouette],
    ['spacing', spacing],
    ['anisotropy', anisotropy],
  ];
  report?.(1);
  return {
    count: stimuli.length,
    ids: stimuli.map((s) => s.id),
    samples,
    resolution,
    thresholds,
    ...spread,
    rdms: { design, contour, silhouette },
    correlations,
    spacing,
    anisotropy,
    flags: panel.filter(([, m]) => m.flagged).map(([measure, m]) => ({ measure, message: m.message })),
  };
}
