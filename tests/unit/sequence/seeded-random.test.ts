import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { deriveSeed, MAX_SEED, randomPermutation, seededRandom, xoshiro128StarStar } from '@/lib/sequence';
import { expectSequenceError, PROPERTY_SEED } from './support';

describe('xoshiro128**', () => {
  it('matches the reference implementation', () => {
    // Blackman & Vigna 2018, xoshiro128starstar.c (the authors' reference C code) from state {1, 2, 3, 4}.
    const next = xoshiro128StarStar([1, 2, 3, 4]);
    expect(Array.from({ length: 6 }, next)).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492]);
  });

  it('matches the reference implementation from a full 32-bit state', () => {
    // Same reference C code, state {0x964D4A0C, 0xD40AB895, 0xAD7FDECB, 0x3006F0F0}.
    const next = xoshiro128StarStar([0x964d4a0c, 0xd40ab895, 0xad7fdecb, 0x3006f0f0]);
    expect(Array.from({ length: 4 }, next)).toEqual([0xf1391922, 0x6fe53806, 0xa5be2840, 0xf510ee70]);
  });

  it('does not write into the state it is given', () => {
    const state = [1, 2, 3, 4] as const;
    const copy = [...state];
    const next = xoshiro128StarStar(state);
    next();
    next();
    expect([...state]).toEqual(copy);
  });
});

describe('seededRandom', () => {
  it('gives the same stream for the same seed and a different one for another seed', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    const c = seededRandom(43);
    const streamA = Array.from({ length: 20 }, () => a.next());
    expect(Array.from({ length: 20 }, () => b.next())).toEqual(streamA);
    expect(Array.from({ length: 20 }, () => c.next())).not.toEqual(streamA);
  });

  it('draws next() in [0, 1) and nextInt(m) in 0…m−1', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: MAX_SEED }), fc.integer({ min: 1, max: 1000 }), (seed, m) => {
        const random = seededRandom(seed);
        for (let i = 0; i < 50; i++) {
          const x = random.next();
          const k = random.nextInt(m);
          if (!(x >= 0 && x < 1 && Number.isInteger(k) && k >= 0 && k < m)) return false;
        }
        return true;
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('draws nextInt(3) evenly', () => {
    // Chi-square with 2 degrees of freedom: P(χ² > 13.8) = 0.001 for a fair draw (common practice).
    const random = seededRandom(7);
    const counts = [0, 0, 0];
    const draws = 30_000;
    for (let i = 0; i < draws; i++) counts[random.nextInt(3)]! += 1;
    const expected = draws / 3;
    const chiSquare = counts.reduce((sum, count) => sum + (count - expected) ** 2 / expected, 0);
    expect(chiSquare).toBeLessThan(13.8);
  });

  it.each([-1, 1.5, MAX_SEED + 1, Number.NaN, Number.POSITIVE_INFINITY])('refuses the seed %s', (seed) => {
    expectSequenceError(() => seededRandom(seed), 'invalid-seed');
  });

  it('accepts the extreme seeds 0 and 2³² − 1', () => {
    expect(seededRandom(0).next()).toBeGreaterThanOrEqual(0);
    expect(seededRandom(MAX_SEED).next()).toBeLessThan(1);
  });
});

describe('randomPermutation and deriveSeed', () => {
  it('returns a permutation of 0…n−1', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 60 }), fc.integer({ min: 0, max: MAX_SEED }), (n, seed) => {
        const permutation = randomPermutation(n, seededRandom(seed));
        return permutation.length === n && [...permutation].sort((a, b) => a - b).every((value, index) => value === index);
      }),
      { seed: PROPERTY_SEED, numRuns: 200 },
    );
  });

  it('reaches all 6 permutations of three items', () => {
    const seen = new Set<string>();
    for (let seed = 0; seed < 200; seed++) seen.add(randomPermutation(3, seededRandom(seed)).join(''));
    expect(seen.size).toBe(6);
  });

  it('derives stable, distinct child seeds', () => {
    expect(deriveSeed(1, 0, 3)).toBe(deriveSeed(1, 0, 3));
    const children = new Set([deriveSeed(1), deriveSeed(1, 0), deriveSeed(1, 1), deriveSeed(1, 0, 0), deriveSeed(1, 0, 1), deriveSeed(2, 0, 0)]);
    expect(children.size).toBe(6);
    for (const child of children) expect(child >= 0 && child <= MAX_SEED && Number.isInteger(child)).toBe(true);
    expectSequenceError(() => deriveSeed(-3), 'invalid-seed');
    expectSequenceError(() => deriveSeed(3, -1), 'invalid-argument');
  });
});
