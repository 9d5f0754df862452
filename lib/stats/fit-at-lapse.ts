import { binomialLogLikelihood } from './binomial-log-likelihood';
import { BOUND_TOLERANCE, LOG_LIKELIHOOD_TOLERANCE, MAX_HALVINGS, MAX_ITERATIONS, STEP_TOLERANCE, VARIANCE_FLOOR } from './fisher-scoring-limits';
import { linkFunction } from './link-function';
import type { BoundHit, Link, PsychometricData } from './types';

/** Result of `fitAtLapse`: the ML threshold and spread (units of x) at a given λ, and the log-likelihood kernel. */
export interface LapseConditionalFit {
  readonly threshold: number;
  readonly spread: number;
  readonly logLikelihood: number;
  readonly spreadAtBound: BoundHit;
}

/**
 * Maximum-likelihood threshold and spread at a fixed symmetric lapse λ (ψ = λ + (1 − 2λ)F((x − α)/β)), by Fisher
 * scoring (iteratively reweighted least squares, Nelder & Wedderburn 1972) in the GLM form η = c + b(x − x̄), b = 1/β,
 * with step halving so the likelihood never falls, and an active-set bound 1/β_max ≤ b ≤ 1/β_min so separable data
 * stop at β_min. `start` warm-starts from a previous fit.
 */
export function fitAtLapse(
  data: PsychometricData,
  link: Link,
  lapse: number,
  spreadBounds: { readonly min: number; readonly max: number },
  start?: { readonly threshold: number; readonly spread: number },
): LapseConditionalFit {
  const { cdf, pdf } = linkFunction(link);
  const m = data.x.length;
  const xMean = data.x.reduce((s, v) => s + v, 0) / m;
  const bLow = 1 / spreadBounds.max;
  const bHigh = 1 / spreadBounds.min;
  const scale = 1 - 2 * lapse;
  const toParameters = (c: number, b: number) => ({ threshold: xMean - c / b, spread: 1 / b, lapse });
  const logLikelihood = (c: number, b: number) => binomialLogLikelihood(data, link, toParameters(c, b));

  // Start: the previous fit, or threshold at the mean level and spread a quarter of the range.
  const range = Math.max(...data.x) - Math.min(...data.x);
  const startSpread = start?.spread ?? range / 4;
  let b = Math.min(bHigh, Math.max(bLow, 1 / startSpread));
  let c = start ? (xMean - start.threshold) * b : 0;
  let ll = logLikelihood(c, b);

  for (let iter = 0; iter < MAX_ITERATIONS; iter++) {
    // Score g and expected information I in (c, b).
    let g0 = 0;
    let g1 = 0;
    let i00 = 0;
    let i01 = 0;
    let i11 = 0;
    for (let i = 0; i < m; i++) {
      const xc = (data.x[i] as number) - xMean;
      const eta = c + b * xc;
      const n = data.n[i] as number;
      const psi = lapse + scale * cdf(eta);
      const psiC = lapse + scale * cdf(-eta);
      const variance = Math.max(psi * psiC, VARIANCE_FLOOR);
      const dpsi = scale * pdf(eta);
      const w = ((data.k[i] as number) - n * psi) * (dpsi / variance);
      const info = n * dpsi * (dpsi / variance);
      g0 += w;
      g1 += w * xc;
      i00 += info;
      i01 += info * xc;
      i11 += info * xc * xc;
    }
    // Direction: the full Newton step, or c alone when b is on a bound and the score pushes it outward.
    const atHigh = b >= bHigh * (1 - BOUND_TOLERANCE) && g1 > 0;
    const atLow = b <= bLow * (1 + BOUND_TOLERANCE) && g1 < 0;
    let dc: number;
    let db: number;
    const det = i00 * i11 - i01 * i01;
    if (atHigh || atLow || !(det > 0)) {
      dc = i00 > 0 ? g0 / i00 : 0;
      db = 0;
    } else {
      dc = (i11 * g0 - i01 * g1) / det;
      db = (i00 * g1 - i01 * g0) / det;
    }
    // Shorten the step so b stays within its bounds (still an ascent direction).
    let t = 1;
    if (b + db > bHigh) t = (bHigh - b) / db;
    else if (b + db < bLow) t = (bLow - b) / db;
    // Step halving until the likelihood does not fall.
    let accepted = false;
    for (let h = 0; h < MAX_HALVINGS; h++) {
      const cNew = c + t * dc;
      const bNew = Math.min(bHigh, Math.max(bLow, b + t * db));
      const llNew = logLikelihood(cNew, bNew);
      if (llNew >= ll) {
        const gain = llNew - ll;
        // Separable data gain almost nothing per step while b still climbs to its bound: keep going while it moves.
        const moved = Math.abs(bNew - b) > STEP_TOLERANCE * b || Math.abs(cNew - c) > STEP_TOLERANCE * (1 + Math.abs(c));
        c = cNew;
        b = bNew;
        ll = llNew;
        accepted = gain > LOG_LIKELIHOOD_TOLERANCE || moved;
        break;
      }
      t /= 2;
    }
    if (!accepted) break;
  }

  // Separable data can leave ℓ at exactly 0 with all weights underflowed before b reaches its bound; the supremum
  // is then on the bound, so move there (same threshold) whenever that is no worse.
  for (const bound of [bHigh, bLow]) {
    const cBound = c * (bound / b);
    const llBound = logLikelihood(cBound, bound);
    if (llBound >= ll && bound !== b) {
      c = cBound;
      b = bound;
      ll = llBound;
      break;
    }
  }
  const spreadAtBound: BoundHit =
    b >= bHigh * (1 - BOUND_TOLERANCE) ? 'lower' : b <= bLow * (1 + BOUND_TOLERANCE) ? 'upper' : null;
  const p = toParameters(c, b);
  return { threshold: p.threshold, spread: p.spread, logLikelihood: ll, spreadAtBound };
}
