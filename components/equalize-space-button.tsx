'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { apiFetch, ApiError } from '@/lib/api-client';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

/** One click: a new space from the study's equalisation suggestion, then its page. The name can be changed first. */
export function EqualizeSpaceButton({ lab, studyId, basis, defaultName }: { lab: string; studyId: string; basis: 'slopes' | 'map'; defaultName: string }) {
  const router = useRouter();
  const [name, setName] = useState(defaultName);
  const create = useMutation({
    mutationFn: () => apiFetch<{ space: { id: string } }>(`/api/v1/labs/${lab}/studies/${studyId}/similarity/equalize`, { method: 'POST', body: { basis, name } }),
    onSuccess: (made) => router.push(`/labs/${lab}/spaces/${made.space.id}`),
  });
  const fieldError = create.error instanceof ApiError ? create.error.fields.name?.[0] : undefined;
  return (
    <div className="space-y-2">
      <label className="block text-sm">
        <span className="mb-1 block text-graphite-soft">Name of the new space</span>
        <input
          value={name}
          onChange={(e) => setName(e.target.value)}
          maxLength={80}
          aria-invalid={fieldError ? true : undefined}
          className="h-9 w-full max-w-md rounded-[3px] border-[0.5px] border-rule-strong bg-paper px-2"
          data-testid={`equalize-name-${basis}`}
        />
      </label>
      <Button onClick={() => create.mutate()} disabled={create.isPending || name.trim() === ''} data-testid={`equalize-${basis}`}>
        {create.isPending ? 'Creating the space…' : 'Create the equalised space'}
      </Button>
      {create.error ? <Notice tone="error" testId={`equalize-error-${basis}`}>{create.error.message}</Notice> : null}
    </div>
  );
}
