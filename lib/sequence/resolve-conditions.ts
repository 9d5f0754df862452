import { SequenceError } from './sequence-error';
import type { RunConditionInput, RunOrderCondition } from './types';

/** `trial_type` of null events unless the caller names them. */
const DEFAULT_NULL_TRIAL_TYPE = 'null';
/** BIDS's marker for a missing value; as a `trial_type` it would read as missing. */
const MISSING_VALUE = 'n/a';
/** Characters that would break a TSV row or a BIDS path. */
const FORBIDDEN_CHARACTERS = /[\t\n\r]/;

function checkTrialType(id: unknown, position: number): string {
  if (typeof id !== 'string' || id.length === 0 || id.trim() !== id || FORBIDDEN_CHARACTERS.test(id) || id === MISSING_VALUE) {
    throw new SequenceError(
      'invalid-condition',
      `Condition ${position + 1} has the id ${JSON.stringify(id)}: an id must be non-empty text without tabs, line ` +
        `breaks or surrounding spaces, and not "${MISSING_VALUE}".`,
      { field: `conditions.${position}.id`, value: id },
    );
  }
  return id;
}

function checkStimFile(stimFile: unknown, position: number): string | null {
  if (stimFile === undefined || stimFile === null) return null;
  const segments = typeof stimFile === 'string' ? stimFile.split('/') : [];
  const isRelative =
    typeof stimFile === 'string' &&
    !FORBIDDEN_CHARACTERS.test(stimFile) &&
    !stimFile.includes('\\') &&
    stimFile !== MISSING_VALUE &&
    segments.every((segment) => segment !== '' && segment !== '.' && segment !== '..');
  if (!isRelative) {
    throw new SequenceError(
      'invalid-condition',
      `Condition ${position + 1} has the stimulus file ${JSON.stringify(stimFile)}: it must be a path relative to ` +
        'the dataset\'s stimuli/ folder, with "/" between folders and no "..", tabs or line breaks.',
      { field: `conditions.${position}.stimFile`, value: stimFile },
    );
  }
  return stimFile;
}

/**
 * The conditions of a run order: the given ones, checked (ids usable as `trial_type`, stimulus files relative to
 * `stimuli/`, ids distinct), then the null event condition when asked for (`stim_file` n/a). Throws
 * `too-few-conditions`, `invalid-condition` or `duplicate-condition`.
 */
export function resolveConditions(
  inputs: readonly RunConditionInput[],
  nullEvents: boolean | { readonly trialType: string } | undefined,
): RunOrderCondition[] {
  const conditions: RunOrderCondition[] = inputs.map((input, position) => ({
    id: checkTrialType(input.id, position),
    stimFile: checkStimFile(input.stimFile, position),
    isNullEvent: false,
  }));
  if (nullEvents) {
    const trialType = typeof nullEvents === 'object' ? nullEvents.trialType : DEFAULT_NULL_TRIAL_TYPE;
    conditions.push({ id: checkTrialType(trialType, conditions.length), stimFile: null, isNullEvent: true });
  }
  if (conditions.length === 0) {
    throw new SequenceError('too-few-conditions', 'A run order needs at least one condition.', { field: 'conditions', conditions: 0, minimum: 1 });
  }
  const seen = new Set<string>();
  conditions.forEach((condition, position) => {
    if (seen.has(condition.id)) {
      throw new SequenceError(
        'duplicate-condition',
        `The id "${condition.id}" is used twice${condition.isNullEvent ? ' (once by the null events)' : ''}; ids must be distinct.`,
        { field: `conditions.${position}.id`, value: condition.id },
      );
    }
    seen.add(condition.id);
  });
  return conditions;
}
