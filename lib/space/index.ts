// lib/space — shape spaces: axes in descriptor space, Rings / Lattice / Diameters layouts, stimuli, model RDMs,
// the confound audit and equalisation. Pure and deterministic, built on lib/shape; the browser and its web
// workers run the same code.

export type {
  AuditMeasure,
  AuditThresholds,
  AxisChange,
  AxisMap,
  ConfoundAudit,
  ContourSpectrum,
  Equalization,
  EqualizationKnot,
  LayoutLine,
  LayoutPoint,
  LayoutPosition,
  LayoutRay,
  LineSpacing,
  NormalizedStimulus,
  PolarPosition,
  RadiusMap,
  RayGrowth,
  Rdm,
  RdmRows,
  SpaceAxis,
  SpaceCheck,
  SpaceDefinition,
  SpaceFailure,
  SpaceFailureCode,
  SpaceLayout,
  SpaceNormalization,
  SpacePosition,
  Spread,
  SpreadMeasure,
  Stimulus,
  StimulusMetrics,
} from './types';
export { SpaceError, type SpaceErrorCode } from './space-error';
export { SPACE_LIMITS } from './space-limits';

// Coordinates, layouts and ids
export { polarToCartesian } from './polar-to-cartesian';
export { cartesianToPolar } from './cartesian-to-polar';
export { wrapAngle } from './wrap-angle';
export { countStimuli } from './count-stimuli';
export { stimulusId } from './stimulus-id';
export { layoutPoints } from './layout-points';
export { layoutRays } from './layout-rays';

// Definitions and stimuli
export { AXIS_FIELDS } from './axis-fields';
export { compileAxes } from './compile-axes';
export { normalizeStimulus } from './normalize-stimulus';
export { equalizationMap } from './equalization-map';
export { centreStimulus } from './centre-stimulus';
export { stimulusAt } from './stimulus-at';
export { generateSpace } from './generate-space';
export { checkDefinition } from './check-definition';
export { checkSpace } from './check-space';
export { isDrawableFailure } from './is-drawable-failure';
export { stimulusContour, type StimulusContourOptions } from './stimulus-contour';
export { stimulusMetrics } from './stimulus-metrics';

// Distances and RDMs
export { contourSpectrum } from './contour-spectrum';
export { descriptorSpectrum } from './descriptor-spectrum';
export { descriptorCentroid } from './descriptor-centroid';
export { shiftGrid } from './shift-grid';
export { spectrumDistance } from './spectrum-distance';
export { contourDistance } from './contour-distance';
export { designRdm } from './design-rdm';
export { contourRdm } from './contour-rdm';
export { spectrumRdm } from './spectrum-rdm';
export { silhouetteRdm, DEFAULT_SILHOUETTE_RESOLUTION, type SilhouetteRdmOptions } from './silhouette-rdm';
export { silhouetteExtent } from './silhouette-extent';
export { silhouetteRdmRows } from './silhouette-rdm-rows';
export { spectrumRdmRows } from './spectrum-rdm-rows';
export { splitRdmRows } from './split-rdm-rows';
export { rdmFromRows } from './rdm-from-rows';
export { rdmEntry } from './rdm-entry';
export { condenseRdm } from './condense-rdm';

// Statistics
export { averageRanks } from './average-ranks';
export { spearman } from './spearman';
export { coefficientOfVariation } from './coefficient-of-variation';
export { slopeThroughOrigin } from './slope-through-origin';

// Confound audit and equalisation
export { DEFAULT_AUDIT_THRESHOLDS } from './audit-thresholds';
export { rayGrowth } from './ray-growth';
export { lineSpacing } from './line-spacing';
export { anisotropyFromRates } from './anisotropy-from-rates';
export { anisotropyIndex } from './anisotropy-index';
export { auditSpace, type AuditOptions } from './audit-space';
export { equalizeSpace, type EqualizeOptions } from './equalize-space';
export { rescaleEqualization } from './rescale-equalization';
export { selectLayoutStimuli, type LayoutSelection } from './select-layout-stimuli';
