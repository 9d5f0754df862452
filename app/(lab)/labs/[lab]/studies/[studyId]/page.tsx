import type { Metadata } from 'next';
import Link from 'next/link';
import { StudyForm } from '@/components/study-form';
import { StudyLifecycle } from '@/components/study-lifecycle';
import { formatMinutes, StudyStateBadge } from '@/components/study-notices';
import { StudyPlanPreview } from '@/components/study-plan-preview';
import { StudySessionsMonitor } from '@/components/study-sessions-monitor';
import { Notice } from '@/components/ui/notice';
import { getDb } from '@/lib/server/db';
import { requireLabPageActor } from '@/lib/server/page-context';
import { can } from '@/lib/server/policy';
import { getStudy, listStudyEditions } from '@/lib/server/services/studies';
import { listStudySessions } from '@/lib/server/services/study-sessions';

export const metadata: Metadata = { title: 'Study setup' };

export default async function StudyPage({ params }: { params: Promise<{ lab: string; studyId: string }> }) {
  const { lab, studyId } = await params;
  const { actor } = await requireLabPageActor(lab, `/labs/${lab}/studies/${studyId}`);
  const db = getDb();
  const study = await getStudy(db, actor, studyId);
  const editions = await listStudyEditions(db, actor);
  const canEdit = can(actor.role, 'study:write');
  const sessions = study.state === 'draft' ? null : await listStudySessions(db, actor, studyId, { limit: 200 });
  return (
    <>
      <p className="mb-2 text-sm">
        <Link href={`/labs/${lab}/studies`} className="text-accent underline underline-offset-2">
          Norming studies
        </Link>
      </p>
      <div className="mb-2 flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold" data-testid="study-title">
          {study.name}
        </h1>
        <StudyStateBadge state={study.state} testId="study-state" />
      </div>
      <p className="tabular mb-6 text-sm text-graphite-soft" data-testid="study-facts">
        On{' '}
        <Link href={`/labs/${lab}/spaces/${study.edition.spaceId}/editions/${study.edition.number}`} className="text-accent underline underline-offset-2">
          {study.edition.spaceName}, edition {study.edition.number}
        </Link>{' '}
        · {study.plannedTrials.total} trials per participant · at most {formatMinutes(study.estimatedSeconds)} · target {study.targetParticipants} participants
      </p>
      {study.editionWarning ? (
        <div className="mb-6">
          <Notice tone="caution" testId="stored-edition-warning">
            {study.editionWarning}
          </Notice>
        </div>
      ) : null}
      {sessions ? (
        <p className="mb-6 text-sm">
          <Link href={`/labs/${lab}/studies/${studyId}/results`} className="text-accent underline underline-offset-2" data-testid="study-results-link">
            Results: fits per direction, isotropy test, exports
          </Link>
          {study.design.similarity ? (
            <>
              {' · '}
              <Link href={`/labs/${lab}/studies/${studyId}/similarity`} className="text-accent underline underline-offset-2" data-testid="study-similarity-link">
                Similarity: perceptual vs designed, MDS map, equalise
              </Link>
            </>
          ) : null}
        </p>
      ) : null}
      {sessions ? (
        <div className="mb-10">
          <StudySessionsMonitor lab={lab} studyId={studyId} initial={sessions} canManage={can(actor.role, 'session:manage')} />
        </div>
      ) : null}
      <div className="grid gap-8 xl:grid-cols-[1fr_24rem]">
        <div className="min-w-0 space-y-10">
          <StudyPlanPreview lab={lab} study={study} />
          <section aria-labelledby="setup-heading">
            <h2 id="setup-heading" className="mb-4 text-lg font-semibold">
              Study setup
            </h2>
            <StudyForm lab={lab} editions={editions} study={study} canEdit={canEdit} />
          </section>
        </div>
        <div className="space-y-6">
          <StudyLifecycle lab={lab} study={study} canEdit={canEdit} />
        </div>
      </div>
    </>
  );
}
