import { checkWholeNumber } from './check-whole-number';
import { combineRunSummaries } from './combine-run-summaries';
import { cutIntoRuns } from './cut-into-runs';
import { deriveSeed } from './derive-seed';
import { drawItis } from './draw-itis';
import { generateConditionOrder } from './generate-condition-order';
import { resolveConditions } from './resolve-conditions';
import { scheduleRun } from './schedule-run';
import { seededRandom } from './seeded-random';
import { SequenceError } from './sequence-error';
import { SEQUENCE_LIMITS } from './sequence-limits';
import { summarizeRun } from './summarize-run';
import type { LostPair, Run, RunMode, RunOrder, RunOrderOptions } from './types';
import { validateTiming } from './validate-timing';

/** Stream numbers for `deriveSeed`: the condition order of run r is stream (ORDER, r), its ITIs (ITI, r). */
const STREAM_ORDER = 0;
const STREAM_ITI = 1;
/** The one long sequence of run mode `cut`. */
const STREAM_LONG_ORDER = 2;

const RUN_MODES: readonly RunMode[] = ['independent', 'cut'];

/**
 * A run order for a scanning or EEG session: from conditions (plus optional null events), a sequence type
 * (de Bruijn order-2, type-1 index-1, shuffled blocks), timing in seconds (trial duration; fixed, uniform or
 * truncated exponential ITI; TR; dummy volumes, stored or not) and a number of runs. By default each run is a
 * complete sequence of its own; run mode `cut` cuts one long sequence into runs and reports the ordered pairs lost
 * at the cuts. Each run gets trials with onsets (s from the first stored volume, as in BIDS) and a summary
 * (duration, volumes, counts, first-order transitions, WCAG 2.3.1 flash check); the order gets totals.
 * Everything random derives from `seed`, so the same options give the same order.
 * Refuses with `SequenceError`: more than 200 conditions for a balanced type (giving the n² + 1 trials needed),
 * trial duration ≤ 0, TR ≤ 0, a bad ITI, runs that would hold no trial, and bad or duplicate condition ids.
 */
export function buildRunOrder(options: RunOrderOptions): RunOrder {
  // Phase: check the options.
  validateTiming(options.timing);
  const runCount = options.runs ?? 1;
  checkWholeNumber('runs', runCount, 1);
  const runMode = options.runMode ?? 'independent';
  if (!RUN_MODES.includes(runMode)) {
    throw new SequenceError('invalid-argument', `Unknown run mode ${String(runMode)}; use "independent" or "cut".`, { field: 'runMode', value: runMode });
  }
  deriveSeed(options.seed);
  const conditions = resolveConditions(options.conditions, options.nullEvents);
  const n = conditions.length;

  // Phase: one condition order per run.
  let sequences: (readonly number[])[];
  let lostPairs: LostPair[] = [];
  if (runMode === 'independent') {
    sequences = [generateConditionOrder(options.sequence, n, deriveSeed(options.seed, STREAM_ORDER, 0))];
    const trialsPerRun = (sequences[0] as readonly number[]).length;
    if (trialsPerRun * runCount > SEQUENCE_LIMITS.maxTrials) {
      throw new SequenceError('invalid-argument', `${runCount} runs of ${trialsPerRun} trials exceed the limit of ${SEQUENCE_LIMITS.maxTrials} trials.`, {
        field: 'runs',
        value: runCount,
        trials: trialsPerRun * runCount,
        maximum: SEQUENCE_LIMITS.maxTrials,
      });
    }
    for (let run = 1; run < runCount; run++) sequences.push(generateConditionOrder(options.sequence, n, deriveSeed(options.seed, STREAM_ORDER, run)));
  } else {
    const cut = cutIntoRuns(generateConditionOrder(options.sequence, n, deriveSeed(options.seed, STREAM_LONG_ORDER)), runCount);
    sequences = [...cut.pieces];
    lostPairs = cut.cuts.map(({ afterRun, pair: [from, to] }) => ({
      afterRun,
      from,
      to,
      fromId: (conditions[from] as { id: string }).id,
      toId: (conditions[to] as { id: string }).id,
    }));
  }

  // Phase: timing and figures per run.
  const runs: Run[] = sequences.map((sequence, run) => {
    const itis = drawItis(sequence.length, options.timing.iti, seededRandom(deriveSeed(options.seed, STREAM_ITI, run)));
    const trials = scheduleRun(sequence, conditions, options.timing, itis);
    return { index: run + 1, sequence: [...sequence], trials, summary: summarizeRun(trials, conditions, options.timing) };
  });

  return {
    sequenceType: options.sequence.kind,
    runMode,
    seed: options.seed,
    tr: options.timing.tr,
    conditions,
    runs,
    lostPairs,
    summary: combineRunSummaries(
      runs.map((run) => run.summary),
      n,
    ),
  };
}
