'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState, type ReactNode } from 'react';
import { useForm, type FieldPath, type UseFormRegisterReturn } from 'react-hook-form';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import { EDITION_STATE_LABELS, type EditionState } from '@/lib/schemas/edition';
import { CreateStudySchema, DEFAULT_CATEGORISATION, DEFAULT_SIMILARITY, type CreateStudyInput, type StudyValue } from '@/lib/schemas/study';
import { checkFlashRate } from '@/lib/study/check-flash-rate';
import { checkStudyDesign } from '@/lib/study/check-study-design';
import { countPlannedTrials } from '@/lib/study/count-planned-trials';
import { estimateDuration } from '@/lib/study/estimate-duration';
import type { StudyDesign } from '@/lib/study/types';
import { EthicsNotice, formatMinutes, PhotosensitivityNotice } from './study-notices';
import { Button } from './ui/button';
import { Field } from './ui/field';
import { Notice } from './ui/notice';

export interface EditionChoice {
  id: string;
  label: string;
  state: EditionState;
  stimulusCount: number;
}

type FormValues = Omit<CreateStudyInput, 'instructionsText' | 'debriefText' | 'finishCodePrefix'> & { instructionsText: string; debriefText: string; finishCodePrefix: string };

const selectClass = 'mt-1 block h-9 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal';
const textareaClass = 'mt-1 block w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-3 py-2 text-sm font-normal aria-[invalid=true]:border-danger';

const num = { valueAsNumber: true } as const;
const nullableNum = { setValueAs: (v: unknown) => (v === '' || v === null ? null : Number(v)) } as const;

function errorAt(errors: unknown, path: string): string | undefined {
  let node: unknown = errors;
  for (const part of path.split('.')) node = node && typeof node === 'object' ? (node as Record<string, unknown>)[part] : undefined;
  const message = node && typeof node === 'object' ? (node as { message?: unknown }).message : undefined;
  if (typeof message === 'string') return message;
  // Tuple and array errors sit on `root` or on an element.
  const root = node && typeof node === 'object' ? (node as { root?: { message?: string } }).root?.message : undefined;
  return root;
}

function Section({ title, children, testId }: { title: string; children: ReactNode; testId?: string }) {
  return (
    <fieldset className="space-y-4 border-t-[0.5px] border-rule pt-4" data-testid={testId}>
      <legend className="pr-2 text-base font-semibold">{title}</legend>
      {children}
    </fieldset>
  );
}

function TextArea({ label, error, hint, registration, testId, rows = 4 }: { label: string; error?: string | undefined; hint?: string; registration: UseFormRegisterReturn; testId: string; rows?: number }) {
  const id = `study-${registration.name.replace(/\./g, '-')}`;
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <textarea id={id} rows={rows} className={textareaClass} aria-invalid={error ? true : undefined} aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined} data-testid={testId} {...registration} />
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-xs text-graphite-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-xs text-danger" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

const FIELDS = [
  'name',
  'editionId',
  'consentText',
  'instructionsText',
  'debriefText',
  'finishCodePrefix',
  'targetParticipants',
  'design.stimulusSizeDeg',
  'design.categorisation.directionsDeg',
  'design.categorisation.steps',
  'design.categorisation.extent',
  'design.categorisation.repetitions',
  'design.categorisation.practiceTrials',
  'design.categorisation.catchRate',
  'design.categorisation.keys',
  'design.categorisation.timing.fixationMs',
  'design.categorisation.timing.probeMs',
  'design.categorisation.timing.blankMs',
  'design.categorisation.timing.responseMs',
  'design.categorisation.timing.itiMs',
  'design.similarity.pairCount',
  'design.similarity.repetitions',
  'design.similarity.scaleLow',
  'design.similarity.scaleHigh',
  'design.similarity.timing.fixationMs',
  'design.similarity.timing.stimulusMs',
  'design.similarity.timing.gapMs',
  'design.similarity.timing.responseMs',
  'design.similarity.timing.itiMs',
] as const satisfies readonly FieldPath<FormValues>[];

