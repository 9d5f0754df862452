import type { PsychometricData } from './types';

/** One two-choice categorisation answer along a diameter: its direction, the signed position and the anchor chosen. */
export interface DirectionAnswer {
  /** The diameter's angle in degrees, [0, 180). */
  readonly directionDeg: number;
  /** Signed position along the diameter (towards anchor A positive), as a fraction of ρmax. */
  readonly position: number;
  readonly chose: 'A' | 'B';
}

/** The pooled binomial data of one direction: counts of choosing anchor A at each position. */
export interface DirectionData {
  readonly directionDeg: number;
  readonly data: PsychometricData;
}

/**
 * The answers of every participant pooled per direction, as binomial data for `fitPsychometric`: per distinct
 * position (ascending) the number of answers `n` and of answers "A" `k`, so ψ rises with the position; the
 * slope's size is the same as that of P(B) against −position. Directions in ascending order.
 */
export function directionData(answers: readonly DirectionAnswer[]): DirectionData[] {
  const byDirection = new Map<number, Map<number, { n: number; k: number }>>();
  for (const a of answers) {
    let levels = byDirection.get(a.directionDeg);
    if (!levels) byDirection.set(a.directionDeg, (levels = new Map()));
    const cell = levels.get(a.position) ?? { n: 0, k: 0 };
    cell.n += 1;
    if (a.chose === 'A') cell.k += 1;
    levels.set(a.position, cell);
  }
  return [...byDirection.entries()]
    .sort(([p], [q]) => p - q)
    .map(([directionDeg, levels]) => {
      const cells = [...levels.entries()].sort(([p], [q]) => p - q);
      return { directionDeg, data: { x: cells.map(([x]) => x), n: cells.map(([, c]) => c.n), k: cells.map(([, c]) => c.k) } };
    });
}
