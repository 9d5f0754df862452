import { checkOutline } from './check-outline';
import { ShapeError } from './errors';
import type { Contour } from './types';

export interface SvgPathOptions {
  /** `polygon` (straight edges, default) or `smooth` (closed uniform Catmull–Rom spline as cubic Béziers). */
  readonly curve?: 'polygon' | 'smooth';
  /** Digits after the decimal point, 0…10 (default 3). */
  readonly decimals?: number;
  /**
   * SVG's y axis points down. By default y is negated so the outline appears as in the mathematical y-up frame
   * (counter-clockwise stays counter-clockwise on screen). `parseSvgOutline` undoes it by the same default.
   */
  readonly flipY?: boolean;
}

const MAX_DECIMALS = 10;

/**
 * SVG path data for a closed contour, with a fixed number of decimals so the same contour always gives the
 * same string: `M x y L x y … Z`, or with `curve: 'smooth'` the closed uniform Catmull–Rom spline through the
 * vertices converted to cubic Béziers (control points p_i + (p_{i+1} − p_{i−1})/6 and
 * p_{i+1} − (p_{i+2} − p_i)/6; Catmull & Rom 1974). Negative zero prints as 0.
 */
export function contourToSvgPath(contour: Contour, options: SvgPathOptions = {}): string {
  checkOutline(contour);
  const decimals = options.decimals ?? 3;
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > MAX_DECIMALS) {
    throw new ShapeError('invalid-argument', `decimals = ${decimals} must be an integer from 0 to ${MAX_DECIMALS}`, { value: decimals });
  }
  const sign = options.flipY === false ? 1 : -1;
  const zero = (0).toFixed(decimals);
  const format = (value: number): string => {
    const text = value.toFixed(decimals);
    return text === `-${zero}` ? zero : text;
  };
  const { x, y } = contour;
  const n = x.length;
  const px = (i: number): number => x[((i % n) + n) % n] as number;
  const py = (i: number): number => sign * (y[((i % n) + n) % n] as number);
  const parts: string[] = [`M${format(px(0))} ${format(py(0))}`];
  if (options.curve === 'smooth') {
    for (let i = 0; i < n; i++) {
      const c1x = px(i) + (px(i + 1) - px(i - 1)) / 6;
      const c1y = py(i) + (py(i + 1) - py(i - 1)) / 6;
      const c2x = px(i + 1) - (px(i + 2) - px(i)) / 6;
      const c2y = py(i + 1) - (py(i + 2) - py(i)) / 6;
      parts.push(`C${format(c1x)} ${format(c1y)} ${format(c2x)} ${format(c2y)} ${format(px(i + 1))} ${format(py(i + 1))}`);
    }
  } else {
    for (let i = 1; i < n; i++) parts.push(`L${format(px(i))} ${format(py(i))}`);
  }
  parts.push('Z');
  return parts.join('');
}
