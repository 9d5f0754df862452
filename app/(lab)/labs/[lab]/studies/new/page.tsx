import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { StudyForm } from '@/components/study-form';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listStudyEditions } from '@/lib/server/services/studies';

export const metadata: Metadata = { title: 'New norming study' };

export default async function NewStudyPage({ params, searchParams }: { params: Promise<{ lab: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { lab } = await params;
  const { edition } = await searchParams;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/studies/new`);
  if (!can(actor.role, 'study:write')) notFound();
  const all = await listStudyEditions(getDb(), actor);
  // An edition picked on its own page comes first, so the form starts on it.
  const picked = all.find((e) => e.id === edition);
  const editions = picked ? [picked, ...all.filter((e) => e !== picked)] : all;
  return (
    <>
      <h1 className="mb-2 text-2xl font-semibold">New norming study</h1>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">Approved editions are listed first. The study stays a Draft, visible only to the lab, until you open it.</p>
      <StudyForm lab={lab} editions={editions} study={null} canEdit />
    </>
  );
}
