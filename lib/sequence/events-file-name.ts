import { SequenceError } from './sequence-error';

/** BIDS labels are alphanumeric only: `-` and `_` separate entities in file names. */
const BIDS_LABEL = /^[A-Za-z0-9]+$/;

/** The BIDS entities of an events file name. */
export interface EventsFileNameParts {
  /** Participant label, alphanumeric (the `sub-` entity). */
  readonly subject: string;
  /** Session label, alphanumeric (optional `ses-` entity). */
  readonly session?: string;
  /** Task label, alphanumeric (the `task-` entity). */
  readonly task: string;
  /** Run index, a whole number ≥ 0 (the `run-` entity; Epicycle counts runs from 1). */
  readonly run: number;
}

function checkLabel(entity: string, label: string): string {
  if (typeof label !== 'string' || !BIDS_LABEL.test(label)) {
    throw new SequenceError(
      'invalid-label',
      `The ${entity} label ${JSON.stringify(label)} is not valid in BIDS: use letters and digits only.`,
      { field: entity, value: label },
    );
  }
  return label;
}

/**
 * The BIDS name of a run's events file, `sub-<label>[_ses-<label>]_task-<label>_run-<index>_events.tsv`, with the
 * entities in the order the BIDS specification fixes. Labels must be alphanumeric and the run a whole number ≥ 0;
 * otherwise `invalid-label`. Replace the `.tsv` ending with `.json` for a per-run sidecar.
 */
export function eventsFileName(parts: EventsFileNameParts): string {
  const subject = checkLabel('subject', parts.subject);
  const session = parts.session === undefined ? undefined : checkLabel('session', parts.session);
  const task = checkLabel('task', parts.task);
  if (!Number.isInteger(parts.run) || parts.run < 0) {
    throw new SequenceError('invalid-label', `The run index must be a whole number ≥ 0; got ${String(parts.run)}.`, {
      field: 'run',
      value: parts.run,
    });
  }
  const entities = [`sub-${subject}`, ...(session === undefined ? [] : [`ses-${session}`]), `task-${task}`, `run-${parts.run}`];
  return `${entities.join('_')}_events.tsv`;
}
