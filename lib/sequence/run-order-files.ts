import { eventsFileName, type EventsFileNameParts } from './events-file-name';
import { toEventsJson } from './to-events-json';
import { toEventsTsv } from './to-events-tsv';
import type { RunOrder } from './types';

/** One output file of a run order: its BIDS name and its text. */
export interface RunOrderFile {
  readonly name: string;
  readonly text: string;
}

/**
 * The files of a run order, run by run: `sub-<label>[_ses-<label>]_task-<label>_run-<n>_events.tsv` and its
 * `_events.json` sidecar (BIDS specification, "Task events"; the sidecar sits beside each run's file, as the
 * inheritance principle allows). Labels are checked by `eventsFileName` (`invalid-label`). Same order and labels
 * → same names and bytes.
 */
export function runOrderFiles(order: Pick<RunOrder, 'runs' | 'conditions'>, labels: Omit<EventsFileNameParts, 'run'>): RunOrderFile[] {
  const sidecar = toEventsJson(order);
  return order.runs.flatMap((run) => {
    const tsvName = eventsFileName({ ...labels, run: run.index });
    return [
      { name: tsvName, text: toEventsTsv(run) },
      { name: tsvName.replace(/\.tsv$/, '.json'), text: sidecar },
    ];
  });
}
