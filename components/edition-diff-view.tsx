'use client';

import { useMemo, useState } from 'react';
import { frozenPath } from '@/lib/edition-view';
import type { EditionDiffValue } from '@/lib/schemas/edition';
import { ShapePreview } from './shape-preview';
import { Button } from './ui/button';

const SHOWN = 48;

function show(value: unknown): string {
  if (value === undefined) return '—';
  const text = typeof value === 'number' ? String(Number(value.toPrecision(10))) : JSON.stringify(value);
  return text.length > 80 ? `${text.slice(0, 77)}…` : text;
}

/** The differences between two editions: parameter rows, then stimuli added, removed and changed (matched by id). */
export function EditionDiffView({ diff }: { diff: EditionDiffValue }) {
  const [all, setAll] = useState(false);
  const changed = all ? diff.changed : diff.changed.slice(0, SHOWN);
  const paths = useMemo(() => {
    const m = new Map<string, string | null>();
    for (const c of changed) {
      m.set(`before:${c.id}`, frozenPath(c.before));
      m.set(`after:${c.id}`, frozenPath(c.after));
    }
    for (const s of diff.added) m.set(`after:${s.id}`, frozenPath(s));
    for (const s of diff.removed) m.set(`before:${s.id}`, frozenPath(s));
    return m;
  }, [changed, diff.added, diff.removed]);

  return (
    <div className="space-y-8" data-testid="edition-diff">
      <p className="tabular text-sm" data-testid="diff-summary">
        {diff.parameters.length} parameter changes · {diff.added.length} stimuli added · {diff.removed.length} removed · {diff.changed.length} changed · {diff.unchangedCount} unchanged
      </p>
      <section aria-labelledby="params-heading">
        <h2 id="params-heading" className="mb-2 text-base font-semibold">
          Parameters
        </h2>
        {diff.parameters.length === 0 ? (
          <p className="text-sm text-graphite-muted">No parameter changed.</p>
        ) : (
          <table className="w-full border-collapse text-sm" data-testid="diff-parameters">
            <thead>
              <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
                <th scope="col" className="py-2 pr-4 font-medium">Where</th>
                <th scope="col" className="py-2 pr-4 font-medium">Edition {diff.from}</th>
                <th scope="col" className="py-2 pr-4 font-medium">Edition {diff.to}</th>
              </tr>
            </thead>
            <tbody>
              {diff.parameters.map((p) => (
                <tr key={p.path} className="border-b-[0.5px] border-rule">
                  <td className="tabular py-1.5 pr-4 text-xs">{p.path}</td>
                  <td className="tabular py-1.5 pr-4 text-xs">{show(p.before)}</td>
                  <td className="tabular py-1.5 pr-4 text-xs">{show(p.after)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>

      {(['added', 'removed'] as const).map((kind) =>
        diff[kind].length ? (
          <section key={kind} aria-labelledby={`${kind}-heading`}>
            <h2 id={`${kind}-heading`} className="mb-2 text-base font-semibold">
              {kind === 'added' ? `Added in edition ${diff.to}` : `Removed since edition ${diff.from}`} ({diff[kind].length})
            </h2>
            <ul className="flex flex-wrap gap-2" data-testid={`diff-${kind}`}>
              {diff[kind].map((s) => {
                const d = paths.get(`${kind === 'added' ? 'after' : 'before'}:${s.id}`);
                return (
                  <li key={s.id} className="border-[0.5px] border-rule p-1 text-center">
                    {d ? <ShapePreview paths={[{ d, fill: '#23262B' }]} size={64} extent={1.6} label={s.id} /> : null}
                    <span className="tabular block text-[10px]">{s.id}</span>
                  </li>
                );
              })}
            </ul>
          </section>
        ) : null,
      )}

      <section aria-labelledby="changed-heading">
        <h2 id="changed-heading" className="mb-2 text-base font-semibold">
          Changed ({diff.changed.length})
        </h2>
        <p className="mb-3 text-xs text-graphite-soft">
          Each pair: edition {diff.from} (dashed outline) and edition {diff.to} (filled), overlaid at the same scale.
        </p>
        <ul className="grid grid-cols-[repeat(auto-fill,minmax(13rem,1fr))] gap-3" data-testid="diff-changed">
          {changed.map((c) => {
            const before = paths.get(`before:${c.id}`);
            const after = paths.get(`after:${c.id}`);
            return (
              <li key={c.id} className="border-[0.5px] border-rule p-2" data-testid={`diff-changed-${c.id}`}>
                <div className="flex gap-1">
                  {before ? <ShapePreview paths={[{ d: before, fill: '#8A8780' }]} size={64} extent={1.6} label={`${c.id} in edition ${diff.from}`} /> : null}
                  {after ? <ShapePreview paths={[{ d: after, fill: '#23262B' }]} size={64} extent={1.6} label={`${c.id} in edition ${diff.to}`} /> : null}
                  {before && after ? (
                    <ShapePreview
                      paths={[
                        { d: after, fill: '#0072B2' },
                        { d: before, stroke: '#D55E00', strokeWidth: 0.07, dashed: true },
                      ]}
                      size={64}
                      extent={1.6}
                      label={`${c.id}, both outlines overlaid`}
                    />
                  ) : null}
                </div>
                <p className="tabular mt-1 text-xs">
                  {c.id}: {c.fields.join(' and ')}
                </p>
              </li>
            );
          })}
        </ul>
        {diff.changed.length > SHOWN && !all ? (
          <Button variant="quiet" size="sm" className="mt-3" onClick={() => setAll(true)}>
            Show all {diff.changed.length}
          </Button>
        ) : null}
      </section>
    </div>
  );
}
