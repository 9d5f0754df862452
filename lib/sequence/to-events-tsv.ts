import { SequenceError } from './sequence-error';
import type { RunTrial } from './types';

/** Default decimals: times to the millisecond, the resolution of the drawn ITIs. */
const DEFAULT_DECIMALS = 3;
/** Up to the microsecond; more digits would only print floating-point noise. */
const MAX_DECIMALS = 6;
/** BIDS's marker for a missing value. */
const MISSING_VALUE = 'n/a';
/** The column order: BIDS requires `onset` and `duration` first. */
const COLUMNS = ['onset', 'duration', 'trial_type', 'stim_file'] as const;

/** Options of `toEventsTsv`. */
export interface EventsTsvOptions {
  /** Fixed decimals for `onset` and `duration`, 0…6 (default 3). */
  readonly decimals?: number;
}

function formatSeconds(value: number, decimals: number, field: string, row: number): string {
  if (!Number.isFinite(value) || value < 0) {
    throw new SequenceError('invalid-argument', `Trial ${row + 1} has ${field} ${String(value)}; it must be a number of seconds ≥ 0.`, {
      field,
      value,
    });
  }
  return value.toFixed(decimals);
}

function formatText(value: string | null, field: string, row: number): string {
  if (value === null || value === '') return MISSING_VALUE;
  if (/[\t\n\r]/.test(value)) {
    throw new SequenceError('invalid-argument', `Trial ${row + 1} has a tab or line break in ${field}.`, { field, value });
  }
  return value;
}

/**
 * The BIDS `events.tsv` text of one run: a header row `onset duration trial_type stim_file`, then one row per
 * trial, fields separated by real tab characters and every line ended by `\n`. `onset` and `duration` are seconds
 * with fixed decimals (onsets from the first stored volume); `stim_file` is relative to the dataset's `stimuli/`
 * folder; missing values are written `n/a` (BIDS specification, "Task events").
 */
export function toEventsTsv(run: { readonly trials: readonly RunTrial[] }, options: EventsTsvOptions = {}): string {
  const decimals = options.decimals ?? DEFAULT_DECIMALS;
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > MAX_DECIMALS) {
    throw new SequenceError('invalid-argument', `Decimals must be a whole number from 0 to ${MAX_DECIMALS}; got ${String(decimals)}.`, {
      field: 'decimals',
      value: decimals,
    });
  }
  const rows = run.trials.map((trial, row) =>
    [
      formatSeconds(trial.onset, decimals, 'onset', row),
      formatSeconds(trial.duration, decimals, 'duration', row),
      formatText(trial.trialType, 'trial_type', row),
      formatText(trial.stimFile, 'stim_file', row),
    ].join('\t'),
  );
  return [COLUMNS.join('\t'), ...rows].map((line) => `${line}\n`).join('');
}
