import { checkWholeNumber } from './check-whole-number';
import { SequenceError } from './sequence-error';
import type { OrderedPair } from './types';

/** A transition at a cut: `pair[0]` ends run `afterRun` (1-based) and `pair[1]` opens the next. */
export interface CutTransition {
  readonly afterRun: number;
  readonly pair: OrderedPair;
}

/** Pieces of a cut sequence and the transitions the cuts remove. */
export interface CutSequence {
  readonly pieces: readonly (readonly number[])[];
  readonly cuts: readonly CutTransition[];
}

/**
 * Cuts one long sequence into `runs` consecutive pieces whose lengths differ by at most one (the first
 * length mod runs pieces get the extra trial). Each of the runs − 1 cuts removes exactly one transition — the pair
 * (last of run r, first of run r + 1) — which is reported. Refuses (`run-too-short`) when a run would hold no trial.
 */
export function cutIntoRuns(sequence: readonly number[], runs: number): CutSequence {
  checkWholeNumber('runs', runs, 1);
  if (runs > sequence.length) {
    throw new SequenceError(
      'run-too-short',
      `${sequence.length} trials cannot be cut into ${runs} runs: every run needs at least one trial.`,
      { field: 'runs', value: runs, trials: sequence.length, maximum: sequence.length },
    );
  }
  const base = Math.floor(sequence.length / runs);
  const extra = sequence.length % runs;
  const pieces: number[][] = [];
  const cuts: CutTransition[] = [];
  let start = 0;
  for (let run = 0; run < runs; run++) {
    const end = start + base + (run < extra ? 1 : 0);
    pieces.push(sequence.slice(start, end));
    if (end < sequence.length) cuts.push({ afterRun: run + 1, pair: [sequence[end - 1] as number, sequence[end] as number] });
    start = end;
  }
  return { pieces, cuts };
}
