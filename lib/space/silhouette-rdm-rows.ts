import type { Contour, RasterExtent } from '../shape/types';
import { fillPairwiseRows } from './fill-pairwise-rows';
import { silhouetteRuns, silhouetteRunsDistance, type SilhouetteRuns } from './silhouette-runs';
import type { RdmRows } from './types';

/**
 * Rows `from` … `to − 1` of the silhouette RDM of `contours` (`RdmRows`): the same values as `silhouetteRdm`
 * with the same `resolution` and `extent` (pass `silhouetteExtent` of all the contours, not of a block's).
 * Rasterises only the contours the rows need (from `from` on).
 */
export function silhouetteRdmRows(contours: readonly Contour[], from: number, to: number, options: { readonly resolution: number; readonly extent: RasterExtent }): RdmRows {
  const masks: (SilhouetteRuns | undefined)[] = contours.map((c, i) => (i >= from ? silhouetteRuns(c, options.resolution, options.extent) : undefined));
  return fillPairwiseRows(contours.length, from, to, (i, j) => silhouetteRunsDistance(masks[i] as SilhouetteRuns, masks[j] as SilhouetteRuns));
}
