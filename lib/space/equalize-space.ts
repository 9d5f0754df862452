import { checkSpace } from './check-space';
import { compileAxes } from './compile-axes';
import { descriptorSpectrum } from './descriptor-spectrum';
import { generateSpace } from './generate-space';
import { layoutRays } from './layout-rays';
import { normalizeStimulus } from './normalize-stimulus';
import { SpaceError } from './space-error';
import { spectrumDistance } from './spectrum-distance';
import type { ContourSpectrum, Equalization, EqualizationKnot, SpaceDefinition } from './types';

/** Points of the distance profile along each ray, centre to tip: fine enough to bracket every crossing. */
const DEFAULT_PROFILE_STEPS = 64;
/** Evenly spaced knots per ray (besides one at each stimulus's ρ), so the map is smooth between stimuli too. */
const DEFAULT_KNOTS = 16;
/** Root-finding steps inside a profile cell at most (Illinois converges in well under ten on smooth profiles). */
const MAX_ROOT_STEPS = 60;
/** A root is found when the distance is within this fraction of its target: far below any visible change. */
const ROOT_TOLERANCE = 1e-12;
/** A ray whose largest contour distance is below this fraction of the largest ray's does not change the outline. */
const FLAT_RAY_TOLERANCE = 1e-9;
/** Knots closer than this fraction of the ray's length are merged. */
const KNOT_MERGE_TOLERANCE = 1e-9;

/** Options of `equalizeSpace`. */
export interface EqualizeOptions {
  /** Points of the distance profile per ray (default 64). */
  readonly profileSteps?: number;
  /** Evenly spaced knots per ray, besides those at the stimuli (default 16). */
  readonly knots?: number;
}

/** Contour distance from the centre along one ray, as a function of the (re-mapped) radius. */
type RayDistance = (rho: number) => number;

/** Stage: the first radius where the distance reaches `target`: the profile brackets it, Illinois refines it. */
function invertProfile(distanceAt: RayDistance, grid: Float64Array, profile: Float64Array, target: number): number {
  let cell = 1;
  while (cell < grid.length - 1 && (profile[cell] as number) < target) cell++;
  let low = grid[cell - 1] as number, high = grid[cell] as number;
  let fLow = (profile[cell - 1] as number) - target, fHigh = (profile[cell] as number) - target;
  if (fHigh <= 0) return high;
  if (fLow >= 0) return low;
  // Regula falsi with the Illinois modification (Dowell & Jarratt 1971): superlinear, and the bracket holds.
  let side = 0;
  let x = high;
  for (let step = 0; step < MAX_ROOT_STEPS; step++) {
    x = (low * fHigh - high * fLow) / (fHigh - fLow);
    const f = distanceAt(x) - target;
    if (Math.abs(f) <= ROOT_TOLERANCE * target || high - low <= ROOT_TOLERANCE * high) break;
    if (f < 0) {
      low = x;
      fLow = f;
      if (side === -1) fHigh /= 2;
      side = -1;
    } else {
      high = x;
      fHigh = f;
      if (side === 1) fLow /= 2;
      side = 1;
    }
  }
  return x;
}

/**
 * Re-maps the radius per direction so that contour distance from the centre grows linearly in designed ρ, at
 * the same rate in every direction: for each of the layout's rays (`layoutRays`: spokes, diameter halves, a
 * lattice's compass directions), the contour distance d_θ(ρ) from the centre shape (`spectrumDistance`, exact
 * from the descriptors) is profiled from 0 to the ray's outermost ρ_θ; the common rate is
 * c = min_θ d_θ(ρ_θ)/ρ_θ (the slowest direction's, so no stimulus moves farther out than designed and the
 * checked extent still holds); and the map is ρ′ = the first radius where d_θ reaches c·ρ (the profile brackets it, the
 * Illinois variant of regula falsi refines it; monotone by construction), stored as knots at every stimulus's ρ and at evenly spaced
 * radii. A ray that does not change the outline at all cannot be equalised and keeps the identity (its
 * anisotropy stays infinite). Computed on the definition without its equalisation; anisotropyIndex of the
 * result is ~1 (at the knots, to 1e-12). Raises `SpaceError` (`invalid-space`) unless
 * `checkSpace` passes the unequalised definition.
 */
