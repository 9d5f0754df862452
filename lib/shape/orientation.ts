import { orient2d } from 'robust-predicates';

/**
 * Exact sign of the turn a → b → c: +1 counter-clockwise (c left of the directed line ab), −1 clockwise,
 * 0 collinear. Shewchuk's adaptive-precision orientation predicate (robust-predicates), whose own sign
 * convention is the opposite (positive for clockwise); this wrapper makes counter-clockwise positive.
 */
export function orientation(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): -1 | 0 | 1 {
  const det = orient2d(ax, ay, bx, by, cx, cy);
  return det < 0 ? 1 : det > 0 ? -1 : 0;
}
