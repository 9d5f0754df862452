import { checkOutline } from './check-outline';
import { correspondingPointDistance } from './corresponding-point-distance';
import { procrustesDistance } from './procrustes-distance';
import { rasterizeContour } from './rasterize-contour';
import { silhouetteDistance } from './silhouette-distance';
import type { Contour, RasterExtent, ShapeDistanceMetric } from './types';

/** Default raster for the silhouette metric: 256² pixels resolve 0.4 % of the shapes' common extent. */
const DEFAULT_SILHOUETTE_RESOLUTION = 256;

export interface ShapeDistanceOptions {
  /** `silhouette`: pixels per side (default 256). */
  readonly resolution?: number;
  /** `silhouette`: the square to rasterise; default the union bounding square of both shapes. */
  readonly extent?: RasterExtent;
  /** `corresponding-points`: also search over cyclic shifts of b's start vertex. */
  readonly matchStart?: boolean;
}

function unionExtent(a: Contour, b: Contour): RasterExtent {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const c of [a, b]) {
    for (let i = 0; i < c.x.length; i++) {
      minX = Math.min(minX, c.x[i] as number);
      maxX = Math.max(maxX, c.x[i] as number);
      minY = Math.min(minY, c.y[i] as number);
      maxY = Math.max(maxY, c.y[i] as number);
    }
  }
  const size = Math.max(maxX - minX, maxY - minY) || 1;
  return { minX: (minX + maxX - size) / 2, minY: (minY + maxY - size) / 2, size };
}

/**
 * Distance between two outlines for the confound audit:
 * - `corresponding-points`: mean distance of corresponding vertices after rigid alignment, in shape units;
 * - `procrustes`: full Procrustes distance (dimensionless, [0, 1]);
 * - `silhouette`: 1 − IoU of the filled regions on a raster at `resolution` (default 256² over the union
 *   bounding square). For many pairs, rasterise once with `rasterizeContour` and use `silhouetteDistance`.
 */
export function shapeDistance(a: Contour, b: Contour, metric: ShapeDistanceMetric, options: ShapeDistanceOptions = {}): number {
  switch (metric) {
    case 'corresponding-points':
      return correspondingPointDistance(a, b, { matchStart: options.matchStart ?? false });
    case 'procrustes':
      return procrustesDistance(a, b);
    case 'silhouette': {
      checkOutline(a);
      checkOutline(b);
      const raster = { resolution: options.resolution ?? DEFAULT_SILHOUETTE_RESOLUTION, extent: options.extent ?? unionExtent(a, b) };
      return silhouetteDistance(rasterizeContour(a, raster), rasterizeContour(b, raster));
    }
  }
}
