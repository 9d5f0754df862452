'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { apiFetch } from '@/lib/api-client';
import { applyApiError } from '@/lib/form-errors';
import { checkRender } from '@/lib/render/check-render';
import type { DisplayProfile } from '@/lib/render/types';
import type { DisplayProfileValue } from '@/lib/schemas/display-profile';
import { CreatePackSchema, type PackValue } from '@/lib/schemas/pack';
import { DEFAULT_RENDER_OPTIONS, type RenderOptionsValue } from '@/lib/schemas/render';
import { RenderCheckPanel } from './render-check-panel';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

interface FormValues {
  displayProfileId: string;
  render: RenderOptionsValue;
  runOrderIds: string[];
}

/** Measured on this kind of machine: about 60 stimuli per second per pack worker, all stages included. */
const STIMULI_PER_SECOND = 60;

/** A rough size: PNG bytes grow with the image area (grey silhouettes compress well), RDM tables with n². */
function estimate(stimuli: number, canvasPx: number): { megabytes: number; seconds: number } {
  const png = canvasPx * canvasPx * 0.03 + 1500;
  const svg = 9000;
  const rdm = 3 * stimuli * stimuli * 11;
  return { megabytes: (stimuli * (png + svg) + rdm) / 2 ** 20, seconds: Math.max(2, stimuli / STIMULI_PER_SECOND) };
}

/** "Make a pack" of an edition: a display profile and render options, checked live, with an estimate. */
export function MakePackForm({ lab, spaceId, number, stimulusCount, profiles, runOrders = [] }: { lab: string; spaceId: string; number: number; stimulusCount: number; profiles: DisplayProfileValue[]; runOrders?: { id: string; name: string }[] }) {
  const router = useRouter();
  const form = useForm<FormValues>({
    resolver: zodResolver(CreatePackSchema) as never,
    defaultValues: { displayProfileId: profiles[0]?.id ?? '', render: DEFAULT_RENDER_OPTIONS, runOrderIds: [] },
  });
  const profileId = form.watch('displayProfileId');
  const render = form.watch('render');
  const chosen = profiles.find((p) => p.id === profileId);
  const profile: DisplayProfile | null = chosen
    ? { name: chosen.name, resolutionPx: chosen.resolutionPx, widthCm: chosen.widthCm, pixelsPerCm: chosen.pixelsPerCm, viewingDistanceCm: chosen.viewingDistanceCm }
    : null;
  const check = profile ? checkRender(profile, render) : null;
  const guess = check?.sizes ? estimate(stimulusCount, check.sizes.canvasPx) : null;

  const make = useMutation({
    mutationFn: (values: FormValues) => apiFetch<PackValue>(`/api/v1/labs/${lab}/spaces/${spaceId}/editions/${number}/packs`, { method: 'POST', body: values }),
    onSuccess: (pack) => router.push(`/labs/${lab}/packs?pack=${pack.id}`),
    onError: (e) => {
      applyApiError<FormValues>(e, form.setError, ['displayProfileId']);
    },
  });

  if (profiles.length === 0) {
    return <Notice tone="caution">Add a display profile first: a pack is drawn for one screen at one viewing distance.</Notice>;
  }
  return (
    <form onSubmit={form.handleSubmit((v) => make.mutate(v))} className="space-y-4 border-[0.5px] border-rule p-4 text-sm" aria-labelledby="make-pack-heading" data-testid="make-pack-form">
      <h2 id="make-pack-heading" className="text-base font-semibold">
        Make a pack
      </h2>
      <label className="block font-medium">
        Display profile
        <select {...form.register('displayProfileId')} className="mt-1 block h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal" data-testid="pack-profile">
          {profiles.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name} ({p.derived.pixelsPerDegree.toFixed(1)} px/°)
            </option>
          ))}
        </select>
        {form.formState.errors.displayProfileId ? <span className="mt-1 block text-xs text-danger">{form.formState.errors.displayProfileId.message}</span> : null}
      </label>
      {runOrders.length > 0 ? (
        <fieldset className="space-y-1">
          <legend className="font-medium">Run orders to include under sequences/</legend>
          {runOrders.map((o) => (
            <label key={o.id} className="flex items-center gap-1.5">
              <input type="checkbox" value={o.id} {...form.register('runOrderIds')} data-testid={`pack-run-order-${o.id}`} />
              {o.name}
            </label>
          ))}
        </fieldset>
      ) : null}
      <RenderCheckPanel profile={profile} options={render} onChange={(o) => form.setValue('render', o, { shouldValidate: true })} />
      {guess ? (
        <p className="tabular text-xs text-graphite-soft" data-testid="pack-estimate">
          About {guess.megabytes < 1 ? guess.megabytes.toFixed(2) : guess.megabytes.toFixed(0)} MB and {Math.ceil(guess.seconds)} s for {stimulusCount} stimuli (a rough estimate).
        </p>
      ) : null}
      {make.error ? (
        <Notice tone="error" testId="make-pack-error">
          {make.error.message}
        </Notice>
      ) : null}
      <Button type="submit" disabled={make.isPending || (check !== null && !check.ok)} data-testid="make-pack">
        {make.isPending ? 'Asking…' : 'Make the pack'}
      </Button>
    </form>
  );
}
