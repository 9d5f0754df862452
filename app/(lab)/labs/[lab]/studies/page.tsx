import type { Metadata } from 'next';
import Link from 'next/link';
import { formatMinutes, StudyStateBadge } from '@/components/study-notices';
import { ButtonLink } from '@/components/ui/button-link';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { listStudies } from '@/lib/server/services/studies';

export const metadata: Metadata = { title: 'Norming studies' };

export default async function StudiesPage({ params }: { params: Promise<{ lab: string }> }) {
  const { lab } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/studies`);
  const studies = await listStudies(getDb(), actor, { limit: 200 });
  return (
    <>
      <div className="mb-6 flex items-center justify-between">
        <h1 className="text-2xl font-semibold">Norming studies</h1>
        {can(actor.role, 'study:write') ? (
          <ButtonLink href={`/labs/${lab}/studies/new`} data-testid="new-study">
            New study
          </ButtonLink>
        ) : null}
      </div>
      <p className="mb-6 max-w-2xl text-sm text-graphite-soft">
        A norming study checks that an edition is perceived evenly in every direction: participants categorise stimuli along each diameter and rate how similar pairs are.
        Each participant’s trials follow from the study seed and their index, so any plan can be rebuilt.
      </p>
      {studies.items.length === 0 ? (
        <p className="text-graphite-muted">No studies yet.</p>
      ) : (
        <table className="w-full border-collapse text-sm" data-testid="study-table">
          <thead>
            <tr className="border-b-[0.5px] border-rule-strong text-left text-graphite-soft">
              <th scope="col" className="py-2 pr-4 font-medium">Study</th>
              <th scope="col" className="py-2 pr-4 font-medium">Edition</th>
              <th scope="col" className="py-2 pr-4 font-medium">Tasks</th>
              <th scope="col" className="py-2 pr-4 font-medium">Trials</th>
              <th scope="col" className="py-2 pr-4 font-medium">Duration</th>
              <th scope="col" className="py-2 pr-4 font-medium">Target</th>
              <th scope="col" className="py-2 pr-4 font-medium">State</th>
            </tr>
          </thead>
          <tbody>
            {studies.items.map((s) => (
              <tr key={s.id} className="border-b-[0.5px] border-rule">
                <td className="py-2 pr-4">
                  <Link href={`/labs/${lab}/studies/${s.id}`} className="text-accent underline underline-offset-2" data-testid={`study-${s.name}`}>
                    {s.name}
                  </Link>
                </td>
                <td className="py-2 pr-4">
                  {s.edition.spaceName} · {s.edition.number}
                  {s.editionWarning ? <span className="ml-1 text-xs text-graphite-muted">(not approved)</span> : null}
                </td>
                <td className="py-2 pr-4">{[s.design.categorisation ? 'Two-choice categorisation' : null, s.design.similarity ? 'Pair similarity' : null].filter(Boolean).join(', ')}</td>
                <td className="tabular py-2 pr-4">{s.plannedTrials.total}</td>
                <td className="tabular py-2 pr-4">≤ {formatMinutes(s.estimatedSeconds)}</td>
                <td className="tabular py-2 pr-4">{s.targetParticipants}</td>
                <td className="py-2 pr-4">
                  <StudyStateBadge state={s.state} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
