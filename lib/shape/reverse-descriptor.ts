import type { ShapeDescriptor } from './types';

/**
 * The same curve traced backwards, t → −t, so the point at t = 0 stays put and the direction flips:
 * elliptic b_n, d_n change sign; complex c_k ↔ c_−k. The radial family is counter-clockwise by construction,
 * so a radial descriptor is returned unchanged.
 */
export function reverseDescriptor<D extends ShapeDescriptor>(descriptor: D): D {
  if (descriptor.family === 'elliptic') {
    return {
      ...descriptor,
      terms: descriptor.terms.map(({ n, a, b, c, d }) => ({ n, a, b: -b, c, d: -d })),
    };
  }
  if (descriptor.family === 'complex') {
    return {
      ...descriptor,
      terms: descriptor.terms.map(({ k, re, im }) => ({ k: k === 0 ? 0 : -k, re, im })).sort((p, q) => p.k - q.k),
    };
  }
  return descriptor;
}
