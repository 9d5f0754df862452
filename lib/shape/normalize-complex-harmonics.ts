import { checkDescriptorTerms } from './check-descriptor-terms';
import { descriptorArea } from './descriptor-area';
import { descriptorMaxRadius } from './descriptor-max-radius';
import { descriptorMoments } from './descriptor-moments';
import { descriptorPerimeter } from './descriptor-perimeter';
import { ShapeError } from './errors';
import { principalAxisRotations } from './principal-axis-rotations';
import { pickOrientationCandidate, type OrientationCandidate } from './pick-orientation-candidate';
import { reverseDescriptor } from './reverse-descriptor';
import { toComplexHarmonics } from './to-complex-harmonics';
import { transformComplexHarmonics } from './transform-complex-harmonics';
import type { ComplexDescriptor, NormalizeOptions, ScaleNormalization, ShapeMoments } from './types';

/**
 * The first-harmonic ellipse counts as a circle when its minor/major imbalance |c_−1|/|c_1| is below this.
 * Sampling a 1,024-vertex outline perturbs harmonics by ~1e-7 of |c_1|, so the rule is only trusted above.
 */
const CIRCULAR_FIRST_HARMONIC_TOLERANCE = 1e-6;
/** Ties in the orientation rules are decided within this fraction of |c_1| (coefficients carry ~1e-15 noise). */
const TIE_TOLERANCE = 1e-9;

type Placement = OrientationCandidate;

/** Stage: scale factor that brings the (centred, counter-clockwise) curve to the unit of the chosen measure. */
function scaleFactor(descriptor: ComplexDescriptor, scale: ScaleNormalization, area: number): number {
  switch (scale) {
    case 'area':
      return 1 / Math.sqrt(area);
    case 'equal-area-radius':
      return 1 / Math.sqrt(area / Math.PI);
    case 'max-radius':
      return 1 / descriptorMaxRadius(descriptor, [0, 0]);
    case 'perimeter':
      return 1 / descriptorPerimeter(descriptor);
    case 'none':
      return 1;
  }
}

function coefficient(descriptor: ComplexDescriptor, k: number): { re: number; im: number } {
  const term = descriptor.terms.find((t) => t.k === k);
  return term ?? { re: 0, im: 0 };
}

/** The symmetric-shape rule; see the module comment. Always defined. */
function dominantHarmonicPlacement(descriptor: ComplexDescriptor, tolerance: number): Placement {
  const c1 = coefficient(descriptor, 1);
  const arg1 = Math.atan2(c1.im, c1.re);
  const others = descriptor.terms.filter((t) => t.k !== 0 && t.k !== 1 && Math.hypot(t.re, t.im) > tolerance);
  if (others.length === 0) return { rotation: -arg1, startShift: 0 };
  const largest = Math.max(...others.map((t) => Math.hypot(t.re, t.im)));
  const reference = others
    .filter((t) => Math.hypot(t.re, t.im) >= largest - tolerance)
    .sort((p, q) => Math.abs(p.k - 1) - Math.abs(q.k - 1) || q.k - p.k)[0];
  if (!reference) return { rotation: -arg1, startShift: 0 };
  // arg c_1 + α + τ = 0 and arg c_r + α + rτ = 0  ⇒  (r − 1)τ = arg c_1 − arg c_r (mod 2π): |r − 1| solutions.
  const m = reference.k - 1;
  const base = arg1 - Math.atan2(reference.im, reference.re);
  const candidates: Placement[] = [];
  for (let j = 0; j < Math.abs(m); j++) {
    const startShift = (base + 2 * Math.PI * j) / m;
    candidates.push({ rotation: -arg1 - startShift, startShift });
  }
  const rest = descriptor.terms.filter((t) => t.k !== 1 && t.k !== reference.k);
  return pickOrientationCandidate(candidates, rest, tolerance);
}

/** Kuhl & Giardina's first-harmonic rule with the farther-end start convention; undefined for a circular c_±1. */
function firstHarmonicPlacement(descriptor: ComplexDescriptor, tolerance: number): Placement | undefined {
  const p = coefficient(descriptor, 1);
  const q = coefficient(descriptor, -1);
  const magnitudeP = Math.hypot(p.re, p.im);
  if (Math.hypot(q.re, q.im) <= CIRCULAR_FIRST_HARMONIC_TOLERANCE * magnitudeP) return undefined;
  const argP = Math.atan2(p.im, p.re);
  const tau0 = (Math.atan2(q.im, q.re) - argP) / 2;
  const candidates: Placement[] = [0, Math.PI].map((offset) => ({ rotation: -(argP + tau0 + offset), startShift: tau0 + offset }));
  // x(0) of each placement: Re Σ c_k e^{i(α + kτ)}.
  const startX = candidates.map(({ rotation, startShift }) =>
    descriptor.terms.reduce((sum, t) => {
      const angle = rotation + t.k * startShift;
      return sum + t.re * Math.cos(angle) - t.im * Math.sin(angle);
    }, 0),
  );
  const [x0 = 0, x1 = 0] = startX;
  if (Math.abs(x0 - x1) > tolerance) return (x0 > x1 ? candidates[0] : candidates[1]) as Placement;
  return pickOrientationCandidate(candidates, descriptor.terms.filter((t) => t.k !== 1 && t.k !== -1), tolerance);
}

