'use client';

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import Link from 'next/link';
import { useState } from 'react';
import { apiFetch } from '@/lib/api-client';
import type { Page } from '@/lib/schemas/common';
import { PACK_STATE_LABELS, type PackValue } from '@/lib/schemas/pack';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

const ACTIVE = new Set(['queued', 'running']);

function megabytes(bytes: number | null): string {
  if (bytes === null) return '—';
  return bytes < 2 ** 20 ? `${(bytes / 1024).toFixed(0)} KB` : `${(bytes / 2 ** 20).toFixed(1)} MB`;
}

/** The lab's packs, refreshed every second while any is waiting or building (no reload needed). */
export function PacksTable({ lab, initial, canCreate, highlight }: { lab: string; initial: Page<PackValue>; canCreate: boolean; highlight: string | null }) {
  const client = useQueryClient();
  const key = ['packs', lab];
  const { data } = useQuery({
    queryKey: key,
    queryFn: () => apiFetch<Page<PackValue>>(`/api/v1/labs/${lab}/packs?limit=100`),
    initialData: initial,
    refetchInterval: (q) => (q.state.data?.items.some((p) => ACTIVE.has(p.state)) ? 1000 : false),
  });
  const [error, setError] = useState<string | null>(null);
  const act = useMutation({
    mutationFn: ({ pack, action }: { pack: PackValue; action: 'cancel' | 'retry' }) => apiFetch(`/api/v1/labs/${lab}/packs/${pack.id}/${action}`, { method: 'POST' }),
    onSuccess: () => {
      setError(null);
      void client.invalidateQueries({ queryKey: key });
    },
    onError: (e) => setError(e.message),
  });
  const download = useMutation({
    mutationFn: (pack: PackValue) => apiFetch<{ url: string }>(`/api/v1/labs/${lab}/packs/${pack.id}/download-link`, { method: 'POST' }),
    onSuccess: (link) => window.location.assign(link.url),
    onError: (e) => setError(e.message),
  });

  const packs = data.items;
  if (packs.length === 0) return <p className="text-graphite-muted">No packs yet. Make one from an edition’s page.</p>;
  return (
    <div className="space-y-3">
      {error ? (
        <Notice tone="error" testId="packs-error">
          {error}
        </Notice>
      ) : null}
      <table className="w-full border-collapse text-sm" data-testid="packs-table">
        <thead>
          <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
            <th scope="col" className="py-2 pr-4 font-medium">Edition</th>
            <th scope="col" className="py-2 pr-4 font-medium">Drawn for</th>
            <th scope="col" className="py-2 pr-4 font-medium">State</th>
            <th scope="col" className="py-2 pr-4 font-medium">Size</th>
            <th scope="col" className="py-2 pr-4 font-medium">Made</th>
            <th scope="col" className="py-2 pr-4 font-medium">
              <span className="sr-only">Actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {packs.map((p) => (
            <tr key={p.id} className={`border-b-[0.5px] border-rule align-top ${p.id === highlight ? 'bg-accent-soft' : ''}`} data-testid={`pack-row-${p.id}`} data-state={p.state}>
              <td className="py-2 pr-4">
                <Link href={`/labs/${lab}/spaces/${p.edition.spaceId}/editions/${p.edition.number}`} className="text-accent underline underline-offset-2">
                  {p.edition.spaceName}, edition {p.edition.number}
                </Link>
                {p.edition.state !== 'approved' ? <span className="block text-xs text-caution">edition not approved</span> : null}
              </td>
              <td className="tabular py-2 pr-4 text-xs">
                {p.profile.name}
                <span className="block text-graphite-muted">
                  {p.render.sizeDeg}° {p.render.sizeMeasure === 'max-extent' ? 'max extent' : 'equal-area diameter'}, {p.render.style}
                </span>
              </td>
              <td className="py-2 pr-4">
                <span className="text-xs font-medium" data-testid="pack-state">
                  {PACK_STATE_LABELS[p.state]}
                  {p.cancelRequested && p.state === 'running' ? ' (stopping…)' : ''}
                </span>
                {ACTIVE.has(p.state) ? (
                  <div
                    role="progressbar"
                    aria-label={`Progress of ${p.edition.spaceName}, edition ${p.edition.number}`}
                    aria-valuemin={0}
                    aria-valuemax={100}
                    aria-valuenow={Math.round(p.progress * 100)}
                    className="mt-1 h-2 w-40 overflow-hidden rounded-full bg-paper-deep"
                    data-testid="pack-progress"
                  >
                    <div className="h-full bg-accent transition-[width]" style={{ width: `${Math.round(p.progress * 100)}%` }} />
                  </div>
                ) : null}
                {ACTIVE.has(p.state) ? (
                  <span className="tabular block text-xs text-graphite-muted">
                    {Math.round(p.progress * 100)} % · {p.stage}
                  </span>
                ) : null}
                {p.error ? (
                  <span className="mt-1 block max-w-xs text-xs text-danger" data-testid="pack-error">
                    {p.error}
                  </span>
                ) : null}
              </td>
              <td className="tabular py-2 pr-4 text-xs">
                {megabytes(p.sizeBytes)}
                {p.sha256 ? <span className="block text-graphite-muted" title={p.sha256}>SHA-256 {p.sha256.slice(0, 10)}…</span> : null}
              </td>
              <td className="tabular py-2 pr-4 text-xs">
                {p.createdAt.slice(0, 16).replace('T', ' ')}
                <span className="block text-graphite-muted">{p.createdBy ?? '—'}</span>
              </td>
              <td className="space-x-1 space-y-1 py-2 pr-0 text-right">
                {p.state === 'succeeded' ? (
                  <>
                    <Button size="sm" onClick={() => download.mutate(p)} disabled={download.isPending} data-testid="pack-download">
                      Download
                    </Button>
                    <Link href={`/labs/${lab}/packs/${p.id}`} className="inline-flex h-7 items-center px-2 text-xs text-accent underline underline-offset-2" data-testid="pack-manifest-link">
                      Manifest
                    </Link>
                  </>
                ) : null}
                {canCreate && ACTIVE.has(p.state) ? (
                  <Button size="sm" variant="quiet" onClick={() => act.mutate({ pack: p, action: 'cancel' })} disabled={act.isPending || p.cancelRequested} data-testid="pack-cancel">
                    Cancel
                  </Button>
                ) : null}
                {canCreate && (p.state === 'failed' || p.state === 'cancelled') ? (
                  <Button size="sm" variant="quiet" onClick={() => act.mutate({ pack: p, action: 'retry' })} disabled={act.isPending} data-testid="pack-retry">
                    Retry
                  </Button>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
