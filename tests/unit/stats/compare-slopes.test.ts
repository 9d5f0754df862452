import { describe, expect, it } from 'vitest';
import {
  chiSquareSurvival,
  compareSlopes,
  drawBinomial,
  evaluatePsychometric,
  fitCommonSlope,
  fitPsychometric,
  logGamma,
  regularizedGammaQ,
  seededRandom,
  spreadBoundsFor,
  StatsError,
  type PsychometricData,
} from '@/lib/stats';

// Bliss (1935) beetle mortality, as tabulated in Dobson, An Introduction to Generalized Linear Models (Table 7.2).
const BLISS: PsychometricData = {
  x: [1.6907, 1.7242, 1.7552, 1.7842, 1.8113, 1.8369, 1.861, 1.8839],
  n: [59, 60, 62, 56, 63, 59, 62, 60],
  k: [6, 13, 18, 28, 52, 53, 61, 60],
};

describe('logGamma and regularizedGammaQ', () => {
  it('matches Γ at integers and halves (Γ(n) = (n − 1)!, Γ(1/2) = √π)', () => {
    expect(logGamma(1)).toBeCloseTo(0, 13);
    expect(logGamma(5)).toBeCloseTo(Math.log(24), 13);
    expect(logGamma(0.5)).toBeCloseTo(Math.log(Math.sqrt(Math.PI)), 13);
    expect(logGamma(0.1)).toBeCloseTo(Math.log(9.513507698668732), 12);
    expect(logGamma(101)).toBeCloseTo(363.73937555556347, 9);
  });

  it('gives Q(1, x) = e^(−x) on both sides of the series/continued-fraction switch (derived)', () => {
    for (const x of [0.1, 1.5, 2, 7, 30]) expect(regularizedGammaQ(1, x)).toBeCloseTo(Math.exp(-x), 13);
    expect(regularizedGammaQ(2, 0)).toBe(1);
    expect(regularizedGammaQ(-1, 1)).toBeNaN();
  });

  it('returns the nominal tail at tabulated χ² quantiles', () => {
    // Upper-tail χ² critical values (Pearson & Hartley, Biometrika Tables for Statisticians, Table 8; common practice).
    const QUANTILES: readonly (readonly [df: number, x: number, p: number])[] = [
      [1, 3.841459, 0.05],
      [1, 6.634897, 0.01],
      [2, 5.991465, 0.05],
      [4, 9.487729, 0.05],
      [10, 18.307038, 0.05],
      [15, 7.260944, 0.95],
      [30, 50.892181, 0.01],
    ];
    for (const [df, x, p] of QUANTILES) expect(chiSquareSurvival(x, df)).toBeCloseTo(p, 6);
    // χ²(2) survival is e^(−x/2) exactly (derived).
    expect(chiSquareSurvival(3, 2)).toBeCloseTo(Math.exp(-1.5), 13);
    expect(chiSquareSurvival(0, 3)).toBe(1);
  });
});

describe('fitCommonSlope', () => {
  it('with one group equals the single fit; with two copies it gives one threshold twice and twice the ℓ', () => {
    const bounds = spreadBoundsFor(BLISS, { link: 'logit' });
    const single = fitPsychometric(BLISS, { link: 'logit' });
    const one = fitCommonSlope([BLISS], 'logit', 0, bounds);
    expect(one.thresholds[0]).toBeCloseTo(single.threshold, 7);
    expect(one.spread).toBeCloseTo(single.spread, 8);
    const shifted = { ...BLISS, x: BLISS.x.map((x) => x + 1) };
    const two = fitCommonSlope([BLISS, shifted], 'logit', 0, bounds);
    expect(two.thresholds[0]).toBeCloseTo(single.threshold, 7);
    expect(two.thresholds[1]).toBeCloseTo(single.threshold + 1, 7);
    expect(two.logLikelihood).toBeCloseTo(2 * single.logLikelihood, 7);
  });
});

describe('compareSlopes', () => {
  it('finds no difference between shifted copies and a large one for a doubled slope', () => {
    const shifted = { ...BLISS, x: BLISS.x.map((x) => x + 0.5) };
    const same = compareSlopes([BLISS, shifted], { link: 'probit' });
    expect(same.df).toBe(1);
    expect(same.statistic).toBeLessThan(1e-6);
    expect(same.p).toBeGreaterThan(0.999);
    const steeper = { ...BLISS, x: BLISS.x.map((x) => 1.77 + (x - 1.77) / 2) };
    const differ = compareSlopes([BLISS, steeper, BLISS], { link: 'logit', lapse: { max: 0.06 } });
    expect(differ.df).toBe(2);
    expect(differ.statistic).toBeGreaterThan(20);
    expect(differ.p).toBeLessThan(1e-4);
  });

  it('keeps its nominal false-positive rate on simulated isotropic observers (seeded)', () => {
    // 300 observers, 4 directions sharing one slope; rejections at α = 0.05 have SD ≈ 0.013 over 300.
    const random = seededRandom(1938);
    const levels = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];
    const observers = 300;
    let rejected = 0;
    for (let o = 0; o < observers; o++) {
      const groups = [-0.5, 0, 0.4, 1].map((threshold) => ({
        x: levels,
        n: levels.map(() => 20),
        k: levels.map((x) => drawBinomial(20, evaluatePsychometric('logit', { threshold, spread: 1.3, lapse: 0 }, x), random)),
      }));
      if (compareSlopes(groups, { link: 'logit' }).p < 0.05) rejected++;
    }
    expect(rejected / observers).toBeGreaterThan(0.02);
    expect(rejected / observers).toBeLessThan(0.09);
  });

  it('rejects fewer than two groups, bad data and bad lapses with a StatsError', () => {
    expect(() => compareSlopes([BLISS], { link: 'logit' })).toThrow(StatsError);
    expect(() => compareSlopes([BLISS, { x: [0, 1], n: [2, 2], k: [3, 0] }], { link: 'logit' })).toThrow(StatsError);
    expect(() => compareSlopes([BLISS, BLISS], { link: 'logit', lapse: { fixed: 0.7 } })).toThrow(StatsError);
  });
});
