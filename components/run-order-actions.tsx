'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { apiFetch } from '@/lib/api-client';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

/** Download the run order's zip (BIDS events files and sidecars) and, for those who may, delete it. */
export function RunOrderActions({ lab, id, isReady, canDelete, backHref }: { lab: string; id: string; isReady: boolean; canDelete: boolean; backHref: string }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const remove = useMutation({
    mutationFn: () => apiFetch<void>(`/api/v1/labs/${lab}/run-orders/${id}`, { method: 'DELETE' }),
    onSuccess: () => {
      router.push(backHref);
      router.refresh();
    },
  });
  return (
    <div className="flex flex-wrap items-center gap-3 text-sm">
      {isReady ? (
        <a href={`/api/v1/labs/${lab}/run-orders/${id}/download`} download className="inline-flex h-9 items-center rounded-[3px] bg-accent px-4 font-medium text-white hover:bg-accent-strong" data-testid="download-run-order">
          Download the events files (zip)
        </a>
      ) : null}
      {canDelete && !confirming ? (
        <Button variant="danger" onClick={() => setConfirming(true)} data-testid="delete-run-order">
          Delete
        </Button>
      ) : null}
      {confirming ? (
        <>
          <span>Delete this run order? Packs that carry its files keep them.</span>
          <Button variant="danger" onClick={() => remove.mutate()} disabled={remove.isPending} data-testid="confirm-delete-run-order">
            Delete it
          </Button>
          <Button variant="quiet" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </>
      ) : null}
      {remove.error ? <Notice tone="error">{remove.error.message}</Notice> : null}
    </div>
  );
}
