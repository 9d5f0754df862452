import { assertPositiveRadius } from './assert-positive-radius';
import { checkDescriptorTerms } from './check-descriptor-terms';
import { descriptorArea } from './descriptor-area';
import { descriptorMaxRadius } from './descriptor-max-radius';
import { descriptorMoments } from './descriptor-moments';
import { descriptorPerimeter } from './descriptor-perimeter';
import { pickOrientationCandidate, type OrientationCandidate } from './pick-orientation-candidate';
import { principalAxisRotations } from './principal-axis-rotations';
import type { RadialDescriptor, RadialNormalizeOptions, RadialTerm } from './types';

/** Amplitude ties and tie-break comparisons are decided within this fraction of r0 (rounding is ~1e-16). */
const TIE_TOLERANCE = 1e-9;

/** Phase wrapped into (−π, π]. */
function wrapPhase(phase: number): number {
  const wrapped = phase - 2 * Math.PI * Math.round(phase / (2 * Math.PI));
  return wrapped <= -Math.PI ? wrapped + 2 * Math.PI : wrapped;
}

/** A negative amplitude is the same component half a cycle on: A cos(x) = |A| cos(x + π). */
function canonicalTerm({ k, amplitude, phase }: RadialTerm): RadialTerm {
  return amplitude < 0 ? { k, amplitude: -amplitude, phase: wrapPhase(phase + Math.PI) } : { k, amplitude, phase: wrapPhase(phase) };
}

/** Rotating the shape by α turns r(θ) into r(θ − α): φ_k ↦ φ_k − kα. */
function rotate(descriptor: RadialDescriptor, alpha: number): RadialDescriptor {
  return {
    ...descriptor,
    terms: descriptor.terms.map((t) => ({ k: t.k, amplitude: t.amplitude, phase: wrapPhase(t.phase - t.k * alpha) })),
  };
}

/** Tie-break view of the terms: A_k e^{iφ_k}, which a rotation by α turns by −kα (start shift τ = −α). */
function tieBreakTerms(descriptor: RadialDescriptor): { k: number; re: number; im: number }[] {
  return descriptor.terms.map((t) => ({ k: t.k, re: t.amplitude * Math.cos(t.phase), im: t.amplitude * Math.sin(t.phase) }));
}

function asCandidate(alpha: number): OrientationCandidate {
  // In the tie-break's coefficient view c_k e^{i(α' + kτ)}, a radial rotation is α' = 0, τ = −α.
  return { rotation: 0, startShift: -alpha };
}

/** The symmetric-shape rule for the radial family; see `normalizeRadialHarmonics`. */
function dominantHarmonicRotation(descriptor: RadialDescriptor): number {
  const active = descriptor.terms.filter((t) => t.amplitude > TIE_TOLERANCE);
  if (active.length === 0) return 0;
  const largest = Math.max(...active.map((t) => t.amplitude));
  const reference = active.filter((t) => t.amplitude >= largest - TIE_TOLERANCE).sort((p, q) => p.k - q.k)[0];
  if (!reference) return 0;
  const candidates: OrientationCandidate[] = [];
  for (let j = 0; j < reference.k; j++) candidates.push(asCandidate((reference.phase + 2 * Math.PI * j) / reference.k));
  const rest = tieBreakTerms(descriptor).filter((t) => t.k !== reference.k);
  return -pickOrientationCandidate(candidates, rest, TIE_TOLERANCE).startShift;
}

function principalAxisRotation(descriptor: RadialDescriptor): number | undefined {
  const rotations = principalAxisRotations(descriptorMoments(descriptor));
  if (!rotations) return undefined;
  if (rotations.length === 1) return rotations[0];
  return -pickOrientationCandidate(rotations.map(asCandidate), tieBreakTerms(descriptor), TIE_TOLERANCE).startShift;
}

/**
 * Normalises radial harmonics r(θ) = r0(1 + Σ A_k cos(kθ + φ_k)) (radial-frequency patterns, Wilkinson,
 * Wilson & Habak 1998). The radial family is counter-clockwise by construction and always starts at θ = 0, so
 * a rotation by α is the only placement freedom (φ_k ↦ φ_k − kα); the shape stays drawn about its polar
 * origin (the area centroid sits off the origin when the terms make it lopsided — translate the contour,
 * not the descriptor, for display).
 *
 * - Terms come back sorted by k, with amplitudes ≥ 0 (A cos x = |A| cos(x + π)) and phases in (−π, π].
 * - Scale (`scale`, default `equal-area-radius`): r0 is set so the area (exact, π r0²(1 + ½ΣA²)), the
 *   equal-area radius, the largest distance from the area centroid, or the perimeter is 1.
 * - Orientation (`orientation`, default `dominant-harmonic`):
 *   - `dominant-harmonic` — **the symmetric-shape rule**: the phase of the harmonic with the largest
 *     amplitude (ties: the lower k) is set to 0, which puts one of its lobes on +x. Of the k rotations that do
 *     so, the chosen one makes the remaining harmonics, in order of decreasing amplitude, have the largest
 *     cos φ, then the largest sin φ. A shape with only k-fold symmetric terms gets the same result from all k,
 *     as it should. This is the rule for shapes with threefold or higher symmetry, where a principal axis
 *     does not exist.
 *   - `principal-axis` — the major principal axis of the area's second moments goes onto +x, the direction
 *     with positive third moment along x (then y); falls back to `dominant-harmonic` when the second moments
 *     are equal (anisotropy below 1e-6).
 *   - `none`.
 * Raises `ShapeError` for malformed terms and for r ≤ 0 anywhere.
 */
export function normalizeRadialHarmonics(descriptor: RadialDescriptor, options: RadialNormalizeOptions = {}): RadialDescriptor {
  checkDescriptorTerms(descriptor);
  assertPositiveRadius(descriptor);
  // Stage 1: canonical terms.
  let current: RadialDescriptor = {
    family: 'radial',
    baseRadius: descriptor.baseRadius,
    terms: descriptor.terms.map(canonicalTerm).sort((p, q) => p.k - q.k),
  };
  // Stage 2: scale.
  const scale = options.scale ?? 'equal-area-radius';
  const area = descriptorArea(current);
  const factor =
    scale === 'area'
      ? 1 / Math.sqrt(area)
      : scale === 'equal-area-radius'
        ? 1 / Math.sqrt(area / Math.PI)
        : scale === 'max-radius'
          ? 1 / descriptorMaxRadius(current, descriptorMoments(current).centroid)
          : scale === 'perimeter'
            ? 1 / descriptorPerimeter(current)
            : 1;
  current = { ...current, baseRadius: current.baseRadius * factor };
  // Stage 3: orientation.
  const rule = options.orientation ?? 'dominant-harmonic';
  if (rule === 'none') return current;
  const alpha = (rule === 'principal-axis' ? principalAxisRotation(current) : undefined) ?? dominantHarmonicRotation(current);
  return rotate(current, alpha);
}
