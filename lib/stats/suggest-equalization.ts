import { StatsError } from './stats-error';

/** A direction and its measured perceptual rate: a psychometric slope, or a map's radial rate. */
export interface DirectionRate {
  /** Radians. */
  readonly angle: number;
  readonly rate: number;
}

export interface EqualizationSuggestion {
  readonly directions: readonly {
    readonly angle: number;
    readonly rate: number;
    /** Factor on the radius in this direction (0 < scale ≤ 1). */
    readonly scale: number;
    /** The rate expected after the change: rate × scale. */
    readonly predictedRate: number;
    /** Whether the scale was held at `minScale`. */
    readonly limited: boolean;
  }[];
  /** Largest over smallest rate, as measured. */
  readonly ratioBefore: number;
  /** The same after the change, as predicted (1 unless a scale was limited). */
  readonly ratioAfter: number;
}

/** Default floor of the scale: no direction shrinks below a quarter of its designed length. */
export const DEFAULT_MIN_SCALE = 0.25;

/**
 * Perceptual equalisation by linear re-scaling per direction: a direction perceived to change faster (a steeper
 * psychometric slope, or a longer reach in the perceptual map) per designed unit is compressed, so that every
 * direction matches the slowest one: scale_θ = max(minScale, rate_min / rate_θ) and the predicted rate is
 * rate_θ·scale_θ (a psychometric function of the re-mapped radius has its slope multiplied by the factor, as
 * F(c·x) has slope c·F′). Scales never exceed 1, so no stimulus moves outside the designed extent. Rates must be
 * positive and finite; raises `StatsError` (`not-finite`, `invalid-option`).
 */
export function suggestEqualization(rates: readonly DirectionRate[], options: { minScale?: number } = {}): EqualizationSuggestion {
  const minScale = options.minScale ?? DEFAULT_MIN_SCALE;
  if (!(minScale > 0 && minScale <= 1)) throw new StatsError('invalid-option', `minScale must lie in (0, 1]; got ${minScale}.`);
  if (rates.length === 0) throw new StatsError('invalid-option', 'An equalisation needs at least one direction with a rate.');
  if (rates.some((r) => !Number.isFinite(r.rate) || !Number.isFinite(r.angle) || r.rate <= 0)) {
    throw new StatsError('not-finite', 'Every direction needs a finite angle and a positive, finite rate.');
  }
  const slowest = Math.min(...rates.map((r) => r.rate));
  const directions = rates.map((r) => {
    const ideal = slowest / r.rate;
    const scale = Math.max(minScale, ideal);
    return { angle: r.angle, rate: r.rate, scale, predictedRate: r.rate * scale, limited: ideal < minScale };
  });
  const ratio = (v: number[]) => Math.max(...v) / Math.min(...v);
  return { directions, ratioBefore: ratio(rates.map((r) => r.rate)), ratioAfter: ratio(directions.map((d) => d.predictedRate)) };
}
