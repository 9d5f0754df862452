import { getTrigTable } from '../shape/trig-table';
import { toComplexHarmonics } from '../shape/to-complex-harmonics';
import type { Point, ShapeDescriptor } from '../shape/types';

/** A floor on the quadrature size, for curves with one or two harmonics. */
const MIN_SAMPLES = 8;

let buffers = { x: new Float64Array(0), y: new Float64Array(0), dy: new Float64Array(0) };

/** Zeroed work arrays of at least `size` entries (only the first `size` are used). */
function scratch(size: number) {
  if (buffers.x.length < size) buffers = { x: new Float64Array(size), y: new Float64Array(size), dy: new Float64Array(size) };
  buffers.x.fill(0, 0, size);
  buffers.y.fill(0, 0, size);
  buffers.dy.fill(0, 0, size);
  return buffers;
}

/**
 * The area centroid of the region a descriptor's curve encloses, exact and cheap, for normalising every
 * stimulus on every slider move. Green's theorem: A = ∮ x dy, C = (1/A)(∮ ½x² dy, ∮ xy dy), on the complex form
 * z(t) = Σ c_k e^{ikt} (`lib/shape`'s `toComplexHarmonics`). The integrands are trigonometric polynomials of
 * degree ≤ 3K (K the highest |k|), so the periodic trapezoid rule on M = 3K + 2 points is exact. Either
 * direction (the signs cancel). The same value as `lib/shape`'s `descriptorMoments(…).centroid`, which also
 * computes second and third moments on 8K + 64 points and is ~30× slower. Assumes a descriptor of non-zero area.
 */
export function descriptorCentroid(descriptor: ShapeDescriptor): Point {
  const { terms } = toComplexHarmonics(descriptor);
  let highest = 0;
  for (const t of terms) highest = Math.max(highest, Math.abs(t.k));
  const samples = Math.max(MIN_SAMPLES, 3 * highest + 2);
  const { cos, sin } = getTrigTable(samples);
  // Phase 1: x, y and y′ at t_j = 2πj/M, one term at a time (the table index steps by k). The work arrays are
  // reused scratch: browsers allocate small typed arrays slowly, and this runs for every stimulus on every move.
  const { x, y, dy } = scratch(samples);
  for (const { k, re, im } of terms) {
    const step = ((k % samples) + samples) % samples;
    let index = 0;
    for (let j = 0; j < samples; j++) {
      const c = cos[index] as number;
      const s = sin[index] as number;
      // c_k e^{ikt} = (re cos − im sin) + i(re sin + im cos); d/dt multiplies by ik, so Im z′ = Σ k·Re(c_k e^{ikt}).
      const real = re * c - im * s;
      x[j] = (x[j] as number) + real;
      y[j] = (y[j] as number) + re * s + im * c;
      dy[j] = (dy[j] as number) + k * real;
      index += step;
      if (index >= samples) index -= samples;
    }
  }
  // Phase 2: the trapezoid sums (the common factor 2π/M cancels).
  let area = 0, sx = 0, sy = 0;
  for (let j = 0; j < samples; j++) {
    const xj = x[j] as number;
    const w = dy[j] as number;
    area += xj * w;
    sx += 0.5 * xj * xj * w;
    sy += xj * (y[j] as number) * w;
  }
  return [sx / area, sy / area];
}
