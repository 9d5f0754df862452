'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useCallback, useMemo, useRef, useState } from 'react';
import { ApiError, apiFetch } from '@/lib/api-client';
import { assessDraft, removeHarmonic, setTermField } from '@/lib/seed-editor';
import { AXIS_FIELDS, defaultSettings, liveStimuli } from '@/lib/space-editor';
import { FAMILY_LABELS, type DescriptorInput } from '@/lib/schemas/descriptor';
import type { ShapeSpace, SpaceSettings } from '@/lib/schemas/space';
import type { ShapeDescriptor } from '@/lib/shape/types';
import type { SpaceDefinition } from '@/lib/space/types';
import Link from 'next/link';
import { SIDE_COLOURS, classify } from '@/lib/boundary-editor';
import type { BoundaryValue } from '@/lib/schemas/boundary';
import type { Edition } from '@/lib/schemas/edition';
import { BoundaryOverlay } from './boundary-overlay';
import { BoundaryPanel } from './boundary-panel';
import { ConfoundAuditPanel } from './confound-audit-panel';
import { HarmonicTable } from './harmonic-table';
import { NumberSlider } from './number-slider';
import { SpaceCanvas, type CanvasStimulus } from './space-canvas';
import { SpaceInspector } from './space-inspector';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

export interface SeedOption {
  id: string;
  name: string;
  version: number;
  descriptor: ShapeDescriptor;
}

type Axis = SpaceSettings['axes'][number];
type Layout = SpaceSettings['layout'];

const LAYOUT_DEFAULTS: Record<Layout['kind'], Layout> = {
  rings: { kind: 'rings', rings: 5, spokes: 16 },
  lattice: { kind: 'lattice', size: 9 },
  diameters: { kind: 'diameters', directions: 8, steps: 11 },
};
const LAYOUT_LABELS: Record<Layout['kind'], string> = { rings: 'Rings', lattice: 'Lattice', diameters: 'Diameters' };

const selectClass = 'mt-1 block h-8 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal';
const numberClass = 'tabular mt-1 block h-8 w-20 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal';

