import type { Contour } from './types';

/** Perimeter of a closed polygon (sum of edge lengths, closing edge included), in shape units. */
export function contourPerimeter(contour: Contour): number {
  const { x, y } = contour;
  const n = x.length;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    sum += Math.hypot((x[j] as number) - (x[i] as number), (y[j] as number) - (y[i] as number));
  }
  return sum;
}
