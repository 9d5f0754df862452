/**
 * Catch trials to add to a direction with `mainTrials` ordinary trials so that they make up `catchRate` of all its
 * trials: c / (main + c) ≈ rate, so c = round(main · rate / (1 − rate)). 0 when the rate is 0.
 */
export function catchTrialsPerDirection(mainTrials: number, catchRate: number): number {
  if (catchRate <= 0) return 0;
  return Math.round((mainTrials * catchRate) / (1 - catchRate));
}
