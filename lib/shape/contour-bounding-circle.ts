import type { Circle, Contour } from './types';

/** Points count as inside a circle within this relative slack, so rounding never ejects a boundary point. */
const INSIDE_RELATIVE_SLACK = 1e-12;
/** Seed of the fixed visiting order; the minimum enclosing circle is unique, so it does not affect the result. */
const VISIT_ORDER_SEED = 0x9e3779b9;

function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function circleOfTwo(ax: number, ay: number, bx: number, by: number): [number, number, number] {
  const cx = (ax + bx) / 2;
  const cy = (ay + by) / 2;
  return [cx, cy, Math.hypot(ax - cx, ay - cy)];
}

function circleOfThree(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): [number, number, number] {
  const bxr = bx - ax, byr = by - ay, cxr = cx - ax, cyr = cy - ay;
  const d = 2 * (bxr * cyr - byr * cxr);
  if (d === 0) {
    // Collinear: the circle on the two farthest-apart points.
    const pairs: [number, number, number][] = [circleOfTwo(ax, ay, bx, by), circleOfTwo(ax, ay, cx, cy), circleOfTwo(bx, by, cx, cy)];
    return pairs.reduce((best, c) => (c[2] > best[2] ? c : best));
  }
  const b2 = bxr * bxr + byr * byr;
  const c2 = cxr * cxr + cyr * cyr;
  const ux = (cyr * b2 - byr * c2) / d;
  const uy = (bxr * c2 - cxr * b2) / d;
  return [ax + ux, ay + uy, Math.hypot(ux, uy)];
}

/**
 * Smallest circle enclosing every vertex: Welzl's algorithm (1991) in its iterative form, expected O(N), over
 * a fixed pseudo-random visiting order (the answer is unique, so the order only affects speed).
 */
export function contourBoundingCircle(contour: Contour): Circle {
  const { x, y } = contour;
  const n = x.length;
  if (n === 0) return { center: [0, 0], radius: 0 };
  const order = Array.from({ length: n }, (_, i) => i);
  const random = mulberry32(VISIT_ORDER_SEED);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [order[i], order[j]] = [order[j] as number, order[i] as number];
  }
  const px = (i: number): number => x[order[i] as number] as number;
  const py = (i: number): number => y[order[i] as number] as number;
  let c: [number, number, number] = [px(0), py(0), 0];
  const outside = (i: number): boolean => Math.hypot(px(i) - c[0], py(i) - c[1]) > c[2] * (1 + INSIDE_RELATIVE_SLACK);
  for (let i = 1; i < n; i++) {
    if (!outside(i)) continue;
    c = [px(i), py(i), 0];
    for (let j = 0; j < i; j++) {
      if (!outside(j)) continue;
      c = circleOfTwo(px(i), py(i), px(j), py(j));
      for (let k = 0; k < j; k++) {
        if (outside(k)) c = circleOfThree(px(i), py(i), px(j), py(j), px(k), py(k));
      }
    }
  }
  return { center: [c[0], c[1]], radius: c[2] };
}