function principalAxisPlacement(descriptor: ComplexDescriptor, moments: ShapeMoments, tolerance: number): Placement | undefined {
  const rotations = principalAxisRotations(moments);
  if (!rotations) return undefined;
  const c1 = coefficient(descriptor, 1);
  const arg1 = Math.atan2(c1.im, c1.re);
  // Start point: where the counter-clockwise circular part of the first harmonic, c_1 e^{it}, points along +x.
  const candidates = rotations.map((rotation) => ({ rotation, startShift: -(arg1 + rotation) }));
  return candidates.length === 1 ? candidates[0] : pickOrientationCandidate(candidates, descriptor.terms, tolerance);
}

/**
 * Normalises complex harmonics z(t) = Σ c_k e^{ikt}. Stages, in order:
 *
 * 1. Direction: counter-clockwise (a clockwise curve is re-traced as t → −t, c_k ↔ c_−k).
 * 2. Translation: the area centroid (exact, from the coefficients) moves to the origin.
 * 3. Scale (`scale`, default `equal-area-radius`): unit area, unit equal-area radius √(A/π), unit maximum
 *    distance from the centroid, unit perimeter, or none.
 * 4. Orientation and start point (`orientation`, default `first-harmonic`):
 *    - `first-harmonic` — Kuhl & Giardina (1982): the start point moves to an end of the first harmonic
 *      ellipse's major axis and the major axis is turned onto +x, so b1 = c1 = 0 and a1 > 0. That fixes the
 *      start only modulo π; the two choices differ in the sign of every even harmonic. **Convention: the start
 *      is the end of the major axis where the curve lies farther from the centroid** (larger x(0) after
 *      rotation), i.e. the sign that makes A0 + Σ_even a_n positive.
 *    - `principal-axis` — the major principal axis of the area's second moments goes onto +x, the direction
 *      chosen so the third moment along x is positive (then along y); the start point is the parameter where
 *      c_1 e^{it}, the counter-clockwise circular part of the first harmonic, points along +x.
 *    - `dominant-harmonic` — **the symmetric-shape rule**, also the fallback of both rules above whenever they
 *      are undefined (a circular first harmonic, |c_−1| < 1e-6·|c_1|; equal second moments, anisotropy
 *      < 1e-6). These are exactly the shapes with threefold or higher rotational symmetry, the likeliest seed
 *      shapes. Rule: make c_1 real and positive, and make the largest other harmonic c_r (ties: smaller |r − 1|,
 *      then positive r) real and positive too. That leaves |r − 1| placements, which differ only if the shape
 *      lacks the (r − 1)-fold symmetry; the tie-break takes the one whose remaining harmonics, in order of
 *      decreasing magnitude, have the largest real part, then imaginary part (`pickOrientationCandidate`).
 *    - `none` — leave rotation and start alone.
 *
 * Raises `ShapeError` for malformed descriptors and `degenerate-shape` for zero area.
 */
export function normalizeComplexHarmonics(descriptor: ComplexDescriptor, options: NormalizeOptions = {}): ComplexDescriptor {
  checkDescriptorTerms(descriptor);
  let current = toComplexHarmonics(descriptor);
  // Stage 1: direction.
  const signedArea = descriptorArea(current);
  if (!(signedArea !== 0) || !Number.isFinite(signedArea)) {
    throw new ShapeError('degenerate-shape', 'the descriptor encloses no area', { family: descriptor.family, value: signedArea });
  }
  if (signedArea < 0) current = reverseDescriptor(current);
  // Stage 2: translation.
  const moments = descriptorMoments(current);
  current = transformComplexHarmonics(current, { translation: [-moments.centroid[0], -moments.centroid[1]] });
  // Stage 3: scale.
  const scale = scaleFactor(current, options.scale ?? 'equal-area-radius', Math.abs(signedArea));
  current = transformComplexHarmonics(current, { scale });
  // Stage 4: orientation and start point.
  const rule = options.orientation ?? 'first-harmonic';
  if (rule === 'none') return current;
  const c1 = coefficient(current, 1);
  const tolerance = TIE_TOLERANCE * Math.hypot(c1.re, c1.im);
  const placement =
    (rule === 'first-harmonic'
      ? firstHarmonicPlacement(current, tolerance)
      : rule === 'principal-axis'
        ? principalAxisPlacement(current, moments, tolerance)
        : undefined) ?? dominantHarmonicPlacement(current, tolerance);
  return transformComplexHarmonics(current, placement);
}
