import { normalizeComplexHarmonics } from './normalize-complex-harmonics';
import { toComplexHarmonics } from './to-complex-harmonics';
import { toEllipticHarmonics } from './to-elliptic-harmonics';
import type { EllipticDescriptor, NormalizeOptions } from './types';

/**
 * Normalises elliptic harmonics (Kuhl & Giardina 1982): counter-clockwise, area centroid at the origin, the
 * chosen scale, and the chosen orientation rule — by default Kuhl & Giardina's first-harmonic rule, after which
 * b1 = c1 = 0 and a1 ≥ d1 > 0.
 *
 * Conventions (documented in full on `normalizeComplexHarmonics`, which does the work in the equivalent
 * complex form c_n = ((a + d) + i(c − b))/2, c_−n = ((a − d) + i(b + c))/2):
 * - Start point: the first-harmonic rule fixes it only modulo π, and the two choices differ in the sign of every
 *   even harmonic. Epicycle starts at the end of the major axis where the outline lies farther from the area
 *   centroid (the larger x(0) after rotation).
 * - Symmetric shapes (threefold or higher symmetry: a circular first harmonic and equal second moments) fall
 *   back to the dominant-harmonic rule: c_1 and the largest other complex harmonic are both made real and
 *   positive, ties broken by the remaining harmonics in order of magnitude.
 * - Validity: malformed descriptors raise `ShapeError`; zero area raises `degenerate-shape`. Self-intersection
 *   is not checked here (see `validateDescriptor`).
 * The result has harmonics 1…n_max, all present.
 */
export function normalizeEllipticHarmonics(descriptor: EllipticDescriptor, options: NormalizeOptions = {}): EllipticDescriptor {
  return toEllipticHarmonics(normalizeComplexHarmonics(toComplexHarmonics(descriptor), options));
}
