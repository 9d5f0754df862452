import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { averageRanks, spearman } from '@/lib/space';
import { PROPERTY_SEED } from './support';

describe('Spearman’s rank correlation', () => {
  it('IQ vs weekly hours of TV: Σd² = 194, ρ = −29/165', () => {
    // A widely reproduced textbook example (REFERENCES.md, Similarity structure): ten people, no ties.
    const iq = [106, 86, 100, 101, 99, 103, 97, 113, 112, 110];
    const tv = [7, 0, 27, 50, 28, 29, 20, 12, 6, 17];
    const rx = averageRanks(iq);
    const ry = averageRanks(tv);
    expect(rx.reduce((s, r, i) => s + (r - (ry[i] as number)) ** 2, 0)).toBe(194);
    expect(spearman(iq, tv)).toBeCloseTo(-29 / 165, 14);
  });

  it('gives ties the mean of the ranks they span', () => {
    expect(Array.from(averageRanks([10, 20, 20, 30]))).toEqual([1, 2.5, 2.5, 4]);
    expect(Array.from(averageRanks([5, 5, 5]))).toEqual([2, 2, 2]);
    expect(Array.from(averageRanks([3, 1, 2, 1]))).toEqual([4, 1.5, 3, 1.5]);
  });

  it('with ties, is Pearson’s r of the average ranks (not the 1 − 6Σd² shortcut)', () => {
    // Derived by hand: ranks x → [1, 2.5, 2.5, 4], y → [1, 2, 3, 4]; both centred on 2.5:
    // Σxy = 2.25 + 0 + 0 + 2.25 = 4.5, Σx² = 4.5, Σy² = 5, ρ = 4.5/√22.5.
    expect(spearman([1, 2, 2, 3], [1, 2, 3, 4])).toBeCloseTo(4.5 / Math.sqrt(22.5), 14);
  });

  it('is 1 for a monotone relation, −1 for a reversed one, unchanged by increasing transforms, symmetric', () => {
    // Values on a 0.1 grid, so that strictly increasing transforms keep distinct values distinct in floating point.
    const sample = fc.array(fc.integer({ min: -1000, max: 1000 }).map((v) => v / 10), { minLength: 3, maxLength: 40 });
    fc.assert(
      fc.property(sample, sample, (xs, ys) => {
        const n = Math.min(xs.length, ys.length);
        const x = xs.slice(0, n);
        const y = ys.slice(0, n);
        if (new Set(x).size < 2 || new Set(y).size < 2) return;
        expect(spearman(x, x.map((v) => Math.exp(v / 50)))).toBeCloseTo(1, 12);
        expect(spearman(x, x.map((v) => -v * v * v))).toBeCloseTo(-1, 12);
        expect(spearman(x.map((v) => 3 * v + 1), y)).toBeCloseTo(spearman(x, y), 12);
        expect(spearman(y, x)).toBeCloseTo(spearman(x, y), 14);
        expect(Math.abs(spearman(x, y))).toBeLessThanOrEqual(1 + 1e-12);
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('is undefined (NaN) for a constant sample and refuses mismatched lengths and NaN', () => {
    expect(spearman([1, 1, 1], [1, 2, 3])).toBeNaN();
    expect(() => spearman([1, 2], [1, 2, 3])).toThrow(/equal length/);
    expect(() => spearman([1, Number.NaN, 3], [1, 2, 3])).toThrow(/NaN/);
  });
});
