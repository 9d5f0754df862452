import { SequenceError } from './sequence-error';
import type { SeededRandom } from './types';

/**
 * Cutoff of the first restart, in search nodes: most attempts for n ≤ 12 succeed within a few hundred nodes, so a
 * stuck attempt is abandoned early.
 */
const RESTART_INITIAL_NODES = 1_000;
/**
 * Geometric growth of the cutoff between restarts (Gomes, Selman & Kautz 1998): short attempts escape the heavy
 * tail of backtracking times, and the cutoff grows without bound, so the search stays complete.
 */
const RESTART_GROWTH = 1.5;
/** Nodes between two clock reads: reading the clock costs far more than one node. */
const CLOCK_CHECK_INTERVAL = 4_096;
/**
 * The reachability check runs only in the last blocks: earlier, the residual graph is dense and the check never
 * prunes, but it costs O(n²) per node. Measured: 8 blocks roughly halves the time to n = 40.
 */
const PRUNE_TAIL_BLOCKS = 8;

/** Options of `searchChainedBlocks`. */
export interface ChainedBlockSearchOptions {
  /** Give up with `search-timeout` after this many milliseconds (≥ 0). */
  readonly timeBudgetMs: number;
  /** Millisecond clock; injected so the core reads no global state it cannot be given. */
  readonly now: () => number;
}

/**
 * Stage of `type1Index1Sequence`: seeded randomised depth-first backtracking with restarts for a type-1 index-1
 * sequence over 0…n−1 (n ≥ 2) in which every block starts with the last symbol of the block before (the first
 * block with the initial symbol). The n self-pairs then fall on the joins, and each block is a Hamiltonian path
 * through the pairs not used yet, ending on a symbol that has not started a block (the last block ends on the
 * initial symbol): the blocks form a chained decomposition of the complete directed graph into Hamiltonian paths.
 * Returns n² + 1 symbols. Throws `search-timeout` when the budget runs out, and `no-type1-index1` if an attempt
 * exhausts the space (by symmetry none exists then).
 */
export function searchChainedBlocks(n: number, random: SeededRandom, options: ChainedBlockSearchOptions): number[] {
  const total = n * n + 1;
  const sequence = new Int32Array(total);
  const usedPair = new Uint8Array(n * n);
  const hasStarted = new Uint8Array(n);
  const inBlock = new Uint8Array(n * n); // row b: symbols already placed in block b
  const candidates = new Int32Array(total * n);
  const candidateCount = new Int32Array(total);
  const nextCandidate = new Int32Array(total);
  const startedAt = options.now();
  let cutoff = RESTART_INITIAL_NODES;
  let nodesSinceClock = 0;

  const blockOf = (position: number): number => Math.floor((position - 1) / n);
  const offsetOf = (position: number): number => (position - 1) % n;
  const isAllowedEnd = (block: number, symbol: number): boolean =>
    block === n - 1 ? symbol === sequence[0] : hasStarted[symbol] === 0;

  // Phase: list the symbols that may go at `position`, in random order.
  const prepare = (position: number): void => {
    const block = blockOf(position);
    const offset = offsetOf(position);
    const base = position * n;
    nextCandidate[position] = 0;
    if (offset === 0) {
      inBlock.fill(0, block * n, block * n + n);
      candidates[base] = sequence[position - 1] as number;
      candidateCount[position] = 1;
      return;
    }
    const current = sequence[position - 1] as number;
    const isLast = offset === n - 1;
    let count = 0;
    for (let symbol = 0; symbol < n; symbol++) {
      if (inBlock[block * n + symbol] || usedPair[current * n + symbol]) continue;
      if (isLast && !isAllowedEnd(block, symbol)) continue;
      candidates[base + count++] = symbol;
    }
    for (let i = count - 1; i > 0; i--) {
      const j = random.nextInt(i + 1);
      const swap = candidates[base + i] as number;
      candidates[base + i] = candidates[base + j] as number;
      candidates[base + j] = swap;
    }
    candidateCount[position] = count;
  };

  const place = (position: number, symbol: number, isPlacing: boolean): void => {
    const block = blockOf(position);
    const flag = isPlacing ? 1 : 0;
    sequence[position] = symbol;
    inBlock[block * n + symbol] = flag;
    if (offsetOf(position) === 0) hasStarted[symbol] = flag;
    else usedPair[(sequence[position - 1] as number) * n + symbol] = flag;
  };

  // Phase: can the current block still be completed? Needs an unplaced allowed end, and every unplaced symbol
  // must have an unused pair into it from the current symbol or from another unplaced symbol.
  const isViable = (position: number): boolean => {
    const block = blockOf(position);
    const offset = offsetOf(position);
    if (offset === 0 || offset === n - 1 || block < n - PRUNE_TAIL_BLOCKS) return true;
    const row = block * n;
    const current = sequence[position] as number;
    let hasEnd = false;
    for (let target = 0; target < n; target++) {
      if (inBlock[row + target]) continue;
      if (isAllowedEnd(block, target)) hasEnd = true;
      let isReachable = usedPair[current * n + target] === 0;
      for (let from = 0; !isReachable && from < n; from++) {
        if (from !== target && !inBlock[row + from] && !usedPair[from * n + target]) isReachable = true;
      }
      if (!isReachable) return false;
    }
    return hasEnd;
  };

  for (;;) {
    // Phase: one attempt, abandoned after `cutoff` nodes.
    usedPair.fill(0);
    hasStarted.fill(0);
    sequence[0] = random.nextInt(n);
    let nodes = 0;
    let position = 1;
    prepare(position);
    while (nodes <= cutoff) {
      if ((nextCandidate[position] as number) < (candidateCount[position] as number)) {
        const symbol = candidates[position * n + (nextCandidate[position] as number)] as number;
        nextCandidate[position] = (nextCandidate[position] as number) + 1;
        place(position, symbol, true);
        nodes++;
        if (++nodesSinceClock >= CLOCK_CHECK_INTERVAL) {
          nodesSinceClock = 0;
          const elapsedMs = options.now() - startedAt;
          if (elapsedMs > options.timeBudgetMs) {
            throw new SequenceError(
              'search-timeout',
              `No type-1 index-1 sequence for n = ${n} was found within ${options.timeBudgetMs} ms. ` +
                `Try a larger time budget or another seed, or use a de Bruijn order-2 cycle (${n * n + 1} trials).`,
              { conditions: n, elapsedMs, maximum: options.timeBudgetMs, alternative: 'de-bruijn' },
            );
          }
        }
        if (!isViable(position)) {
          place(position, symbol, false);
          continue;
        }
        if (position === total - 1) return Array.from(sequence);
        position++;
        prepare(position);
      } else {
        position--;
        if (position === 0) {
          throw new SequenceError(
            'no-type1-index1',
            `No type-1 index-1 sequence with blocks chained on their last symbol exists for n = ${n}.`,
            { conditions: n, alternative: 'de-bruijn' },
          );
        }
        place(position, sequence[position] as number, false);
      }
    }
    cutoff = Math.ceil(cutoff * RESTART_GROWTH);
  }
}
