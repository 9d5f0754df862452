'use client';

import { useMutation } from '@tanstack/react-query';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useMemo, useState } from 'react';
import { ApiError, apiFetch } from '@/lib/api-client';
import { SIDE_COLOURS, SIDE_NAMES, classify } from '@/lib/boundary-editor';
import { frozenPath } from '@/lib/edition-view';
import type { Edition, EditionComment, EditionSnapshotValue } from '@/lib/schemas/edition';
import { EditionStateBadge } from './edition-state-badge';
import { ShapePreview } from './shape-preview';
import { Button } from './ui/button';
import { Notice } from './ui/notice';

const DEG = 180 / Math.PI;
const textareaClass = 'mt-1 block w-full rounded-[3px] border-[0.5px] border-rule-strong bg-paper-raised px-2 py-1 text-sm font-normal';

export interface ReviewPermissions {
  submit: boolean;
  decide: boolean;
  comment: boolean;
  /** The viewer froze this edition (so may not decide on it). */
  isAuthor: boolean;
}

/**
 * The review of one edition: every frozen stimulus in a zoomable grid with an inspector, comments on the
 * edition or pinned to a stimulus, and the actions the viewer's role allows (send for review, approve, return).
 */
export function EditionReview({
  lab,
  edition,
  snapshot,
  comments,
  can,
}: {
  lab: string;
  edition: Edition;
  snapshot: EditionSnapshotValue;
  comments: EditionComment[];
  can: ReviewPermissions;
}) {
  const router = useRouter();
  const base = `/api/v1/labs/${lab}/spaces/${edition.spaceId}/editions/${edition.number}`;
  const [zoom, setZoom] = useState(72);
  const [selected, setSelected] = useState<string | null>(null);
  const [note, setNote] = useState('');
  const [body, setBody] = useState('');
  const [pin, setPin] = useState(true);
  const [onlySelected, setOnlySelected] = useState(false);
  const [error, setError] = useState<string | null>(null);

  const paths = useMemo(() => new Map(snapshot.stimuli.map((s) => [s.id, frozenPath(s)])), [snapshot]);
  const classification = useMemo(() => classify(snapshot.stimuli, snapshot.boundaries.map((b) => ({ ...b, prototypeDistance: b.prototypeDistance })), snapshot.definition.extent), [snapshot]);
  const pinned = useMemo(() => {
    const m = new Map<string, number>();
    for (const c of comments) if (c.stimulusId && !c.resolvedAt) m.set(c.stimulusId, (m.get(c.stimulusId) ?? 0) + 1);
    return m;
  }, [comments]);
  const index = snapshot.stimuli.findIndex((s) => s.id === selected);
  const chosen = index >= 0 ? snapshot.stimuli[index]! : null;
  const firstBoundary = snapshot.boundaries[0];

  const onError = (e: unknown) => setError(e instanceof ApiError || e instanceof Error ? e.message : 'Could not reach the server.');
  const refresh = () => {
    setError(null);
    router.refresh();
  };
  const submit = useMutation({ mutationFn: () => apiFetch(`${base}/submit`, { method: 'POST' }), onSuccess: refresh, onError });
  const decide = useMutation({
    mutationFn: (decision: 'approve' | 'return') => apiFetch(`${base}/decision`, { method: 'POST', body: { decision, note } }),
    onSuccess: () => {
      setNote('');
      refresh();
    },
    onError,
  });
  const post = useMutation({
    mutationFn: () => apiFetch(`${base}/comments`, { method: 'POST', body: { body, stimulusId: pin && selected ? selected : null } }),
    onSuccess: () => {
      setBody('');
      refresh();
    },
    onError,
  });
  const resolve = useMutation({
    mutationFn: (c: EditionComment) => apiFetch(`${base}/comments/${c.id}`, { method: 'PATCH', body: { resolved: !c.resolvedAt } }),
    onSuccess: refresh,
    onError,
  });

  const shown = onlySelected && selected ? comments.filter((c) => c.stimulusId === selected) : comments;

  return (
    <div className="space-y-6" data-testid="edition-review" data-state={edition.state}>
      <header className="space-y-2 border-b-[0.5px] border-rule pb-4">
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-semibold">
            {edition.spaceName}, edition {edition.number}
          </h1>
          <EditionStateBadge state={edition.state} testId="edition-state" />
        </div>
        <p className="tabular break-all text-xs text-graphite-soft">
          SHA-256 <span data-testid="edition-hash">{edition.contentHash}</span> · engine {edition.engineVersion} · {edition.stimulusCount} stimuli
        </p>
        <p className="text-sm">
          Frozen {edition.createdAt.slice(0, 16).replace('T', ' ')} by {edition.author?.name ?? '—'}
          {edition.changeNote ? <span className="text-graphite-soft"> — “{edition.changeNote}”</span> : null}
        </p>
        {edition.decidedAt ? (
          <p className="text-sm" data-testid="decision-note">
            {edition.state === 'approved' ? 'Approved' : 'Returned'} {edition.decidedAt.slice(0, 16).replace('T', ' ')} by {edition.decidedBy?.name ?? '—'}
            {edition.decisionNote ? <span className="text-graphite-soft"> — “{edition.decisionNote}”</span> : null}
          </p>
        ) : null}
        {edition.supersededBy ? (
          <p className="text-sm">
            Superseded by{' '}
            <Link href={`/labs/${lab}/spaces/${edition.spaceId}/editions/${edition.supersededBy}`} className="text-accent underline underline-offset-2">
              edition {edition.supersededBy}
            </Link>
            .
          </p>
        ) : null}
        {edition.state !== 'approved' ? <Notice tone="caution">Not approved: studies and packs made from this edition will say so.</Notice> : null}
      </header>

      {error ? (
        <Notice tone="error" testId="review-error">
          {error}
        </Notice>
      ) : null}

      {edition.state === 'draft' && can.submit ? (
        <div className="flex flex-wrap items-center gap-3">
          <Button onClick={() => submit.mutate()} disabled={submit.isPending} data-testid="submit-edition">
            {submit.isPending ? 'Sending…' : 'Send for review'}
          </Button>
          <span className="text-sm text-graphite-soft">The lab’s reviewers get an e-mail.</span>
        </div>
      ) : null}
      {edition.state === 'in_review' && can.decide ? (
        <section className="max-w-2xl space-y-2 border-[0.5px] border-rule p-4 text-sm" aria-labelledby="decision-heading" data-testid="decision-panel">
          <h2 id="decision-heading" className="text-base font-semibold">
            Your decision
          </h2>
          <label className="block font-medium">
            Note to the author (needed to return)
            <textarea value={note} onChange={(e) => setNote(e.target.value)} rows={3} maxLength={4000} className={textareaClass} data-testid="decision-note-input" />
          </label>
          <div className="flex gap-2">
            <Button onClick={() => decide.mutate('approve')} disabled={decide.isPending} data-testid="approve-edition">
              Approve
            </Button>
            <Button variant="danger" onClick={() => decide.mutate('return')} disabled={decide.isPending || !note.trim()} data-testid="return-edition">
              Return with note
            </Button>
          </div>
        </section>
      ) : null}
      {edition.state === 'in_review' && can.isAuthor ? <p className="text-sm text-graphite-soft">You froze this edition, so another reviewer decides on it.</p> : null}

      <div className="grid gap-8 xl:grid-cols-[1fr_24rem]">
        <section className="space-y-3" aria-labelledby="grid-heading">
          <div className="flex flex-wrap items-center gap-4">
            <h2 id="grid-heading" className="text-base font-semibold">
              The whole set
            </h2>
            <label className="flex items-center gap-2 text-sm">
              Zoom
              <input type="range" min={40} max={160} step={8} value={zoom} onChange={(e) => setZoom(Number(e.target.value))} className="h-6 w-40 accent-accent" data-testid="grid-zoom" />
            </label>
            {firstBoundary ? (
              <span className="text-xs text-graphite-soft">
                Coloured by {firstBoundary.label || firstBoundary.key}: <span style={{ color: SIDE_COLOURS.A }}>■</span> side A, <span style={{ color: SIDE_COLOURS.B }}>■</span> side B
              </span>
            ) : null}
          </div>
          <ul className="flex flex-wrap gap-1" data-testid="edition-grid">
            {snapshot.stimuli.map((s, i) => {
              const side = classification?.[i]?.placements[0]?.side;
              const d = paths.get(s.id);
              return (
                <li key={s.id}>
                  <button
                    type="button"
                    onClick={() => setSelected(s.id)}
                    aria-pressed={s.id === selected}
                    aria-label={`Stimulus ${s.id}${pinned.get(s.id) ? `, ${pinned.get(s.id)} open comments` : ''}`}
                    className={`relative block border-[0.5px] ${s.id === selected ? 'border-accent bg-accent-soft' : 'border-rule'} ${s.kind === 'prototype' ? 'border-dashed' : ''}`}
                    data-testid={`grid-stimulus-${s.id}`}
                  >
                    {d ? <ShapePreview paths={[{ d, fill: side ? SIDE_COLOURS[side] : '#23262B' }]} size={zoom} extent={1.6} label={s.id} /> : <span className="block text-xs text-danger">✕</span>}
                    {pinned.get(s.id) ? <span className="absolute right-0.5 top-0.5 h-2 w-2 rounded-full bg-caution" aria-hidden="true" /> : null}
                    {zoom >= 88 ? <span className="tabular block text-center text-[10px] text-graphite-muted">{s.id}</span> : null}
                  </button>
                </li>
              );
            })}
          </ul>
        </section>

        <aside className="space-y-6">
          {chosen ? (
            <section className="space-y-2 border-[0.5px] border-rule bg-paper-raised p-4 text-sm" aria-label={`Stimulus ${chosen.id}`} data-testid="edition-inspector">
              {paths.get(chosen.id) ? <ShapePreview paths={[{ d: paths.get(chosen.id)!, fill: '#23262B' }]} size={200} label={`Stimulus ${chosen.id} enlarged`} /> : null}
              <p>
                <span className="tabular font-medium" data-testid="edition-inspector-id">
                  {chosen.id}
                </span>{' '}
                {chosen.kind === 'prototype' ? <span className="text-xs text-graphite-soft">prototype of {chosen.prototypeOf?.boundaryKey}, side {chosen.prototypeOf?.side}</span> : null}
              </p>
              <p className="tabular text-xs text-graphite-soft">
                a = {chosen.position.a.toFixed(3)}, b = {chosen.position.b.toFixed(3)} · ρ = {chosen.polar.rho.toFixed(3)}, θ = {(chosen.polar.angle * DEG).toFixed(1)}°
              </p>
              <ul className="tabular text-xs">
                {(classification?.[index]?.placements ?? []).map((p, i) => (
                  <li key={p.boundaryKey}>
                    <span style={{ color: SIDE_COLOURS[p.side] }}>■</span> {snapshot.boundaries[i]?.label || p.boundaryKey}: {SIDE_NAMES[p.side]}, {p.distance.toFixed(3)} ({p.fraction.toFixed(3)} ρmax)
                    {p.isAmbiguous ? <strong className="ml-1 text-caution">ambiguous</strong> : null}
                  </li>
                ))}
              </ul>
            </section>
          ) : (
            <p className="text-sm text-graphite-muted">Choose a stimulus in the grid to inspect it or pin a comment to it.</p>
          )}

          <section className="space-y-3 text-sm" aria-labelledby="comments-heading" data-testid="comments-panel">
            <div className="flex flex-wrap items-center gap-3">
              <h2 id="comments-heading" className="text-base font-semibold">
                Comments
              </h2>
              {selected ? (
                <label className="flex items-center gap-2 text-xs">
                  <input type="checkbox" checked={onlySelected} onChange={(e) => setOnlySelected(e.target.checked)} />
                  only on {selected}
                </label>
              ) : null}
            </div>
            {shown.length === 0 ? <p className="text-graphite-muted">No comments.</p> : null}
            <ul className="space-y-2">
              {shown.map((c) => (
                <li key={c.id} className={`border-l-2 pl-3 ${c.resolvedAt ? 'border-rule text-graphite-muted' : 'border-caution'}`} data-testid="comment">
                  <p className="text-xs text-graphite-soft">
                    {c.author?.name ?? '—'} · {c.createdAt.slice(0, 16).replace('T', ' ')}
                    {c.stimulusId ? (
                      <>
                        {' '}
                        · on{' '}
                        <button type="button" className="tabular text-accent underline underline-offset-2" onClick={() => setSelected(c.stimulusId)}>
                          {c.stimulusId}
                        </button>
                      </>
                    ) : ' · on the edition'}
                    {c.resolvedAt ? ` · resolved by ${c.resolvedBy?.name ?? '—'}` : ''}
                  </p>
                  <p className="whitespace-pre-wrap">{c.body}</p>
                  {can.comment ? (
                    <button type="button" className="text-xs text-accent underline underline-offset-2" onClick={() => resolve.mutate(c)} data-testid="resolve-comment">
                      {c.resolvedAt ? 'Reopen' : 'Mark resolved'}
                    </button>
                  ) : null}
                </li>
              ))}
            </ul>
            {can.comment ? (
              <form
                className="space-y-2"
                onSubmit={(e) => {
                  e.preventDefault();
                  if (body.trim()) post.mutate();
                }}
              >
                <label className="block font-medium">
                  Add a comment
                  <textarea value={body} onChange={(e) => setBody(e.target.value)} rows={3} maxLength={4000} className={textareaClass} data-testid="comment-body" />
                </label>
                {selected ? (
                  <label className="flex items-center gap-2 text-xs">
                    <input type="checkbox" checked={pin} onChange={(e) => setPin(e.target.checked)} data-testid="comment-pin" />
                    pin to stimulus {selected}
                  </label>
                ) : null}
                <Button type="submit" variant="quiet" disabled={post.isPending || !body.trim()} data-testid="post-comment">
                  Post comment
                </Button>
              </form>
            ) : null}
          </section>
        </aside>
      </div>
    </div>
  );
}
