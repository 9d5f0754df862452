import { equalizationMap } from './equalization-map';
import { SpaceError } from './space-error';
import { wrapAngle } from './wrap-angle';
import type { Equalization, EqualizationKnot } from './types';

/** Evenly spaced knots per direction: the scaled map is piecewise linear only where the earlier one was. */
const DEFAULT_KNOTS = 16;

/**
 * A radius re-mapping that multiplies the designed radius by a factor per direction before the space's own
 * re-mapping (if any): ρ′ = E₀(scale_θ·ρ, θ), as knots at `knots` evenly spaced radii up to `extent` along each
 * given direction (radians); between directions `equalizationMap` blends by angle as usual. With no earlier
 * re-mapping the knots are exactly (ρ, scale·ρ). Scales must be positive and finite, directions distinct; raises
 * `SpaceError` (`invalid-argument`).
 */
export function rescaleEqualization(previous: Equalization | null | undefined, directions: readonly { readonly angle: number; readonly scale: number }[], extent: number, knots = DEFAULT_KNOTS): Equalization {
  if (!(extent > 0) || !Number.isFinite(extent)) throw new SpaceError('invalid-argument', `extent must be positive and finite; got ${extent}`);
  if (!Number.isInteger(knots) || knots < 1) throw new SpaceError('invalid-argument', `knots must be a whole number ≥ 1; got ${knots}`);
  if (directions.length === 0 || directions.some((d) => !(d.scale > 0) || !Number.isFinite(d.scale) || !Number.isFinite(d.angle))) {
    throw new SpaceError('invalid-argument', 'Every direction needs a finite angle and a positive, finite scale.');
  }
  const angles = directions.map((d) => wrapAngle(d.angle));
  if (new Set(angles.map((a) => a.toFixed(12))).size !== angles.length) throw new SpaceError('invalid-argument', 'Directions must be distinct.');
  const before = equalizationMap(previous);
  return {
    directions: directions.map((d, i) => {
      const angle = angles[i] as number;
      const points: EqualizationKnot[] = Array.from({ length: knots }, (_, k) => {
        const rho = (extent * (k + 1)) / knots;
        return [rho, before(d.scale * rho, angle)];
      });
      return { angle, knots: points };
    }),
  };
}
