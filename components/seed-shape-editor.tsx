'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useCallback, useEffect, useMemo, useState } from 'react';
import { ApiError, apiFetch } from '@/lib/api-client';
import { addHarmonic, assessDraft, convertFamily, removeHarmonic, setTermField } from '@/lib/seed-editor';
import { SEED_PRESETS } from '@/lib/seed-presets';
import { FAMILIES, FAMILY_LABELS, type DescriptorInput, type Family } from '@/lib/schemas/descriptor';
import type { FitResult, SeedShape, SeedShapeOrigin } from '@/lib/schemas/seed-shapes';
import { HarmonicTable } from './harmonic-table';
import { NumberSlider } from './number-slider';
import { OutlineUploadPanel } from './outline-upload-panel';
import { ShapeMetricsPanel } from './shape-metrics-panel';
import { ShapePreview } from './shape-preview';
import { ShortcutHelp, type Shortcut } from './shortcut-help';
import { useUndoHistory } from './use-undo-history';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

const SHORTCUTS: readonly Shortcut[] = [
  { keys: '?', action: 'Show or hide this list' },
  { keys: 'Ctrl Z', action: 'Undo' },
  { keys: 'Ctrl Shift Z  /  Ctrl Y', action: 'Redo' },
  { keys: 'Ctrl S', action: 'Save' },
  { keys: 'Alt N', action: 'Add a harmonic' },
  { keys: '← → on a slider', action: 'Nudge a value by one step' },
  { keys: 'Home / End on a slider', action: 'Jump to the end of its range' },
];

const UNSAVED_PROMPT = 'You have unsaved changes to this seed shape. Leave without saving?';

interface Draft {
  name: string;
  descriptor: DescriptorInput;
}

function isTyping(target: EventTarget | null): boolean {
  return target instanceof HTMLElement && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.tagName === 'SELECT') && (target as HTMLInputElement).type !== 'range';
}

