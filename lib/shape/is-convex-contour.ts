import { isSimpleContour } from './is-simple-contour';
import { orientation } from './orientation';
import type { Contour } from './types';

/**
 * True when the polygon is simple and every turn has the same sense (collinear vertices allowed), in either
 * orientation. Exact (orientation predicate plus the exact simple-polygon test, which rules out star
 * polygons whose turns all agree but which wind more than once).
 */
export function isConvexContour(contour: Contour): boolean {
  const { x, y } = contour;
  const n = x.length;
  let sense = 0;
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    const k = (i + 2) % n;
    const turn = orientation(x[i] as number, y[i] as number, x[j] as number, y[j] as number, x[k] as number, y[k] as number);
    if (turn === 0) continue;
    if (sense === 0) sense = turn;
    else if (turn !== sense) return false;
  }
  return sense !== 0 && isSimpleContour(contour);
}
