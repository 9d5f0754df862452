import { firstOnsetOffset } from './first-onset-offset';
import { SequenceError } from './sequence-error';
import type { RunOrderCondition, RunTiming, RunTrial } from './types';

/**
 * Trials of one run with onsets in seconds from the first stored volume: onset₀ = the stored-dummy offset,
 * onsetᵢ₊₁ = onsetᵢ + trial duration + ITIᵢ. `sequence` holds condition indices into `conditions`; `itis` has one
 * interval (s) per trial. Inputs are not changed.
 */
export function scheduleRun(
  sequence: readonly number[],
  conditions: readonly RunOrderCondition[],
  timing: RunTiming,
  itis: readonly number[],
): RunTrial[] {
  if (itis.length !== sequence.length) {
    throw new SequenceError('invalid-argument', `Need one ITI per trial: ${sequence.length} trials, ${itis.length} ITIs.`, {
      field: 'itis',
      value: itis.length,
    });
  }
  let onset = firstOnsetOffset(timing);
  return sequence.map((index, position) => {
    const condition = conditions[index];
    if (condition === undefined) {
      throw new SequenceError('invalid-argument', `Trial ${position} refers to condition ${index}, which does not exist.`, {
        value: index,
      });
    }
    const iti = itis[position] as number;
    const trial: RunTrial = {
      onset,
      duration: timing.trialDuration,
      condition: index,
      trialType: condition.id,
      stimFile: condition.stimFile,
      iti,
    };
    onset += timing.trialDuration + iti;
    return trial;
  });
}
