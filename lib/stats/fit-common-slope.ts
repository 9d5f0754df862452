import { binomialLogLikelihood } from './binomial-log-likelihood';
import { BOUND_TOLERANCE, LOG_LIKELIHOOD_TOLERANCE, MAX_HALVINGS, MAX_ITERATIONS, STEP_TOLERANCE, VARIANCE_FLOOR } from './fisher-scoring-limits';
import { linkFunction } from './link-function';
import type { BoundHit, Link, PsychometricData } from './types';

/** Result of `fitCommonSlope`: one threshold per group (units of x), the shared spread, the summed ℓ kernel. */
export interface CommonSlopeFit {
  readonly thresholds: readonly number[];
  readonly spread: number;
  readonly logLikelihood: number;
  readonly spreadAtBound: BoundHit;
}

/**
 * Maximum-likelihood fit of G psychometric functions sharing one spread (and a fixed symmetric lapse λ), each with
 * its own threshold: Fisher scoring (Nelder & Wedderburn 1972) in η_g = c_g + b(x − x̄_g), b = 1/β, solving the
 * arrow-shaped information matrix by its Schur complement, with step halving and the active-set spread bound of
 * `fitAtLapse`. With one group it is `fitAtLapse`.
 */
export function fitCommonSlope(
  groups: readonly PsychometricData[],
  link: Link,
  lapse: number,
  spreadBounds: { readonly min: number; readonly max: number },
): CommonSlopeFit {
  const { cdf, pdf } = linkFunction(link);
  const scale = 1 - 2 * lapse;
  const means = groups.map((g) => g.x.reduce((s, v) => s + v, 0) / g.x.length);
  const bLow = 1 / spreadBounds.max;
  const bHigh = 1 / spreadBounds.min;
  const thresholdsOf = (c: readonly number[], b: number) => c.map((cg, g) => (means[g] as number) - cg / b);
  const logLikelihood = (c: readonly number[], b: number) =>
    groups.reduce(
      (s, data, g) => s + binomialLogLikelihood(data, link, { threshold: (means[g] as number) - (c[g] as number) / b, spread: 1 / b, lapse }),
      0,
    );

  // Start: thresholds at the group means, spread a quarter of the widest group range.
  const range = Math.max(...groups.map((g) => Math.max(...g.x) - Math.min(...g.x)));
  let b = Math.min(bHigh, Math.max(bLow, 4 / range));
  let c = groups.map(() => 0);
  let ll = logLikelihood(c, b);

  for (let iter = 0; iter < MAX_ITERATIONS; iter++) {
    // Score and information, group by group.
    const gc: number[] = [];
    const icc: number[] = [];
    const icb: number[] = [];
    let gb = 0;
    let ibb = 0;
    groups.forEach((data, g) => {
      let s0 = 0;
      let i00 = 0;
      let i01 = 0;
      for (let i = 0; i < data.x.length; i++) {
        const xc = (data.x[i] as number) - (means[g] as number);
        const eta = (c[g] as number) + b * xc;
        const n = data.n[i] as number;
        const psi = lapse + scale * cdf(eta);
        const variance = Math.max(psi * (lapse + scale * cdf(-eta)), VARIANCE_FLOOR);
        const dpsi = scale * pdf(eta);
        const w = ((data.k[i] as number) - n * psi) * (dpsi / variance);
        const info = n * dpsi * (dpsi / variance);
        s0 += w;
        gb += w * xc;
        i00 += info;
        i01 += info * xc;
        ibb += info * xc * xc;
      }
      gc.push(s0);
      icc.push(i00);
      icb.push(i01);
    });
    // Newton direction by the Schur complement of the diagonal block; c alone when b sits on a bound.
    const onBound = (b >= bHigh * (1 - BOUND_TOLERANCE) && gb > 0) || (b <= bLow * (1 + BOUND_TOLERANCE) && gb < 0);
    let schur = ibb;
    let rhs = gb;
    for (let g = 0; g < groups.length; g++) {
      const d = icc[g] as number;
      if (d > 0) {
        schur -= ((icb[g] as number) * (icb[g] as number)) / d;
        rhs -= ((icb[g] as number) * (gc[g] as number)) / d;
      }
    }
    const db = onBound || !(schur > 0) ? 0 : rhs / schur;
    const dc = gc.map((s, g) => ((icc[g] as number) > 0 ? (s - (icb[g] as number) * db) / (icc[g] as number) : 0));
    let t = 1;
    if (b + db > bHigh) t = (bHigh - b) / db;
    else if (b + db < bLow) t = (bLow - b) / db;
    let accepted = false;
    for (let h = 0; h < MAX_HALVINGS; h++) {
      const cNew = c.map((cg, g) => cg + t * (dc[g] as number));
      const bNew = Math.min(bHigh, Math.max(bLow, b + t * db));
      const llNew = logLikelihood(cNew, bNew);
      if (llNew >= ll) {
        const moved =
          Math.abs(bNew - b) > STEP_TOLERANCE * b || cNew.some((v, g) => Math.abs(v - (c[g] as number)) > STEP_TOLERANCE * (1 + Math.abs(v)));
        accepted = llNew - ll > LOG_LIKELIHOOD_TOLERANCE || moved;
        c = cNew;
        b = bNew;
        ll = llNew;
        break;
      }
      t /= 2;
    }
    if (!accepted) break;
  }

  // As in `fitAtLapse`: separable data may stall with underflowed weights short of the bound.
  for (const bound of [bHigh, bLow]) {
    const cBound = c.map((cg) => cg * (bound / b));
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
  return { thresholds: thresholdsOf(c, b), spread: 1 / b, logLikelihood: ll, spreadAtBound };
}
