/**
 * Limits of `lib/sequence`, each with its reason.
 * - `maxBalancedConditions`: 200. A balanced first-order order of n conditions has n² + 1 trials; 200 conditions
 *   already need 40,001 trials (11 h at one trial per second), beyond any scanning or EEG session, and the cap
 *   bounds the n × n transition tables and the type-1 index-1 search memory (n³ integers).
 * - `maxCycleLength`: 2²⁰ symbols for a de Bruijn cycle kⁿ: ample for trial orders and still a few megabytes.
 * - `maxTrials`: 100,000 trials in one order (shuffled blocks included; 28 h at one trial per second), so a typo
 *   cannot allocate gigabytes: an order is built inside a web request and stored whole, and a million trials took
 *   over a minute to build and half a minute to list again (found by the request fuzzer).
 * - `flashLimitPerSecond`: 3. WCAG 2.3.1 (Three Flashes or Below Threshold): no more than three flashes in any
 *   one-second period. Each stimulus onset counts as one flash.
 * - `defaultTimeBudgetMs`: 5,000 ms for a type-1 index-1 search, the interactive requirement for n = 6…12
 *   (which take milliseconds); larger n are run as background jobs with a larger budget.
 */
export const SEQUENCE_LIMITS = {
  maxBalancedConditions: 200,
  maxCycleLength: 1_048_576,
  maxTrials: 100_000,
  flashLimitPerSecond: 3,
  defaultTimeBudgetMs: 5_000,
} as const;
