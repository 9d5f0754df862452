'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useDeferredValue, useMemo, useState } from 'react';
import { useForm, type FieldPath } from 'react-hook-form';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import {
  BACKGROUND_SEARCH_BUDGET_MS,
  buildRunOrderOf,
  conditionCountOf,
  definitionFieldOf,
  needsBackgroundSearch,
  runOrderResultOf,
  SequenceError,
} from '@/lib/run-order-build';
import {
  CreateRunOrderSchema,
  RUN_ORDER_SELECTION_LABELS,
  RunOrderDefinitionSchema,
  SEQUENCE_KIND_LABELS,
  type CreateRunOrderInput,
  type RunOrderDefinition,
  type RunOrderValue,
} from '@/lib/schemas/run-order';
import { RunOrderSummary } from './run-order-summary';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

type Layout = { kind: 'rings'; rings: number; spokes: number } | { kind: 'lattice'; size: number } | { kind: 'diameters'; directions: number; steps: number };
type Iti = RunOrderDefinition['timing']['iti'];

const ITI_DEFAULTS: Record<Iti['kind'], Iti> = {
  fixed: { kind: 'fixed', duration: 2 },
  uniform: { kind: 'uniform', min: 1.5, max: 3.5 },
  'truncated-exponential': { kind: 'truncated-exponential', mean: 2.5, min: 1.5, max: 6 },
};
const ITI_LABELS: Record<Iti['kind'], string> = { fixed: 'Fixed', uniform: 'Uniform between two values', 'truncated-exponential': 'Truncated exponential (mean, shortest, longest)' };
/** Fields the server may name; its messages land on them inline. */
const FIELDS: FieldPath<CreateRunOrderInput>[] = [
  'name',
  'definition.conditions',
  'definition.conditions.indices',
  'definition.sequence.blocks',
  'definition.timing.trialDuration',
  'definition.timing.tr',
  'definition.timing.dummyVolumes',
  'definition.timing.iti.duration' as FieldPath<CreateRunOrderInput>,
  'definition.timing.iti.min' as FieldPath<CreateRunOrderInput>,
  'definition.timing.iti.max' as FieldPath<CreateRunOrderInput>,
  'definition.timing.iti.mean' as FieldPath<CreateRunOrderInput>,
  'definition.runs',
  'definition.seed',
  'definition.bids.subject',
  'definition.bids.session',
  'definition.bids.task',
];

function choicesOf(layout: Layout, selection: RunOrderDefinition['conditions']['selection']): { value: number; label: string }[] {
  if (layout.kind === 'rings' && selection === 'rings') return Array.from({ length: layout.rings }, (_, i) => ({ value: i + 1, label: `Ring ${i + 1}` }));
  if (layout.kind === 'rings' && selection === 'spokes') return Array.from({ length: layout.spokes }, (_, i) => ({ value: i, label: `Spoke ${i}` }));
  if (layout.kind === 'diameters' && selection === 'diameters') return Array.from({ length: layout.directions }, (_, i) => ({ value: i, label: `Diameter ${i}` }));
  return [];
}

const selectClass = 'mt-1 block h-9 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal';

