import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { INV_SQRT_2PI, normalCdf } from '@/lib/stats';

// Standard normal probabilities to 16 significant digits (common practice: the double-precision values of
// R's pnorm and SciPy's norm.cdf; the first digits agree with Abramowitz & Stegun, Table 26.1).
const LOWER_TAIL: readonly (readonly [z: number, phi: number])[] = [
  [-1, 0.15865525393145707],
  [-1.96, 0.024997895148220435],
  [-3, 1.3498980316300946e-3],
  [-5, 2.866515718791939e-7],
  [-8, 6.220960574271784e-16],
  [-10, 7.61985302416047e-24],
];

describe('normalCdf', () => {
  it('matches reference lower-tail probabilities to a relative 1e-13', () => {
    for (const [z, phi] of LOWER_TAIL) {
      expect(Math.abs(normalCdf(z) - phi) / phi).toBeLessThan(1e-13);
    }
  });

  it('gives Φ(0) = 0.5 and Φ(1) = 0.8413447460685429 (common practice)', () => {
    expect(normalCdf(0)).toBe(0.5);
    expect(normalCdf(1)).toBeCloseTo(0.8413447460685429, 15);
    expect(normalCdf(1.959963984540054)).toBeCloseTo(0.975, 14);
  });

  it('saturates beyond the double-precision range and passes NaN through', () => {
    expect(normalCdf(-40)).toBe(0);
    expect(normalCdf(40)).toBe(1);
    expect(normalCdf(Number.NaN)).toBeNaN();
  });

  it('is symmetric, Φ(z) + Φ(−z) = 1, and non-decreasing (seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: -12, max: 12, noNaN: true }), fc.double({ min: 0, max: 3, noNaN: true }), (z, dz) => {
        expect(normalCdf(z) + normalCdf(-z)).toBeCloseTo(1, 14);
        expect(normalCdf(z + dz)).toBeGreaterThanOrEqual(normalCdf(z));
      }),
      { seed: 12, numRuns: 500 },
    );
  });

  it('has the normal density as its derivative (central difference), e.g. across the switch at |z| = 3', () => {
    const h = 1e-5;
    for (const z of [-6, -3.2, -3, -2.8, -0.5, 0, 1.7, 4]) {
      const numeric = (normalCdf(z + h) - normalCdf(z - h)) / (2 * h);
      const density = INV_SQRT_2PI * Math.exp((-z * z) / 2);
      expect(Math.abs(numeric - density)).toBeLessThan(1e-9);
    }
  });
});
