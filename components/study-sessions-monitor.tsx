'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { createColumnHelper, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { apiFetch } from '@/lib/api-client';
import type { Page } from '@/lib/schemas/common';
import type { StudySessionValue } from '@/lib/schemas/participant-session';
import { Button } from './ui/button';
import { DataTable } from './ui/data-table';
import { Notice } from './ui/notice';

const column = createColumnHelper<StudySessionValue>();
/** How often the monitor asks for new figures while the page is open. */
const POLL_MS = 3000;
const when = (iso: string | null) => (iso ? iso.slice(0, 16).replace('T', ' ') : '—');

/** The live monitor of a study's participant sessions: figures per session, exclusion with a reason, CSV. */
export function StudySessionsMonitor({ lab, studyId, initial, canManage }: { lab: string; studyId: string; initial: Page<StudySessionValue>; canManage: boolean }) {
  const client = useQueryClient();
  const key = ['study-sessions', lab, studyId];
  const base = `/api/v1/labs/${lab}/studies/${studyId}`;
  const { data } = useQuery({ queryKey: key, queryFn: () => apiFetch<Page<StudySessionValue>>(`${base}/sessions?limit=200`), initialData: initial, refetchInterval: POLL_MS });
  const [sorting, setSorting] = useState<SortingState>([{ id: 'startedAt', desc: true }]);
  const [editing, setEditing] = useState<{ id: string; reason: string } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const done = () => {
    setError(null);
    setEditing(null);
    void client.invalidateQueries({ queryKey: key });
  };
  const exclude = useMutation({
    mutationFn: (v: { id: string; isExcluded: boolean; reason: string }) =>
      apiFetch(`${base}/sessions/${v.id}`, { method: 'PATCH', body: { isExcluded: v.isExcluded, reason: v.reason } }),
    onSuccess: done,
    onError: (e) => setError(e.message),
  });
  const remove = useMutation({ mutationFn: (id: string) => apiFetch(`${base}/sessions/${id}`, { method: 'DELETE' }), onSuccess: done, onError: (e) => setError(e.message) });

  const columns = useMemo(
    () => [
      column.accessor('participant', { header: 'Participant', cell: (c) => <span className="tabular">{c.getValue()}</span> }),
      column.accessor('startedAt', { header: 'Started', cell: (c) => <span className="tabular text-xs">{when(c.getValue())}</span> }),
      column.accessor('lastSeenAt', { header: 'Last seen', cell: (c) => <span className="tabular text-xs">{when(c.getValue())}</span> }),
      column.accessor((s) => s.stored / s.planned, {
        id: 'progress',
        header: 'Trials stored',
        cell: (c) => <span className="tabular" data-testid="session-stored">{c.row.original.stored} / {c.row.original.planned}</span>,
      }),
      column.accessor('catchAccuracy', { header: 'Catch accuracy', cell: (c) => <span className="tabular">{c.getValue() === null ? '—' : `${Math.round(c.getValue()! * 100)} %`}</span> }),
      column.accessor('medianRtMs', { header: 'Median RT', cell: (c) => <span className="tabular">{c.getValue() === null ? '—' : `${Math.round(c.getValue()!)} ms`}</span> }),
      column.accessor('completedAt', {
        header: 'Completed',
        cell: (c) => {
          const s = c.row.original;
          return <span data-testid="session-status">{s.withdrawnAt ? 'Withdrawn' : s.completedAt ? `Yes, ${when(s.completedAt)}` : 'In progress'}</span>;
        },
      }),
      column.display({
        id: 'flags',
        header: 'Flags',
        cell: (c) => {
          const s = c.row.original;
          const flags = [s.tabHiddenTrials ? `tab hidden in ${s.tabHiddenTrials}` : null, s.fullScreenLeftTrials ? `left full screen in ${s.fullScreenLeftTrials}` : null, s.isExcluded ? `excluded: ${s.exclusionReason}` : null].filter(Boolean);
          return <span className="text-xs">{flags.length ? flags.join('; ') : '—'}</span>;
        },
      }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (c) => {
          const s = c.row.original;
          if (!canManage) return null;
          if (s.withdrawnAt) return <Button size="sm" variant="danger" onClick={() => remove.mutate(s.id)} data-testid="session-delete">Delete</Button>;
          if (s.isExcluded) return <Button size="sm" variant="quiet" onClick={() => exclude.mutate({ id: s.id, isExcluded: false, reason: '' })} data-testid="session-include">Include</Button>;
          return <Button size="sm" variant="quiet" onClick={() => setEditing({ id: s.id, reason: '' })} data-testid="session-exclude">Exclude…</Button>;
        },
      }),
    ],
    [canManage, exclude, remove],
  );
  const table = useReactTable({ data: data.items, columns, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });
  const complete = data.items.filter((s) => s.completedAt && !s.withdrawnAt).length;

  return (
    <section aria-labelledby="sessions-heading" className="space-y-3">
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="sessions-heading" className="text-lg font-semibold">Participant sessions</h2>
        <p className="tabular text-sm text-graphite-soft" data-testid="sessions-summary">{data.items.length} started · {complete} complete · refreshed every {POLL_MS / 1000} s</p>
        <span className="flex gap-3 text-sm">
          <a href={`${base}/trials/csv`} className="text-accent underline underline-offset-2" data-testid="trials-csv">Trials as CSV</a>
          <a href={`${base}/trials`} className="text-accent underline underline-offset-2">as JSON</a>
        </span>
      </div>
      {error ? <Notice tone="error" testId="sessions-error">{error}</Notice> : null}
      {editing ? (
        <form
          className="flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            exclude.mutate({ id: editing.id, isExcluded: true, reason: editing.reason });
          }}
        >
          <label className="text-sm">
            <span className="block">Why is this session excluded?</span>
            <input value={editing.reason} onChange={(e) => setEditing({ ...editing, reason: e.target.value })} className="w-80 border border-rule-strong px-2 py-1" data-testid="exclusion-reason" />
          </label>
          <Button type="submit" size="sm" data-testid="exclusion-save">Exclude</Button>
          <Button size="sm" variant="quiet" onClick={() => setEditing(null)}>Cancel</Button>
        </form>
      ) : null}
      {data.items.length === 0 ? <p className="text-graphite-muted">No participant has started yet.</p> : <DataTable table={table} testId="sessions-table" rowTestId={(r) => `session-row-${r.original.participant}`} dense />}
    </section>
  );
}
