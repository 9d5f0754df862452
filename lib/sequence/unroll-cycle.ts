import { checkWholeNumber } from './check-whole-number';

/**
 * A cycle read as a linear trial list: the cycle followed by its first `order` − 1 items again, so that every
 * length-`order` window of the cycle occurs between consecutive trials (order ≥ 1). For a de Bruijn cycle of order
 * 2 over n conditions this is the n² + 1-trial list in which every ordered pair occurs once.
 */
export function unrollCycle(cycle: readonly number[], order = 2): number[] {
  checkWholeNumber('order', order, 1);
  if (cycle.length === 0) return [];
  const tail = Array.from({ length: order - 1 }, (_, i) => cycle[i % cycle.length] as number);
  return [...cycle, ...tail];
}
