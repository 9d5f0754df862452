'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { ApiError, apiFetch } from '@/lib/api-client';
import { checkDisplayProfile } from '@/lib/render/check-display-profile';
import { pixelsPerCm } from '@/lib/render/pixels-per-cm';
import { pixelsPerDegree } from '@/lib/render/pixels-per-degree';
import { visualAngle } from '@/lib/render/visual-angle';
import type { DisplayProfile } from '@/lib/render/types';
import type { DisplayProfileValue } from '@/lib/schemas/display-profile';
import { DEFAULT_RENDER_OPTIONS, type RenderOptionsValue } from '@/lib/schemas/render';
import { RenderCheckPanel } from './render-check-panel';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

const inputClass = 'tabular mt-1 block h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal';

interface Draft {
  name: string;
  width: string;
  height: string;
  pitch: 'width' | 'density';
  widthCm: string;
  pixelsPerCm: string;
  viewingDistanceCm: string;
  notes: string;
}

const EMPTY: Draft = { name: '', width: '1920', height: '1080', pitch: 'width', widthCm: '53.1', pixelsPerCm: '', viewingDistanceCm: '57', notes: '' };

function fromProfile(p: DisplayProfileValue): Draft {
  return {
    name: p.name,
    width: String(p.resolutionPx.width),
    height: String(p.resolutionPx.height),
    pitch: p.widthCm !== null ? 'width' : 'density',
    widthCm: p.widthCm === null ? '' : String(p.widthCm),
    pixelsPerCm: p.pixelsPerCm === null ? '' : String(p.pixelsPerCm),
    viewingDistanceCm: String(p.viewingDistanceCm),
    notes: p.notes,
  };
}

const num = (s: string) => (s.trim() === '' ? Number.NaN : Number(s));

function toProfile(d: Draft): DisplayProfile {
  return {
    name: d.name,
    resolutionPx: { width: num(d.width), height: num(d.height) },
    widthCm: d.pitch === 'width' ? num(d.widthCm) : null,
    pixelsPerCm: d.pitch === 'density' ? num(d.pixelsPerCm) : null,
    viewingDistanceCm: num(d.viewingDistanceCm),
  };
}