/** Build a run order of an edition: conditions, sequence type, timing, runs and BIDS labels, with a live summary. */
export function RunOrderForm({ lab, spaceId, number, layout, stimulusIds, existing, defaults }: { lab: string; spaceId: string; number: number; layout: Layout; stimulusIds: string[]; existing?: RunOrderValue; defaults: RunOrderDefinition }) {
  const router = useRouter();
  const [saveMessage, setSaveMessage] = useState<string | null>(null);
  const form = useForm<CreateRunOrderInput>({
    resolver: zodResolver(CreateRunOrderSchema),
    defaultValues: { name: existing?.name ?? '', definition: existing?.definition ?? defaults },
    mode: 'onChange',
  });
  const { register, setValue, watch, formState } = form;
  const values = watch();
  // watch() hands back the same objects, changed in place: key the preview on their content instead.
  const definitionKey = useDeferredValue(JSON.stringify(values.definition));
  const errors = formState.errors.definition;
  const numberOpts = { valueAsNumber: true } as const;

  const preview = useMemo(() => {
    const parsed = RunOrderDefinitionSchema.safeParse(JSON.parse(definitionKey));
    if (!parsed.success) return { kind: 'invalid' as const };
    if (needsBackgroundSearch(parsed.data, stimulusIds)) return { kind: 'background' as const, n: conditionCountOf(parsed.data, stimulusIds) };
    try {
      return { kind: 'built' as const, result: runOrderResultOf(buildRunOrderOf(parsed.data, stimulusIds), parsed.data) };
    } catch (error) {
      if (error instanceof SequenceError) return { kind: 'error' as const, message: error.message, field: definitionFieldOf(error), alternative: error.details.alternative };
      throw error;
    }
  }, [definitionKey, stimulusIds]);

  const save = useMutation({
    mutationFn: (v: CreateRunOrderInput) =>
      existing
        ? apiFetch<RunOrderValue>(`/api/v1/labs/${lab}/run-orders/${existing.id}`, { method: 'PUT', body: { ...v, version: existing.version } })
        : apiFetch<RunOrderValue>(`/api/v1/labs/${lab}/spaces/${spaceId}/editions/${number}/run-orders`, { method: 'POST', body: v }),
    onMutate: () => setSaveMessage(null),
    onError: (error) => setSaveMessage(applyApiError<CreateRunOrderInput>(error, form.setError, FIELDS)),
    onSuccess: (order) => {
      router.push(`/labs/${lab}/spaces/${spaceId}/editions/${number}/run-orders/${order.id}`);
      router.refresh();
    },
  });

  const c = values.definition.conditions;
  const choices = choicesOf(layout, c.selection);
  const selections = (['all', ...(layout.kind === 'rings' ? (['rings', 'spokes'] as const) : layout.kind === 'diameters' ? (['diameters'] as const) : [])] as const).map((s) => s);
  const iti = values.definition.timing.iti;
  const itiErrors = errors?.timing?.iti as Record<string, { message?: string }> | undefined;
  const toggleIndex = (value: number, on: boolean) => {
    const next = on ? [...new Set([...c.indices, value])].sort((a, b) => a - b) : c.indices.filter((i) => i !== value);
    setValue('definition.conditions.indices', next, { shouldValidate: true });
  };

  return (
    <form onSubmit={form.handleSubmit((v) => save.mutate(v))} className="space-y-6 text-sm" aria-labelledby="run-order-form-heading" data-testid="run-order-form" noValidate>
      <h2 id="run-order-form-heading" className="text-base font-semibold">
        {existing ? 'Change this run order' : 'New run order'}
      </h2>
      <Field label="Name" {...register('name')} error={formState.errors.name?.message} data-testid="run-order-name" className="max-w-sm" />

      <fieldset className="space-y-2 border-t-[0.5px] border-rule pt-4">
        <legend className="font-medium">Conditions</legend>
        <div className="flex flex-wrap gap-4">
          {selections.map((s) => (
            <label key={s} className="flex items-center gap-1.5">
              <input type="radio" value={s} {...register('definition.conditions.selection', { onChange: () => setValue('definition.conditions.indices', []) })} data-testid={`selection-${s}`} />
              {RUN_ORDER_SELECTION_LABELS[s]}
            </label>
          ))}
        </div>
        {choices.length > 0 ? (
          <div className="flex flex-wrap gap-3" role="group" aria-label={`Which ${c.selection}`}>
            {choices.map((ch) => (
              <label key={ch.value} className="flex items-center gap-1">
                <input type="checkbox" checked={c.indices.includes(ch.value)} onChange={(e) => toggleIndex(ch.value, e.target.checked)} data-testid={`choice-${ch.value}`} />
                {ch.label}
              </label>
            ))}
            <label className="flex items-center gap-1">
              <input type="checkbox" {...register('definition.conditions.includeCentre')} data-testid="include-centre" />
              and the centre stimulus
            </label>
          </div>
        ) : null}
        {errors?.conditions?.indices?.message ? <p className="text-xs text-danger" role="alert">{errors.conditions.indices.message}</p> : null}
        <label className="flex items-center gap-1.5">
          <input type="checkbox" {...register('definition.conditions.nullEvents')} data-testid="null-events" />
          Add null events (blank trials) as one more condition
        </label>
        <p className="tabular text-xs text-graphite-soft" data-testid="condition-count">
          {conditionCountOf(values.definition, stimulusIds)} conditions
        </p>
        {errors?.conditions?.message ? <p className="text-xs text-danger" role="alert">{errors.conditions.message}</p> : null}
      </fieldset>

      <fieldset className="space-y-2 border-t-[0.5px] border-rule pt-4">
        <legend className="font-medium">Sequence</legend>
        <label className="block">
          Type
          <select
            className={selectClass}
            value={values.definition.sequence.kind}
            onChange={(e) => {
              const kind = e.target.value as RunOrderDefinition['sequence']['kind'];
              setValue('definition.sequence', kind === 'shuffled-blocks' ? { kind, blocks: 4 } : { kind }, { shouldValidate: true });
            }}
            data-testid="sequence-kind"
          >
            {Object.entries(SEQUENCE_KIND_LABELS).map(([k, label]) => (
              <option key={k} value={k}>
                {label}
              </option>
            ))}
          </select>
        </label>
        {values.definition.sequence.kind === 'shuffled-blocks' ? (
          <Field label="Blocks" type="number" min={1} {...register('definition.sequence.blocks', numberOpts)} error={(errors?.sequence as { blocks?: { message?: string } } | undefined)?.blocks?.message} className="max-w-[10rem]" />
        ) : null}
        {values.definition.sequence.kind === 'type1-index1' ? (
          <p className="text-xs text-graphite-soft">
            Exists for 2 and for 6 or more conditions. Up to 12 conditions it is found at once; more are searched in the background for up to {BACKGROUND_SEARCH_BUDGET_MS / 1000} s.
          </p>
        ) : null}
      </fieldset>

      <fieldset className="grid max-w-3xl grid-cols-2 gap-4 border-t-[0.5px] border-rule pt-4 sm:grid-cols-3">
        <legend className="font-medium">Timing (seconds)</legend>
        <Field label="Trial duration (s)" type="number" step="any" {...register('definition.timing.trialDuration', numberOpts)} error={errors?.timing?.trialDuration?.message} data-testid="trial-duration" />
        <label className="block font-medium">
          ITI
          <select
            className={selectClass}
            value={iti.kind}
            onChange={(e) => setValue('definition.timing.iti', ITI_DEFAULTS[e.target.value as Iti['kind']], { shouldValidate: true })}
            data-testid="iti-kind"
          >
            {Object.entries(ITI_LABELS).map(([k, label]) => (
              <option key={k} value={k}>
                {label}
              </option>
            ))}
          </select>
        </label>
        {iti.kind === 'fixed' ? (
          <Field label="ITI (s)" type="number" step="any" {...register('definition.timing.iti.duration' as 'definition.timing.iti', numberOpts)} error={itiErrors?.duration?.message} data-testid="iti-duration" />
        ) : (
          <>
            {iti.kind === 'truncated-exponential' ? <Field label="Mean ITI (s)" type="number" step="any" {...register('definition.timing.iti.mean' as 'definition.timing.iti', numberOpts)} error={itiErrors?.mean?.message} data-testid="iti-mean" /> : null}
            <Field label="Shortest ITI (s)" type="number" step="any" {...register('definition.timing.iti.min' as 'definition.timing.iti', numberOpts)} error={itiErrors?.min?.message} data-testid="iti-min" />
            <Field label="Longest ITI (s)" type="number" step="any" {...register('definition.timing.iti.max' as 'definition.timing.iti', numberOpts)} error={itiErrors?.max?.message} data-testid="iti-max" />
          </>
        )}
        <Field label="TR (s)" type="number" step="any" {...register('definition.timing.tr', numberOpts)} error={errors?.timing?.tr?.message} hint="For EEG, any counting block, e.g. 1 s." data-testid="tr" />
        <Field label="Dummy volumes" type="number" min={0} {...register('definition.timing.dummyVolumes', numberOpts)} error={errors?.timing?.dummyVolumes?.message} data-testid="dummy-volumes" />
        <label className="flex items-center gap-1.5 self-end pb-2">
          <input type="checkbox" {...register('definition.timing.dummyVolumesStored')} data-testid="dummy-stored" />
          Dummy volumes are stored in the data file (onsets shift by their length)
        </label>
      </fieldset>

      <fieldset className="grid max-w-3xl grid-cols-2 gap-4 border-t-[0.5px] border-rule pt-4 sm:grid-cols-3">
        <legend className="font-medium">Runs, seed and file names</legend>
        <Field label="Runs" type="number" min={1} {...register('definition.runs', numberOpts)} error={errors?.runs?.message} data-testid="runs" />
        <div className="col-span-2 space-y-1">
          <span className="block font-medium">How runs are made</span>
          <label className="flex items-center gap-1.5">
            <input type="radio" value="independent" {...register('definition.runMode')} data-testid="run-mode-independent" />
            Each run a complete balanced sequence of its own
          </label>
          <label className="flex items-center gap-1.5">
            <input type="radio" value="cut" {...register('definition.runMode')} data-testid="run-mode-cut" />
            One long sequence cut into runs (the pairs at the cuts are lost)
          </label>
        </div>
        <div className="flex items-end gap-2">
          <Field label="Seed" type="number" min={0} {...register('definition.seed', numberOpts)} error={errors?.seed?.message} data-testid="seed" />
          <Button variant="quiet" onClick={() => setValue('definition.seed', Math.floor(Math.random() * 2 ** 32), { shouldValidate: true })} data-testid="new-seed">
            New seed
          </Button>
        </div>
        <Field label="Subject label (sub-)" {...register('definition.bids.subject')} error={errors?.bids?.subject?.message} data-testid="bids-subject" />
        <Field label="Session label (ses-, optional)" {...register('definition.bids.session')} error={errors?.bids?.session?.message} data-testid="bids-session" />
        <Field label="Task label (task-)" {...register('definition.bids.task')} error={errors?.bids?.task?.message} data-testid="bids-task" />
      </fieldset>

      <div className="border-t-[0.5px] border-rule pt-4" aria-live="polite" data-testid="run-order-preview">
        {preview.kind === 'built' ? <RunOrderSummary result={preview.result} tr={values.definition.timing.tr} testId="preview-summary" /> : null}
        {preview.kind === 'invalid' ? <p className="text-graphite-soft">Correct the highlighted fields to see the summary.</p> : null}
        {preview.kind === 'background' ? (
          <Notice tone="info" testId="background-note">
            A type-1 index-1 sequence of {preview.n} conditions is searched for in the background after you save, for up to {BACKGROUND_SEARCH_BUDGET_MS / 1000} s. The summary appears when one is found.
          </Notice>
        ) : null}
        {preview.kind === 'error' ? (
          <Notice tone="error" testId="preview-error">
            {preview.message}
            {preview.alternative === 'de-bruijn' ? (
              <>
                {' '}
                <Button variant="quiet" size="sm" onClick={() => setValue('definition.sequence', { kind: 'de-bruijn' }, { shouldValidate: true })} data-testid="use-de-bruijn">
                  Use the de Bruijn cycle
                </Button>
              </>
            ) : null}
          </Notice>
        ) : null}
      </div>

      {saveMessage ? (
        <Notice tone="error" testId="run-order-save-error">
          {saveMessage}
        </Notice>
      ) : null}
      <Button type="submit" disabled={save.isPending || preview.kind === 'error'} data-testid="save-run-order">
        {save.isPending ? 'Saving…' : existing ? 'Save the changes' : 'Save the run order'}
      </Button>
    </form>
  );
}
