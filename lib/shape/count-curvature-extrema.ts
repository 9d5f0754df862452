import { checkDescriptorTerms } from './check-descriptor-terms';
import { sampleCurve } from './sample-curve';
import type { Contour, ShapeDescriptor } from './types';

/** Curvature varying by less than this fraction of its mean magnitude counts as constant (a circle): 0 extrema. */
const FLAT_CURVATURE_TOLERANCE = 1e-9;
/** An extremum must stand out from its neighbours by this fraction of the curvature range (hysteresis). */
const EXTREMUM_PROMINENCE = 1e-3;
/** Analytic curvature is sampled at 32 points per cycle of the highest harmonic, at least 2048. */
const SAMPLES_PER_HARMONIC = 32;
const MIN_SAMPLES = 2048;

function isContour(shape: Contour | ShapeDescriptor): shape is Contour {
  return 'x' in shape && shape.x instanceof Float64Array;
}

/** Signed Menger curvature at each vertex: 4·(triangle area)/(product of its sides) of the vertex and its neighbours. */
function polygonCurvature({ x, y }: Contour): Float64Array {
  const n = x.length;
  const curvature = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const h = (i + n - 1) % n;
    const j = (i + 1) % n;
    const ax = (x[i] as number) - (x[h] as number), ay = (y[i] as number) - (y[h] as number);
    const bx = (x[j] as number) - (x[i] as number), by = (y[j] as number) - (y[i] as number);
    const cx = (x[j] as number) - (x[h] as number), cy = (y[j] as number) - (y[h] as number);
    const sides = Math.hypot(ax, ay) * Math.hypot(bx, by) * Math.hypot(cx, cy);
    curvature[i] = sides === 0 ? 0 : (2 * (ax * by - ay * bx)) / sides;
  }
  return curvature;
}

/** κ(t) = (x'y'' − y'x'')/|z'|³ on a dense grid. */
function descriptorCurvature(descriptor: ShapeDescriptor): Float64Array {
  checkDescriptorTerms(descriptor);
  const probe = sampleCurve(descriptor, 8);
  const samples = Math.max(MIN_SAMPLES, SAMPLES_PER_HARMONIC * probe.highestComplexHarmonic);
  const { dx, dy, ddx, ddy } = sampleCurve(descriptor, samples);
  return Float64Array.from(dx, (vx, j) => {
    const vy = dy[j] as number;
    const speed = Math.hypot(vx, vy);
    return (vx * (ddy[j] as number) - vy * (ddx[j] as number)) / (speed * speed * speed);
  });
}

/** Stage: count the extrema of a cyclic sequence with hysteresis (maxima and minima alternate, so 2 × minima). */
function countCyclicExtrema(values: Float64Array): number {
  const n = values.length;
  if (n < 3) return 0;
  let max = -Infinity, min = Infinity, meanMagnitude = 0, start = 0;
  for (let i = 0; i < n; i++) {
    const v = values[i] as number;
    if (v > max) {
      max = v;
      start = i;
    }
    min = Math.min(min, v);
    meanMagnitude += Math.abs(v) / n;
  }
  const range = max - min;
  if (!(range > FLAT_CURVATURE_TOLERANCE * meanMagnitude)) return 0;
  const delta = EXTREMUM_PROMINENCE * range;
  // Walk once around from the global maximum, confirming minima and maxima in turn.
  let seekingMinimum = true;
  let extreme = max;
  let minima = 0;
  for (let s = 1; s <= n; s++) {
    const v = values[(start + s) % n] as number;
    if (seekingMinimum) {
      if (v < extreme) extreme = v;
      else if (v > extreme + delta) {
        minima++;
        seekingMinimum = false;
        extreme = v;
      }
    } else if (v > extreme) extreme = v;
    else if (v < extreme - delta) {
      seekingMinimum = true;
      extreme = v;
    }
  }
  return 2 * minima;
}

/**
 * Number of curvature extrema (maxima plus minima) around a closed outline. A descriptor uses its analytic
 * curvature κ = (x'y'' − y'x'')/|z'|³; a contour uses the Menger curvature of each vertex triple, which
 * suits finely sampled smooth outlines (a polygon's corners are each a spike). Extrema smaller than 0.1 % of
 * the curvature range are ignored, and a curve of constant curvature (a circle) has none.
 * A single radial-frequency component of frequency k has 2k (k maxima at the lobes, k minima between).
 */
export function countCurvatureExtrema(shape: Contour | ShapeDescriptor): number {
  return countCyclicExtrema(isContour(shape) ? polygonCurvature(shape) : descriptorCurvature(shape));
}