/** The seed-shape editor: family, harmonics, live preview, metrics, undo/redo, upload-and-fit, save. */
export function SeedShapeEditor({ lab, initial, canEdit }: { lab: string; initial: SeedShape | null; canEdit: boolean }) {
  const router = useRouter();
  const start: Draft = initial ? { name: initial.name, descriptor: initial.descriptor } : { name: '', descriptor: SEED_PRESETS[0]!.descriptor };
  const history = useUndoHistory<Draft>(start);
  const draft = history.value;
  const [baseline, setBaseline] = useState(() => JSON.stringify(start));
  const [version, setVersion] = useState(initial?.version ?? 0);
  const [origin, setOrigin] = useState<SeedShapeOrigin>(initial?.origin ?? { kind: 'editor' });
  const [helpOpen, setHelpOpen] = useState(false);
  const [note, setNote] = useState<string | null>(null);
  const [saveError, setSaveError] = useState<{ message: string; fields: Record<string, string[]> } | null>(null);
  const dirty = canEdit && JSON.stringify(draft) !== baseline;

  const assessment = useMemo(() => assessDraft(draft.descriptor), [draft.descriptor]);
  const problems = useMemo(() => {
    const m = new Map<string, string>();
    for (const p of assessment.problems) if (p.field && !m.has(p.field)) m.set(p.field, p.message);
    for (const [k, v] of Object.entries(saveError?.fields ?? {})) {
      const key = k.replace(/^descriptor\./, '');
      if (v[0] && !m.has(key)) m.set(key, v[0]);
    }
    return m;
  }, [assessment.problems, saveError]);
  const shapeProblems = assessment.problems.filter((p) => !p.field || !p.field.startsWith('terms.'));

  const setDescriptor = useCallback((descriptor: DescriptorInput, key?: string) => history.set({ ...draft, descriptor }, key), [draft, history]);

  const save = useMutation({
    mutationFn: async () => {
      const body = initial
        ? { name: draft.name, descriptor: draft.descriptor, version }
        : { name: draft.name, descriptor: draft.descriptor, origin };
      return initial
        ? apiFetch<SeedShape>(`/api/v1/labs/${lab}/seed-shapes/${initial.id}`, { method: 'PATCH', body })
        : apiFetch<SeedShape>(`/api/v1/labs/${lab}/seed-shapes`, { method: 'POST', body });
    },
    onSuccess: (saved) => {
      setSaveError(null);
      setVersion(saved.version);
      setBaseline(JSON.stringify({ name: saved.name, descriptor: saved.descriptor }));
      history.reset({ name: saved.name, descriptor: saved.descriptor });
      if (!initial) router.replace(`/labs/${lab}/seed-shapes/${saved.id}`);
      else router.refresh();
    },
    onError: (e) => setSaveError(e instanceof ApiError ? { message: e.message, fields: e.fields } : { message: 'Could not reach the server.', fields: {} }),
  });
  const remove = useMutation({
    mutationFn: () => apiFetch(`/api/v1/labs/${lab}/seed-shapes/${initial!.id}`, { method: 'DELETE' }),
    onSuccess: () => {
      setBaseline(JSON.stringify(draft));
      router.push(`/labs/${lab}/seed-shapes`);
      router.refresh();
    },
    onError: (e) => setSaveError({ message: e instanceof Error ? e.message : 'Could not delete.', fields: {} }),
  });
  const unsaved = !initial || dirty;
  const canSave = canEdit && unsaved && draft.name.trim() !== '' && assessment.problems.length === 0 && !save.isPending;

  // Keyboard shortcuts (the list is under `?`).
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const mod = e.ctrlKey || e.metaKey;
      if (e.key === '?' && !isTyping(e.target)) {
        e.preventDefault();
        setHelpOpen((o) => !o);
      } else if (!canEdit) {
        return;
      } else if (mod && e.key.toLowerCase() === 'z' && !isTyping(e.target)) {
        e.preventDefault();
        if (e.shiftKey) history.redo();
        else history.undo();
      } else if (mod && e.key.toLowerCase() === 'y' && !isTyping(e.target)) {
        e.preventDefault();
        history.redo();
      } else if (mod && e.key.toLowerCase() === 's') {
        e.preventDefault();
        if (canSave) save.mutate();
      } else if (e.altKey && e.key.toLowerCase() === 'n') {
        e.preventDefault();
        setDescriptor(addHarmonic(draft.descriptor));
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [canEdit, canSave, draft.descriptor, history, save, setDescriptor]);

  // Unsaved changes: a prompt on reload or close, and on in-app links.
  useEffect(() => {
    if (!dirty) return;
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      e.returnValue = '';
    };
    const onClick = (e: MouseEvent) => {
      const a = (e.target as HTMLElement | null)?.closest?.('a[href]');
      if (a && !a.hasAttribute('download') && !window.confirm(UNSAVED_PROMPT)) {
        e.preventDefault();
        e.stopPropagation();
      }
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    document.addEventListener('click', onClick, true);
    return () => {
      window.removeEventListener('beforeunload', onBeforeUnload);
      document.removeEventListener('click', onClick, true);
    };
  }, [dirty]);

  const switchFamily = (to: Family) => {
    try {
      const { descriptor, note: n } = convertFamily(draft.descriptor, to);
      setNote(n ?? null);
      setDescriptor(descriptor);
    } catch (e) {
      setNote(e instanceof Error ? `Cannot switch to ${FAMILY_LABELS[to]}: ${e.message}.` : 'Cannot switch family.');
    }
  };

  const useFit = (fit: FitResult, fileName: string, harmonics: number) => {
    setOrigin({ kind: 'upload', format: fit.format, fileName, harmonics, meanError: fit.meanError, maxError: fit.maxError });
    setNote(`Using the fit of ${harmonics} ${FAMILY_LABELS[fit.descriptor.family].toLowerCase()} to ${fileName}. Name it and save.`);
    history.set({ name: draft.name || fileName.replace(/\.[a-z]+$/i, ''), descriptor: fit.descriptor });
  };

  return (
    <div className="space-y-8" data-testid="seed-shape-editor" data-readonly={canEdit ? undefined : 'true'}>
      <div className="flex flex-wrap items-end gap-4 border-b-[0.5px] border-rule pb-4">
        {canEdit ? (
          <label className="min-w-64 flex-1 text-sm font-medium">
            Name
            <input
              value={draft.name}
              onChange={(e) => history.set({ ...draft, name: e.target.value }, 'name')}
              className="mt-1 block h-9 w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-3 text-sm font-normal"
              data-testid="seed-name"
              aria-invalid={saveError?.fields.name ? true : undefined}
            />
            {saveError?.fields.name ? <span className="text-xs text-danger">{saveError.fields.name[0]}</span> : null}
          </label>
        ) : (
          <h1 className="flex-1 text-2xl font-semibold" data-testid="seed-name-readonly">
            {draft.name}
          </h1>
        )}
        {canEdit ? (
          <>
            <label className="text-sm font-medium">
              Family
              <select
                value={draft.descriptor.family}
                onChange={(e) => switchFamily(e.target.value as Family)}
                className="mt-1 block h-9 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal"
                data-testid="family-picker"
              >
                {FAMILIES.map((f) => (
                  <option key={f} value={f}>
                    {FAMILY_LABELS[f]}
                  </option>
                ))}
              </select>
            </label>
            <label className="text-sm font-medium">
              Start from
              <select
                value=""
                onChange={(e) => {
                  const p = SEED_PRESETS.find((x) => x.id === e.target.value);
                  if (p) {
                    setOrigin({ kind: 'preset', preset: p.id });
                    setDescriptor(p.descriptor);
                  }
                }}
                className="mt-1 block h-9 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-sm font-normal"
                data-testid="preset-picker"
              >
                <option value="">A preset…</option>
                {SEED_PRESETS.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.label}
                  </option>
                ))}
              </select>
            </label>
            <div className="flex gap-2">
              <Button variant="quiet" onClick={history.undo} disabled={!history.canUndo} aria-label="Undo (Ctrl Z)" data-testid="undo">
                Undo
              </Button>
              <Button variant="quiet" onClick={history.redo} disabled={!history.canRedo} aria-label="Redo (Ctrl Shift Z)" data-testid="redo">
                Redo
              </Button>
              <Button onClick={() => save.mutate()} disabled={!canSave} data-testid="save-seed">
                {save.isPending ? 'Saving…' : unsaved ? 'Save' : 'Saved'}
              </Button>
              {initial ? (
                <Button
                  variant="danger"
                  onClick={() => {
                    if (window.confirm(`Delete the seed shape “${initial.name}”? This cannot be undone.`)) remove.mutate();
                  }}
                  disabled={remove.isPending}
                  data-testid="delete-seed"
                >
                  Delete
                </Button>
              ) : null}
              <Button variant="quiet" onClick={() => setHelpOpen(true)} aria-label="Keyboard shortcuts (?)">
                ?
              </Button>
            </div>
          </>
        ) : (
          <span className="text-sm text-graphite-muted" data-testid="read-only-note">
            Read-only: your role can look but not change seed shapes.
          </span>
        )}
      </div>

      {note ? <Notice testId="editor-note">{note}</Notice> : null}
      {saveError ? <Notice tone="error" testId="save-error">{saveError.message}</Notice> : null}
      {shapeProblems.map((p, i) => (
        <Notice key={i} tone="error" testId="shape-problem">
          {p.message}
        </Notice>
      ))}

      <div className="grid gap-8 lg:grid-cols-[minmax(16rem,22rem)_1fr]">
        <div className="space-y-6">
          <div className="border-[0.5px] border-rule bg-paper-raised">
            {assessment.path ? (
              <ShapePreview
                paths={[{ d: assessment.path, fill: assessment.problems.length ? '#A63F00' : '#23262B', testId: 'preview-path' }]}
                label={`Preview of ${draft.name || 'the seed shape'}`}
                size="100%"
                testId="seed-preview"
              />
            ) : (
              <p className="p-8 text-sm text-graphite-muted">No preview until the harmonics are valid numbers.</p>
            )}
          </div>
          <ShapeMetricsPanel metrics={assessment.metrics} />
        </div>
        <div className="space-y-4">
          <h2 className="text-lg font-semibold">{FAMILY_LABELS[draft.descriptor.family]}</h2>
          {draft.descriptor.family === 'radial' ? (
            <div className="flex items-center gap-3 text-sm">
              <span className="w-28 font-medium">Base radius r₀</span>
              {canEdit ? (
                <NumberSlider
                  label="Base radius"
                  value={draft.descriptor.baseRadius}
                  min={0.1}
                  max={2}
                  step={0.01}
                  onChange={(v) => setDescriptor({ ...(draft.descriptor as Extract<DescriptorInput, { family: 'radial' }>), baseRadius: v }, 'baseRadius')}
                  error={problems.get('baseRadius')}
                  testId="base-radius"
                />
              ) : (
                <span className="tabular text-xs">{draft.descriptor.baseRadius.toFixed(4)}</span>
              )}
            </div>
          ) : null}
          <HarmonicTable
            draft={draft.descriptor}
            readOnly={!canEdit}
            problems={problems}
            onField={(i, field, v) => setDescriptor(setTermField(draft.descriptor, i, field, v), `${i}.${field}`)}
            onRemove={(i) => setDescriptor(removeHarmonic(draft.descriptor, i))}
          />
          {canEdit ? (
            <Button variant="quiet" onClick={() => setDescriptor(addHarmonic(draft.descriptor))} data-testid="add-harmonic">
              Add a harmonic
            </Button>
          ) : null}
        </div>
      </div>

      {canEdit ? <OutlineUploadPanel lab={lab} onUse={useFit} /> : null}
      <ShortcutHelp open={helpOpen} onClose={() => setHelpOpen(false)} shortcuts={SHORTCUTS} title="Seed-shape editor shortcuts" />
    </div>
  );
}
