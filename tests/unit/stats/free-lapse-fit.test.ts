import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  binomialLogLikelihood,
  drawBinomial,
  evaluatePsychometric,
  fitAtLapse,
  fitPsychometric,
  goldenSectionMaximum,
  profileLapse,
  seededRandom,
  spreadBoundsFor,
  type Link,
  type PsychometricData,
} from '@/lib/stats';

const LEVELS = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];
const LAPSE_MAX = 0.06;
/** Grid steps on [0, λmax] for the dense reference profile. */
const GRID = 240;

/** The maximum of ℓ over λ in [0, max]: a dense grid of the λ-conditional fits, refined by golden section. */
function referenceMaximum(data: PsychometricData, link: Link): number {
  const bounds = spreadBoundsFor(data, { link });
  const profile = (lapse: number) => fitAtLapse(data, link, lapse, bounds).logLikelihood;
  let best = Number.NEGATIVE_INFINITY;
  let bestLapse = 0;
  for (let j = 0; j <= GRID; j++) {
    const lapse = (LAPSE_MAX * j) / GRID;
    const ll = profile(lapse);
    if (ll > best) [best, bestLapse] = [ll, lapse];
  }
  const step = LAPSE_MAX / GRID;
  const refined = goldenSectionMaximum(profile, Math.max(0, bestLapse - step), Math.min(LAPSE_MAX, bestLapse + step), 1e-9);
  return Math.max(best, refined.value, profileLapse(data, link, LAPSE_MAX, bounds).logLikelihood);
}

describe('fitPsychometric with a free lapse (joint bounded Newton)', () => {
  it('reaches the maximum likelihood of a dense-grid lapse profile on seeded simulated observers', () => {
    // Reference: the λ-conditional two-parameter fit (`fitAtLapse`, an independent IRLS) maximised over λ on a
    // grid of 241 points and refined by golden section (Kiefer 1953); tolerance 1e-6 in ℓ (natural-log units).
    const random = seededRandom(1293);
    let interior = 0;
    for (let s = 0; s < 24; s++) {
      const link: Link = s % 2 === 0 ? 'logit' : 'probit';
      const trials = [10, 20, 50][s % 3] as number;
      const truth = { threshold: (random() - 0.5) * 3, spread: 0.5 + random() * 1.5, lapse: random() * 0.08 };
      const data = { x: LEVELS, n: LEVELS.map(() => trials), k: LEVELS.map((x) => drawBinomial(trials, evaluatePsychometric(link, truth, x), random)) };
      const fast = fitPsychometric(data, { link, lapse: { max: LAPSE_MAX } });
      const reference = referenceMaximum(data, link);
      expect(fast.logLikelihood).toBeGreaterThan(reference - 1e-6);
      expect(fast.logLikelihood).toBeLessThan(reference + 1e-6);
      expect(fast.lapse).toBeGreaterThanOrEqual(0);
      expect(fast.lapse).toBeLessThanOrEqual(LAPSE_MAX);
      if (fast.bounds.lapseAtBound === null) interior++;
    }
    // The set must exercise the free lapse, not only the bound λ = 0.
    expect(interior).toBeGreaterThan(3);
  });

  it('is a maximum in (threshold, spread, λ) jointly: nearby parameters in the box score lower (seeded)', () => {
    const random = seededRandom(63);
    const truth = { threshold: 0.4, spread: 1, lapse: 0.04 };
    const data = { x: LEVELS, n: LEVELS.map(() => 40), k: LEVELS.map((x) => drawBinomial(40, evaluatePsychometric('logit', truth, x), random)) };
    const fit = fitPsychometric(data, { link: 'logit', lapse: { max: LAPSE_MAX } });
    fc.assert(
      fc.property(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), (u, v, w) => {
        fc.pre(Math.abs(u) + Math.abs(v) + Math.abs(w) > 1e-3);
        const lapse = Math.min(LAPSE_MAX, Math.max(0, fit.lapse + 0.01 * w));
        const nearby = { threshold: fit.threshold + 0.05 * u, spread: fit.spread * (1 + 0.1 * v), lapse };
        expect(binomialLogLikelihood(data, 'logit', nearby)).toBeLessThanOrEqual(fit.logLikelihood + 1e-9);
      }),
      { seed: 2001, numRuns: 300 },
    );
  });
});
