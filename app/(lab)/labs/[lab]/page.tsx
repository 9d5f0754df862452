import { ROLE_LABELS, ROLE_SUMMARIES } from '@/lib/schemas/roles';
import { requireLabPageActor } from '@/lib/server/page-context';

export default async function LabOverviewPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor, user } = await requireLabPageActor(lab);
  return (
    <section>
      <h1 className="text-2xl font-semibold" data-testid="lab-title">{actor.labName}</h1>
      <p className="mt-2 text-graphite-soft">
        Signed in as {user.name}, {ROLE_LABELS[actor.role]}: {ROLE_SUMMARIES[actor.role].toLowerCase()}.
      </p>
    </section>
  );
}
