/** Link of a psychometric function: logistic (`logit`) or cumulative normal (`probit`). */
export type Link = 'logit' | 'probit';

/**
 * Binomial psychometric data, one entry per stimulus level: `x` the level (any unit, e.g. signed position along a
 * direction), `n` the number of trials (integer ≥ 1), `k` how many were answered "B" (integer 0…n).
 */
export interface PsychometricData {
  readonly x: readonly number[];
  readonly n: readonly number[];
  readonly k: readonly number[];
}

/**
 * The symmetric lapse λ (γ = λ, two-category classification): `{ max }` fits it as a free parameter on [0, max];
 * `{ fixed }` holds it. Both must lie in [0, 0.5).
 */
export type LapseOption = { readonly max: number } | { readonly fixed: number };

/** Options of `fitPsychometric`. */
export interface FitOptions {
  readonly link: Link;
  /** Absent: λ = 0. */
  readonly lapse?: LapseOption;
  /**
   * Range allowed for the spread, in units of x. Default: `DEFAULT_SPREAD_BOUNDS` fractions of the range of x
   * (see `spreadBoundsFor`).
   */
  readonly spreadBounds?: { readonly min: number; readonly max: number };
}

/** Which bound of a parameter an estimate sits on, or `null` when it is interior. */
export type BoundHit = 'lower' | 'upper' | null;

/**
 * A maximum-likelihood psychometric fit ψ(x) = λ + (1 − 2λ)F((x − threshold)/spread).
 * - `threshold`: the PSE, ψ = 0.5 (units of x). `spread`: β of the logistic or σ of the normal (units of x, > 0).
 * - `slopeAtThreshold`: dψ/dx at the threshold (per unit of x). `interquartileSpread`: x(F = 0.75) − x(F = 0.25).
 * - `logLikelihood`: the binomial kernel Σ k ln ψ + (n − k) ln(1 − ψ) (natural log; no binomial coefficients).
 * - `deviance`: 2(ℓ_saturated − ℓ), against the saturated model.
 */
export interface PsychometricFit {
  readonly link: Link;
  readonly threshold: number;
  readonly spread: number;
  readonly lapse: number;
  readonly slopeAtThreshold: number;
  readonly interquartileSpread: number;
  readonly logLikelihood: number;
  readonly deviance: number;
  readonly bounds: { readonly spreadAtBound: BoundHit; readonly lapseAtBound: BoundHit };
}
