import { SequenceError } from './sequence-error';

/** Below this u = λL the closed form 1/u − 1/(eᵘ − 1) cancels badly; its Taylor series ½ − u/12 + u³/720 is exact to 1e-20. */
const SERIES_BELOW = 1e-4;
/** Bisection steps: each halves the bracket, so 200 reach the limit of double precision from any start. */
const BISECTION_STEPS = 200;

/** Mean of Exp(rate u/L) truncated to [0, L], divided by L, as a function of u = λL > 0: 1/u − 1/(eᵘ − 1). */
function scaledTruncatedMean(u: number): number {
  if (u < SERIES_BELOW) return 0.5 - u / 12 + (u * u * u) / 720;
  return 1 / u - 1 / Math.expm1(u);
}

/**
 * The rate λ (1/s) of an exponential distribution truncated to [0, width] whose mean is `mean` seconds, for
 * 0 < mean < width/2 (the truncated mean 1/λ − L/(e^{λL} − 1) falls from L/2 at λ → 0 to 0 as λ → ∞). Solved by
 * bisection on u = λL; used for truncated exponential ITIs (min + X, X on [0, max − min]).
 */
export function truncatedExponentialRate(mean: number, width: number): number {
  if (!(width > 0 && mean > 0 && mean < width / 2) || !Number.isFinite(width)) {
    throw new SequenceError('invalid-iti', `A truncated exponential needs 0 < mean < width/2; got mean ${mean} s, width ${width} s.`, {
      field: 'iti.mean',
      value: mean,
    });
  }
  const target = mean / width;
  // scaledTruncatedMean(u) < 1/u, so u = 1/target is already past the root; the root lies in (0, 1/target].
  let low = 0;
  let high = 1 / target;
  for (let step = 0; step < BISECTION_STEPS; step++) {
    const middle = (low + high) / 2;
    if (scaledTruncatedMean(middle) > target) low = middle;
    else high = middle;
  }
  return (low + high) / 2 / width;
}
