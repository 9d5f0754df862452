import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  checkDeBruijnCycle,
  checkPairBalance,
  countDeBruijnCycles,
  countDeBruijnCyclesByEnumeration,
  deBruijnSequence,
  leastDeBruijnSequence,
  lyndonWords,
  unrollCycle,
} from '@/lib/sequence';
import { digits, expectSequenceError, PROPERTY_SEED } from './support';

describe('lexicographically least de Bruijn cycles', () => {
  // Lexicographically least B(k, n) as concatenated Lyndon words (Fredricksen & Maiorana 1978), as listed in
  // REFERENCES.md "Trial orders".
  it.each([
    [2, 3, '00010111'],
    [3, 2, '001021122'],
    [4, 2, '0010203112132233'],
  ])('B(%i, %i) = %s', (k, n, published) => {
    expect(digits(leastDeBruijnSequence(k, n))).toBe(published);
    expect(digits(deBruijnSequence(k, n))).toBe(published);
  });

  it('is lexicographically least among all B(2,4) cycles', () => {
    // Fredricksen & Maiorana 1978: the FKM cycle is the least; 0000100110101111 is the known least B(2,4).
    expect(digits(deBruijnSequence(2, 4))).toBe('0000100110101111');
  });

  it('yields the Lyndon words in lexicographic order with the counts of Witt’s formula', () => {
    // Number of binary Lyndon words of length 1…6: 2, 1, 2, 3, 6, 9 (Moreau's necklace formula, OEIS A001037);
    // ternary: 3, 3, 8, 18, 48, 116 (OEIS A027376).
    const byLength = (k: number) => {
      const counts = [0, 0, 0, 0, 0, 0];
      let previous = '';
      for (const word of lyndonWords(k, 6)) {
        const text = word.join(',');
        expect(text > previous).toBe(true);
        previous = text;
        counts[word.length - 1]! += 1;
      }
      return counts;
    };
    expect(byLength(2)).toEqual([2, 1, 2, 3, 6, 9]);
    expect(byLength(3)).toEqual([3, 3, 8, 18, 48, 116]);
  });
});

describe('number of de Bruijn cycles', () => {
  // van Aardenne-Ehrenfest & de Bruijn 1951 (BEST theorem): (k!)^(k^(n−1)) / kⁿ cycles up to rotation.
  it.each([
    [2, 3, 2],
    [2, 4, 16],
    [3, 2, 24],
    [4, 2, 20736],
  ])('B(%i, %i): the formula gives %i', (k, n, published) => {
    expect(countDeBruijnCycles(k, n)).toBe(BigInt(published));
  });

  it.each([
    [2, 3, 2],
    [2, 4, 16],
    [3, 2, 24],
    [4, 2, 20736],
    [2, 5, 2048],
    [2, 1, 1],
    [1, 3, 1],
  ])('B(%i, %i): enumeration finds %i, as the formula says', (k, n, published) => {
    // van Aardenne-Ehrenfest & de Bruijn 1951: enumeration and formula must agree.
    expect(countDeBruijnCyclesByEnumeration(k, n)).toBe(published);
    expect(countDeBruijnCycles(k, n)).toBe(BigInt(published));
  });

  it('refuses enumerations that are too large', () => {
    expectSequenceError(() => countDeBruijnCyclesByEnumeration(5, 2, { maxNodes: 1000 }), 'enumeration-too-large');
  });
});

describe('checkDeBruijnCycle', () => {
  it('accepts B(k, n) for larger orders', () => {
    for (const [k, n] of [
      [2, 10],
      [3, 5],
      [5, 3],
      [7, 2],
    ] as const) {
      const report = checkDeBruijnCycle(deBruijnSequence(k, n, { seed: 11 }), k, n);
      expect(report.isValid).toBe(true);
      expect(report.length).toBe(k ** n);
    }
  });

  it('reports the missing and repeated words of a corrupted cycle', () => {
    // 00010111 with its 4th and 5th symbols swapped: 00001111 has 0000-windows 000 twice and misses 010 and 101.
    const corrupted = [0, 0, 0, 0, 1, 1, 1, 1];
    const report = checkDeBruijnCycle(corrupted, 2, 3);
    expect(report.isValid).toBe(false);
    expect(report.missingWords).toEqual([
      [0, 1, 0],
      [1, 0, 1],
    ]);
    expect(report.repeatedWords).toEqual([
      { word: [0, 0, 0], count: 2 },
      { word: [1, 1, 1], count: 2 },
    ]);
  });

  it('rejects wrong lengths and foreign symbols', () => {
    expect(checkDeBruijnCycle([0, 0, 1, 0, 1, 1, 1], 2, 3).isValid).toBe(false);
    expect(checkDeBruijnCycle([0, 0, 0, 1, 0, 1, 1, 2], 2, 3).invalidPositions).toEqual([7]);
    expect(checkDeBruijnCycle([], 2, 3).isValid).toBe(false);
  });
});

