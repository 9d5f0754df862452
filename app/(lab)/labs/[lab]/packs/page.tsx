import type { Metadata } from 'next';
import Link from 'next/link';
import { PacksTable } from '@/components/packs-table';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listPacks } from '@/lib/server/services/packs';

export const metadata: Metadata = { title: 'Packs' };

export default async function PacksPage({ params, searchParams }: { params: Promise<{ lab: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { lab } = await params;
  const { pack } = await searchParams;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/packs`);
  const packs = await listPacks(getDb(), actor, { limit: 100 });
  return (
    <>
      <div className="mb-2 flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-semibold">Stimulus packs</h1>
        <Link href={`/labs/${lab}/packs/check`} className="text-sm text-accent underline underline-offset-2" data-testid="check-pack-link">
          Check a pack you hold
        </Link>
      </div>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        A pack holds every stimulus of an edition as SVG and PNG at a size in degrees of visual angle, with its manifest, tables, model RDMs and checksums. The same edition and
        options always give the same bytes.
      </p>
      <PacksTable lab={lab} initial={packs} canCreate={can(actor.role, 'pack:create')} highlight={typeof pack === 'string' ? pack : null} />
    </>
  );
}
