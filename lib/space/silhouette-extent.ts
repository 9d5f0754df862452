import type { Contour, RasterExtent } from '../shape/types';

/** The common extent leaves this fraction of its size free on every side, so no shape touches the raster's edge. */
const EXTENT_MARGIN = 0.02;

/**
 * The default raster square of `silhouetteRdm`: the bounding square of every contour's vertices, centred on
 * their bounding box, enlarged by 2 % of its side on every side (side 1 when all vertices coincide). Compute it
 * once over all stimuli when rows of one matrix are computed apart (`silhouetteRdmRows`).
 */
export function silhouetteExtent(contours: readonly Contour[]): RasterExtent {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const { x, y } of contours) {
    for (let i = 0; i < x.length; i++) {
      minX = Math.min(minX, x[i] as number);
      maxX = Math.max(maxX, x[i] as number);
      minY = Math.min(minY, y[i] as number);
      maxY = Math.max(maxY, y[i] as number);
    }
  }
  const side = Math.max(maxX - minX, maxY - minY) || 1;
  const size = side * (1 + 2 * EXTENT_MARGIN);
  return { minX: (minX + maxX - size) / 2, minY: (minY + maxY - size) / 2, size };
}
