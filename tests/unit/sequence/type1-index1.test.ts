import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkType1Index1Sequence, searchChainedBlocks, seededRandom, type1Index1Sequence } from '@/lib/sequence';
import { expectSequenceError, PROPERTY_SEED } from './support';

// Published n = 6 type-1 index-1 sequence (Nonyane & Theobald 2007, BJMSP 60:339), 1-based, as in REFERENCES.md:
// 1 | 1 2 3 4 5 6 | 6 1 4 3 5 2 | 2 5 3 1 6 4 | 4 2 6 5 1 3 | 3 6 2 4 1 5 | 5 4 6 3 2 1
const PUBLISHED_N6_ONE_BASED = [
  1, 1, 2, 3, 4, 5, 6, 6, 1, 4, 3, 5, 2, 2, 5, 3, 1, 6, 4, 4, 2, 6, 5, 1, 3, 3, 6, 2, 4, 1, 5, 5, 4, 6, 3, 2, 1,
];
const PUBLISHED_N6 = PUBLISHED_N6_ONE_BASED.map((symbol) => symbol - 1);

/**
 * Exhaustive search over all sequences with an initial symbol and n permuted blocks, each ordered pair used at most
 * once — no chaining assumed. The initial symbol is fixed to 0, which loses nothing by relabelling.
 */
function existsByExhaustion(n: number): boolean {
  const usedPair = new Uint8Array(n * n);
  const inBlock = new Uint8Array(n * n);
  const sequence: number[] = [0];
  const extend = (position: number): boolean => {
    if (position === n * n + 1) return true;
    const row = Math.floor((position - 1) / n) * n;
    const previous = sequence[position - 1] as number;
    for (let symbol = 0; symbol < n; symbol++) {
      if (inBlock[row + symbol] || usedPair[previous * n + symbol]) continue;
      inBlock[row + symbol] = 1;
      usedPair[previous * n + symbol] = 1;
      sequence.push(symbol);
      if (extend(position + 1)) return true;
      sequence.pop();
      inBlock[row + symbol] = 0;
      usedPair[previous * n + symbol] = 0;
    }
    return false;
  };
  return extend(1);
}

describe('checkType1Index1Sequence', () => {
  it('accepts the published n = 6 example', () => {
    // Nonyane & Theobald 2007; Aguirre 2007 (NeuroImage 35:1480): the n = 6 example of REFERENCES.md.
    const report = checkType1Index1Sequence(PUBLISHED_N6, 6);
    expect(report.isValid).toBe(true);
    expect(report.length).toBe(37);
    expect(report.pairs.counts.flat()).toEqual(new Array(36).fill(1));
  });

  it('rejects a corrupted copy whose blocks are still permutations', () => {
    // Swap two items inside block 3 (2 5 3 1 6 4 → 2 5 1 3 6 4): blocks stay permutations, pairs break.
    const corrupted = [...PUBLISHED_N6];
    [corrupted[15], corrupted[16]] = [corrupted[16] as number, corrupted[15] as number];
    const report = checkType1Index1Sequence(corrupted, 6);
    expect(report.isValid).toBe(false);
    expect(report.badBlocks).toEqual([]);
    expect(report.pairs.missingPairs.length).toBeGreaterThan(0);
  });

  it('rejects a copy with a block that is not a permutation', () => {
    const corrupted = [...PUBLISHED_N6];
    corrupted[10] = corrupted[9] as number; // block 2 now holds 3 (0-based) twice
    const report = checkType1Index1Sequence(corrupted, 6);
    expect(report.isValid).toBe(false);
    expect(report.badBlocks).toEqual([1]);
  });

  it('rejects wrong lengths and the one-based copy', () => {
    expect(checkType1Index1Sequence(PUBLISHED_N6.slice(0, 36), 6).isValid).toBe(false);
    expect(checkType1Index1Sequence(PUBLISHED_N6_ONE_BASED, 6).isValid).toBe(false);
  });
});

describe('type1Index1Sequence', () => {
  it('finds valid sequences for n = 2 and n = 6…12', () => {
    // Nonyane & Theobald 2007: they exist for n = 2 and n ≥ 6. Same checker as for the published example.
    for (const n of [2, 6, 7, 8, 9, 10, 11, 12]) {
      for (const seed of [0, 1, 2]) {
        const sequence = type1Index1Sequence(n, { seed });
        expect(checkType1Index1Sequence(sequence, n).isValid).toBe(true);
      }
    }
  });

  it('finds valid sequences for larger n (13…20)', () => {
    for (let n = 13; n <= 20; n++) expect(checkType1Index1Sequence(type1Index1Sequence(n, { seed: n }), n).isValid).toBe(true);
  });

  it('is valid for any seed (property, n = 6…10)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 6, max: 10 }), fc.nat(), (n, seed) => checkType1Index1Sequence(type1Index1Sequence(n, { seed }), n).isValid),
      { seed: PROPERTY_SEED, numRuns: 60 },
    );
  });

  it('is reproducible for a seed and differs between seeds', () => {
    expect(type1Index1Sequence(9, { seed: 123 })).toEqual(type1Index1Sequence(9, { seed: 123 }));
    expect(type1Index1Sequence(9, { seed: 123 })).not.toEqual(type1Index1Sequence(9, { seed: 124 }));
  });

  it.each([3, 4, 5])('refuses n = %i and offers the de Bruijn cycle', (n) => {
    // Nonyane & Theobald 2007: no type-1 index-1 sequence exists for n = 3, 4, 5.
    const error = expectSequenceError(() => type1Index1Sequence(n, { seed: 1 }), 'no-type1-index1');
    expect(error.details.alternative).toBe('de-bruijn');
    expect(error.details.trials).toBe(n * n + 1);
    expect(error.message).toMatch(/de Bruijn/);
  });

  it('agrees with an exhaustive search: none for n = 3, 4, 5, some for n = 2 and 6', () => {
    // Nonyane & Theobald 2007's existence result, checked by brute force over all block sequences.
    expect([2, 3, 4, 5, 6].map(existsByExhaustion)).toEqual([true, false, false, false, true]);
  });

  it('the chained search proves the chained subspace empty for n = 3, 4, 5', () => {
    for (const n of [3, 4, 5]) {
      expectSequenceError(() => searchChainedBlocks(n, seededRandom(1), { timeBudgetMs: 10_000, now: () => 0 }), 'no-type1-index1');
    }
  });

  it('times out with a clear error when the budget runs out', () => {
    // A clock that jumps 1 s per reading: the first check (after 4,096 nodes, fewer than 100² + 1) is past 50 ms.
    let clock = 0;
    const now = () => (clock += 1000);
    const error = expectSequenceError(() => type1Index1Sequence(100, { seed: 1, timeBudgetMs: 50, now }), 'search-timeout');
    expect(error.message).toMatch(/50 ms/);
    expect(error.details.alternative).toBe('de-bruijn');
  });

  it('refuses too few and too many conditions and a bad budget', () => {
    expectSequenceError(() => type1Index1Sequence(1, { seed: 1 }), 'too-few-conditions');
    expectSequenceError(() => type1Index1Sequence(6.5, { seed: 1 }), 'too-few-conditions');
    const tooMany = expectSequenceError(() => type1Index1Sequence(201, { seed: 1 }), 'too-many-conditions');
    expect(tooMany.details.trials).toBe(201 * 201 + 1);
    expectSequenceError(() => type1Index1Sequence(6, { seed: 1, timeBudgetMs: -1 }), 'invalid-argument');
    expectSequenceError(() => type1Index1Sequence(6, { seed: -1 }), 'invalid-seed');
  });
});
