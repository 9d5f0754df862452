import { describe, expect, it } from 'vitest';
import {
  bootstrapFit,
  combineChiSquareTests,
  compareSlopes,
  describeIsotropy,
  drawBinomial,
  evaluatePsychometric,
  goodnessOfFit,
  seededRandom,
  slopeRatioInterval,
  StatsError,
  testNoBias,
  type Link,
  type PsychometricData,
} from '@/lib/stats';

const LEVELS = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];

/** A simulated observer's data from a probability per level (invented data, seeded). */
function simulate(probability: (x: number) => number, trials: number, random: () => number): PsychometricData {
  return { x: LEVELS, n: LEVELS.map(() => trials), k: LEVELS.map((x) => drawBinomial(trials, probability(x), random)) };
}

function psychometric(link: Link, threshold: number, spread: number, lapse: number) {
  return (x: number) => evaluatePsychometric(link, { threshold, spread, lapse }, x);
}

describe('goodnessOfFit', () => {
  it('gives roughly uniform p on data simulated from the model (seeded)', () => {
    // Under the model the bootstrap p is approximately uniform. Kolmogorov–Smirnov critical value for n = 60 at
    // α = 0.01: 1.63/√60 = 0.210 (common practice, asymptotic formula).
    const random = seededRandom(1935);
    const observers = 60;
    const ps: number[] = [];
    for (let o = 0; o < observers; o++) {
      const data = simulate(psychometric('logit', 0.3, 1.2, 0.02), 20, random);
      ps.push(goodnessOfFit(data, { link: 'logit', lapse: { max: 0.06 } }, { resamples: 199, seed: o }).p);
    }
    ps.sort((a, b) => a - b);
    let ks = 0;
    ps.forEach((p, i) => (ks = Math.max(ks, Math.abs((i + 1) / observers - p), Math.abs(i / observers - p))));
    expect(ks).toBeLessThan(0.21);
    const small = ps.filter((p) => p < 0.05).length / observers;
    expect(small).toBeLessThan(0.15);
  });

  it('gives a small p on data from a clearly wrong (non-monotone) model, and p = (b + 1)/(m + 1)', () => {
    // A U-shaped response probability no monotone ψ can follow.
    const random = seededRandom(439);
    for (let o = 0; o < 5; o++) {
      const data = simulate((x) => 0.1 + 0.8 * (x / 5) ** 2, 20, random);
      const gof = goodnessOfFit(data, { link: 'probit', lapse: { max: 0.06 } }, { resamples: 199, seed: o });
      // Monte-Carlo p = (b + 1)/(m + 1) (North, Curtis & Sham 2002): with b = 0 and m = 199 it is 1/200.
      expect(gof.p).toBeLessThan(0.02);
      expect(gof.p).toBeGreaterThanOrEqual(1 / 200);
      expect(Math.abs(gof.p * 200 - Math.round(gof.p * 200))).toBeLessThan(1e-9);
      expect(gof.deviance).toBeGreaterThan(30);
    }
    expect(() => goodnessOfFit(simulate(() => 0.5, 5, random), { link: 'logit' }, { resamples: 0, seed: 1 })).toThrow(StatsError);
  });
});

describe('testNoBias', () => {
  it('keeps its nominal false-positive rate on unbiased simulated observers and has power on biased ones (seeded)', () => {
    // 200 observers, 4 directions with PSE = 0; rejections at α = 0.05 have SD ≈ 0.015 over 200.
    const random = seededRandom(1938);
    const observers = 200;
    let falsePositives = 0;
    let detected = 0;
    for (let o = 0; o < observers; o++) {
      const unbiased = [1, 1.3, 0.8, 1.1].map((spread) => simulate(psychometric('logit', 0, spread, 0), 20, random));
      if (testNoBias(unbiased, { link: 'logit' }).p < 0.05) falsePositives++;
      const biased = [0.8, 0, -0.6, 0.3].map((threshold) => simulate(psychometric('logit', threshold, 1.1, 0), 20, random));
      if (testNoBias(biased, { link: 'logit' }).p < 0.05) detected++;
    }
    expect(falsePositives / observers).toBeGreaterThan(0.02);
    expect(falsePositives / observers).toBeLessThan(0.09);
    expect(detected / observers).toBeGreaterThan(0.8);
  });

  it('has G degrees of freedom, shares a free lapse, and rejects bad input', () => {
    const random = seededRandom(5);
    const groups = [0.5, -0.5, 0.2].map((t) => simulate(psychometric('probit', t, 1, 0.03), 40, random));
    const result = testNoBias(groups, { link: 'probit', lapse: { max: 0.06 } });
    expect(result.df).toBe(3);
    expect(result.statistic).toBeGreaterThan(0);
    expect(result.p).toBeLessThan(0.05);
    expect(() => testNoBias([], { link: 'logit' })).toThrow(StatsError);
    expect(() => testNoBias(groups, { link: 'logit', lapse: { max: 0.6 } })).toThrow(StatsError);
  });
});

