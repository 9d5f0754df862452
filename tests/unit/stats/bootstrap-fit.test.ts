import { describe, expect, it } from 'vitest';
import { bootstrapFit, drawBinomial, evaluatePsychometric, percentile, seededRandom, StatsError, type Link } from '@/lib/stats';

const LEVELS = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5];

/** A simulated observer's data set: binomial counts at LEVELS from a known ψ (invented data, seeded). */
function simulate(link: Link, truth: { threshold: number; spread: number; lapse: number }, trials: number, random: () => number) {
  const n = LEVELS.map(() => trials);
  const k = LEVELS.map((x) => drawBinomial(trials, evaluatePsychometric(link, truth, x), random));
  return { x: LEVELS, n, k };
}

describe('seededRandom', () => {
  it('repeats a stream for a seed, differs between seeds, and stays on [0, 1) with mean ≈ 1/2', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    const c = seededRandom(43);
    const first = Array.from({ length: 5 }, () => a());
    expect(Array.from({ length: 5 }, () => b())).toEqual(first);
    expect(Array.from({ length: 5 }, () => c())).not.toEqual(first);
    const random = seededRandom(7);
    let sum = 0;
    let outside = 0;
    for (let i = 0; i < 100_000; i++) {
      const u = random();
      if (!(u >= 0 && u < 1)) outside++;
      sum += u;
    }
    expect(outside).toBe(0);
    // Mean of 1e5 uniforms: SD 0.289/√1e5 ≈ 0.0009; allow 5 SD.
    expect(Math.abs(sum / 100_000 - 0.5)).toBeLessThan(0.0046);
    expect(() => seededRandom(-1)).toThrow(StatsError);
    expect(() => seededRandom(1.5)).toThrow(StatsError);
  });
});

describe('drawBinomial and percentile', () => {
  it('draws Binomial(n, p) with mean np (seeded, 5 SD tolerance)', () => {
    const random = seededRandom(3);
    let sum = 0;
    const draws = 20_000;
    for (let i = 0; i < draws; i++) sum += drawBinomial(20, 0.3, random);
    // Var of the mean = np(1 − p)/draws = 4.2/20000.
    expect(Math.abs(sum / draws - 6)).toBeLessThan(5 * Math.sqrt(4.2 / draws));
    expect(drawBinomial(10, 0, random)).toBe(0);
    expect(drawBinomial(10, 1, random)).toBe(10);
  });

  it('interpolates order statistics (Hyndman & Fan 1996, definition 7) without reordering its input', () => {
    const values = [4, 1, 3, 2, 5];
    expect(percentile(values, 0)).toBe(1);
    expect(percentile(values, 0.5)).toBe(3);
    expect(percentile(values, 0.9)).toBeCloseTo(4.6, 12);
    expect(percentile(values, 1)).toBe(5);
    expect(values).toEqual([4, 1, 3, 2, 5]);
    expect(percentile([], 0.5)).toBeNaN();
  });
});

describe('bootstrapFit', () => {
  it('is deterministic for a seed and brackets the point estimate', () => {
    const data = simulate('logit', { threshold: 0.3, spread: 1.2, lapse: 0 }, 20, seededRandom(11));
    const a = bootstrapFit(data, { link: 'logit' }, { resamples: 200, seed: 5 });
    const b = bootstrapFit(data, { link: 'logit' }, { resamples: 200, seed: 5 });
    const c = bootstrapFit(data, { link: 'logit' }, { resamples: 200, seed: 6 });
    expect(b).toEqual(a);
    expect(c.intervals).not.toEqual(a.intervals);
    for (const key of ['threshold', 'spread', 'slopeAtThreshold'] as const) {
      const [lo, hi] = a.intervals[key];
      expect(lo).toBeLessThan(a.fit[key]);
      expect(hi).toBeGreaterThan(a.fit[key]);
    }
    expect(a.intervals.lapse).toEqual([0, 0]);
    expect(() => bootstrapFit(data, { link: 'logit' }, { resamples: 0, seed: 1 })).toThrow(StatsError);
  });

  it('covers the true threshold and spread at about the nominal 95 % on simulated observers (seeded)', () => {
    // 200 simulated observers, 200 resamples each. Coverage of a 95 % interval over 200 observers has SD ≈ 0.015;
    // percentile intervals of small psychophysical data sets run a little narrow (Wichmann & Hill 2001), hence the
    // lower tolerance.
    const truth = { threshold: 0.3, spread: 1.2, lapse: 0 };
    const random = seededRandom(2001);
    const observers = 200;
    let thresholdCovered = 0;
    let spreadCovered = 0;
    for (let i = 0; i < observers; i++) {
      const data = simulate('logit', truth, 40, random);
      const { intervals } = bootstrapFit(data, { link: 'logit' }, { resamples: 200, seed: i });
      if (intervals.threshold[0] <= truth.threshold && truth.threshold <= intervals.threshold[1]) thresholdCovered++;
      if (intervals.spread[0] <= truth.spread && truth.spread <= intervals.spread[1]) spreadCovered++;
    }
    expect(thresholdCovered / observers).toBeGreaterThan(0.9);
    expect(thresholdCovered / observers).toBeLessThan(0.99);
    expect(spreadCovered / observers).toBeGreaterThan(0.87);
    expect(spreadCovered / observers).toBeLessThan(0.99);
  });
});