/** The shape-space editor: seed, two axes, ρmax, layout and normalisation, with the whole space redrawn live. */
export function SpaceEditor({
  lab,
  seeds,
  initial,
  canEdit,
  canEditBoundaries = false,
  canFreeze = false,
}: {
  lab: string;
  seeds: SeedOption[];
  initial: ShapeSpace | null;
  canEdit: boolean;
  canEditBoundaries?: boolean;
  canFreeze?: boolean;
}) {
  const router = useRouter();
  const [boundaries, setBoundaries] = useState<BoundaryValue[]>(initial?.boundaries ?? []);
  const [boundariesVersion, setBoundariesVersion] = useState(initial?.boundariesVersion ?? 1);
  const [savedBoundaries, setSavedBoundaries] = useState(() => JSON.stringify(initial?.boundaries ?? []));
  const boundariesDirty = JSON.stringify(boundaries) !== savedBoundaries;
  const [activeBoundary, setActiveBoundary] = useState<string | null>(initial?.boundaries[0]?.key ?? null);
  const [snap, setSnap] = useState(false);
  const firstSeed = initial ? seeds.find((s) => s.id === initial.seedShape.id) ?? { id: initial.seedShape.id, name: initial.seedShape.name, version: 1, descriptor: initial.seedShape.descriptor as ShapeDescriptor } : seeds[0];
  const [name, setName] = useState(initial?.name ?? '');
  const [seedId, setSeedId] = useState(firstSeed?.id ?? '');
  const baseSeed = seeds.find((s) => s.id === seedId) ?? firstSeed;
  // Edits to the seed's own harmonics, per seed, made from this view; saving the space saves them to the seed shape.
  const [seedDrafts, setSeedDrafts] = useState<Record<string, DescriptorInput>>({});
  const [seedVersions, setSeedVersions] = useState<Record<string, number>>({});
  const seedDraft = baseSeed ? seedDrafts[baseSeed.id] : undefined;
  const seedDirty = !!baseSeed && !!seedDraft && JSON.stringify(seedDraft) !== JSON.stringify(baseSeed.descriptor);
  const seed = useMemo(() => (baseSeed && seedDraft ? { ...baseSeed, descriptor: seedDraft as ShapeDescriptor } : baseSeed), [baseSeed, seedDraft]);
  const seedAssessment = useMemo(() => (seed ? assessDraft(seed.descriptor as DescriptorInput) : null), [seed]);
  const seedProblems = useMemo(() => {
    const m = new Map<string, string>();
    for (const p of seedAssessment?.problems ?? []) if (p.field && !m.has(p.field)) m.set(p.field, p.message);
    return m;
  }, [seedAssessment]);
  const [settings, setSettings] = useState<SpaceSettings>(() =>
    initial
      ? { axes: initial.axes, extent: initial.extent, layout: initial.layout, normalization: initial.normalization, equalize: initial.equalizationSource === 'contour' }
      : defaultSettings(firstSeed!.descriptor),
  );
  const [selected, setSelected] = useState<string | null>(null);
  const [version, setVersion] = useState(initial?.version ?? 0);
  const [saveError, setSaveError] = useState<{ message: string; fields: Record<string, string[]> } | null>(null);
  const frameRef = useRef<HTMLSpanElement>(null);
  const [savedJson, setSavedJson] = useState(() => (initial ? JSON.stringify({ name: initial.name, seedId: initial.seedShape.id, settings }) : ''));
  const settingsDirty = JSON.stringify({ name, seedId, settings }) !== savedJson;
  const savedEqualization = initial?.equalization ?? null;
  const dirty = settingsDirty || seedDirty;

  // The stored equalisation applies while the settings are the saved ones; a change redraws the designed space.
  const definition: SpaceDefinition | null = useMemo(
    () =>
      seed
        ? { seed: seed.descriptor, axes: settings.axes, extent: settings.extent, layout: settings.layout, normalization: settings.normalization, equalization: dirty ? null : savedEqualization }
        : null,
    [seed, settings, dirty, savedEqualization],
  );
  const live = useMemo(() => {
    if (!definition) return null;
    performance.mark('space-synth-start');
    const r = liveStimuli(definition);
    performance.mark('space-synth-end');
    performance.measure('space-synthesis', 'space-synth-start', 'space-synth-end');
    return r;
  }, [definition]);
  const positioned = useMemo(() => (live?.items ?? []).map((i) => i.stimulus), [live]);
  const classification = useMemo(() => classify(positioned, boundaries, settings.extent), [positioned, boundaries, settings.extent]);
  const activeIndex = boundaries.findIndex((b) => b.key === activeBoundary);
  const canvasStimuli: CanvasStimulus[] = useMemo(
    () =>
      (live?.items ?? []).map(({ stimulus, contour }, i) => {
        const side = activeIndex >= 0 ? classification?.[i]?.placements[activeIndex]?.side : undefined;
        return { id: stimulus.id, a: stimulus.position.a, b: stimulus.position.b, contour, ...(side ? { color: SIDE_COLOURS[side] } : {}) };
      }),
    [live, classification, activeIndex],
  );
  const onDrawn = useCallback(
    (drawMs: number) => {
      const total = (live?.ms ?? 0) + drawMs;
      const now = performance.now();
      performance.measure('space-frame', { start: now - total, duration: total });
      performance.measure('space-draw', { start: now - drawMs, duration: drawMs });
      if (frameRef.current) {
        frameRef.current.textContent = `${canvasStimuli.length} stimuli · synthesis ${live?.ms.toFixed(1)} ms + drawing ${drawMs.toFixed(1)} ms`;
        frameRef.current.dataset.frameMs = total.toFixed(2);
      }
    },
    [live, canvasStimuli.length],
  );
  const invalidCount = live?.items.filter((i) => !i.contour).length ?? 0;
  const selectedIndex = live?.items.findIndex((i) => i.stimulus.id === selected) ?? -1;
  const selectedStimulus = selectedIndex >= 0 ? live!.items[selectedIndex]! : null;
  const selectedPlacements = selectedIndex >= 0 ? classification?.[selectedIndex]?.placements ?? null : null;

  const freeze = useMutation({
    mutationFn: () => apiFetch<Edition>(`/api/v1/labs/${lab}/spaces/${initial!.id}/editions`, { method: 'POST', body: { changeNote, spaceVersion: version, boundariesVersion } }),
    onSuccess: (e) => router.push(`/labs/${lab}/spaces/${initial!.id}/editions/${e.number}`),
  });
  const [changeNote, setChangeNote] = useState('');

  const setAxis = (i: 0 | 1, axis: Axis) => setSettings((s) => ({ ...s, axes: (i === 0 ? [axis, s.axes[1]] : [s.axes[0], axis]) as SpaceSettings['axes'] }));

  const save = useMutation({
    mutationFn: async () => {
      if (seedDirty && baseSeed && seedDraft) {
        const version = seedVersions[baseSeed.id] ?? baseSeed.version;
        const savedSeed = await apiFetch<{ version: number }>(`/api/v1/labs/${lab}/seed-shapes/${baseSeed.id}`, { method: 'PATCH', body: { descriptor: seedDraft, version } });
        setSeedVersions((v) => ({ ...v, [baseSeed.id]: savedSeed.version }));
      }
      const body = { name, seedShapeId: seedId, ...settings };
      return initial
        ? apiFetch<ShapeSpace>(`/api/v1/labs/${lab}/spaces/${initial.id}`, { method: 'PATCH', body: { ...body, version } })
        : apiFetch<ShapeSpace>(`/api/v1/labs/${lab}/spaces`, { method: 'POST', body });
    },
    onSuccess: (saved) => {
      setSaveError(null);
      setVersion(saved.version);
      setSavedJson(JSON.stringify({ name: saved.name, seedId: saved.seedShape.id, settings }));
      if (!initial) router.replace(`/labs/${lab}/spaces/${saved.id}`);
      else router.refresh();
    },
    onError: (e) => setSaveError(e instanceof ApiError ? { message: e.message, fields: e.fields } : { message: 'Could not reach the server.', fields: {} }),
  });

  const remove = useMutation({
    mutationFn: () => apiFetch(`/api/v1/labs/${lab}/spaces/${initial!.id}`, { method: 'DELETE' }),
    onSuccess: () => {
      router.push(`/labs/${lab}/spaces`);
      router.refresh();
    },
    onError: (e) => setSaveError({ message: e instanceof Error ? e.message : 'Could not delete.', fields: {} }),
  });

  if (!seed) return <Notice tone="caution">Create a seed shape first: every space is built around one.</Notice>;
  const circular = settings.layout.kind !== 'lattice';
  const fields = AXIS_FIELDS[seed.descriptor.family];

  return (
    <div className="space-y-6" data-testid="space-editor" data-readonly={canEdit ? undefined : 'true'}>
      <div className="flex flex-wrap items-end gap-4 border-b-[0.5px] border-rule pb-4">
        {canEdit ? (
          <label className="min-w-56 flex-1 text-sm font-medium">
            Name
            <input value={name} onChange={(e) => setName(e.target.value)} className="mt-1 block h-9 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-3 text-sm font-normal" data-testid="space-name" />
          </label>
        ) : (
          <h1 className="flex-1 text-2xl font-semibold">{name}</h1>
        )}
        <label className="text-sm font-medium">
          Seed shape
          <select
            value={seedId}
            onChange={(e) => {
              const next = seeds.find((x) => x.id === e.target.value);
              setSeedId(e.target.value);
              // Axes name entries of the seed's family; a seed of another family starts from fresh axes.
              if (next && seed && next.descriptor.family !== seed.descriptor.family) setSettings((st) => ({ ...st, axes: defaultSettings(next.descriptor).axes }));
            }}
            disabled={!canEdit}
            className={selectClass}
            data-testid="space-seed"
          >
            {seeds.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name} ({FAMILY_LABELS[s.descriptor.family]})
              </option>
            ))}
          </select>
        </label>
        {canEdit ? (
          <Button onClick={() => save.mutate()} disabled={save.isPending || !name.trim() || (!dirty && !!initial)} data-testid="save-space">
            {save.isPending ? 'Saving…' : dirty || !initial ? 'Save' : 'Saved'}
          </Button>
        ) : null}
        {canEdit && initial ? (
          <Button
            variant="danger"
            onClick={() => {
              if (window.confirm(`Delete the shape space “${initial.name}”? This cannot be undone.`)) remove.mutate();
            }}
            disabled={remove.isPending}
            data-testid="delete-space"
          >
            Delete
          </Button>
        ) : null}
        {canEdit ? null : (
          <span className="text-sm text-graphite-muted" data-testid="read-only-note">
            Read-only: your role can look but not change shape spaces.
          </span>
        )}
      </div>
      {saveError ? (
        <Notice tone="error" testId="space-save-error">
          {saveError.message}
        </Notice>
      ) : null}
      {live?.error ? <Notice tone="error" testId="space-error">{live.error}</Notice> : null}

      <div className="grid gap-8 xl:grid-cols-[1fr_22rem]">
        <div className="space-y-3">
          <SpaceCanvas
            stimuli={canvasStimuli}
            extent={settings.extent}
            circular={circular}
            selectedId={selected}
            onSelect={setSelected}
            onDrawn={onDrawn}
            overlay={
              boundaries.length
                ? (g) => (
                    <BoundaryOverlay
                      geometry={g}
                      boundaries={boundaries}
                      activeKey={activeBoundary}
                      editable={canEditBoundaries}
                      snapSpokes={snap && settings.layout.kind === 'rings' ? settings.layout.spokes : null}
                      onAngle={(key, angleDeg) => setBoundaries((bs) => bs.map((b) => (b.key === key ? { ...b, angleDeg } : b)))}
                    />
                  )
                : undefined
            }
          />
          <p className="tabular text-xs text-graphite-muted">
            <span ref={frameRef} data-testid="space-frame" />
            {invalidCount ? <span className="ml-2 text-danger" data-testid="space-invalid-count">{invalidCount} stimuli cannot be drawn at this ρmax</span> : null}
          </p>
          <label className="block text-sm font-medium">
            Inspect a stimulus
            <select value={selected ?? ''} onChange={(e) => setSelected(e.target.value || null)} className={selectClass} data-testid="stimulus-picker">
              <option value="">—</option>
              {canvasStimuli.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.id}
                </option>
              ))}
            </select>
          </label>
          {selectedStimulus ? (
            <SpaceInspector stimulus={selectedStimulus.stimulus} contour={selectedStimulus.contour} placements={selectedPlacements} boundaries={boundaries} extent={settings.extent} />
          ) : null}
          <BoundaryPanel
            lab={lab}
            spaceId={initial?.id ?? null}
            boundaries={boundaries}
            version={boundariesVersion}
            extent={settings.extent}
            stimuli={positioned}
            activeKey={activeBoundary}
            canEdit={canEditBoundaries}
            snap={snap}
            canSnap={settings.layout.kind === 'rings'}
            onChange={setBoundaries}
            onActivate={setActiveBoundary}
            onSnap={setSnap}
            dirty={boundariesDirty}
            onSaved={(saved) => {
              setBoundaries(saved.boundaries);
              setBoundariesVersion(saved.boundariesVersion);
              setSavedBoundaries(JSON.stringify(saved.boundaries));
            }}
          />
          {initial ? (
            <section className="space-y-2 border-t-[0.5px] border-rule pt-4 text-sm" aria-labelledby="freeze-heading" data-testid="freeze-panel">
              <div className="flex flex-wrap items-center gap-3">
                <h2 id="freeze-heading" className="text-base font-semibold">
                  Editions
                </h2>
                <Link href={`/labs/${lab}/spaces/${initial.id}/editions`} className="text-accent underline underline-offset-2" data-testid="editions-link">
                  {initial.editionCount === 1 ? '1 edition' : `${initial.editionCount} editions`}
                </Link>
              </div>
              {canFreeze ? (
                <>
                  <p className="text-graphite-soft">
                    Freezing snapshots the seed, axes, layout, normalisation, boundaries and every stimulus into a numbered edition that never changes. A reviewer approves it before studies use it.
                  </p>
                  <label className="block font-medium">
                    Change note
                    <textarea value={changeNote} onChange={(e) => setChangeNote(e.target.value)} rows={2} maxLength={2000} className="mt-1 block w-full max-w-xl rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 py-1 text-sm font-normal" data-testid="change-note" />
                  </label>
                  {dirty || boundariesDirty ? <p className="text-xs text-caution">Save your changes first: an edition freezes what is saved.</p> : null}
                  {freeze.error ? (
                    <Notice tone="error" testId="freeze-error">
                      {freeze.error.message}
                    </Notice>
                  ) : null}
                  <Button onClick={() => freeze.mutate()} disabled={freeze.isPending || dirty || boundariesDirty || !!live?.error} data-testid="freeze-edition">
                    {freeze.isPending ? 'Freezing…' : 'Freeze as edition'}
                  </Button>
                </>
              ) : null}
            </section>
          ) : null}
        </div>

        <fieldset disabled={!canEdit} className="space-y-5 text-sm" data-testid="space-controls">
          {([0, 1] as const).map((i) => (
            <AxisEditor key={i} index={i} axis={settings.axes[i]} fields={fields} onChange={(a) => setAxis(i, a)} errors={saveError?.fields.axes} />
          ))}
          <div>
            <span className="font-medium">Extent ρmax</span>
            <NumberSlider label="Extent ρmax" value={settings.extent} min={0.05} max={3} step={0.05} onChange={(v) => setSettings((s) => ({ ...s, extent: v }))} testId="extent" decimals={2} />
            {saveError?.fields.extent ? <p className="mt-1 text-xs text-danger">{saveError.fields.extent[0]}</p> : null}
          </div>
          <div className="flex flex-wrap gap-3">
            <label className="font-medium">
              Layout
              <select value={settings.layout.kind} onChange={(e) => setSettings((s) => ({ ...s, layout: LAYOUT_DEFAULTS[e.target.value as Layout['kind']] }))} className={selectClass} data-testid="layout-kind">
                {Object.entries(LAYOUT_LABELS).map(([k, l]) => (
                  <option key={k} value={k}>
                    {l}
                  </option>
                ))}
              </select>
            </label>
            <LayoutNumbers layout={settings.layout} onChange={(layout) => setSettings((s) => ({ ...s, layout }))} />
          </div>
          <div className="flex flex-wrap items-end gap-3">
            <label className="font-medium">
              Normalise size to
              <select
                value={settings.normalization.scale}
                onChange={(e) => setSettings((s) => ({ ...s, normalization: { ...s.normalization, scale: e.target.value as SpaceSettings['normalization']['scale'] } }))}
                className={selectClass}
                data-testid="normalization-scale"
              >
                <option value="equal-area-radius">equal area</option>
                <option value="area">unit area</option>
                <option value="max-radius">unit max radius</option>
                <option value="perimeter">unit perimeter</option>
                <option value="none">no normalisation</option>
              </select>
            </label>
            <label className="flex items-center gap-2">
              <input type="checkbox" checked={settings.normalization.centroid} onChange={(e) => setSettings((s) => ({ ...s, normalization: { ...s.normalization, centroid: e.target.checked } }))} />
              centroid at origin
            </label>
          </div>
          <label className="flex items-start gap-2">
            <input type="checkbox" checked={settings.equalize} disabled={initial?.equalizationSource === 'study'} onChange={(e) => setSettings((s) => ({ ...s, equalize: e.target.checked }))} data-testid="equalize" className="mt-1" />
            <span>
              Equalise: re-map the radius per direction so contour distance grows at the same rate everywhere (computed on save).
              {initial?.equalizationSource === 'study' ? <span className="mt-1 block text-xs text-graphite-muted">This space keeps the radius re-mapping it was made with from a norming study.</span> : null}
              {initial ? (
                <span className="tabular mt-1 block text-xs text-graphite-muted" data-testid="anisotropy-figures">
                  Anisotropy index as designed {fmt(initial.anisotropy.designed)}
                  {initial.anisotropy.equalized !== null ? `, ${initial.equalizationSource === 'study' ? "with the study's re-mapping" : 'after equalising'} ${fmt(initial.anisotropy.equalized)}` : ''}
                </span>
              ) : null}
            </span>
          </label>
        </fieldset>
      </div>

      {canEdit && seed ? (
        <details className="border-t-[0.5px] border-rule pt-4 text-sm" data-testid="seed-harmonics-panel">
          <summary className="cursor-pointer font-medium">Seed harmonics — {seed.name}</summary>
          <p className="mt-2 text-graphite-soft">
            Changing the seed moves every stimulus. Saving the space saves these harmonics to the seed shape itself, which other spaces built on it share.
          </p>
          <div className="mt-3 max-w-3xl">
            <HarmonicTable
              draft={seed.descriptor as DescriptorInput}
              readOnly={false}
              problems={seedProblems}
              onField={(i, field, v) => setSeedDrafts((d) => ({ ...d, [seed.id]: setTermField(seed.descriptor as DescriptorInput, i, field, v) }))}
              onRemove={(i) => setSeedDrafts((d) => ({ ...d, [seed.id]: removeHarmonic(seed.descriptor as DescriptorInput, i) }))}
            />
          </div>
          {seedDirty ? <p className="mt-2 text-xs text-caution" data-testid="seed-changed-note">The seed has unsaved changes.</p> : null}
        </details>
      ) : null}

      {definition && !live?.error ? <ConfoundAuditPanel definition={definition} /> : null}
    </div>
  );
}

