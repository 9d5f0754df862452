import { classifyStimuli } from './classify-stimuli';
import type { Boundary, BoundarySummary, PositionedStimulus } from './types';

/**
 * Counts of stimuli on each side of a boundary and on it, and the balance (countA − countB) / (countA + countB)
 * in [−1, 1] (0 = balanced; null when every stimulus is on the boundary or there are none). `extent` ρmax > 0
 * (axis units). Throws `BoundaryError`.
 */
export function boundarySummary(stimuli: readonly PositionedStimulus[], boundary: Boundary, extent: number): BoundarySummary {
  let countA = 0;
  let countB = 0;
  let countOn = 0;
  for (const { placements } of classifyStimuli(stimuli, [boundary], extent)) {
    const side = placements[0]?.side;
    if (side === 'A') countA++;
    else if (side === 'B') countB++;
    else countOn++;
  }
  const off = countA + countB;
  return { boundaryKey: boundary.key, countA, countB, countOn, balance: off === 0 ? null : (countA - countB) / off };
}
