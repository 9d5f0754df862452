import type { Metadata } from 'next';
import { SeedShapeTable } from '@/components/seed-shape-table';
import { ButtonLink } from '@/components/ui/button-link';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listSeedShapes } from '@/lib/server/services/seed-shapes';

export const metadata: Metadata = { title: 'Seed shapes' };

export default async function SeedShapesPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/seed-shapes`);
  const initial = await listSeedShapes(getDb(), actor, { limit: 100 });
  return (
    <>
      <div className="mb-6 flex items-center justify-between">
        <h1 className="text-2xl font-semibold">Seed shapes</h1>
        {can(actor.role, 'seed:write') ? (
          <ButtonLink href={`/labs/${lab}/seed-shapes/new`} data-testid="new-seed-shape">
            New seed shape
          </ButtonLink>
        ) : null}
      </div>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        A seed shape is the centre of a shape space: an outline described by Fourier harmonics, drawn in the editor or
        fitted to an outline you upload.
      </p>
      <SeedShapeTable lab={lab} initial={initial} />
    </>
  );
}
