import { contourArea } from './contour-area';
import { contourCentroid } from './contour-centroid';
import { contourCompactness } from './contour-compactness';
import { contourConvexity } from './contour-convexity';
import { contourPerimeter } from './contour-perimeter';
import { contourToSvgPath } from './contour-to-svg-path';
import { countCurvatureExtrema } from './count-curvature-extrema';
import { isSimpleContour } from './is-simple-contour';
import { radialMinimumRadius } from './radial-minimum-radius';
import { checkDescriptorTerms } from './check-descriptor-terms';
import { SHAPE_LIMITS } from './shape-limits';
import { synthesizeContour } from './synthesize-contour';
import type { Contour, ShapeDescriptor } from './types';

/** Samples used for the editor's metrics and thumbnails: enough for 128 harmonics at 4 samples per cycle. */
export const MEASURE_SAMPLES = 512;
/** Decimals in thumbnail path data (shape units of equal-area radius 1; 1e-3 is far below a pixel). */
const THUMBNAIL_DECIMALS = 3;

export interface ShapeMeasures {
  /** Enclosed area, |shoelace| of the sampled contour, in squared shape units. */
  readonly area: number;
  readonly perimeter: number;
  /** 4πA/P², 1 for a circle. */
  readonly compactness: number;
  /** Area over convex-hull area, 1 for a convex shape. */
  readonly convexity: number;
  /** Radial family only: r_min; null otherwise. */
  readonly minRadius: number | null;
  readonly isSimple: boolean;
  readonly curvatureExtrema: number;
}

/** The contour sampled for measuring (N = max(512, 4 × highest harmonic)), without the simplicity check. */
export function sampleForMeasures(descriptor: ShapeDescriptor): Contour {
  const { highestHarmonic } = checkDescriptorTerms(descriptor);
  const samples = Math.max(MEASURE_SAMPLES, SHAPE_LIMITS.aliasFactor * highestHarmonic);
  return synthesizeContour(descriptor, samples, { checkSimple: false });
}

/**
 * The metrics the seed-shape editor and lists show: area, perimeter, compactness, convexity, the minimum
 * radius (radial family), simplicity (exact) and the number of curvature extrema.
 */
export function measureShape(descriptor: ShapeDescriptor, contour: Contour = sampleForMeasures(descriptor)): ShapeMeasures {
  return {
    area: Math.abs(contourArea(contour)),
    perimeter: contourPerimeter(contour),
    compactness: contourCompactness(contour),
    convexity: contourConvexity(contour),
    minRadius: descriptor.family === 'radial' ? radialMinimumRadius(descriptor).radius : null,
    isSimple: isSimpleContour(contour),
    curvatureExtrema: countCurvatureExtrema(contour),
  };
}

/**
 * SVG path data of a contour moved to its area centroid and scaled to unit equal-area radius, y flipped for
 * screen: draw it in a `viewBox="-1.6 -1.6 3.2 3.2"` (or wider) and it keeps its true geometry.
 */
export function thumbnailPath(contour: Contour): string {
  const [cx, cy] = contourCentroid(contour);
  const scale = 1 / Math.sqrt(Math.abs(contourArea(contour)) / Math.PI);
  const centred: Contour = { x: contour.x.map((v) => (v - cx) * scale), y: contour.y.map((v) => (v - cy) * scale) };
  return contourToSvgPath(centred, { decimals: THUMBNAIL_DECIMALS });
}
