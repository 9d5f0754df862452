// Benchmark of the type-1 index-1 search:
//   node --import tsx scripts/bench-sequence.ts [--from M] [--to N] [--step D] [--seeds S] [--budget-ms B]
// Prints one JSON line per n with search times over S seeds (default 10) for n = M, M + D, … N (default 6…12).
// Searches that exceed the budget (default 600 s) are counted as timed out. A script, not a test: figures depend
// on the machine and its load; run it alone.
import { checkType1Index1Sequence, SequenceError, type1Index1Sequence } from '../lib/sequence/index';

/** The interactive requirement: n = 6…12 each in under 5 s. */
const REQUIREMENT_MS = 5_000;

function option(name: string, fallback: number): number {
  const at = process.argv.indexOf(name);
  const value = at >= 0 ? Number(process.argv[at + 1]) : fallback;
  if (!Number.isInteger(value) || value < 1) throw new Error(`${name} needs a whole number ≥ 1`);
  return value;
}

const firstN = option('--from', 6);
const lastN = option('--to', 12);
const step = option('--step', 1);
const seeds = option('--seeds', 10);
const budgetMs = option('--budget-ms', 600_000);

for (let n = firstN; n <= lastN; n += step) {
  const times: number[] = [];
  let isEveryValid = true;
  let timedOut = 0;
  for (let seed = 0; seed < seeds; seed++) {
    const started = performance.now();
    try {
      const sequence = type1Index1Sequence(n, { seed, timeBudgetMs: budgetMs });
      isEveryValid &&= checkType1Index1Sequence(sequence, n).isValid;
    } catch (error) {
      if (!(error instanceof SequenceError && error.code === 'search-timeout')) throw error;
      timedOut++;
    }
    times.push(performance.now() - started);
  }
  const sorted = [...times].sort((a, b) => a - b);
  const round = (ms: number) => Math.round(ms * 100) / 100;
  console.log(
    JSON.stringify({
      bench: 'type1-index1-search',
      n,
      trials: n * n + 1,
      seeds,
      minMs: round(sorted[0] ?? 0),
      medianMs: round(sorted[Math.floor(sorted.length / 2)] ?? 0),
      maxMs: round(sorted[sorted.length - 1] ?? 0),
      timedOut,
      budgetMs,
      meetsRequirement: n > 12 || (timedOut === 0 && (sorted[sorted.length - 1] ?? 0) < REQUIREMENT_MS),
      isEveryValid,
    }),
  );
}
