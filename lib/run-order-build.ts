// Client-safe: the page's live preview and the server build a run order the same way, from a definition and the
// edition's stimulus ids, so what the form shows is what is stored.
import { buildRunOrder } from './sequence/build-run-order';
import { SequenceError } from './sequence/sequence-error';
import { SEQUENCE_LIMITS } from './sequence/sequence-limits';
import type { RunOrder, RunOrderOptions } from './sequence/types';
import { selectLayoutStimuli } from './space/select-layout-stimuli';
import { eventsFileName } from './sequence/events-file-name';
import type { RunOrderDefinition, RunOrderResultValue } from './schemas/run-order';

/** Largest n whose type-1 index-1 search runs inline (n = 6…12 take milliseconds; the requirement is < 5 s). */
export const INLINE_TYPE1_MAX_CONDITIONS = 12;
/** Time budget of a background type-1 index-1 search (n > 12), stated in the page and in the failure message. */
export const BACKGROUND_SEARCH_BUDGET_MS = 120_000;

/** Stimulus files as the pack writes them, relative to the dataset's `stimuli/` folder. */
export const stimulusFileOf = (id: string) => `svg/${id}.svg`;

/** The condition ids a definition picks from an edition's stimuli (null events not included). */
export function conditionIdsOf(definition: RunOrderDefinition, stimulusIds: readonly string[]): string[] {
  const { selection, indices, includeCentre } = definition.conditions;
  return selectLayoutStimuli(stimulusIds, selection === 'all' ? { kind: 'all' } : { kind: selection, indices, includeCentre });
}

/** Number of conditions of a definition, null events included. */
export function conditionCountOf(definition: RunOrderDefinition, stimulusIds: readonly string[]): number {
  return conditionIdsOf(definition, stimulusIds).length + (definition.conditions.nullEvents ? 1 : 0);
}

/** Whether a definition's type-1 index-1 search is too long to run inline and goes to a background job. */
export function needsBackgroundSearch(definition: RunOrderDefinition, stimulusIds: readonly string[]): boolean {
  const n = conditionCountOf(definition, stimulusIds);
  return definition.sequence.kind === 'type1-index1' && n > INLINE_TYPE1_MAX_CONDITIONS && n <= SEQUENCE_LIMITS.maxBalancedConditions;
}

/** The `buildRunOrder` options of a definition; `timeBudgetMs` bounds a type-1 index-1 search. */
export function runOrderOptionsOf(definition: RunOrderDefinition, stimulusIds: readonly string[], timeBudgetMs: number = SEQUENCE_LIMITS.defaultTimeBudgetMs): RunOrderOptions {
  const sequence = definition.sequence.kind === 'type1-index1' ? { kind: 'type1-index1' as const, timeBudgetMs } : definition.sequence;
  return {
    conditions: conditionIdsOf(definition, stimulusIds).map((id) => ({ id, stimFile: stimulusFileOf(id) })),
    sequence,
    timing: definition.timing,
    runs: definition.runs,
    runMode: definition.runMode,
    nullEvents: definition.conditions.nullEvents,
    seed: definition.seed,
  };
}

/** Builds the run order of a definition (throws `SequenceError` for bad input or a search that ran out of time). */
export function buildRunOrderOf(definition: RunOrderDefinition, stimulusIds: readonly string[], timeBudgetMs?: number): RunOrder {
  return buildRunOrder(runOrderOptionsOf(definition, stimulusIds, timeBudgetMs));
}

/**
 * Checks everything about a definition except the type-1 index-1 search itself: a de Bruijn order has the same
 * n² + 1 trials per run, so the counts, timing, labels and run lengths fail the same way. Used before a
 * background search is queued, so bad input is refused at once.
 */
export function checkRunOrderDefinition(definition: RunOrderDefinition, stimulusIds: readonly string[]): void {
  const n = conditionCountOf(definition, stimulusIds);
  const stand = definition.sequence.kind === 'type1-index1' && n > INLINE_TYPE1_MAX_CONDITIONS ? { ...definition, sequence: { kind: 'de-bruijn' as const } } : definition;
  buildRunOrderOf(stand, stimulusIds);
}

const FIELD_OF: Record<string, string> = {
  n: 'conditions',
  conditions: 'conditions',
  trialDuration: 'timing.trialDuration',
  tr: 'timing.tr',
  dummyVolumes: 'timing.dummyVolumes',
  'iti.kind': 'timing.iti.kind',
  'iti.mean': 'timing.iti.mean',
  'iti.min': 'timing.iti.min',
  'iti.max': 'timing.iti.max',
  'iti.duration': 'timing.iti.duration',
  blocks: 'sequence.blocks',
  'sequence.kind': 'sequence.kind',
  runs: 'runs',
  runMode: 'runMode',
  seed: 'seed',
  subject: 'bids.subject',
  session: 'bids.session',
  task: 'bids.task',
};

/** The definition field a `SequenceError` is about (dot path into the definition), `conditions` when unsure. */
export function definitionFieldOf(error: SequenceError): string {
  const field = error.details.field ?? '';
  if (field.startsWith('conditions.')) return 'conditions';
  return FIELD_OF[field] ?? (field.startsWith('iti.') ? `timing.${field}` : 'conditions');
}

/** BIDS labels of a definition, as `eventsFileName` takes them (an empty session is left out). */
export function bidsLabelsOf(definition: RunOrderDefinition) {
  const { subject, session, task } = definition.bids;
  return { subject, task, ...(session ? { session } : {}) };
}

/** The figures of a built order as the API and the page show them (no trials), with each run's file name. */
export function runOrderResultOf(order: RunOrder, definition: RunOrderDefinition): RunOrderResultValue {
  return {
    conditions: order.conditions.map((c) => ({ ...c })),
    runs: order.runs.map((run) => {
      const { conditionCounts: _c, transitionCounts: _t, ...figures } = run.summary;
      return { index: run.index, fileName: eventsFileName({ ...bidsLabelsOf(definition), run: run.index }), ...figures };
    }),
    lostPairs: order.lostPairs.map((p) => ({ ...p })),
    summary: { ...order.summary, conditionCounts: [...order.summary.conditionCounts], transitionCounts: order.summary.transitionCounts.map((r) => [...r]) },
  };
}

export { SequenceError };
