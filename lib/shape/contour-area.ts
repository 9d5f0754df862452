import type { Contour } from './types';

/**
 * Signed area of a closed polygon by the shoelace formula (Gauss's area formula),
 * A = ½ Σ (x_i y_{i+1} − x_{i+1} y_i): positive for counter-clockwise vertices, in squared shape units.
 * Coordinates are taken relative to the first vertex, which keeps the sum accurate far from the origin.
 */
export function contourArea(contour: Contour): number {
  const { x, y } = contour;
  const n = x.length;
  if (n < 3) return 0;
  const ox = x[0] as number;
  const oy = y[0] as number;
  let twice = 0;
  for (let i = 1; i < n - 1; i++) {
    twice += ((x[i] as number) - ox) * ((y[i + 1] as number) - oy) - ((x[i + 1] as number) - ox) * ((y[i] as number) - oy);
  }
  return twice / 2;
}
