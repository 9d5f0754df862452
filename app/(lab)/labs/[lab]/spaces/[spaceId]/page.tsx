import type { Metadata } from 'next';
import Link from 'next/link';
import { SpaceEditor } from '@/components/space-editor';
import { getDb } from '@/lib/server/db';
import { orNotFound, requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listSeedOptions } from '@/lib/server/services/seed-options';
import { getShapeSpace } from '@/lib/server/services/shape-spaces';
import { getSpaceOrigin } from '@/lib/server/services/study-similarity';

export const metadata: Metadata = { title: 'Shape space' };

export default async function SpacePage({ params }: { params: Promise<{ lab: string; spaceId: string }> }) {
  const { lab, spaceId } = await params;
  requireUuidSegment(spaceId);
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/spaces/${spaceId}`);
  const space = await orNotFound(getShapeSpace(getDb(), actor, spaceId));
  const seeds = await listSeedOptions(getDb(), actor);
  const origin = await getSpaceOrigin(getDb(), actor, spaceId);
  const editable = can(actor.role, 'space:write');
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/spaces`} className="text-accent underline underline-offset-2">
          Shape spaces
        </Link>{' '}
        / {space.name}
      </p>
      {origin ? (
        <p className="mb-4 border-l-2 border-accent bg-accent-soft px-4 py-2 text-sm" data-testid="space-origin">
          Made from norming study{' '}
          {origin.study.id ? (
            <Link href={`/labs/${lab}/studies/${origin.study.id}/similarity`} className="text-accent underline underline-offset-2">
              {origin.study.name}
            </Link>
          ) : (
            `${origin.study.name} (since deleted)`
          )}
          {origin.edition ? ` on ${origin.edition.spaceName}, edition ${origin.edition.number}` : ''}: its radius is re-mapped per direction from the {origin.basis === 'slopes' ? 'psychometric slopes' : 'MDS map'}, predicted to bring the
          largest / smallest ratio from {origin.suggestion.ratioBefore.toFixed(2)} to {origin.suggestion.ratioAfter.toFixed(2)}.
        </p>
      ) : null}
      {editable ? <h1 className="sr-only">Shape space {space.name}</h1> : null}
      <SpaceEditor
        key={space.id}
        lab={lab}
        seeds={seeds}
        initial={space}
        canEdit={editable}
        canEditBoundaries={can(actor.role, 'boundary:write')}
        canFreeze={can(actor.role, 'edition:freeze')}
      />
    </>
  );
}
