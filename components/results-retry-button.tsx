'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { apiFetch } from '@/lib/api-client';
import { Button } from './ui/button';

/** Computes failed results again. */
export function ResultsRetryButton({ lab, studyId }: { lab: string; studyId: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <Button
      variant="quiet"
      disabled={busy}
      data-testid="results-retry"
      onClick={async () => {
        setBusy(true);
        await apiFetch(`/api/v1/labs/${lab}/studies/${studyId}/results/retry`, { method: 'POST' }).catch(() => undefined);
        setBusy(false);
        router.refresh();
      }}
    >
      Compute again
    </Button>
  );
}