/** The lab's screens: a list, and a form that shows pixels per degree (θ = 2·atan(S/2D)) as you type. */
export function DisplayProfileManager({ lab, profiles, canEdit }: { lab: string; profiles: DisplayProfileValue[]; canEdit: boolean }) {
  const router = useRouter();
  const [editing, setEditing] = useState<DisplayProfileValue | null>(null);
  const [draft, setDraft] = useState<Draft>(EMPTY);
  const [render, setRender] = useState<RenderOptionsValue>(DEFAULT_RENDER_OPTIONS);
  const profile = toProfile(draft);
  const issues = checkDisplayProfile(profile);
  const issueFor = (field: string) => issues.find((i) => i.field === field)?.message;
  const ok = issues.length === 0;
  const pxPerCm = ok ? pixelsPerCm(profile) : null;
  const set = (patch: Partial<Draft>) => setDraft((d) => ({ ...d, ...patch }));

  const save = useMutation({
    mutationFn: () => {
      const body = { ...profile, notes: draft.notes };
      return editing
        ? apiFetch<DisplayProfileValue>(`/api/v1/labs/${lab}/display-profiles/${editing.id}`, { method: 'PATCH', body: { ...body, version: editing.version } })
        : apiFetch<DisplayProfileValue>(`/api/v1/labs/${lab}/display-profiles`, { method: 'POST', body });
    },
    onSuccess: (saved) => {
      setEditing(saved);
      setDraft(fromProfile(saved));
      router.refresh();
    },
  });
  const remove = useMutation({
    mutationFn: (p: DisplayProfileValue) => apiFetch(`/api/v1/labs/${lab}/display-profiles/${p.id}`, { method: 'DELETE' }),
    onSuccess: () => {
      setEditing(null);
      setDraft(EMPTY);
      router.refresh();
    },
  });
  const error = save.error ?? remove.error;

  return (
    <div className="grid gap-8 xl:grid-cols-[1fr_28rem]">
      <section aria-label="Display profiles">
        {profiles.length === 0 ? (
          <p className="text-graphite-muted">No display profiles yet.</p>
        ) : (
          <table className="w-full border-collapse text-sm" data-testid="profile-table">
            <thead>
              <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
                <th scope="col" className="py-2 pr-4 font-medium">Name</th>
                <th scope="col" className="py-2 pr-4 font-medium">Resolution</th>
                <th scope="col" className="py-2 pr-4 font-medium">Pixel pitch</th>
                <th scope="col" className="py-2 pr-4 font-medium">Distance</th>
                <th scope="col" className="py-2 pr-4 font-medium">px/°</th>
              </tr>
            </thead>
            <tbody>
              {profiles.map((p) => (
                <tr key={p.id} className="border-b-[0.5px] border-rule">
                  <td className="py-2 pr-4">
                    <button
                      type="button"
                      className="text-accent underline underline-offset-2"
                      onClick={() => {
                        setEditing(p);
                        setDraft(fromProfile(p));
                      }}
                      data-testid={`profile-${p.name}`}
                    >
                      {p.name}
                    </button>
                  </td>
                  <td className="tabular py-2 pr-4">
                    {p.resolutionPx.width} × {p.resolutionPx.height}
                  </td>
                  <td className="tabular py-2 pr-4">{p.widthCm !== null ? `${p.widthCm} cm wide` : `${p.pixelsPerCm} px/cm`}</td>
                  <td className="tabular py-2 pr-4">{p.viewingDistanceCm} cm</td>
                  <td className="tabular py-2 pr-4">{p.derived.pixelsPerDegree.toFixed(2)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        <div className="mt-8">
          <RenderCheckPanel profile={ok ? profile : null} options={render} onChange={setRender} />
          <p className="mt-2 text-xs text-graphite-muted">Try render options against the profile in the form; packs take their own options when they are built.</p>
        </div>
      </section>

      <form
        className="space-y-3 border-[0.5px] border-rule p-4 text-sm"
        onSubmit={(e) => {
          e.preventDefault();
          save.mutate();
        }}
        aria-labelledby="profile-form-heading"
        data-testid="profile-form"
      >
        <h2 id="profile-form-heading" className="text-base font-semibold">
          {editing ? `Edit ${editing.name}` : 'New display profile'}
        </h2>
        <fieldset disabled={!canEdit} className="space-y-3">
          <label className="block font-medium">
            Name
            <input value={draft.name} onChange={(e) => set({ name: e.target.value })} className={`${inputClass} w-full`} data-testid="profile-name" />
          </label>
          <div className="flex gap-3">
            <label className="font-medium">
              Width (px)
              <input type="number" value={draft.width} onChange={(e) => set({ width: e.target.value })} className={`${inputClass} w-28`} data-testid="profile-width" />
            </label>
            <label className="font-medium">
              Height (px)
              <input type="number" value={draft.height} onChange={(e) => set({ height: e.target.value })} className={`${inputClass} w-28`} data-testid="profile-height" />
            </label>
          </div>
          <fieldset className="space-y-2">
            <legend className="font-medium">Pixel pitch from</legend>
            <label className="mr-4 inline-flex items-center gap-2">
              <input type="radio" name="pitch" checked={draft.pitch === 'width'} onChange={() => set({ pitch: 'width' })} /> the screen’s physical width
            </label>
            <label className="inline-flex items-center gap-2">
              <input type="radio" name="pitch" checked={draft.pitch === 'density'} onChange={() => set({ pitch: 'density' })} data-testid="profile-pitch-density" /> pixels per cm
            </label>
            {draft.pitch === 'width' ? (
              <label className="block font-medium">
                Physical width of the image area (cm)
                <input type="number" step="any" value={draft.widthCm} onChange={(e) => set({ widthCm: e.target.value })} className={`${inputClass} w-32`} data-testid="profile-width-cm" />
              </label>
            ) : (
              <label className="block font-medium">
                Pixels per cm
                <input type="number" step="any" value={draft.pixelsPerCm} onChange={(e) => set({ pixelsPerCm: e.target.value })} className={`${inputClass} w-32`} data-testid="profile-px-per-cm" />
              </label>
            )}
          </fieldset>
          <label className="block font-medium">
            Viewing distance (cm, eye to screen)
            <input type="number" step="any" value={draft.viewingDistanceCm} onChange={(e) => set({ viewingDistanceCm: e.target.value })} className={`${inputClass} w-32`} data-testid="profile-distance" />
            {issueFor('viewingDistanceCm') ? <span className="mt-1 block text-xs font-normal text-danger">{issueFor('viewingDistanceCm')}</span> : null}
          </label>
          <label className="block font-medium">
            Notes
            <textarea value={draft.notes} onChange={(e) => set({ notes: e.target.value })} rows={2} maxLength={1000} className="mt-1 block w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 py-1 text-sm font-normal" />
          </label>
        </fieldset>
        <div className="tabular border-t-[0.5px] border-rule pt-3 text-xs" aria-live="polite" data-testid="profile-derived">
          {ok && pxPerCm ? (
            <>
              {pixelsPerDegree(profile).toFixed(2)} pixels per degree · {pxPerCm.toFixed(2)} px/cm · the screen spans{' '}
              {visualAngle(profile.resolutionPx.width / pxPerCm, profile.viewingDistanceCm).toFixed(1)}° ×{' '}
              {visualAngle(profile.resolutionPx.height / pxPerCm, profile.viewingDistanceCm).toFixed(1)}°
            </>
          ) : (
            <span className="text-danger">{issues.filter((i) => i.field !== 'viewingDistanceCm').map((i) => i.message).join(' ') || issueFor('viewingDistanceCm')}</span>
          )}
        </div>
        {error ? (
          <Notice tone="error" testId="profile-error">
            {error.message}
            {error instanceof ApiError
              ? Object.entries(error.fields).map(([k, v]) => (
                  <span key={k} className="block text-xs">
                    {k}: {v[0]}
                  </span>
                ))
              : null}
          </Notice>
        ) : null}
        {canEdit ? (
          <div className="flex flex-wrap gap-2">
            <Button type="submit" disabled={save.isPending} data-testid="save-profile">
              {save.isPending ? 'Saving…' : editing ? 'Save changes' : 'Add profile'}
            </Button>
            {editing ? (
              <>
                <Button
                  variant="quiet"
                  onClick={() => {
                    setEditing(null);
                    setDraft(EMPTY);
                  }}
                >
                  New profile
                </Button>
                <Button
                  variant="danger"
                  onClick={() => {
                    if (window.confirm(`Delete the display profile “${editing.name}”?`)) remove.mutate(editing);
                  }}
                >
                  Delete
                </Button>
              </>
            ) : null}
          </div>
        ) : (
          <p className="text-xs text-graphite-muted">Read-only: your role can look but not change display profiles.</p>
        )}
      </form>
    </div>
  );
}
