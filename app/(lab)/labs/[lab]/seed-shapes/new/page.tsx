import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { SeedShapeEditor } from '@/components/seed-shape-editor';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';

export const metadata: Metadata = { title: 'New seed shape' };

export default async function NewSeedShapePage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/seed-shapes/new`);
  if (!can(actor.role, 'seed:write')) notFound();
  return (
    <>
      <h1 className="mb-6 text-2xl font-semibold">New seed shape</h1>
      <SeedShapeEditor lab={lab} initial={null} canEdit />
    </>
  );
}
