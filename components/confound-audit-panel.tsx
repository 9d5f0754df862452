'use client';

import { useEffect, useRef, useState } from 'react';
import type { AuditThresholds, ConfoundAudit, SpaceDefinition } from '@/lib/space/types';
import { RdmHeatmap } from './rdm-heatmap';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

type State = { kind: 'idle' } | { kind: 'running'; fraction: number } | { kind: 'done'; audit: ConfoundAudit } | { kind: 'error'; message: string };

const THRESHOLD_FIELDS: { key: keyof AuditThresholds; label: string }[] = [
  { key: 'areaCv', label: 'Area CV at most' },
  { key: 'perimeterCv', label: 'Perimeter CV at most' },
  { key: 'compactnessCv', label: 'Compactness CV at most' },
  { key: 'spacingCv', label: 'Spacing CV at most' },
  { key: 'anisotropy', label: 'Anisotropy index at most' },
  { key: 'designContour', label: 'Design ~ contour ρ at least' },
];

/** The confound audit: low-level differences between stimuli, computed in a web worker with progress. */
export function ConfoundAuditPanel({ definition }: { definition: SpaceDefinition }) {
  const [state, setState] = useState<State>({ kind: 'idle' });
  const [thresholds, setThresholds] = useState<Partial<AuditThresholds>>({});
  const worker = useRef<Worker | null>(null);
  useEffect(() => () => worker.current?.terminate(), []);

  const run = () => {
    worker.current?.terminate();
    const w = new Worker(new URL('../lib/workers/space-audit.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    setState({ kind: 'running', fraction: 0 });
    w.onmessage = (e: MessageEvent<{ type: string; fraction?: number; audit?: ConfoundAudit; message?: string }>) => {
      if (e.data.type === 'progress') setState({ kind: 'running', fraction: e.data.fraction ?? 0 });
      else if (e.data.type === 'result') setState({ kind: 'done', audit: e.data.audit! });
      else setState({ kind: 'error', message: e.data.message ?? 'The audit failed.' });
    };
    w.onerror = (e) => setState({ kind: 'error', message: e.message || 'The audit worker failed to start.' });
    w.postMessage({ definition, thresholds });
  };

  return (
    <section aria-labelledby="audit-heading" className="border-t-[0.5px] border-rule pt-6" data-testid="audit-panel">
      <div className="flex flex-wrap items-center justify-between gap-4">
        <h2 id="audit-heading" className="text-lg font-semibold">
          Confound audit
        </h2>
        <Button variant="quiet" onClick={run} disabled={state.kind === 'running'} data-testid="run-audit">
          {state.kind === 'done' ? 'Run again' : 'Run the audit'}
        </Button>
      </div>
      <p className="mt-1 max-w-3xl text-sm text-graphite-soft">
        Differences in area, perimeter and compactness, and how contour and silhouette distances follow the designed distances. Reviewers of vision
        studies ask for these first.
      </p>
      <details className="mt-3 text-sm">
        <summary className="cursor-pointer text-accent">Thresholds</summary>
        <div className="mt-2 flex flex-wrap gap-3">
          {THRESHOLD_FIELDS.map((f) => (
            <label key={f.key} className="text-xs">
              {f.label}
              <input
                type="number"
                step="0.01"
                placeholder={state.kind === 'done' ? String(state.audit.thresholds[f.key]) : 'default'}
                onChange={(e) => setThresholds((t) => ({ ...t, [f.key]: e.target.value === '' ? undefined : Number(e.target.value) }))}
                className="tabular mt-1 block h-8 w-24 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2"
              />
            </label>
          ))}
        </div>
      </details>
      {state.kind === 'running' ? (
        <div className="mt-4" data-testid="audit-progress">
          <div role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(state.fraction * 100)} aria-label="Audit progress" className="h-1.5 w-full max-w-md bg-paper-deep">
            <div className="h-full bg-accent" style={{ width: `${Math.round(state.fraction * 100)}%` }} />
          </div>
          <p className="tabular mt-1 text-xs text-graphite-muted">{Math.round(state.fraction * 100)} %</p>
        </div>
      ) : null}
      {state.kind === 'error' ? <Notice tone="error">{state.message}</Notice> : null}
      {state.kind === 'done' ? <AuditResult audit={state.audit} /> : null}
    </section>
  );
}

function Measure({ name, value, message, flagged, testId }: { name: string; value: number | null; message: string; flagged: boolean; testId: string }) {
  return (
    <tr className="border-b-[0.5px] border-rule" data-testid={testId} data-flagged={flagged ? 'true' : 'false'}>
      <th scope="row" className="py-1.5 pr-4 text-left font-normal">
        {name}
      </th>
      <td className="tabular py-1.5 pr-4 text-right">{value === null ? '—' : value.toFixed(3)}</td>
      <td className={`py-1.5 ${flagged ? 'text-danger' : 'text-graphite-soft'}`}>
        {flagged ? '⚑ ' : ''}
        {message}
      </td>
    </tr>
  );
}

function AuditResult({ audit }: { audit: ConfoundAudit }) {
  const c = audit.correlations;
  return (
    <div className="mt-4 space-y-6" data-testid="audit-result">
      <table className="w-full max-w-4xl text-sm">
        <tbody>
          <Measure name="Area, CV" value={audit.area.value} message={audit.area.message} flagged={audit.area.flagged} testId="audit-area" />
          <Measure name="Perimeter, CV" value={audit.perimeter.value} message={audit.perimeter.message} flagged={audit.perimeter.flagged} testId="audit-perimeter" />
          <Measure name="Compactness, CV" value={audit.compactness.value} message={audit.compactness.message} flagged={audit.compactness.flagged} testId="audit-compactness" />
          <Measure name="Design ~ contour (Spearman ρ)" value={c.designContour.value} message={c.designContour.message} flagged={c.designContour.flagged} testId="audit-design-contour" />
          <Measure name="Design ~ silhouette (Spearman ρ)" value={c.designSilhouette.value} message={c.designSilhouette.message} flagged={c.designSilhouette.flagged} testId="audit-design-silhouette" />
          <Measure name="Contour ~ silhouette (Spearman ρ)" value={c.contourSilhouette.value} message={c.contourSilhouette.message} flagged={c.contourSilhouette.flagged} testId="audit-contour-silhouette" />
          <Measure name="Spacing along lines, worst CV" value={audit.spacing.value} message={audit.spacing.message} flagged={audit.spacing.flagged} testId="audit-spacing" />
          <Measure name="Anisotropy index" value={audit.anisotropy.value} message={audit.anisotropy.message} flagged={audit.anisotropy.flagged} testId="audit-anisotropy" />
        </tbody>
      </table>
      <div className="grid max-w-3xl grid-cols-3 gap-4">
        <RdmHeatmap size={audit.rdms.design.size} values={audit.rdms.design.values} label="Designed distance" testId="rdm-design" />
        <RdmHeatmap size={audit.rdms.contour.size} values={audit.rdms.contour.values} label="Contour distance" testId="rdm-contour" />
        <RdmHeatmap size={audit.rdms.silhouette.size} values={audit.rdms.silhouette.values} label={`Silhouette distance (1 − IoU, ${audit.resolution}² px)`} testId="rdm-silhouette" />
      </div>
      <p className="text-xs text-graphite-muted">Each heatmap is scaled to its own maximum: darker is more different. Stimuli are in layout order.</p>
    </div>
  );
}
