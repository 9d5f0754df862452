import { createHash } from 'node:crypto';
import { seededRandom } from '@/lib/stats';

/**
 * Uniform draws keyed by what a simulated trial shows (e.g. participant, direction and position) and how often that
 * key came before, not by the trial's place in the order. A study's seed is drawn anew when it is created, so it
 * shuffles the order of the trials from run to run; keyed draws keep a simulated observer's data the same anyway.
 */
export function keyedDraws(): (key: string) => number {
  const seen = new Map<string, number>();
  return (key) => {
    const n = seen.get(key) ?? 0;
    seen.set(key, n + 1);
    return seededRandom(createHash('sha256').update(`${key}#${n}`).digest().readUInt32LE(0))();
  };
}
