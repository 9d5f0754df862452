import 'server-only';
import type PgBoss from 'pg-boss';
import type { Db } from '@/db/client';
import { logEvent } from '../log';
import { runStudyResultsJob } from '../services/study-results';
import { STUDY_RESULTS_QUEUE, type StudyResultsJobData } from './boss';

/**
 * Takes study-results computations from the queue, one at a time; the fitting runs on this thread and yields
 * between fit sets to write its progress. Returns a stop function.
 */
export async function startResultsWorker({ db, boss, pollingIntervalSeconds = 1 }: { db: Db; boss: PgBoss; pollingIntervalSeconds?: number }): Promise<() => Promise<void>> {
  await boss.work<StudyResultsJobData>(STUDY_RESULTS_QUEUE, { batchSize: 1, pollingIntervalSeconds }, async (jobs) => {
    for (const job of jobs) {
      logEvent('info', 'study results job started', { resultId: job.data.resultId, jobId: job.id });
      const outcome = await runStudyResultsJob(db, job.data.resultId);
      logEvent('info', 'study results job ended', { resultId: job.data.resultId, outcome });
    }
  });
  return () => boss.offWork(STUDY_RESULTS_QUEUE);
}
