import { wrapAngle } from './wrap-angle';
import type { Equalization, EqualizationKnot, RadiusMap } from './types';


interface Direction {
  readonly angle: number;
  /** Knot abscissae and ordinates, with (0, 0) in front. */
  readonly rho: Float64Array;
  readonly mapped: Float64Array;
}

function prepareDirection(angle: number, knots: readonly EqualizationKnot[]): Direction {
  const sorted = knots.filter(([r]) => r > 0).sort((p, q) => p[0] - q[0]);
  return {
    angle: wrapAngle(angle),
    rho: Float64Array.from([0, ...sorted.map(([r]) => r)]),
    mapped: Float64Array.from([0, ...sorted.map(([, m]) => m)]),
  };
}

/** Piecewise-linear through the knots; past the last knot, the last segment's line. */
function evaluate(direction: Direction, rho: number): number {
  const { rho: xs, mapped: ys } = direction;
  const last = xs.length - 1;
  if (last === 0) return rho;
  let i = 1;
  while (i < last && (xs[i] as number) < rho) i++;
  const x0 = xs[i - 1] as number, x1 = xs[i] as number, y0 = ys[i - 1] as number, y1 = ys[i] as number;
  return y0 + ((y1 - y0) * (rho - x0)) / (x1 - x0);
}

/**
 * Prepares an equalisation for use: ρ′ = f(ρ, θ). Along each stored direction f is the piecewise-linear curve
 * through (0, 0) and its knots (ρ, ρ′), continued past the last knot along the last segment; between two
 * neighbouring directions (cyclically, by angle) f is the linear blend of the two curves by angle, so a map
 * whose curves are all monotone stays monotone in ρ. One direction applies everywhere; `null` or no directions
 * is the identity. Assumes knots `checkSpace` accepts (finite, ρ > 0 increasing, ρ′ non-decreasing).
 */
export function equalizationMap(equalization: Equalization | null | undefined): RadiusMap {
  if (!equalization || equalization.directions.length === 0) return (rho) => rho;
  const directions = equalization.directions.map((d) => prepareDirection(d.angle, d.knots)).sort((p, q) => p.angle - q.angle);
  const count = directions.length;
  const first = directions[0] as Direction;
  if (count === 1) return (rho) => evaluate(first, rho);
  return (rho, angle) => {
    const theta = wrapAngle(angle);
    // The last direction at or before θ (cyclically) and the one after it.
    let lower = count - 1;
    for (let i = 0; i < count; i++) if ((directions[i] as Direction).angle <= theta) lower = i;
    const upper = (lower + 1) % count;
    const from = directions[lower] as Direction;
    const to = directions[upper] as Direction;
    const span = wrapAngle(to.angle - from.angle) || 2 * Math.PI;
    const w = wrapAngle(theta - from.angle) / span;
    return w === 0 ? evaluate(from, rho) : (1 - w) * evaluate(from, rho) + w * evaluate(to, rho);
  };
}
