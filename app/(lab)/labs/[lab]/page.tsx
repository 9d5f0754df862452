import { getLabBySlug } from '@/db/repositories/labs';
import { getDb } from '@/lib/server/db';

export default async function LabOverviewPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab: slug } = await params;
  const lab = await getLabBySlug(getDb(), slug);
  return (
    <section>
      <h1 className="text-2xl font-semibold">{lab.name}</h1>
      <p className="mt-2 text-graphite-soft">
        Lab created <span className="tabular">{lab.created_at.toISOString().slice(0, 10)}</span>.
      </p>
    </section>
  );
}
