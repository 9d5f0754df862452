import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { binomialLogLikelihood, fitPsychometric, linkFunction, StatsError, type Link, type PsychometricData } from '@/lib/stats';

// Bliss (1935) beetle mortality, as tabulated in Dobson, An Introduction to Generalized Linear Models (Table 7.2):
// dose in log10 mg/L, beetles exposed, beetles killed.
const BLISS: PsychometricData = {
  x: [1.6907, 1.7242, 1.7552, 1.7842, 1.8113, 1.8369, 1.861, 1.8839],
  n: [59, 60, 62, 56, 63, 59, 62, 60],
  k: [6, 13, 18, 28, 52, 53, 61, 60],
};

/** ψ(x) of a fit, from its parameters, for checks independent of the fit's own derived fields. */
function psiAt(link: Link, fit: { threshold: number; spread: number; lapse: number }, x: number): number {
  return fit.lapse + (1 - 2 * fit.lapse) * linkFunction(link).cdf((x - fit.threshold) / fit.spread);
}

function expectThrowsCode(run: () => unknown, code: string): void {
  try {
    run();
  } catch (error) {
    expect(error).toBeInstanceOf(StatsError);
    expect((error as StatsError).code).toBe(code);
    return;
  }
  throw new Error(`expected a StatsError with code ${code}`);
}

describe('fitPsychometric on the Bliss (1935) beetle data', () => {
  it('reproduces the logit MLE in threshold/spread form', () => {
    // Bliss (1935); logit MLE b1 = −60.72, b2 = 34.27, deviance 11.23, in Dobson (Table 7.2); α = −b1/b2, β = 1/b2.
    const fit = fitPsychometric(BLISS, { link: 'logit' });
    expect(fit.threshold).toBeCloseTo(1.771721, 5);
    expect(fit.spread).toBeCloseTo(0.0291798, 6);
    expect(fit.deviance).toBeCloseTo(11.23, 2);
    expect(fit.lapse).toBe(0);
    expect(fit.bounds).toEqual({ spreadAtBound: null, lapseAtBound: null });
  });

  it('reproduces the probit MLE in threshold/spread form', () => {
    // Bliss (1935); probit MLE b1 = −34.94, b2 = 19.73, deviance 10.12, in Dobson (Table 7.2); μ = −b1/b2, σ = 1/b2.
    const fit = fitPsychometric(BLISS, { link: 'probit' });
    expect(fit.threshold).toBeCloseTo(1.770852, 5);
    expect(fit.spread).toBeCloseTo(0.0506895, 6);
    expect(fit.deviance).toBeCloseTo(10.12, 2);
  });

  it('puts a lapse bounded to [0, 0.06] on 0 and leaves α, β unchanged', () => {
    // REFERENCES.md, "Psychometric fitting": with an upper lapse bounded to [0, 0.06] the estimate sits on 0.
    for (const link of ['logit', 'probit'] as const) {
      const free = fitPsychometric(BLISS, { link });
      const bounded = fitPsychometric(BLISS, { link, lapse: { max: 0.06 } });
      expect(bounded.lapse).toBe(0);
      expect(bounded.bounds.lapseAtBound).toBe('lower');
      expect(bounded.threshold).toBeCloseTo(free.threshold, 7);
      expect(bounded.spread).toBeCloseTo(free.spread, 7);
      expect(bounded.logLikelihood).toBeCloseTo(free.logLikelihood, 8);
    }
  });

  it('is a maximum: every nearby parameter set has a lower likelihood (seeded)', () => {
    for (const link of ['logit', 'probit'] as const) {
      const fit = fitPsychometric(BLISS, { link });
      fc.assert(
        fc.property(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), (u, v) => {
          fc.pre(Math.abs(u) + Math.abs(v) > 1e-3);
          const nearby = { threshold: fit.threshold + 0.01 * u, spread: fit.spread * (1 + 0.2 * v), lapse: 0 };
          expect(binomialLogLikelihood(BLISS, link, nearby)).toBeLessThan(fit.logLikelihood);
        }),
        { seed: 1935, numRuns: 200 },
      );
    }
  });
});