const formatDirections = (list: readonly number[]) => list.join(', ');

/**
 * Study setup: the edition, the two tasks with their timing, texts and target, checked live by the same core the
 * server runs (trial count, duration, flash check). For a study that is not a Draft the design is read-only.
 */
export function StudyForm({ lab, editions, study, canEdit }: { lab: string; editions: EditionChoice[]; study: StudyValue | null; canEdit: boolean }) {
  const router = useRouter();
  const isDesignFixed = study !== null && study.state !== 'draft';
  const form = useForm<FormValues>({
    resolver: zodResolver(CreateStudySchema) as never,
    defaultValues: study
      ? {
          name: study.name,
          editionId: study.edition.id,
          consentText: study.consentText,
          instructionsText: study.instructionsText,
          debriefText: study.debriefText,
          finishCodePrefix: study.finishCodePrefix,
          targetParticipants: study.targetParticipants,
          design: study.design,
        }
      : {
          name: '',
          editionId: editions[0]?.id ?? '',
          consentText: '',
          instructionsText: '',
          debriefText: '',
          finishCodePrefix: '',
          targetParticipants: 24,
          design: { stimulusSizeDeg: 4, categorisation: DEFAULT_CATEGORISATION, similarity: null },
        },
  });
  const errors = form.formState.errors;
  const err = (path: string) => errorAt(errors, path);
  const design = form.watch('design');
  const editionId = form.watch('editionId');
  const edition = editions.find((e) => e.id === editionId);
  const [directionsText, setDirectionsText] = useState(formatDirections(design.categorisation?.directionsDeg ?? DEFAULT_CATEGORISATION.directionsDeg));
  const [spacing, setSpacing] = useState(() => {
    const [a, b] = design.categorisation?.directionsDeg ?? [];
    return a !== undefined && b !== undefined ? String(b - a) : '22.5';
  });
  const [formError, setFormError] = useState<string | null>(null);

  const coreDesign = { ...design, seed: design.seed ?? 0 } as StudyDesign;
  const issues = edition ? checkStudyDesign(coreDesign, edition.stimulusCount) : [];
  const counts = edition && issues.length === 0 ? countPlannedTrials(coreDesign, edition.stimulusCount) : null;
  const duration = edition && issues.length === 0 ? estimateDuration(coreDesign, edition.stimulusCount) : null;
  const flash = issues.every((i) => !i.field.includes('timing')) && (design.categorisation || design.similarity) ? checkFlashRate(coreDesign) : null;

  const save = useMutation({
    mutationFn: (values: FormValues) => {
      if (!study) return apiFetch<StudyValue>(`/api/v1/labs/${lab}/studies`, { method: 'POST', body: values });
      const { design: d, editionId: e, ...texts } = values;
      const body = isDesignFixed ? { ...texts, version: study.version } : { ...texts, editionId: e, design: d, version: study.version };
      return apiFetch<StudyValue>(`/api/v1/labs/${lab}/studies/${study.id}`, { method: 'PATCH', body });
    },
    onSuccess: (saved) => {
      setFormError(null);
      if (!study) router.push(`/labs/${lab}/studies/${saved.id}`);
      else {
        form.reset({ ...form.getValues(), design: saved.design });
        router.refresh();
      }
    },
    onError: (e) => setFormError(applyApiError<FormValues>(e, form.setError, FIELDS)),
  });

  const setDirections = (text: string) => {
    setDirectionsText(text);
    const list = text
      .split(/[,\s]+/)
      .filter(Boolean)
      .map(Number);
    form.setValue('design.categorisation.directionsDeg', list, { shouldValidate: form.formState.isSubmitted });
  };
  const fillDirections = () => {
    const step = Number(spacing);
    if (!(step > 0 && step <= 180)) return;
    const list: number[] = [];
    for (let a = 0; a < 180 - 1e-9; a += step) list.push(Math.round(a * 1000) / 1000);
    setDirections(formatDirections(list));
  };
  const toggleTask = (task: 'categorisation' | 'similarity', on: boolean) => {
    if (task === 'categorisation') {
      form.setValue('design.categorisation', on ? DEFAULT_CATEGORISATION : null);
      if (on) setDirectionsText(formatDirections(DEFAULT_CATEGORISATION.directionsDeg));
    } else form.setValue('design.similarity', on ? DEFAULT_SIMILARITY : null);
  };

  if (editions.length === 0) return <Notice tone="caution">Freeze a shape space as an edition first: a study is set up on an edition.</Notice>;

  return (
    <form onSubmit={form.handleSubmit((v) => save.mutate(v))} className="max-w-3xl space-y-6 text-sm" noValidate aria-label="Study setup" data-testid="study-form">
      {!study ? <EthicsNotice /> : null}
      <fieldset disabled={!canEdit} className="space-y-6">
        <Field label="Name" {...form.register('name')} error={err('name')} data-testid="study-name" />

        <fieldset disabled={isDesignFixed || !canEdit} className="space-y-6" data-testid="design-fields">
          {isDesignFixed ? (
            <Notice testId="design-fixed">Opening fixed this design: only the name, texts and target can change now.</Notice>
          ) : null}
          <div>
            <label htmlFor="study-edition" className="block text-sm font-medium">
              Edition
            </label>
            <select id="study-edition" {...form.register('editionId')} className={selectClass} aria-invalid={err('editionId') ? true : undefined} data-testid="study-edition">
              {editions.map((e) => (
                <option key={e.id} value={e.id}>
                  {e.label} — {EDITION_STATE_LABELS[e.state]}, {e.stimulusCount} stimuli
                </option>
              ))}
            </select>
            {err('editionId') ? <p className="mt-1 text-xs text-danger" role="alert">{err('editionId')}</p> : null}
            {edition && edition.state !== 'approved' ? (
              <div className="mt-2">
                <Notice tone="caution" testId="not-approved-warning">
                  This edition is {EDITION_STATE_LABELS[edition.state]}, not Approved: no reviewer has approved its stimuli. You may still use it; the study keeps this warning.
                </Notice>
              </div>
            ) : null}
          </div>
          <Field label="Stimulus size (degrees of visual angle)" type="number" step="any" {...form.register('design.stimulusSizeDeg', num)} error={err('design.stimulusSizeDeg')} className="max-w-xs" data-testid="study-size" />

          <div className="flex flex-wrap gap-6" role="group" aria-label="Tasks">
            <label className="flex items-center gap-2 font-medium">
              <input type="checkbox" checked={design.categorisation !== null} onChange={(e) => toggleTask('categorisation', e.target.checked)} data-testid="task-categorisation" />
              Two-choice categorisation
            </label>
            <label className="flex items-center gap-2 font-medium">
              <input type="checkbox" checked={design.similarity !== null} onChange={(e) => toggleTask('similarity', e.target.checked)} data-testid="task-similarity" />
              Pair similarity
            </label>
          </div>
          {err('design.tasks') ? <p className="text-xs text-danger" role="alert">{err('design.tasks')}</p> : null}

          {design.categorisation ? (
            <Section title="Two-choice categorisation" testId="categorisation-fields">
              <p className="text-graphite-soft">
                A probe on a diameter is shown with the diameter’s two endpoints; the participant picks the one it matches (method of constant stimuli). The sides of the endpoints
                are counterbalanced.
              </p>
              <div className="grid gap-4 sm:grid-cols-[1fr_auto]">
                <Field
                  label="Directions (diameters, ° from 0 to below 180)"
                  value={directionsText}
                  onChange={(e) => setDirections(e.target.value)}
                  error={err('design.categorisation.directionsDeg')}
                  hint="Comma-separated angles; 0° and 180° are the same diameter."
                  data-testid="study-directions"
                />
                <div className="flex items-end gap-2">
                  <Field label="Every (°)" type="number" step="any" value={spacing} onChange={(e) => setSpacing(e.target.value)} className="w-24" data-testid="study-direction-spacing" />
                  <Button variant="quiet" onClick={fillDirections} data-testid="fill-directions">
                    Fill
                  </Button>
                </div>
              </div>
              <div className="grid gap-4 sm:grid-cols-3">
                <Field label="Steps per direction (odd, 7–21)" type="number" {...form.register('design.categorisation.steps', num)} error={err('design.categorisation.steps')} data-testid="study-steps" />
                <Field label="Extent (fraction of ρmax)" type="number" step="any" {...form.register('design.categorisation.extent', num)} error={err('design.categorisation.extent')} data-testid="study-extent" />
                <Field label="Repetitions per level" type="number" {...form.register('design.categorisation.repetitions', num)} error={err('design.categorisation.repetitions')} data-testid="study-repetitions" />
                <Field label="Practice trials (with feedback)" type="number" {...form.register('design.categorisation.practiceTrials', num)} error={err('design.categorisation.practiceTrials')} data-testid="study-practice" />
                <Field label="Catch-trial rate (0–0.5)" type="number" step="any" {...form.register('design.categorisation.catchRate', num)} error={err('design.categorisation.catchRate')} hint="The probe is an endpoint: an attention check." data-testid="study-catch" />
                <div>
                  <label htmlFor="study-blocking" className="block text-sm font-medium">
                    Blocks
                  </label>
                  <select id="study-blocking" {...form.register('design.categorisation.blocking')} className={selectClass} data-testid="study-blocking">
                    <option value="interleaved">Directions interleaved</option>
                    <option value="blocked">One block per direction</option>
                  </select>
                </div>
              </div>
              <div className="grid gap-4 sm:grid-cols-5">
                <Field label="Fixation (ms)" type="number" {...form.register('design.categorisation.timing.fixationMs', num)} error={err('design.categorisation.timing.fixationMs')} data-testid="timing-fixation" />
                <Field label="Probe (ms)" type="number" {...form.register('design.categorisation.timing.probeMs', num)} error={err('design.categorisation.timing.probeMs')} data-testid="timing-probe" />
                <Field label="Blank (ms)" type="number" {...form.register('design.categorisation.timing.blankMs', num)} error={err('design.categorisation.timing.blankMs')} data-testid="timing-blank" />
                <Field label="Response window (ms)" type="number" {...form.register('design.categorisation.timing.responseMs', num)} error={err('design.categorisation.timing.responseMs')} data-testid="timing-response" />
                <Field label="Between trials (ms)" type="number" {...form.register('design.categorisation.timing.itiMs', num)} error={err('design.categorisation.timing.itiMs')} data-testid="timing-iti" />
              </div>
              <div className="grid max-w-md gap-4 sm:grid-cols-2">
                <Field label="First response key" {...form.register('design.categorisation.keys.0')} error={err('design.categorisation.keys.0') ?? err('design.categorisation.keys')} data-testid="study-key-0" />
                <Field label="Second response key" {...form.register('design.categorisation.keys.1')} error={err('design.categorisation.keys.1')} hint="Which key means left swaps between participants." data-testid="study-key-1" />
              </div>
            </Section>
          ) : null}

          {design.similarity ? (
            <Section title="Pair similarity" testId="similarity-fields">
              <div className="grid gap-4 sm:grid-cols-3">
                <div>
                  <label htmlFor="study-pairset" className="block text-sm font-medium">
                    Pairs
                  </label>
                  <select id="study-pairset" {...form.register('design.similarity.pairSet')} className={selectClass} data-testid="study-pairset">
                    <option value="all">All pairs{edition ? ` (${(edition.stimulusCount * (edition.stimulusCount - 1)) / 2})` : ''}</option>
                    <option value="balanced">A balanced subset of K pairs</option>
                  </select>
                </div>
                {design.similarity.pairSet === 'balanced' ? (
                  <Field label="K (pairs per participant)" type="number" {...form.register('design.similarity.pairCount', nullableNum)} error={err('design.similarity.pairCount')} hint="Each stimulus appears equally often." data-testid="study-paircount" />
                ) : null}
                <div>
                  <label htmlFor="study-presentation" className="block text-sm font-medium">
                    Presentation
                  </label>
                  <select id="study-presentation" {...form.register('design.similarity.presentation')} className={selectClass} data-testid="study-presentation">
                    <option value="sequential">One after the other</option>
                    <option value="simultaneous">Side by side</option>
                  </select>
                </div>
                <Field label="Scale 1 means" {...form.register('design.similarity.scaleLow')} error={err('design.similarity.scaleLow')} data-testid="study-scale-low" />
                <Field label="Scale 7 means" {...form.register('design.similarity.scaleHigh')} error={err('design.similarity.scaleHigh')} data-testid="study-scale-high" />
                <Field label="Repetitions" type="number" {...form.register('design.similarity.repetitions', num)} error={err('design.similarity.repetitions')} data-testid="study-sim-repetitions" />
              </div>
              <div className="grid gap-4 sm:grid-cols-5">
                <Field label="Fixation (ms)" type="number" {...form.register('design.similarity.timing.fixationMs', num)} error={err('design.similarity.timing.fixationMs')} />
                <Field label="Each stimulus (ms)" type="number" {...form.register('design.similarity.timing.stimulusMs', num)} error={err('design.similarity.timing.stimulusMs')} />
                <Field label="Gap (ms)" type="number" {...form.register('design.similarity.timing.gapMs', num)} error={err('design.similarity.timing.gapMs')} hint="Between the two of a pair." />
                <Field label="Response window (ms)" type="number" {...form.register('design.similarity.timing.responseMs', num)} error={err('design.similarity.timing.responseMs')} />
                <Field label="Between trials (ms)" type="number" {...form.register('design.similarity.timing.itiMs', num)} error={err('design.similarity.timing.itiMs')} />
              </div>
            </Section>
          ) : null}
        </fieldset>

        <Section title="Texts and targets">
          <TextArea label="Consent text (required)" registration={form.register('consentText')} error={err('consentText')} testId="study-consent" hint="Participants must agree to it before the task starts. Use the wording your ethics board approved." />
          <TextArea label="Instructions" registration={form.register('instructionsText')} error={err('instructionsText')} testId="study-instructions" />
          <TextArea label="Debrief" registration={form.register('debriefText')} error={err('debriefText')} testId="study-debrief" rows={3} />
          <div className="grid max-w-xl gap-4 sm:grid-cols-2">
            <Field label="Finish code prefix" {...form.register('finishCodePrefix')} error={err('finishCodePrefix')} hint="Each participant gets this prefix and a random code of their own at the end." data-testid="study-finish-prefix" />
            <Field label="Target participants" type="number" {...form.register('targetParticipants', num)} error={err('targetParticipants')} data-testid="study-target" />
          </div>
        </Section>
      </fieldset>

      <section aria-label="Plan check" className="space-y-3 border-t-[0.5px] border-rule pt-4" data-testid="study-live-check">
        {counts && duration ? (
          <p className="tabular" data-testid="study-estimate">
            {counts.total.toLocaleString('en')} trials per participant ({counts.categorisation} categorisation, {counts.similarity} similarity); at most {formatMinutes(duration.seconds)}.
          </p>
        ) : issues.length ? (
          <ul className="list-disc pl-5 text-danger" data-testid="study-issues">
            {issues.map((i) => (
              <li key={i.field + i.message}>{i.message}</li>
            ))}
          </ul>
        ) : null}
        {flash ? <PhotosensitivityNotice peakPerSecond={flash.peakPerSecond} isAboveLimit={flash.isAboveLimit} /> : null}
      </section>

      {formError ? <Notice tone="error" testId="study-form-error">{formError}</Notice> : null}
      {canEdit && study?.state !== 'closed' ? (
        <Button type="submit" disabled={save.isPending} data-testid="save-study">
          {study ? 'Save changes' : 'Create study'}
        </Button>
      ) : null}
    </form>
  );
}
