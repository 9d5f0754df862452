/**
 * A seeded stream of pseudo-random numbers (see `seededRandom`). `next()` is uniform on [0, 1);
 * `nextInt(m)` is uniform on the integers 0…m−1.
 */
export interface SeededRandom {
  next(): number;
  nextInt(maxExclusive: number): number;
}

/** A sequence of condition indices 0…n−1 (trials in presentation order, or the items of a cycle). */
export type Sequence = readonly number[];
