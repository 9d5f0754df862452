'use client';

import { useMutation } from '@tanstack/react-query';
import { ApiError, apiFetch } from '@/lib/api-client';
import { SIDE_COLOURS, nextBoundaryKey, summarize } from '@/lib/boundary-editor';
import type { PositionedStimulus } from '@/lib/boundary/types';
import { MAX_BOUNDARIES, type BoundaryValue } from '@/lib/schemas/boundary';
import type { ShapeSpace } from '@/lib/schemas/space';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

const inputClass = 'tabular mt-1 block h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal';

/**
 * The space's category boundaries: add, name, set the angle (typed here, or dragged on the view), snap to the
 * spokes, set the prototype distance, and save. Shows per boundary the count on each side and the balance.
 */
export function BoundaryPanel({
  lab,
  spaceId,
  boundaries,
  version,
  extent,
  stimuli,
  activeKey,
  canEdit,
  snap,
  canSnap,
  onChange,
  onActivate,
  onSnap,
  onSaved,
  dirty,
}: {
  lab: string;
  spaceId: string | null;
  boundaries: BoundaryValue[];
  version: number;
  extent: number;
  stimuli: readonly PositionedStimulus[];
  activeKey: string | null;
  canEdit: boolean;
  snap: boolean;
  canSnap: boolean;
  onChange: (next: BoundaryValue[]) => void;
  onActivate: (key: string | null) => void;
  onSnap: (snap: boolean) => void;
  onSaved: (space: ShapeSpace) => void;
  dirty: boolean;
}) {
  const save = useMutation({
    mutationFn: () => apiFetch<ShapeSpace>(`/api/v1/labs/${lab}/spaces/${spaceId}/boundaries`, { method: 'PUT', body: { boundaries, version } }),
    onSuccess: onSaved,
  });
  const error = save.error ? { message: save.error.message, fields: save.error instanceof ApiError ? save.error.fields : {} } : null;
  const set = (i: number, patch: Partial<BoundaryValue>) => onChange(boundaries.map((b, k) => (k === i ? { ...b, ...patch } : b)));

  return (
    <section className="space-y-3 border-t-[0.5px] border-rule pt-4 text-sm" aria-labelledby="boundaries-heading" data-testid="boundary-panel">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="boundaries-heading" className="text-base font-semibold">
          Category boundaries
        </h2>
        {canSnap ? (
          <label className="flex items-center gap-2 text-xs">
            <input type="checkbox" checked={snap} onChange={(e) => onSnap(e.target.checked)} data-testid="boundary-snap" />
            snap to spokes
          </label>
        ) : null}
      </div>
      {!spaceId ? <p className="text-graphite-muted">Save the space first; then draw its boundaries.</p> : null}
      {spaceId && boundaries.length === 0 ? <p className="text-graphite-muted">No boundaries yet. A boundary is a diameter: stimuli on one side form category A, on the other category B.</p> : null}
      <ul className="space-y-3">
        {boundaries.map((b, i) => {
          const summary = summarize(stimuli, b, extent);
          const active = b.key === activeKey;
          return (
            <li key={i} className={`space-y-2 border-[0.5px] p-3 ${active ? 'border-accent' : 'border-rule'}`} data-testid={`boundary-${i}`}>
              <div className="flex flex-wrap items-end gap-2">
                <label className="text-xs">
                  Key
                  <input value={b.key} disabled={!canEdit} onChange={(e) => set(i, { key: e.target.value.toLowerCase() })} className={`${inputClass} w-32`} data-testid={`boundary-${i}-key`} />
                </label>
                <label className="text-xs">
                  Name
                  <input value={b.label} disabled={!canEdit} onChange={(e) => set(i, { label: e.target.value })} className={`${inputClass} w-40`} data-testid={`boundary-${i}-label`} />
                </label>
                <label className="text-xs">
                  Angle (°, 0–180)
                  <input
                    type="number"
                    step={0.5}
                    min={0}
                    max={179.99}
                    value={Number.isFinite(b.angleDeg) ? b.angleDeg : ''}
                    disabled={!canEdit}
                    onChange={(e) => set(i, { angleDeg: e.target.value === '' ? Number.NaN : Number(e.target.value) })}
                    className={`${inputClass} w-24`}
                    data-testid={`boundary-${i}-angle`}
                  />
                </label>
                <label className="text-xs">
                  Prototype distance
                  <input
                    type="number"
                    step={0.05}
                    min={0}
                    placeholder={`${(0.75 * extent).toFixed(2)} (0.75·ρmax)`}
                    value={b.prototypeDistance ?? ''}
                    disabled={!canEdit}
                    onChange={(e) => set(i, { prototypeDistance: e.target.value === '' ? null : Number(e.target.value) })}
                    className={`${inputClass} w-36`}
                    data-testid={`boundary-${i}-distance`}
                  />
                </label>
                <Button variant="quiet" size="sm" onClick={() => onActivate(active ? null : b.key)} aria-pressed={active} data-testid={`boundary-${i}-show`}>
                  {active ? 'Shown on the view' : 'Show on the view'}
                </Button>
                {canEdit ? (
                  <Button variant="quiet" size="sm" onClick={() => onChange(boundaries.filter((_, k) => k !== i))} aria-label={`Remove boundary ${b.label || b.key}`}>
                    Remove
                  </Button>
                ) : null}
              </div>
              {summary ? (
                <p className="tabular text-xs" data-testid={`boundary-${i}-summary`}>
                  <span style={{ color: SIDE_COLOURS.A }}>■</span> side A {summary.countA} · <span style={{ color: SIDE_COLOURS.B }}>■</span> side B {summary.countB} · on the
                  boundary {summary.countOn} · balance {summary.balance === null ? '—' : summary.balance.toFixed(2)}
                  {summary.countOn > 0 ? <span className="ml-1 text-caution">({summary.countOn} ambiguous: they belong to neither category)</span> : null}
                </p>
              ) : (
                <p className="text-xs text-danger">Check the angle (0° up to 180°) and the key.</p>
              )}
            </li>
          );
        })}
      </ul>
      {error ? (
        <Notice tone="error" testId="boundary-error">
          {error.message}
          {Object.entries(error.fields).map(([k, v]) => (
            <span key={k} className="block text-xs">
              {k}: {v[0]}
            </span>
          ))}
        </Notice>
      ) : null}
      {canEdit && spaceId ? (
        <div className="flex flex-wrap gap-2">
          <Button
            variant="quiet"
            onClick={() => {
              const key = nextBoundaryKey(boundaries);
              onChange([...boundaries, { key, label: '', angleDeg: 0, prototypeDistance: null }]);
              onActivate(key);
            }}
            disabled={boundaries.length >= MAX_BOUNDARIES}
            data-testid="add-boundary"
          >
            Add a boundary
          </Button>
          <Button onClick={() => save.mutate()} disabled={save.isPending || !dirty} data-testid="save-boundaries">
            {save.isPending ? 'Saving…' : dirty ? 'Save boundaries' : 'Boundaries saved'}
          </Button>
        </div>
      ) : null}
    </section>
  );
}
