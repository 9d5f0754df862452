'use client';

import { useMutation } from '@tanstack/react-query';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { apiFetch } from '@/lib/api-client';
import type { StudyValue } from '@/lib/schemas/study';
import { EthicsNotice } from './study-notices';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

/** Open (with a confirm step naming the ethics approval), close, and the invite link with rotate and revoke. */
export function StudyLifecycle({ lab, study, canEdit }: { lab: string; study: StudyValue; canEdit: boolean }) {
  const router = useRouter();
  const base = `/api/v1/labs/${lab}/studies/${study.id}`;
  const [isConfirming, setConfirming] = useState(false);
  const [isConfirmed, setConfirmed] = useState(false);
  const [copied, setCopied] = useState(false);
  const act = useMutation({
    mutationFn: (a: { path: string; method: string; body?: unknown }) => apiFetch<StudyValue>(`${base}${a.path}`, { method: a.method, body: a.body }),
    onSuccess: () => {
      setConfirming(false);
      router.refresh();
    },
  });

  return (
    <section aria-labelledby="lifecycle-heading" className="space-y-3 border-[0.5px] border-rule p-4 text-sm" data-testid="study-lifecycle">
      <h2 id="lifecycle-heading" className="text-base font-semibold">
        Participants
      </h2>
      {study.state === 'draft' ? (
        <>
          <p className="text-graphite-soft">While the study is a Draft nobody can join. Opening it fixes the design and makes an invite link.</p>
          {canEdit && !isConfirming ? (
            <Button onClick={() => setConfirming(true)} data-testid="open-study">
              Open the study…
            </Button>
          ) : null}
          {isConfirming ? (
            <div className="space-y-3" role="group" aria-labelledby="confirm-open-heading" data-testid="confirm-open">
              <h3 id="confirm-open-heading" className="font-semibold">
                Open “{study.name}”?
              </h3>
              <EthicsNotice testId="ethics-notice-open" />
              <p>The design (edition, tasks, timing, seed) can no longer change once the study is open; its name, texts and target still can.</p>
              <label className="flex items-start gap-2">
                <input type="checkbox" checked={isConfirmed} onChange={(e) => setConfirmed(e.target.checked)} className="mt-0.5" data-testid="confirm-ethics" />
                <span>Our ethics board has approved this study, and every participant will give informed consent.</span>
              </label>
              <div className="flex gap-2">
                <Button disabled={!isConfirmed || act.isPending} onClick={() => act.mutate({ path: '/open', method: 'POST', body: { confirmEthics: true } })} data-testid="confirm-open-study">
                  Open the study
                </Button>
                <Button variant="quiet" onClick={() => setConfirming(false)}>
                  Cancel
                </Button>
              </div>
            </div>
          ) : null}
        </>
      ) : null}
      {study.state === 'open' ? (
        <>
          {study.inviteUrl ? (
            <div className="space-y-2">
              <label htmlFor="invite-link" className="block font-medium">
                Invite link
              </label>
              <div className="flex flex-wrap gap-2">
                <input id="invite-link" readOnly value={study.inviteUrl} className="tabular h-9 min-w-0 flex-1 rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 text-xs" data-testid="invite-url" />
                <Button
                  variant="quiet"
                  onClick={() => {
                    void navigator.clipboard?.writeText(study.inviteUrl ?? '').then(() => setCopied(true));
                  }}
                >
                  {copied ? 'Copied' : 'Copy'}
                </Button>
              </div>
              <p className="text-xs text-graphite-muted">Anyone with the link can take part. Make a new link if it was shared too widely; the old one stops working.</p>
            </div>
          ) : (
            <Notice tone="caution" testId="invite-revoked">
              The invite link was revoked: nobody new can join until you make a new one.
            </Notice>
          )}
          {canEdit ? (
            <div className="flex flex-wrap gap-2">
              <Button variant="quiet" onClick={() => act.mutate({ path: '/invite', method: 'POST' })} data-testid="rotate-invite">
                {study.inviteUrl ? 'Make a new link' : 'Make a link'}
              </Button>
              {study.inviteUrl ? (
                <Button variant="danger" onClick={() => act.mutate({ path: '/invite', method: 'DELETE' })} data-testid="revoke-invite">
                  Revoke the link
                </Button>
              ) : null}
              <Button variant="quiet" onClick={() => act.mutate({ path: '/close', method: 'POST' })} data-testid="close-study">
                Close the study
              </Button>
            </div>
          ) : null}
        </>
      ) : null}
      {study.state === 'closed' ? <p className="text-graphite-soft">This study is closed: nobody new can join. Its design and data stay as they are.</p> : null}
      {act.error ? <Notice tone="error">{act.error.message}</Notice> : null}
    </section>
  );
}
