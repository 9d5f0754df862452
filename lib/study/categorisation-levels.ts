import type { CategorisationTask } from './types';

/**
 * The signed positions of the levels along a diameter, as fractions of ρmax: `steps` evenly spaced values from
 * −extent (anchor B) to +extent (anchor A), the middle one 0 (the method of constant stimuli's fixed levels).
 */
export function categorisationLevels(task: Pick<CategorisationTask, 'steps' | 'extent'>): number[] {
  const last = task.steps - 1;
  return Array.from({ length: task.steps }, (_, i) => (i * 2 === last ? 0 : task.extent * ((2 * i) / last - 1)));
}
