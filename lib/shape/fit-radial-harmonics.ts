import { assertPositiveRadius } from './assert-positive-radius';
import { checkOutline } from './check-outline';
import { contourArea } from './contour-area';
import { contourCentroid } from './contour-centroid';
import { ShapeError } from './errors';
import { getFftPlan } from './fft-plan';
import { orientation } from './orientation';
import type { Contour, RadialDescriptor, RadialTerm } from './types';

/**
 * r(θ) of a polygon has kinks at the vertices, so its Fourier coefficients decay as k⁻²; from 8,192 uniform
 * angles the aliasing error of each coefficient is of order 8192⁻² ≈ 1.5e-8 of r0.
 */
const RADIAL_FIT_SAMPLES = 8192;
/** Sweeps must add to one full turn within this many radians (rounding of atan2 is ~1e-16 per vertex). */
const WINDING_TOLERANCE = 1e-9;

/** Stage: every edge must turn counter-clockwise as seen from the centre (exact), once around in total. */
function checkStarShaped(x: Float64Array, y: Float64Array, cx: number, cy: number): Float64Array {
  const n = x.length;
  const angles = new Float64Array(n);
  for (let i = 0; i < n; i++) angles[i] = Math.atan2((y[i] as number) - cy, (x[i] as number) - cx);
  let total = 0;
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    if (orientation(cx, cy, x[i] as number, y[i] as number, x[j] as number, y[j] as number) <= 0) {
      throw new ShapeError(
        'not-star-shaped',
        `the outline is not star-shaped from its area centroid: edge ${i} (vertex ${i} to ${j}) does not turn counter-clockwise about (${cx.toPrecision(6)}, ${cy.toPrecision(6)}) near θ = ${(angles[i] as number).toFixed(4)} rad`,
        { vertex: i, angle: angles[i] as number, edges: [i, i] },
      );
    }
    let sweep = (angles[j] as number) - (angles[i] as number);
    if (sweep <= 0) sweep += 2 * Math.PI;
    total += sweep;
  }
  if (Math.abs(total - 2 * Math.PI) > WINDING_TOLERANCE) {
    throw new ShapeError('not-star-shaped', `the outline winds ${(total / (2 * Math.PI)).toFixed(3)} times around its centroid`, {
      value: total,
    });
  }
  return angles;
}

/**
 * Stage: r(θ_j) at θ_j = 2πj/M, by intersecting each ray with the edge whose angular range holds it. Edge i
 * owns the grid indices [b_i, b_{i+1}) with b_i = ⌈A_i/h⌉ for the unwrapped vertex angles A_i and
 * b_N = b_0 + M, so every index is written exactly once whatever the rounding of the angles.
 */
function sampleRadius(x: Float64Array, y: Float64Array, cx: number, cy: number, angles: Float64Array, samples: number): Float64Array {
  const n = x.length;
  const h = (2 * Math.PI) / samples;
  const bounds = new Float64Array(n + 1);
  let unwrapped = angles[0] as number;
  bounds[0] = Math.ceil(unwrapped / h);
  for (let i = 1; i < n; i++) {
    let sweep = (angles[i] as number) - (angles[i - 1] as number);
    if (sweep <= 0) sweep += 2 * Math.PI;
    unwrapped += sweep;
    bounds[i] = Math.min(Math.ceil(unwrapped / h), (bounds[0] as number) + samples);
  }
  bounds[n] = (bounds[0] as number) + samples;
  const radius = new Float64Array(samples);
  for (let i = 0; i < n; i++) {
    const j = i + 1 === n ? 0 : i + 1;
    const ax = (x[i] as number) - cx;
    const ay = (y[i] as number) - cy;
    const ex = (x[j] as number) - (x[i] as number);
    const ey = (y[j] as number) - (y[i] as number);
    const numerator = ax * ey - ay * ex;
    for (let m = bounds[i] as number; m < (bounds[i + 1] as number); m++) {
      const theta = m * h;
      radius[((m % samples) + samples) % samples] = numerator / (Math.cos(theta) * ey - Math.sin(theta) * ex);
    }
  }
  return radius;
}

/**
 * Radial harmonics of a closed polygon about its area centroid: r(θ) = r0(1 + Σ_{k=1..K} A_k cos(kθ + φ_k))
 * with r0 the mean radius and A_k, φ_k from the discrete Fourier transform of r on 8,192 uniform angles
 * (least squares on that grid). Either orientation. The descriptor describes the outline relative to its area
 * centroid (translation is dropped). Raises `not-star-shaped` (naming an edge and angle) when some ray from
 * the centroid meets the outline more than once, and `radius-not-positive` if the truncated series dips to 0.
 */
export function fitRadialHarmonics(contour: Contour, harmonics: number): RadialDescriptor {
  checkOutline(contour, harmonics);
  // Phase 1: counter-clockwise, centre, star-shapedness.
  const reversed = contourArea(contour) < 0;
  const x = reversed ? Float64Array.from(contour.x).reverse() : contour.x;
  const y = reversed ? Float64Array.from(contour.y).reverse() : contour.y;
  const [cx, cy] = contourCentroid({ x, y });
  const angles = checkStarShaped(x, y, cx, cy);
  // Phase 2: sample r(θ) and transform.
  const radius = sampleRadius(x, y, cx, cy, angles, RADIAL_FIT_SAMPLES);
  const data = new Float64Array(2 * RADIAL_FIT_SAMPLES);
  for (let j = 0; j < RADIAL_FIT_SAMPLES; j++) data[2 * j] = radius[j] as number;
  const spectrum = new Float64Array(2 * RADIAL_FIT_SAMPLES);
  getFftPlan(RADIAL_FIT_SAMPLES).transform(spectrum, data);
  // Phase 3: R_k = (1/M)Σ r_j e^{−ikθ_j}; r = R_0 + Σ 2|R_k| cos(kθ + arg R_k).
  const baseRadius = (spectrum[0] as number) / RADIAL_FIT_SAMPLES;
  const terms: RadialTerm[] = [];
  for (let k = 1; k <= harmonics; k++) {
    const re = (spectrum[2 * k] as number) / RADIAL_FIT_SAMPLES;
    const im = (spectrum[2 * k + 1] as number) / RADIAL_FIT_SAMPLES;
    terms.push({ k, amplitude: (2 * Math.hypot(re, im)) / baseRadius, phase: Math.atan2(im, re) });
  }
  const descriptor: RadialDescriptor = { family: 'radial', baseRadius, terms };
  assertPositiveRadius(descriptor);
  return descriptor;
}
