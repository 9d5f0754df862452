import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { EditionReview } from '@/components/edition-review';
import { MakePackForm } from '@/components/make-pack-form';
import { listDisplayProfiles } from '@/lib/server/services/display-profiles';
import { getDb } from '@/lib/server/db';
import { orNotFound, requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { getEdition, getEditionSnapshot, listComments } from '@/lib/server/services/editions';
import { listRunOrders } from '@/lib/server/services/run-orders';

export const metadata: Metadata = { title: 'Edition review' };

export default async function EditionPage({ params }: { params: Promise<{ lab: string; spaceId: string; number: string }> }) {
  const { lab, spaceId, number: raw } = await params;
  const number = Number(raw);
  requireUuidSegment(spaceId);
  if (!Number.isInteger(number) || number < 1) notFound();
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/spaces/${spaceId}/editions/${number}`);
  const db = getDb();
  const [edition, snapshot, comments] = await orNotFound(Promise.all([
    getEdition(db, actor, spaceId, number),
    getEditionSnapshot(db, actor, spaceId, number),
    listComments(db, actor, spaceId, number),
  ]));
  const isAuthor = edition.author?.id === actor.userId;
  const canPack = can(actor.role, 'pack:create');
  const profiles = canPack ? (await listDisplayProfiles(db, actor, { limit: 200 })).items : [];
  const runOrders = canPack ? (await listRunOrders(db, actor, spaceId, number, { limit: 100 })).items.filter((o) => o.state === 'ready').map((o) => ({ id: o.id, name: o.name })) : [];
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/spaces`} className="text-accent underline underline-offset-2">
          Shape spaces
        </Link>{' '}
        /{' '}
        <Link href={`/labs/${lab}/spaces/${spaceId}`} className="text-accent underline underline-offset-2">
          {edition.spaceName}
        </Link>{' '}
        /{' '}
        <Link href={`/labs/${lab}/spaces/${spaceId}/editions`} className="text-accent underline underline-offset-2">
          Editions
        </Link>{' '}
        / {number}
        <span className="ml-4">
          <Link href={`/labs/${lab}/spaces/${spaceId}/editions/${number}/run-orders`} className="text-accent underline underline-offset-2" data-testid="edition-run-orders">
            Run orders
          </Link>
        </span>
      </p>
      <EditionReview
        lab={lab}
        edition={edition}
        snapshot={snapshot}
        comments={comments}
        can={{ submit: can(actor.role, 'edition:submit'), decide: can(actor.role, 'edition:decide') && !isAuthor, comment: can(actor.role, 'edition:comment'), isAuthor }}
      />
      {can(actor.role, 'study:write') ? (
        <p className="mt-6 text-sm">
          <Link href={`/labs/${lab}/studies/new?edition=${edition.id}`} className="text-accent underline underline-offset-2" data-testid="new-study-on-edition">
            Set up a norming study on this edition
          </Link>
        </p>
      ) : null}
      {canPack ? (
        <div className="mt-8 max-w-4xl">
          <MakePackForm lab={lab} spaceId={spaceId} number={number} stimulusCount={edition.stimulusCount} profiles={profiles} runOrders={runOrders} />
        </div>
      ) : null}
    </>
  );
}