describe('parametric identities', () => {
  it('reports F′(α) = 1/(4β) for the logistic and 1/(σ√(2π)) for the probit, matching a numeric derivative', () => {
    // Derived (REFERENCES.md, "Psychometric fitting"): logistic F′(α) = 1/(4β); cumulative normal F′(μ) = 1/(σ√(2π)).
    const h = 1e-6;
    const logit = fitPsychometric(BLISS, { link: 'logit' });
    const probit = fitPsychometric(BLISS, { link: 'probit' });
    expect(logit.slopeAtThreshold).toBeCloseTo(1 / (4 * logit.spread), 9);
    expect(probit.slopeAtThreshold).toBeCloseTo(1 / (probit.spread * Math.sqrt(2 * Math.PI)), 9);
    for (const [link, fit] of [['logit', logit], ['probit', probit]] as const) {
      const numeric = (psiAt(link, fit, fit.threshold + h) - psiAt(link, fit, fit.threshold - h)) / (2 * h);
      expect(numeric).toBeCloseTo(fit.slopeAtThreshold, 4);
    }
  });

  it('reports the 25–75 % spread as 2 ln 3 · β for the logistic (derived)', () => {
    const fit = fitPsychometric(BLISS, { link: 'logit' });
    expect(fit.interquartileSpread).toBeCloseTo(2 * Math.log(3) * fit.spread, 12);
    expect(psiAt('logit', fit, fit.threshold + fit.interquartileSpread / 2)).toBeCloseTo(0.75, 12);
  });

  it('has ψ(α) = 0.5 with symmetric lapses, and the slope scaled by 1 − 2λ', () => {
    // Two-category classification with γ = λ: ψ(α) = 0.5 (common practice).
    for (const link of ['logit', 'probit'] as const) {
      const fit = fitPsychometric(BLISS, { link, lapse: { fixed: 0.03 } });
      expect(fit.lapse).toBe(0.03);
      expect(psiAt(link, fit, fit.threshold)).toBeCloseTo(0.5, 12);
      const h = 1e-6;
      const numeric = (psiAt(link, fit, fit.threshold + h) - psiAt(link, fit, fit.threshold - h)) / (2 * h);
      expect(numeric).toBeCloseTo(fit.slopeAtThreshold, 4);
      expect(fit.slopeAtThreshold).toBeCloseTo((0.94 * linkFunction(link).densityAtZero) / fit.spread, 9);
    }
  });
});

