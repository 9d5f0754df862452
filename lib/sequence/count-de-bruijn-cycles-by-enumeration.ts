import { checkWholeNumber } from './check-whole-number';
import { SequenceError } from './sequence-error';

/** Search nodes allowed by default: B(4,2) (20,736 cycles) needs well under a million; more is a mistake. */
const DEFAULT_MAX_NODES = 20_000_000;

/** Options of `countDeBruijnCyclesByEnumeration`. */
export interface EnumerationOptions {
  /** Abort with `enumeration-too-large` after this many search nodes (default 20,000,000). */
  readonly maxNodes?: number;
}

/**
 * The number of de Bruijn cycles B(k, n) up to rotation, counted by exhaustive enumeration — an independent check
 * of `countDeBruijnCycles` for tiny cases (B(2,3), B(2,4), B(3,2), B(4,2)). Every cycle contains the word 0ⁿ
 * exactly once, so each is counted once, in its rotation that starts with 0ⁿ: a depth-first search appends
 * symbols while every length-n window is new, then checks the n − 1 windows that wrap around.
 */
export function countDeBruijnCyclesByEnumeration(k: number, n: number, options: EnumerationOptions = {}): number {
  checkWholeNumber('k', k, 1);
  checkWholeNumber('n', n, 1);
  const maxNodes = options.maxNodes ?? DEFAULT_MAX_NODES;
  const length = k ** n;
  const seen = new Uint8Array(length);
  const symbols = new Int32Array(length);
  seen[0] = 1; // the window 0ⁿ at position 0
  let nodes = 0;
  let count = 0;

  const closesCycle = (): boolean => {
    // Windows starting at length − n + 1 … length − 1 wrap onto the opening symbols.
    const extra: number[] = [];
    for (let start = length - n + 1; start < length; start++) {
      let word = 0;
      for (let i = 0; i < n; i++) word = word * k + (symbols[(start + i) % length] as number);
      if (seen[word] || extra.includes(word)) return false;
      extra.push(word);
    }
    return true;
  };

  const extend = (position: number, window: number): void => {
    if (++nodes > maxNodes) {
      throw new SequenceError(
        'enumeration-too-large',
        `Enumerating B(${k}, ${n}) needs more than ${maxNodes} search nodes; use countDeBruijnCycles instead.`,
        { maximum: maxNodes },
      );
    }
    if (position === length) {
      if (closesCycle()) count++;
      return;
    }
    for (let symbol = 0; symbol < k; symbol++) {
      const next = (window * k + symbol) % length;
      if (seen[next]) continue;
      seen[next] = 1;
      symbols[position] = symbol;
      extend(position + 1, next);
      seen[next] = 0;
    }
  };

  // One symbol: the single cycle "0" (only k = 1 has kⁿ ≤ n, so the search below always has room for 0ⁿ).
  if (k === 1) return 1;
  // Positions 0…n−1 hold 0ⁿ; the window ending at position n − 1 is the word 0.
  extend(n, 0);
  return count;
}
