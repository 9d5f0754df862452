import type { RunOrderCondition } from './types';

/** Indentation of the sidecar: two spaces, the usual layout of BIDS JSON files. */
const JSON_INDENT = 2;

/**
 * The `_events.json` sidecar for the `events.tsv` files of a run order (BIDS specification, "Task events" and
 * "Tabular files"): for each column a LongName and Description, Units `s` for `onset` and `duration`, and the
 * Levels of `trial_type` (one per condition, naming its stimulus file or marking it as the null event). Returns
 * the JSON text, two-space indented, ending with `\n`; same conditions → same bytes.
 */
export function toEventsJson(order: { readonly conditions: readonly RunOrderCondition[] }): string {
  const levels: Record<string, string> = {};
  for (const condition of order.conditions) {
    levels[condition.id] = condition.isNullEvent
      ? 'Null event: a blank trial with no stimulus (fixation only).'
      : condition.stimFile === null
        ? `Condition ${condition.id}.`
        : `Condition ${condition.id}: stimulus stimuli/${condition.stimFile}.`;
  }
  const sidecar = {
    onset: {
      LongName: 'Event onset',
      Description:
        'Onset of the trial, in seconds from the first volume stored in the data file. Stored dummy volumes are counted; discarded ones are not.',
      Units: 's',
    },
    duration: {
      LongName: 'Event duration',
      Description: 'Duration of the stimulus presentation (the interval to the next trial is not included), in seconds.',
      Units: 's',
    },
    trial_type: {
      LongName: 'Condition',
      Description: 'The condition of the trial: one stimulus of the shape space, or a null event.',
      Levels: levels,
    },
    stim_file: {
      LongName: 'Stimulus file',
      Description: "Path of the stimulus file shown, relative to the dataset's stimuli/ folder; n/a for null events.",
    },
  };
  return `${JSON.stringify(sidecar, null, JSON_INDENT)}\n`;
}
