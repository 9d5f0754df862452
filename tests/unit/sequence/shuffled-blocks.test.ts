import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { shuffledBlocks } from '@/lib/sequence';
import { expectSequenceError, PROPERTY_SEED } from './support';

describe('shuffledBlocks', () => {
  it('gives blocks that are permutations, with no immediate repeat anywhere', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 20 }), fc.integer({ min: 1, max: 20 }), fc.nat(), (n, blocks, seed) => {
        const order = shuffledBlocks(n, blocks, { seed });
        if (order.length !== n * blocks) return false;
        for (let block = 0; block < blocks; block++) {
          const items = order.slice(block * n, (block + 1) * n).sort((a, b) => a - b);
          if (!items.every((item, index) => item === index)) return false;
        }
        return order.every((item, index) => index === 0 || item !== order[index - 1]);
      }),
      { seed: PROPERTY_SEED, numRuns: 300 },
    );
  });

  it('keeps n = 2 alternating across block joins', () => {
    // With two conditions and no immediate repeat the only orders are 0101… and 1010… (derived).
    const text = shuffledBlocks(2, 10, { seed: 9 }).join('');
    expect(['01'.repeat(10), '10'.repeat(10)]).toContain(text);
  });

  it('is reproducible for a seed and differs between seeds', () => {
    expect(shuffledBlocks(6, 5, { seed: 1 })).toEqual(shuffledBlocks(6, 5, { seed: 1 }));
    expect(shuffledBlocks(6, 5, { seed: 1 })).not.toEqual(shuffledBlocks(6, 5, { seed: 2 }));
  });

  it('draws each block start evenly among the admissible conditions', () => {
    // After a block ending in c, the next block starts uniformly with one of the other n − 1 conditions;
    // chi-square with 3 degrees of freedom, P(χ² > 16.3) = 0.001 (common practice).
    const n = 5;
    const starts = new Map<number, number[]>();
    for (let seed = 0; seed < 4000; seed++) {
      const order = shuffledBlocks(n, 2, { seed });
      const previous = order[n - 1] as number;
      const counts = starts.get(previous) ?? new Array<number>(n).fill(0);
      counts[order[n] as number]! += 1;
      starts.set(previous, counts);
    }
    for (const [previous, counts] of starts) {
      expect(counts[previous]).toBe(0);
      const total = counts.reduce((a, b) => a + b, 0);
      const expected = total / (n - 1);
      const chiSquare = counts.reduce((sum, count, index) => (index === previous ? sum : sum + (count - expected) ** 2 / expected), 0);
      expect(chiSquare).toBeLessThan(16.3);
    }
  });

  it('handles one condition in one block and refuses more blocks', () => {
    expect(shuffledBlocks(1, 1, { seed: 1 })).toEqual([0]);
    expectSequenceError(() => shuffledBlocks(1, 2, { seed: 1 }), 'no-immediate-repeat-impossible');
    expectSequenceError(() => shuffledBlocks(4, 0, { seed: 1 }), 'invalid-argument');
    expectSequenceError(() => shuffledBlocks(1000, 1001, { seed: 1 }), 'invalid-argument');
  });
});