export function equalizeSpace(definition: SpaceDefinition, options: EqualizeOptions = {}): Equalization {
  const profileSteps = options.profileSteps ?? DEFAULT_PROFILE_STEPS;
  const knotCount = options.knots ?? DEFAULT_KNOTS;
  if (!Number.isInteger(profileSteps) || profileSteps < 2 || !Number.isInteger(knotCount) || knotCount < 1) {
    throw new SpaceError('invalid-argument', `profileSteps (${profileSteps}) must be a whole number ≥ 2 and knots (${knotCount}) ≥ 1`);
  }
  // Phase 1: the unequalised space must be valid.
  const designed: SpaceDefinition = { ...definition, equalization: null };
  const check = checkSpace(designed);
  if (!check.ok) throw new SpaceError('invalid-space', `the space cannot be equalised: ${check.failures.map((f) => `${f.id}: ${f.reason}`).join('; ')}`, check.failures);
  const { stimuli } = generateSpace(designed);
  const rays = layoutRays(designed.layout, stimuli).rays.filter((ray) => ray.members.length > 0);
  const descriptorAt = compileAxes(designed.seed, designed.axes);
  const spectrumAt = (a: number, b: number): ContourSpectrum => descriptorSpectrum(normalizeStimulus(descriptorAt(a, b), designed.normalization).descriptor);
  const centre = spectrumAt(0, 0);
  // Phase 2: a distance profile along every ray.
  const profiles = rays.map((ray) => {
    const top = Math.max(...ray.members.map((i) => stimuli[i]?.polar.rho ?? 0));
    const c = Math.cos(ray.angle), s = Math.sin(ray.angle);
    const distanceAt: RayDistance = (rho) => spectrumDistance(centre, spectrumAt(rho * c, rho * s));
    const grid = Float64Array.from({ length: profileSteps + 1 }, (_, g) => (top * g) / profileSteps);
    const profile = grid.map((rho, g) => (g === 0 ? 0 : distanceAt(rho)));
    let envelope = 0;
    for (const d of profile) envelope = Math.max(envelope, d);
    return { ray, top, distanceAt, grid, profile, reach: envelope };
  });
  // Phase 3: the common rate, set by the slowest ray that changes the outline at all.
  const largestReach = Math.max(0, ...profiles.map((p) => p.reach));
  const moving = profiles.filter((p) => p.reach > FLAT_RAY_TOLERANCE * largestReach && p.top > 0);
  const rate = moving.length === 0 ? 0 : Math.min(...moving.map((p) => Math.max(...p.profile) / p.top));
  // Phase 4: knots per ray.
  const directions = profiles.map(({ ray, top, distanceAt, grid, profile, reach }) => {
    const radii = [...ray.members.map((i) => stimuli[i]?.polar.rho ?? 0), ...Array.from({ length: knotCount }, (_, k) => (top * (k + 1)) / knotCount)]
      .filter((rho) => rho > 0)
      .sort((p, q) => p - q)
      .filter((rho, i, all) => i === 0 || rho - (all[i - 1] as number) > KNOT_MERGE_TOLERANCE * top);
    const flat = !(reach > FLAT_RAY_TOLERANCE * largestReach) || rate === 0;
    let previous = 0;
    const knots: EqualizationKnot[] = radii.map((rho) => {
      const mapped = flat ? rho : Math.min(top, Math.max(previous, invertProfile(distanceAt, grid, profile, rate * rho)));
      previous = mapped;
      return [rho, mapped];
    });
    return { angle: ray.angle, knots };
  });
  return { directions };
}
