import { ShapeError } from './errors';
import type { Contour, Point } from './types';

/**
 * Area centroid of a closed polygon (the centre of mass of the enclosed region, not of the vertices):
 * C = (1/6A) Σ (p_i + p_{i+1})(x_i y_{i+1} − x_{i+1} y_i), computed relative to the first vertex.
 * Either orientation. Raises `degenerate-shape` for a polygon of zero area.
 */
export function contourCentroid(contour: Contour): Point {
  const { x, y } = contour;
  const n = x.length;
  if (n < 3) throw new ShapeError('too-few-points', `a polygon needs at least 3 vertices, got ${n}`, { value: n });
  const ox = x[0] as number;
  const oy = y[0] as number;
  let twiceArea = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 1; i < n - 1; i++) {
    const xi = (x[i] as number) - ox;
    const yi = (y[i] as number) - oy;
    const xj = (x[i + 1] as number) - ox;
    const yj = (y[i + 1] as number) - oy;
    const cross = xi * yj - xj * yi;
    twiceArea += cross;
    sx += (xi + xj) * cross;
    sy += (yi + yj) * cross;
  }
  if (twiceArea === 0 || !Number.isFinite(twiceArea)) {
    throw new ShapeError('degenerate-shape', 'the polygon encloses no area, so it has no area centroid', { value: twiceArea / 2 });
  }
  return [ox + sx / (3 * twiceArea), oy + sy / (3 * twiceArea)];
}
