import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { StudyForm } from '@/components/study-form';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listStudyEditions } from '@/lib/server/services/studies';

export const metadata: Metadata = { title: 'New norming study' };

export default async function NewStudyPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/studies/new`);
  if (!can(actor.role, 'study:write')) notFound();
  const editions = await listStudyEditions(getDb(), actor);
  return (
    <>
      <h1 className="mb-2 text-2xl font-semibold">New norming study</h1>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">Approved editions are listed first. The study stays a Draft, visible only to the lab, until you open it.</p>
      <StudyForm lab={lab} editions={editions} study={null} canEdit />
    </>
  );
}
