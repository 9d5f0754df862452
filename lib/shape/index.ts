// lib/shape — the contour engine: Fourier-descriptor synthesis, outline fitting, normalisation, geometry,
// shape distances and SVG path input/output. Pure and deterministic; the browser runs the same code.

export type {
  Bitmask,
  Circle,
  ComplexDescriptor,
  ComplexTerm,
  Contour,
  DescriptorFamily,
  EllipticDescriptor,
  EllipticTerm,
  NormalizeOptions,
  OrientationRule,
  Point,
  RadialDescriptor,
  RadialNormalizeOptions,
  RadialTerm,
  RasterExtent,
  ReconstructionError,
  ScaleNormalization,
  ShapeDescriptor,
  ShapeDistanceMetric,
  ShapeMoments,
  SynthesisMethod,
} from './types';
export { ShapeError, type ShapeErrorCode, type ShapeErrorDetails } from './errors';
export { SHAPE_LIMITS } from './shape-limits';

// Descriptors and synthesis
export { synthesizeContour, type SynthesizeOptions } from './synthesize-contour';
export { evaluateDescriptor } from './evaluate-descriptor';
export { validateDescriptor } from './validate-descriptor';
export { checkDescriptorTerms, type DescriptorTermSummary } from './check-descriptor-terms';
export { radialMinimumRadius, type RadialMinimum } from './radial-minimum-radius';
export { toComplexHarmonics } from './to-complex-harmonics';
export { toEllipticHarmonics } from './to-elliptic-harmonics';
export { reverseDescriptor } from './reverse-descriptor';
export { transformComplexHarmonics, type HarmonicTransform } from './transform-complex-harmonics';
export { descriptorArea } from './descriptor-area';
export { descriptorMoments } from './descriptor-moments';
export { descriptorPerimeter } from './descriptor-perimeter';
export { descriptorMaxRadius } from './descriptor-max-radius';

// Fitting
export { fitEllipticHarmonics } from './fit-elliptic-harmonics';
export { fitRadialHarmonics } from './fit-radial-harmonics';
export { measureReconstructionError } from './measure-reconstruction-error';

// Normalisation
export { normalizeEllipticHarmonics } from './normalize-elliptic-harmonics';
export { normalizeComplexHarmonics } from './normalize-complex-harmonics';
export { normalizeRadialHarmonics } from './normalize-radial-harmonics';
export { normalizeContour, type ContourNormalizeOptions } from './normalize-contour';

// Geometry
export { contourArea } from './contour-area';
export { contourPerimeter } from './contour-perimeter';
export { contourCentroid } from './contour-centroid';
export { contourMoments } from './contour-moments';
export { contourCompactness } from './contour-compactness';
export { contourEqualAreaDiameter } from './contour-equal-area-diameter';
export { contourBoundingCircle } from './contour-bounding-circle';
export { contourConvexHull } from './contour-convex-hull';
export { contourConvexity } from './contour-convexity';
export { isConvexContour } from './is-convex-contour';
export { isSimpleContour } from './is-simple-contour';
export { findSelfIntersection } from './find-self-intersection';
export { countCurvatureExtrema } from './count-curvature-extrema';
export { contourFromPoints } from './contour-from-points';
export { contourToPoints } from './contour-to-points';

// Shape distances
export { shapeDistance, type ShapeDistanceOptions } from './shape-distance';
export { correspondingPointDistance } from './corresponding-point-distance';
export { procrustesDistance } from './procrustes-distance';
export { rasterizeContour } from './rasterize-contour';
export { silhouetteDistance } from './silhouette-distance';

// SVG and CSV
export { contourToSvgPath, type SvgPathOptions } from './contour-to-svg-path';
export { parseSvgOutline, type ParseSvgOptions } from './parse-svg-outline';
export { parseCsvOutline } from './parse-csv-outline';
export { splitPathData } from './split-path-data';

// Editor metrics and thumbnails
export { measureShape, sampleForMeasures, thumbnailPath, MEASURE_SAMPLES, type ShapeMeasures } from './measure-shape';
export { ENGINE_VERSION } from './engine-version';