function fmt(v: number | null): string {
  return v === null ? '—' : v.toFixed(3);
}

function AxisEditor({ index, axis, fields, onChange, errors }: { index: 0 | 1; axis: Axis; fields: readonly { field: Axis['changes'][number]['field']; label: string }[]; onChange: (a: Axis) => void; errors?: string[] | undefined }) {
  const name = index === 0 ? 'A' : 'B';
  const setChange = (j: number, patch: Partial<Axis['changes'][number]>) => onChange({ ...axis, changes: axis.changes.map((c, k) => (k === j ? { ...c, ...patch } : c)) });
  return (
    <div className="space-y-2 border-t-[0.5px] border-rule pt-3" data-testid={`axis-${name}`}>
      <label className="block font-medium">
        Axis {name} label
        <input value={axis.label} onChange={(e) => onChange({ ...axis, label: e.target.value })} className="mt-1 block h-8 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal" />
      </label>
      {axis.changes.map((c, j) => (
        <div key={j} className="flex flex-wrap items-end gap-2">
          <label className="text-xs">
            Harmonic
            <input type="number" value={c.harmonic} onChange={(e) => setChange(j, { harmonic: Math.trunc(Number(e.target.value)) || 0 })} className={numberClass} aria-label={`Axis ${name} change ${j + 1} harmonic`} />
          </label>
          <label className="text-xs">
            Entry
            <select value={c.field} onChange={(e) => setChange(j, { field: e.target.value as Axis['changes'][number]['field'] })} className={selectClass} aria-label={`Axis ${name} change ${j + 1} entry`}>
              {fields.map((f) => (
                <option key={f.field} value={f.field}>
                  {f.label}
                </option>
              ))}
            </select>
          </label>
          <div className="text-xs">
            Change per unit
            <NumberSlider label={`Axis ${name} change ${j + 1} amount`} value={c.delta} min={-0.5} max={0.5} step={0.005} onChange={(v) => setChange(j, { delta: v })} testId={`axis-${name}-delta-${j}`} />
          </div>
          {axis.changes.length > 1 ? (
            <Button variant="quiet" size="sm" onClick={() => onChange({ ...axis, changes: axis.changes.filter((_, k) => k !== j) })} aria-label={`Remove change ${j + 1} of axis ${name}`}>
              ✕
            </Button>
          ) : null}
        </div>
      ))}
      <Button variant="quiet" size="sm" onClick={() => onChange({ ...axis, changes: [...axis.changes, { harmonic: axis.changes.at(-1)!.harmonic + 1, field: fields[0]!.field, delta: 0 }] })}>
        Add a change
      </Button>
      {index === 0 && errors ? <p className="text-xs text-danger">{errors[0]}</p> : null}
    </div>
  );
}

function LayoutNumbers({ layout, onChange }: { layout: Layout; onChange: (l: Layout) => void }) {
  const num = (label: string, value: number, set: (v: number) => Layout, testId: string) => (
    <label className="font-medium">
      {label}
      <input type="number" value={value} min={1} onChange={(e) => onChange(set(Math.max(1, Math.trunc(Number(e.target.value)) || 1)))} className={numberClass} data-testid={testId} />
    </label>
  );
  if (layout.kind === 'rings')
    return (
      <>
        {num('Rings', layout.rings, (v) => ({ ...layout, rings: v }), 'layout-rings')}
        {num('Spokes', layout.spokes, (v) => ({ ...layout, spokes: v }), 'layout-spokes')}
      </>
    );
  if (layout.kind === 'lattice') return num('Size n', layout.size, (v) => ({ ...layout, size: v }), 'layout-size');
  return (
    <>
      {num('Directions', layout.directions, (v) => ({ ...layout, directions: v }), 'layout-directions')}
      {num('Steps (odd)', layout.steps, (v) => ({ ...layout, steps: v }), 'layout-steps')}
    </>
  );
}