describe('the group isotropy test', () => {
  it('sums χ² statistics and df, with p from the summed df', () => {
    // χ²(2) upper 5 % point 5.991465 (Pearson & Hartley, Biometrika Tables for Statisticians, Table 8).
    const combined = combineChiSquareTests([
      { statistic: 2.5, df: 1 },
      { statistic: 3.491465, df: 1 },
    ]);
    expect(combined.statistic).toBeCloseTo(5.991465, 9);
    expect(combined.df).toBe(2);
    expect(combined.p).toBeCloseTo(0.05, 6);
    expect(() => combineChiSquareTests([])).toThrow(StatsError);
    expect(() => combineChiSquareTests([{ statistic: -1, df: 1 }])).toThrow(StatsError);
  });

  it('keeps the nominal false-positive rate when summed over simulated isotropic participants (seeded)', () => {
    // 100 groups of 5 participants × 3 directions with one slope: rejections at α = 0.05, SD ≈ 0.022 over 100.
    const random = seededRandom(2002);
    let rejected = 0;
    for (let s = 0; s < 100; s++) {
      const participants = Array.from({ length: 5 }, () =>
        compareSlopes(
          [-0.4, 0, 0.5].map((t) => simulate(psychometric('logit', t, 1.2, 0), 20, random)),
          { link: 'logit' },
        ),
      );
      const group = combineChiSquareTests(participants);
      expect(group.df).toBe(10);
      if (group.p < 0.05) rejected++;
    }
    expect(rejected / 100).toBeGreaterThan(0.005);
    expect(rejected / 100).toBeLessThan(0.11);
  });

  it('brackets a true slope ratio of 2 and puts an isotropic one near 1 (seeded)', () => {
    const random = seededRandom(8);
    const fits = (spreads: number[]) =>
      spreads.map((spread, d) => bootstrapFit(simulate(psychometric('logit', 0, spread, 0), 200, random), { link: 'logit' }, { resamples: 400, seed: d }));
    const anisotropic = slopeRatioInterval(fits([1, 0.5, 0.8]));
    // Slope at threshold is 1/(4β) for the logistic (REFERENCES.md), so spreads 1 and 0.5 give a true ratio of 2.
    expect(anisotropic.interval[0]).toBeLessThan(2);
    expect(anisotropic.interval[1]).toBeGreaterThan(2);
    expect(anisotropic.interval[0]).toBeGreaterThan(1.2);
    const isotropic = slopeRatioInterval(fits([1, 1, 1]));
    expect(isotropic.ratio).toBeGreaterThanOrEqual(1);
    expect(isotropic.interval[0]).toBeLessThan(1.3);
    expect(isotropic.resamples).toBe(400);
    expect(() => slopeRatioInterval(fits([1]))).toThrow(StatsError);
  });

  it('words the verdict, with the caution only when a test does not reject', () => {
    const slopeRatio = { ratio: 1.4, interval: [1.1, 2.3] as const, resamples: 1000 };
    const quiet = describeIsotropy({ slopes: { statistic: 12.1, df: 15, p: 0.67 }, slopeRatio });
    expect(quiet.hasSlopeDifference).toBe(false);
    expect(quiet.hasBias).toBeNull();
    expect(quiet.text).toContain('χ²(15) = 12.10, p = 0.670');
    expect(quiet.text).toContain('1.10 to 2.30');
    expect(quiet.text).toMatch(/not evidence that there is none/);
    const loud = describeIsotropy({ slopes: { statistic: 40, df: 15, p: 0.0004 }, bias: { statistic: 3, df: 16, p: 0.99 }, slopeRatio });
    expect(loud.hasSlopeDifference).toBe(true);
    expect(loud.hasBias).toBe(false);
    expect(loud.text).toContain('p < 0.001');
    expect(loud.text).not.toMatch(/not evidence that there is none/);
    expect(loud.text).toMatch(/does not prove that there is no bias/);
  });
});