describe('lapse and spread bounds', () => {
  // Expected counts of a simulated observer (common practice for recovery checks; invented data, not a reference).
  const levels = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];
  function expectedData(link: Link, threshold: number, spread: number, lapse: number, trials: number): PsychometricData {
    const psi = levels.map((x) => psiAt(link, { threshold, spread, lapse }, x));
    return { x: levels, n: levels.map(() => trials), k: psi.map((p) => Math.round(p * trials)) };
  }

  it('recovers an interior lapse from a large simulated observer', () => {
    const data = expectedData('logit', 0.5, 0.8, 0.04, 20_000);
    const fit = fitPsychometric(data, { link: 'logit', lapse: { max: 0.06 } });
    expect(fit.lapse).toBeCloseTo(0.04, 3);
    expect(fit.threshold).toBeCloseTo(0.5, 2);
    expect(fit.spread).toBeCloseTo(0.8, 2);
    expect(fit.bounds.lapseAtBound).toBeNull();
    // Ignoring the lapse flattens the slope (Wichmann & Hill 2001).
    expect(fitPsychometric(data, { link: 'logit' }).spread).toBeGreaterThan(fit.spread);
  });

  it('stops a lapse above its bound on the bound and says so', () => {
    const data = expectedData('probit', 0, 1, 0.1, 5_000);
    const fit = fitPsychometric(data, { link: 'probit', lapse: { max: 0.06 } });
    expect(fit.lapse).toBe(0.06);
    expect(fit.bounds.lapseAtBound).toBe('upper');
  });

  it('stops perfectly separable data at the lower spread bound and reports it', () => {
    const data = { x: [0, 1, 2, 3], n: [10, 10, 10, 10], k: [0, 0, 10, 10] };
    for (const link of ['logit', 'probit'] as const) {
      const fit = fitPsychometric(data, { link });
      expect(fit.bounds.spreadAtBound).toBe('lower');
      expect(fit.spread).toBeCloseTo(0.005 * 3, 12);
      expect(fit.threshold).toBeGreaterThan(1);
      expect(fit.threshold).toBeLessThan(2);
      expect(Number.isFinite(fit.logLikelihood)).toBe(true);
    }
    const custom = fitPsychometric(data, { link: 'logit', spreadBounds: { min: 0.1, max: 5 } });
    expect(custom.spread).toBeCloseTo(0.1, 12);
  });

  it('stops flat data at the upper spread bound', () => {
    const fit = fitPsychometric({ x: [0, 1, 2], n: [100, 100, 100], k: [50, 50, 50] }, { link: 'logit' });
    expect(fit.bounds.spreadAtBound).toBe('upper');
    expect(fit.spread).toBeCloseTo(20, 9);
  });
});

describe('invariants (seeded)', () => {
  it('shifts the threshold with x and scales the spread with it; never mutates its input', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -50, max: 50, noNaN: true }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.constantFrom<Link>('logit', 'probit'),
        (shift, scale, link) => {
          const moved: PsychometricData = { ...BLISS, x: BLISS.x.map((x) => (x - 1.78) * scale + shift) };
          const frozen = JSON.stringify(moved);
          const base = fitPsychometric({ ...BLISS, x: BLISS.x.map((x) => x - 1.78) }, { link });
          const fit = fitPsychometric(moved, { link });
          expect(JSON.stringify(moved)).toBe(frozen);
          expect(fit.threshold).toBeCloseTo(base.threshold * scale + shift, 5);
          expect(fit.spread / (base.spread * scale)).toBeCloseTo(1, 6);
          expect(fit.deviance).toBeCloseTo(base.deviance, 6);
        },
      ),
      { seed: 7, numRuns: 60 },
    );
  });
});

describe('bad input', () => {
  it('throws StatsError with a code', () => {
    const fit = (data: PsychometricData) => () => fitPsychometric(data, { link: 'logit' });
    expectThrowsCode(fit({ x: [0, 1], n: [1, 1, 1], k: [0, 1] }), 'length-mismatch');
    expectThrowsCode(fit({ x: [0, 1], n: [5, 5], k: [0, 6] }), 'invalid-count');
    expectThrowsCode(fit({ x: [0, 1], n: [5, 0], k: [0, 0] }), 'invalid-count');
    expectThrowsCode(fit({ x: [0, 1], n: [5, 5], k: [0, 2.5] }), 'invalid-count');
    expectThrowsCode(fit({ x: [0, Number.NaN], n: [5, 5], k: [0, 1] }), 'not-finite');
    expectThrowsCode(fit({ x: [1, 1, 1], n: [5, 5, 5], k: [0, 1, 2] }), 'too-few-levels');
    expectThrowsCode(() => fitPsychometric(BLISS, { link: 'logit', lapse: { max: 0.5 } }), 'invalid-option');
    expectThrowsCode(() => fitPsychometric(BLISS, { link: 'logit', lapse: { fixed: -0.1 } }), 'invalid-option');
    expectThrowsCode(() => fitPsychometric(BLISS, { link: 'logit', spreadBounds: { min: 1, max: 0.5 } }), 'invalid-option');
  });
});
