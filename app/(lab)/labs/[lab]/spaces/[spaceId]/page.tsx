import type { Metadata } from 'next';
import Link from 'next/link';
import { SpaceEditor } from '@/components/space-editor';
import { getDb } from '@/lib/server/db';
import { orNotFound, requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listSeedOptions } from '@/lib/server/services/seed-options';
import { getShapeSpace } from '@/lib/server/services/shape-spaces';

export const metadata: Metadata = { title: 'Shape space' };

export default async function SpacePage({ params }: { params: Promise<{ lab: string; spaceId: string }> }) {
  const { lab, spaceId } = await params;
  requireUuidSegment(spaceId);
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/spaces/${spaceId}`);
  const space = await orNotFound(getShapeSpace(getDb(), actor, spaceId));
  const seeds = await listSeedOptions(getDb(), actor);
  const editable = can(actor.role, 'space:write');
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/spaces`} className="text-accent underline underline-offset-2">
          Shape spaces
        </Link>{' '}
        / {space.name}
      </p>
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
