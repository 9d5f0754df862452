import type { Metadata } from 'next';
import { SpaceTable } from '@/components/space-table';
import { ButtonLink } from '@/components/ui/button-link';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listShapeSpaces } from '@/lib/server/services/shape-spaces';

export const metadata: Metadata = { title: 'Shape spaces' };

export default async function SpacesPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/spaces`);
  const spaces = await listShapeSpaces(getDb(), actor, { limit: 200 });
  return (
    <>
      <div className="mb-6 flex items-center justify-between">
        <h1 className="text-2xl font-semibold">Shape spaces</h1>
        {can(actor.role, 'space:write') ? (
          <ButtonLink href={`/labs/${lab}/spaces/new`} data-testid="new-space">
            New shape space
          </ButtonLink>
        ) : null}
      </div>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        A shape space sweeps two axes of descriptor change around a seed shape. Every stimulus sits at a layout position whose id it keeps.
      </p>
      <SpaceTable lab={lab} spaces={spaces.items} />
    </>
  );
}
