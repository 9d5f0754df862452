import type { Metadata } from 'next';
import Link from 'next/link';
import { SeedShapeEditor } from '@/components/seed-shape-editor';
import { getDb } from '@/lib/server/db';
import { orNotFound, requireLabPageActor, requireUuidSegment } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { getSeedShape } from '@/lib/server/services/seed-shapes';

export const metadata: Metadata = { title: 'Seed shape' };

export default async function SeedShapePage({ params }: { params: Promise<{ lab: string; seedShapeId: string }> }) {
  const { lab, seedShapeId } = await params;
  requireUuidSegment(seedShapeId);
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/seed-shapes/${seedShapeId}`);
  const shape = await orNotFound(getSeedShape(getDb(), actor, seedShapeId));
  const editable = can(actor.role, 'seed:write');
  return (
    <>
      <p className="mb-4 text-sm text-graphite-muted">
        <Link href={`/labs/${lab}/seed-shapes`} className="text-accent underline underline-offset-2">
          Seed shapes
        </Link>{' '}
        / {shape.name}
      </p>
      {editable ? <h1 className="sr-only">Seed shape {shape.name}</h1> : null}
      <SeedShapeEditor key={shape.id} lab={lab} initial={shape} canEdit={editable} />
    </>
  );
}
