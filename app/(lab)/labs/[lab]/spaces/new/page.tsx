import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { SpaceEditor } from '@/components/space-editor';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listSeedOptions } from '@/lib/server/services/seed-options';

export const metadata: Metadata = { title: 'New shape space' };

export default async function NewSpacePage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/spaces/new`);
  if (!can(actor.role, 'space:write')) notFound();
  const seeds = await listSeedOptions(getDb(), actor);
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">New shape space</h1>
      <SpaceEditor lab={lab} seeds={seeds} initial={null} canEdit />
    </>
  );
}