describe('order-2 trial lists: every ordered pair exactly once', () => {
  it('holds for n = 1…30 conditions, with and without a seed', () => {
    // De Bruijn B(n, 2) plus its first item: n² + 1 trials, every ordered pair once (REFERENCES.md "Trial orders").
    for (let n = 1; n <= 30; n++) {
      for (const seed of [undefined, n * 7919]) {
        const cycle = deBruijnSequence(n, 2, seed === undefined ? {} : { seed });
        expect(checkDeBruijnCycle(cycle, n, 2).isValid).toBe(true);
        const trials = unrollCycle(cycle, 2);
        expect(trials).toHaveLength(n * n + 1);
        const balance = checkPairBalance(trials, n);
        expect(balance.isBalanced).toBe(true);
        expect(balance.counts.flat().every((count) => count === 1)).toBe(true);
      }
    }
  });

  it('fails the pair check when the closing item is left off', () => {
    const cycle = deBruijnSequence(4, 2);
    const balance = checkPairBalance(cycle, 4);
    expect(balance.isBalanced).toBe(false);
    // 0010203112132233 read linearly misses exactly the wrap-around pair (3, 0).
    expect(balance.missingPairs).toEqual([[3, 0]]);
  });

  it('reports uneven pairs', () => {
    const balance = checkPairBalance([0, 1, 0, 1, 1, 0, 0], 2);
    expect(balance.isBalanced).toBe(false);
    // Transitions 01 10 01 11 10 00: (0,1) and (1,0) twice, the others once.
    expect(balance.unevenPairs).toEqual([
      { pair: [0, 1], count: 2 },
      { pair: [1, 0], count: 2 },
    ]);
    // 000111010: every pair exactly twice, so balanced at index 2 and not at index 1.
    expect(checkPairBalance([0, 0, 0, 1, 1, 1, 0, 1, 0], 2, 2).isBalanced).toBe(true);
    expect(checkPairBalance([0, 0, 0, 1, 1, 1, 0, 1, 0], 2, 1).isBalanced).toBe(false);
  });
});

describe('seeded de Bruijn cycles', () => {
  it('relabel the least cycle by a permutation and stay valid', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 16 }), fc.integer({ min: 1, max: 3 }), fc.nat(), (k, n, seed) => {
        if (k ** n > 4096) return true;
        const seeded = deBruijnSequence(k, n, { seed });
        const least = deBruijnSequence(k, n);
        // The same positions hold the same symbol in both, so the map least → seeded is a bijection.
        const mapping = new Map<number, number>();
        least.forEach((symbol, position) => mapping.set(symbol, seeded[position] as number));
        return checkDeBruijnCycle(seeded, k, n).isValid && new Set(mapping.values()).size === k && seeded.every((s, i) => mapping.get(least[i] as number) === s);
      }),
      { seed: PROPERTY_SEED, numRuns: 150 },
    );
  });

  it('is reproducible for a seed and differs between seeds', () => {
    expect(deBruijnSequence(8, 2, { seed: 5 })).toEqual(deBruijnSequence(8, 2, { seed: 5 }));
    expect(deBruijnSequence(8, 2, { seed: 5 })).not.toEqual(deBruijnSequence(8, 2, { seed: 6 }));
  });

  it('refuses bad sizes and seeds', () => {
    expectSequenceError(() => deBruijnSequence(0, 2), 'invalid-argument');
    expectSequenceError(() => deBruijnSequence(2, 0), 'invalid-argument');
    expectSequenceError(() => deBruijnSequence(2.5, 2), 'invalid-argument');
    expectSequenceError(() => deBruijnSequence(2, 21), 'invalid-argument');
    expectSequenceError(() => deBruijnSequence(3, 2, { seed: -1 }), 'invalid-seed');
  });
});
