import { synthesizeDirect } from './synthesize-direct';
import { toComplexHarmonics } from './to-complex-harmonics';
import type { ComplexDescriptor, ShapeDescriptor } from './types';

/** Position and first and second derivatives (per radian of t) of a descriptor's curve at t_j = 2πj/M. */
export interface SampledCurve {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly dx: Float64Array;
  readonly dy: Float64Array;
  readonly ddx: Float64Array;
  readonly ddy: Float64Array;
  /** The highest |k| of the complex form, which bounds the degree of every integrand built from these. */
  readonly highestComplexHarmonic: number;
}

function differentiate(descriptor: ComplexDescriptor): ComplexDescriptor {
  // d/dt c_k e^{ikt} = ik c_k e^{ikt}.
  return { family: 'complex', terms: descriptor.terms.map(({ k, re, im }) => ({ k, re: -k * im, im: k * re })) };
}

/**
 * Exact samples of a descriptor's curve and its analytic derivatives, from the complex form
 * z(t) = Σ c_k e^{ikt}: z' = Σ ik c_k e^{ikt}, z'' = Σ −k² c_k e^{ikt}. Used for moments (trapezoid rules that
 * are exact for trigonometric polynomials of degree < M), perimeter and curvature. No validation.
 */
export function sampleCurve(descriptor: ShapeDescriptor, samples: number): SampledCurve {
  const complex = toComplexHarmonics(descriptor);
  const first = differentiate(complex);
  const second = differentiate(first);
  const position = synthesizeDirect(complex, samples);
  const velocity = synthesizeDirect(first, samples);
  const acceleration = synthesizeDirect(second, samples);
  let highestComplexHarmonic = 0;
  for (const { k } of complex.terms) highestComplexHarmonic = Math.max(highestComplexHarmonic, Math.abs(k));
  return {
    x: position.x,
    y: position.y,
    dx: velocity.x,
    dy: velocity.y,
    ddx: acceleration.x,
    ddy: acceleration.y,
    highestComplexHarmonic,
  };
}
