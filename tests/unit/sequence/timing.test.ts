import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { drawItis, peakOnsetRate, seededRandom, truncatedExponentialRate, validateTiming, type ItiDistribution } from '@/lib/sequence';
import { expectSequenceError, PROPERTY_SEED } from './support';

const mean = (values: readonly number[]) => values.reduce((a, b) => a + b, 0) / values.length;

describe('truncatedExponentialRate', () => {
  it('solves the truncated mean 1/λ − L/(e^{λL} − 1)', () => {
    // Derived: rate 1/s on [0, 1 s] has mean 1 − 1/(e − 1) = 0.4180232931 s.
    expect(truncatedExponentialRate(1 - 1 / (Math.E - 1), 1)).toBeCloseTo(1, 9);
    // Derived: rate 0.5/s on [0, 6 s] has mean 2 − 6/(e³ − 1).
    expect(truncatedExponentialRate(2 - 6 / Math.expm1(3), 6)).toBeCloseTo(0.5, 9);
  });

  it('meets the target mean across the whole admissible range', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.499, noNaN: true }), fc.double({ min: 0.1, max: 30, noNaN: true }), (fraction, width) => {
        const target = fraction * width;
        const rate = truncatedExponentialRate(target, width);
        const truncatedMean = 1 / rate - width / Math.expm1(rate * width);
        return Math.abs(truncatedMean - target) < 1e-9 * width;
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('refuses a mean outside (0, width/2)', () => {
    expectSequenceError(() => truncatedExponentialRate(3, 6), 'invalid-iti');
    expectSequenceError(() => truncatedExponentialRate(0, 6), 'invalid-iti');
  });
});

describe('drawItis', () => {
  it('repeats a fixed ITI', () => {
    expect(drawItis(4, { kind: 'fixed', duration: 2.5 }, seededRandom(1))).toEqual([2.5, 2.5, 2.5, 2.5]);
  });

  it.each<[string, ItiDistribution, number]>([
    ['uniform [1, 3] s', { kind: 'uniform', min: 1, max: 3 }, 2],
    ['truncated exponential, mean 3 s on [2, 8] s', { kind: 'truncated-exponential', mean: 3, min: 2, max: 8 }, 3],
  ])('%s: stays in range, on the millisecond grid, with the stated mean', (_, iti, expectedMean) => {
    const itis = drawItis(20_000, iti, seededRandom(2024));
    if (iti.kind === 'fixed') throw new Error('not used');
    expect(Math.min(...itis)).toBeGreaterThanOrEqual(iti.min);
    expect(Math.max(...itis)).toBeLessThanOrEqual(iti.max);
    expect(itis.every((value) => Math.abs(value * 1000 - Math.round(value * 1000)) < 1e-6)).toBe(true);
    // Standard error of the mean ≤ (max − min)/(2√N) = 0.021 s; 0.06 s is about 3 standard errors.
    expect(Math.abs(mean(itis) - expectedMean)).toBeLessThan(0.06);
  });

  it('draws truncated exponential ITIs skewed towards the minimum', () => {
    // Exponential shape: the median lies below the mean (derived).
    const itis = drawItis(5_000, { kind: 'truncated-exponential', mean: 3, min: 2, max: 8 }, seededRandom(5)).sort((a, b) => a - b);
    expect(itis[2_500]!).toBeLessThan(mean(itis));
  });

  it('is reproducible for a seed', () => {
    const iti: ItiDistribution = { kind: 'uniform', min: 0.5, max: 1.5 };
    expect(drawItis(10, iti, seededRandom(3))).toEqual(drawItis(10, iti, seededRandom(3)));
    expect(drawItis(10, iti, seededRandom(3))).not.toEqual(drawItis(10, iti, seededRandom(4)));
  });
});

describe('validateTiming', () => {
  const good = { trialDuration: 1, tr: 2, iti: { kind: 'fixed', duration: 1 } } as const;

  it('accepts good timing and an ITI of 0', () => {
    expect(() => validateTiming(good)).not.toThrow();
    expect(() => validateTiming({ ...good, iti: { kind: 'fixed', duration: 0 } })).not.toThrow();
  });

  it.each([0, -1, Number.NaN, Number.POSITIVE_INFINITY])('refuses the trial duration %s', (trialDuration) => {
    expectSequenceError(() => validateTiming({ ...good, trialDuration }), 'duration-not-positive');
  });

  it.each([0, -2, Number.NaN])('refuses the TR %s', (tr) => {
    expectSequenceError(() => validateTiming({ ...good, tr }), 'tr-not-positive');
  });

  it.each<[string, ItiDistribution]>([
    ['a negative fixed ITI', { kind: 'fixed', duration: -0.5 }],
    ['uniform with min = max', { kind: 'uniform', min: 1, max: 1 }],
    ['uniform with a negative min', { kind: 'uniform', min: -1, max: 1 }],
    ['a truncated exponential mean at the midpoint', { kind: 'truncated-exponential', mean: 5, min: 2, max: 8 }],
    ['a truncated exponential mean below the minimum', { kind: 'truncated-exponential', mean: 1, min: 2, max: 8 }],
  ])('refuses %s', (_, iti) => {
    expectSequenceError(() => validateTiming({ ...good, iti }), 'invalid-iti');
  });

  it('refuses fractional or negative dummy volumes', () => {
    expectSequenceError(() => validateTiming({ ...good, dummyVolumes: 1.5 }), 'invalid-argument');
    expectSequenceError(() => validateTiming({ ...good, dummyVolumes: -1 }), 'invalid-argument');
  });
});

describe('peakOnsetRate', () => {
  it('counts onsets in the busiest one-second window', () => {
    // WCAG 2.3.1: "no more than three flashes in any one-second period". 4 per second exceeds it; 3 does not.
    expect(peakOnsetRate([0, 0.25, 0.5, 0.75, 1, 1.25])).toBe(4);
    expect(peakOnsetRate([0, 1 / 3, 2 / 3, 1, 4 / 3, 5 / 3])).toBe(3);
    expect(peakOnsetRate([0, 2, 4])).toBe(1);
    expect(peakOnsetRate([])).toBe(0);
  });

  it('agrees with a brute-force count over every window start', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 5000 }), { maxLength: 60 }), (milliseconds) => {
        const onsets = milliseconds.map((ms) => ms / 1000);
        const brute = Math.max(0, ...onsets.map((start) => onsets.filter((t) => t >= start && t < start + 1 - 1e-9).length));
        return peakOnsetRate(onsets) === brute;
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });
});
