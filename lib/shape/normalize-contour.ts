import { contourArea } from './contour-area';
import { contourMoments } from './contour-moments';
import { contourPerimeter } from './contour-perimeter';
import { ShapeError } from './errors';
import { principalAxisRotations } from './principal-axis-rotations';
import type { Contour, ScaleNormalization } from './types';

export interface ContourNormalizeOptions {
  /** Default `equal-area-radius`. */
  readonly scale?: ScaleNormalization;
  /** Default `principal-axis`. The harmonic rules live on the descriptors. */
  readonly orientation?: 'principal-axis' | 'none';
}

/** Vertices this much closer to the centroid than the farthest one still count as farthest (rounding). */
const FARTHEST_TIE_TOLERANCE = 1e-9;

function transformed(contour: Contour, cx: number, cy: number, scale: number, angle: number): Contour {
  const c = Math.cos(angle) * scale;
  const s = Math.sin(angle) * scale;
  const n = contour.x.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const u = (contour.x[i] as number) - cx;
    const v = (contour.y[i] as number) - cy;
    x[i] = u * c - v * s;
    y[i] = u * s + v * c;
  }
  return { x, y };
}

/** Re-indexes the vertices cyclically (and reversed, keeping vertex `start` first, when `reverse`). */
function reindexed(contour: Contour, start: number, reverse: boolean): Contour {
  const n = contour.x.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const j = (((reverse ? start - i : start + i) % n) + n) % n;
    x[i] = contour.x[j] as number;
    y[i] = contour.y[j] as number;
  }
  return { x, y };
}

/** Index of the vertex that starts the normalised contour: the first one on or past the +x half-axis. */
function startVertex({ x, y }: Contour): number {
  const n = x.length;
  let best = 0;
  let bestReach = -Infinity;
  for (let i = 0; i < n; i++) {
    const h = (i + n - 1) % n;
    const yh = y[h] as number;
    const yi = y[i] as number;
    if (!(yh < 0 && yi >= 0)) continue;
    // Where the edge h → i crosses y = 0.
    const reach = (x[h] as number) + ((x[i] as number) - (x[h] as number)) * (-yh / (yi - yh));
    if (reach > bestReach) {
      bestReach = reach;
      best = i;
    }
  }
  return best;
}

/**
 * Normalises a polygon: counter-clockwise (reversed if needed), area centroid at the origin, the chosen scale
 * (unit area, equal-area radius, largest vertex distance from the centroid, or perimeter), and with
 * `principal-axis` the major principal axis of the area moments on +x, direction by positive third moment
 * along x, then y. Shapes with equal second moments (threefold or higher symmetry) are turned so the vertex
 * farthest from the centroid lies on +x instead (the first such vertex within 1e-9 relative).
 * Start point: the vertex where the outline crosses the positive x half-axis, going counter-clockwise (the
 * outermost crossing if there are several). A new contour; the input is untouched.
 */
export function normalizeContour(contour: Contour, options: ContourNormalizeOptions = {}): Contour {
  const n = contour.x.length;
  if (n < 3) throw new ShapeError('too-few-points', `a polygon needs at least 3 vertices, got ${n}`, { value: n });
  // Stage 1: direction.
  const oriented = contourArea(contour) < 0 ? reindexed(contour, 0, true) : contour;
  // Stage 2: translation and scale.
  const moments = contourMoments(oriented);
  const [cx, cy] = moments.centroid;
  const scaleRule = options.scale ?? 'equal-area-radius';
  let factor = 1;
  if (scaleRule === 'area') factor = 1 / Math.sqrt(moments.area);
  else if (scaleRule === 'equal-area-radius') factor = 1 / Math.sqrt(moments.area / Math.PI);
  else if (scaleRule === 'perimeter') factor = 1 / contourPerimeter(oriented);
  else if (scaleRule === 'max-radius') {
    let farthest = 0;
    for (let i = 0; i < n; i++) farthest = Math.max(farthest, Math.hypot((oriented.x[i] as number) - cx, (oriented.y[i] as number) - cy));
    factor = 1 / farthest;
  }
  // Stage 3: orientation.
  let angle = 0;
  if ((options.orientation ?? 'principal-axis') === 'principal-axis') {
    const rotations = principalAxisRotations(moments);
    if (rotations && rotations.length === 1) {
      angle = rotations[0] as number;
    } else {
      let farthest = 0;
      for (let i = 0; i < n; i++) farthest = Math.max(farthest, Math.hypot((oriented.x[i] as number) - cx, (oriented.y[i] as number) - cy));
      for (let i = 0; i < n; i++) {
        const u = (oriented.x[i] as number) - cx;
        const v = (oriented.y[i] as number) - cy;
        if (Math.hypot(u, v) >= farthest * (1 - FARTHEST_TIE_TOLERANCE)) {
          angle = -Math.atan2(v, u);
          break;
        }
      }
    }
  }
  // Stage 4: start point.
  const placed = transformed(oriented, cx, cy, factor, angle);
  return reindexed(placed, startVertex(placed), false);
}
