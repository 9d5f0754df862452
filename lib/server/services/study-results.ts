import 'server-only';
import { createHash } from 'node:crypto';
import { stringify } from 'csv-stringify/sync';
import { conflict, notFound, validationError } from '@/lib/errors';
import type { Db } from '@/db/client';
import type { StudyResultRow } from '@/db/database';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import { getStudy, type StudyListRow } from '@/db/repositories/studies';
import {
  deleteResult,
  findResult,
  findResultById,
  findResultSettings,
  getEditionHashOfStudy,
  insertExclusion,
  insertResultOnce,
  listExclusions,
  listSessionsForResults,
  pruneResults,
  removeExclusion,
  updateResult,
  type ExclusionListRow,
} from '@/db/repositories/study-results';
import { upsertResultSettings } from '@/db/repositories/study-results';
import { canonicalJson } from '@/lib/edition/canonical-json';
import { pseByDirectionSvg, psychometricCurvesSvg, slopePolarSvg } from '@/lib/plot';
import { analyseCategorisation, assembleDirectionData, countFitSets, decideExclusions, type AnalysisOptions, type AssembledData, type CategorisationAnalysis, type ManualExclusion, type ResultTrial } from '@/lib/results';
import { participantKeys, type StudyDesign } from '@/lib/study';
import { TrialRecordSchema, type TrialRecordValue } from '@/lib/schemas/participant-session';
import {
  DEFAULT_RESULT_SETTINGS,
  ResultSettingsSchema,
  type CategorisationSectionValue,
  type CreateExclusionInput,
  type ManualExclusionValue,
  type PlotKind,
  type ReportExclusionValue,
  type ResultSettings,
  type StudyReportValue,
  type StudyResultsValue,
} from '@/lib/schemas/study-results';
import { fieldErrorsOf } from '../http';
import { getBoss, sendStudyResultsJob } from '../jobs/boss';
import { logEvent } from '../log';
import { authorize, type LabActor } from './access';
import { neutralizeCsvCell } from '@/lib/csv';
import { studyTrialRecords } from './study-sessions';
import { getStudySimilarity } from './study-similarity';

/**
 * A study's categorisation results: exclusions, fits per direction, the isotropy tests and the verdict, cached in
 * `study_results` by the SHA-256 of their input (the data after exclusions and the settings). Small analyses are
 * computed in the request; larger ones (over about a second of fitting) by a job that writes its progress.
 */

/** Bumped when the analysis changes, so old cached results are not served for new code. */
const RESULTS_VERSION = 1;
/**
 * Resample fits done in the request at most: about a second on the shared 2-core test machine (measured 6–12k
 * resample fits/s through the whole analysis, λ free, under load); beyond it a job computes the results.
 */
export const INLINE_RESAMPLE_FITS = 12_000;
/** Finished results kept per study (other settings stay cached). */
const KEPT_RESULTS = 12;
/** A job writes its progress at most this often. */
const PROGRESS_INTERVAL_MS = 250;
const X_DEFINITION = 'x is the signed position along the diameter towards anchor B, as a fraction of ρmax (anchor B at +extent, anchor A at −extent); ψ(x) is P(choosing anchor B).';

export function analysisOptionsOf(s: ResultSettings): AnalysisOptions {
  return { link: s.link, lapse: s.lapseMode === 'free' ? { max: s.lapseValue } : { fixed: s.lapseValue }, resamples: s.resamples, seed: s.seed, alpha: s.alpha };
}

/** The trials of the categorisation task as the analysis sees them (practice and similarity trials left out). */
export function resultTrialsOf(records: readonly TrialRecordValue[], design: StudyDesign): ResultTrial[] {
  const task = design.categorisation;
  if (!task) return [];
  const out: ResultTrial[] = [];
  for (const r of records) {
    if (r.task !== 'categorisation' || r.isPractice || r.directionDeg === null || r.position === null || r.leftAnchor === null) continue;
    const keys = participantKeys(task.keys, r.participant);
    const rightAnchor = r.leftAnchor === 'A' ? 'B' : 'A';
    const chosen = r.responseKey === keys.left ? r.leftAnchor : r.responseKey === keys.right ? rightAnchor : null;
    out.push({ participant: r.participant, trialIndex: r.trialIndex, directionDeg: r.directionDeg, x: -r.position, choseB: chosen === null ? null : chosen === 'B', rtMs: r.rtMs, isCatch: r.isCatch, isCorrect: r.isCorrect });
  }
  return out;
}

function toManualValue(r: ExclusionListRow): ManualExclusionValue {
  return {
    id: r.id,
    sessionId: r.session_id,
    participant: r.participant_index,
    trialIndex: r.trial_index,
    action: r.action,
    reason: r.reason,
    createdBy: r.created_by_name,
    createdAt: r.created_at.toISOString(),
    removedAt: r.removed_at?.toISOString() ?? null,
    removedBy: r.removed_by_name,
  };
}

async function settingsOf(db: Db, studyId: string): Promise<ResultSettings> {
  const parsed = ResultSettingsSchema.safeParse(await findResultSettings(db, studyId));
  return parsed.success ? parsed.data : DEFAULT_RESULT_SETTINGS;
}

/** What the cache key covers: the data after exclusions, the exclusions themselves and the settings. */
interface ResultsInput {
  version: number;
  settings: ResultSettings;
  assembled: AssembledData;
  exclusions: ReportExclusionValue[];
  counts: StudyReportValue['counts'];
}

interface Prepared {
  study: StudyListRow;
  editionHash: string;
  settings: ResultSettings;
  records: TrialRecordValue[];
  trials: ResultTrial[];
  included: Set<string>;
  exclusionByTrial: Map<string, string>;
  input: ResultsInput;
  dataHash: string;
}

const trialKey = (participant: number, trialIndex: number | null) => `${participant}:${trialIndex ?? '*'}`;

async function prepare(db: Db, study: StudyListRow): Promise<Prepared> {
  const design = study.design as StudyDesign;
  const [editionHash, settings, records, sessions, manualRows] = await Promise.all([
    getEditionHashOfStudy(db, study.id),
    settingsOf(db, study.id),
    studyTrialRecords(db, study),
    listSessionsForResults(db, study.id),
    listExclusions(db, study.id),
  ]);
  const sessionOf = new Map(sessions.map((s) => [s.participant_index, s.id]));
  const manual: ManualExclusion[] = [
    ...sessions.filter((s) => s.is_excluded).map((s) => ({ id: `monitor:${s.id}`, participant: s.participant_index, trialIndex: null, action: 'exclude' as const, reason: `Excluded in the monitor: ${s.exclusion_reason ?? 'no reason given'}` })),
    ...manualRows.filter((r) => r.removed_at === null).map((r) => ({ id: r.id, participant: r.participant_index, trialIndex: r.trial_index, action: r.action, reason: r.reason })),
  ];
  const trials = resultTrialsOf(records, design);
  const decision = decideExclusions(trials, { catchAccuracyMin: settings.catchAccuracyMin, rtMadK: settings.rtMadK }, manual);
  const assembled = assembleDirectionData(decision.included, design.categorisation?.directionsDeg ?? []);
  const exclusions = decision.exclusions.map((e) => ({ ...e, sessionId: sessionOf.get(e.participant) ?? null }));
  const exclusionByTrial = new Map<string, string>();
  for (const e of exclusions) if (!e.isOverridden) exclusionByTrial.set(trialKey(e.participant, e.trialIndex), e.reason);
  const counts = {
    participants: new Set(trials.map((t) => t.participant)).size,
    participantsIncluded: assembled.participants.length,
    trials: trials.length,
    trialsInFits: decision.included.length,
  };
  const input: ResultsInput = { version: RESULTS_VERSION, settings, assembled, exclusions, counts };
  const dataHash = createHash('sha256').update(canonicalJson(input), 'utf8').digest('hex');
  return { study, editionHash, settings, records, trials, included: new Set(decision.included.map((t) => trialKey(t.participant, t.trialIndex))), exclusionByTrial, input, dataHash };
}

function sectionOf(a: CategorisationAnalysis): CategorisationSectionValue {
  const { options: _options, ...rest } = a;
  return { xDefinition: X_DEFINITION, ...rest } as CategorisationSectionValue;
}

function reportOf(study: StudyListRow, editionHash: string, row: StudyResultRow): StudyReportValue {
  const input = row.input as ResultsInput;
  const analysis = row.result as CategorisationAnalysis;
  return {
    format: 'epicycle-study-report',
    formatVersion: 1,
    study: { id: study.id, name: study.name },
    edition: { id: study.edition_id, spaceName: study.space_name, number: study.edition_number, contentHash: editionHash },
    dataHash: row.data_hash,
    computedAt: row.updated_at.toISOString(),
    computeMs: row.compute_ms,
    settings: input.settings,
    counts: input.counts,
    exclusions: input.exclusions,
    sections: { categorisation: input.assembled.directionsDeg.length > 0 ? sectionOf(analysis) : null },
  };
}

function toResults(p: Prepared, row: StudyResultRow): StudyResultsValue {
  return {
    state: row.state,
    progress: row.progress,
    error: row.error,
    dataHash: row.data_hash,
    settings: p.settings,
    report: row.state === 'ready' ? reportOf(p.study, p.editionHash, row) : null,
  };
}

function runNow(input: ResultsInput): CategorisationAnalysis {
  const steps = analyseCategorisation(input.assembled, analysisOptionsOf(input.settings));
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
  }
}

/**
 * The results for the study's current data and settings: from the cache when they were computed before; computed
 * now when that takes under about a second (`inlineFits` resample fits); otherwise queued as a job, answered with
 * state `queued` and then `running` with its progress until it is ready.
 */
export async function getStudyResults(db: Db, actor: LabActor, studyId: string, options: { inlineFits?: number; study?: StudyListRow } = {}): Promise<StudyResultsValue> {
  authorize(actor, 'results:read');
  const p = await prepare(db, options.study ?? (await getStudy(db, actor.labId, studyId)));
  const cached = await findResult(db, studyId, p.dataHash);
  if (cached) return toResults(p, cached);
  const fits = countFitSets(p.input.assembled) * p.settings.resamples * 2;
  if (fits <= (options.inlineFits ?? INLINE_RESAMPLE_FITS)) {
    const started = performance.now();
    const analysis = runNow(p.input);
    const computeMs = Math.round(performance.now() - started);
    const { row } = await insertResultOnce(db, { studyId, dataHash: p.dataHash, state: 'ready', input: p.input, result: analysis, computeMs });
    logEvent('info', 'study results computed', { studyId, fits, computeMs });
    await pruneResults(db, studyId, KEPT_RESULTS);
    return toResults(p, row);
  }
  const { row, isNew } = await insertResultOnce(db, { studyId, dataHash: p.dataHash, state: 'queued', input: p.input, result: null, computeMs: null });
  if (isNew) {
    try {
      await updateResult(db, row.id, { jobId: await sendStudyResultsJob(await getBoss(), { resultId: row.id }) });
    } catch (error) {
      await updateResult(db, row.id, { state: 'failed', error: `The computation could not be queued: ${error instanceof Error ? error.message : String(error)}` });
      return toResults(p, (await findResultById(db, row.id))!);
    }
  }
  return toResults(p, row);
}

/**
 * The job behind a long computation: runs the analysis stored with the row, writing its progress (0…1) at most
 * every 250 ms, and stores the result. A finished or vanished row is skipped.
 */
export async function runStudyResultsJob(db: Db, resultId: string): Promise<'ready' | 'failed' | 'skipped'> {
  const row = await findResultById(db, resultId);
  if (!row || row.state === 'ready') return 'skipped';
  await updateResult(db, resultId, { state: 'running', progress: 0, error: null });
  const input = row.input as ResultsInput;
  const started = performance.now();
  try {
    const steps = analyseCategorisation(input.assembled, analysisOptionsOf(input.settings));
    let last = performance.now();
    for (;;) {
      const step = steps.next();
      if (step.done) {
        await updateResult(db, resultId, { state: 'ready', progress: 1, result: step.value, computeMs: Math.round(performance.now() - started) });
        await pruneResults(db, row.study_id, KEPT_RESULTS);
        return 'ready';
      }
      if (performance.now() - last >= PROGRESS_INTERVAL_MS) {
        last = performance.now();
        await updateResult(db, resultId, { progress: Math.min(0.99, step.value.done / step.value.total) });
      }
      // Let the process answer between fit sets (health checks, other requests of a worker sharing it).
      await new Promise((resolve) => setImmediate(resolve));
    }
  } catch (error) {
    await updateResult(db, resultId, { state: 'failed', error: `The computation failed: ${error instanceof Error ? error.message : String(error)}` });
    return 'failed';
  }
}

/** Computes a failed result again (a new job or inline): the cached failure is dropped first. */
export async function retryStudyResults(db: Db, actor: LabActor, studyId: string): Promise<StudyResultsValue> {
  authorize(actor, 'results:write');
  const p = await prepare(db, await getStudy(db, actor.labId, studyId));
  const cached = await findResult(db, studyId, p.dataHash);
  if (cached?.state === 'failed') await deleteResult(db, cached.id);
  return getStudyResults(db, actor, studyId);
}

export async function getResultSettings(db: Db, actor: LabActor, studyId: string): Promise<ResultSettings> {
  authorize(actor, 'results:read');
  await getStudy(db, actor.labId, studyId);
  return settingsOf(db, studyId);
}

/** Saves how the study's results are computed (the next read computes them for these settings). */
export async function updateResultSettings(db: Db, actor: LabActor, studyId: string, input: unknown): Promise<ResultSettings> {
  authorize(actor, 'results:write');
  const parsed = ResultSettingsSchema.safeParse(input);
  if (!parsed.success) throw validationError('results', 'The settings are not valid.', fieldErrorsOf(parsed.error));
  await db.transaction().execute(async (trx) => {
    await getStudy(trx, actor.labId, studyId);
    await upsertResultSettings(trx, studyId, parsed.data, actor.userId);
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'results.settings', subjectType: 'study', subjectId: studyId, details: { ...parsed.data } });
  });
  return parsed.data;
}

export async function listManualExclusions(db: Db, actor: LabActor, studyId: string): Promise<ManualExclusionValue[]> {
  authorize(actor, 'results:read');
  await getStudy(db, actor.labId, studyId);
  return (await listExclusions(db, studyId)).map(toManualValue);
}

/** Records a manual decision (exclude a session or a trial, or keep one a rule left out), with its reason. */
export async function createManualExclusion(db: Db, actor: LabActor, studyId: string, input: CreateExclusionInput): Promise<ManualExclusionValue> {
  authorize(actor, 'results:write');
  const id = await db.transaction().execute(async (trx) => {
    await getStudy(trx, actor.labId, studyId);
    const session = (await listSessionsForResults(trx, studyId)).find((s) => s.id === input.sessionId);
    if (!session) throw validationError('results', 'No such session in this study.', { sessionId: ['No such session in this study'] });
    if (input.trialIndex !== null) {
      const stored = await trx.selectFrom('trial_responses').select('trial_index').where('session_id', '=', input.sessionId).where('trial_index', '=', input.trialIndex).executeTakeFirst();
      if (!stored) throw validationError('results', 'That session has no such trial.', { trialIndex: ['That session has no stored trial with this index'] });
    }
    const id = await insertExclusion(trx, { studyId, sessionId: input.sessionId, trialIndex: input.trialIndex, action: input.action, reason: input.reason, userId: actor.userId });
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: input.action === 'exclude' ? 'results.exclude' : 'results.keep',
      subjectType: 'study',
      subjectId: studyId,
      details: { participant: session.participant_index, trialIndex: input.trialIndex, reason: input.reason },
    });
    return id;
  });
  const row = (await listExclusions(db, studyId)).find((r) => r.id === id)!;
  return toManualValue(row);
}

/** Withdraws a manual decision; the row stays, marked removed, with who removed it. */
export async function removeManualExclusion(db: Db, actor: LabActor, studyId: string, exclusionId: string): Promise<void> {
  authorize(actor, 'results:write');
  await db.transaction().execute(async (trx) => {
    await getStudy(trx, actor.labId, studyId);
    if (!(await removeExclusion(trx, studyId, exclusionId, actor.userId))) throw notFound('results', 'No such active exclusion in this study.');
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'results.exclusion-removed', subjectType: 'study', subjectId: studyId, details: { exclusionId } });
  });
}

/** The ready results, or a conflict saying they are still being computed (or failed). */
async function readyReport(db: Db, actor: LabActor, studyId: string, study?: StudyListRow): Promise<StudyReportValue> {
  const results = await getStudyResults(db, actor, studyId, study ? { study } : {});
  if (results.state !== 'ready' || !results.report) {
    throw conflict('results', results.state === 'failed' ? `The results could not be computed: ${results.error ?? 'unknown error'}` : 'The results are still being computed; try again when they are ready.');
  }
  return results.report;
}

/** report.json: the categorisation results and, for a study with a pair-similarity task, the similarity section. */
export async function studyReport(db: Db, actor: LabActor, studyId: string): Promise<StudyReportValue> {
  authorize(actor, 'results:read');
  const study = await getStudy(db, actor.labId, studyId);
  const report = await readyReport(db, actor, studyId, study);
  const similarity = (study.design as StudyDesign).similarity ? await getStudySimilarity(db, actor, studyId, study) : null;
  return { ...report, sections: { ...report.sections, similarity } };
}

const csvOf = (rows: readonly (readonly unknown[])[]) => stringify(rows.map((r) => r.map(neutralizeCsvCell)));

/** `trials.csv`: one row per stored trial (all tasks), stamped, with x, the anchor chosen and whether it was fitted. */
export async function resultsTrialsCsv(db: Db, actor: LabActor, studyId: string): Promise<string> {
  authorize(actor, 'results:read');
  const p = await prepare(db, await getStudy(db, actor.labId, studyId));
  const columns = Object.keys(TrialRecordSchema.shape) as (keyof TrialRecordValue)[];
  const byKey = new Map(p.trials.map((t) => [trialKey(t.participant, t.trialIndex), t]));
  const rows = p.records.map((r) => {
    const t = byKey.get(trialKey(r.participant, r.trialIndex));
    const key = trialKey(r.participant, r.trialIndex);
    const exclusion = p.exclusionByTrial.get(key) ?? p.exclusionByTrial.get(trialKey(r.participant, null)) ?? '';
    return [studyId, p.editionHash, ...columns.map((c) => r[c]), t ? t.x : '', t?.choseB === null || !t ? '' : t.choseB ? 'B' : 'A', p.included.has(key), exclusion];
  });
  return csvOf([['studyId', 'editionHash', ...columns, 'towardsB', 'choseAnchor', 'inFits', 'exclusion'], ...rows]);
}

const FIT_COLUMNS = [
  'studyId', 'editionHash', 'dataHash', 'scope', 'participant', 'directionDeg', 'link', 'trials', 'misses', 'levels',
  'pse', 'pseLow', 'pseHigh', 'spread', 'spreadLow', 'spreadHigh', 'slopeAtPse', 'slopeLow', 'slopeHigh', 'lapse', 'lapseLow', 'lapseHigh',
  'interquartileSpread', 'logLikelihood', 'deviance', 'gofP', 'resamples', 'spreadAtBound', 'lapseAtBound', 'resamplesWithSpreadAtBound', 'problem',
] as const;

/** `fits.csv`: one row per fit (pooled directions first, then each participant's), stamped, with the 95 % intervals. */
export async function resultsFitsCsv(db: Db, actor: LabActor, studyId: string): Promise<string> {
  const report = await readyReport(db, actor, studyId);
  const section = report.sections.categorisation;
  const fits = section ? [...section.pooled, ...section.participants.flatMap((p) => p.fits)] : [];
  const rows = fits.map((f) => [
    report.study.id, report.edition.contentHash, report.dataHash, f.participant === null ? 'pooled' : 'participant', f.participant ?? '', f.directionDeg, report.settings.link, f.trials, f.misses, f.levels.length,
    f.fit?.threshold ?? '', f.intervals?.threshold[0] ?? '', f.intervals?.threshold[1] ?? '',
    f.fit?.spread ?? '', f.intervals?.spread[0] ?? '', f.intervals?.spread[1] ?? '',
    f.fit?.slopeAtThreshold ?? '', f.intervals?.slopeAtThreshold[0] ?? '', f.intervals?.slopeAtThreshold[1] ?? '',
    f.fit?.lapse ?? '', f.intervals?.lapse[0] ?? '', f.intervals?.lapse[1] ?? '',
    f.fit?.interquartileSpread ?? '', f.fit?.logLikelihood ?? '', f.fit?.deviance ?? '', f.goodnessOfFit?.p ?? '', f.goodnessOfFit?.resamples ?? '',
    f.fit?.bounds.spreadAtBound ?? '', f.fit?.bounds.lapseAtBound ?? '', f.spreadAtBoundCount, f.problem ?? '',
  ]);
  return csvOf([[...FIT_COLUMNS], ...rows]);
}

/** The plots of a report as standalone SVG. */
export function plotSvgOf(report: StudyReportValue, plot: PlotKind): string {
  const section = report.sections.categorisation;
  const pooled = section?.pooled ?? [];
  const stamp = `${report.study.name}, ${report.edition.spaceName} edition ${report.edition.number} (${report.edition.contentHash.slice(0, 12)})`;
  if (plot === 'curves') {
    const xs = pooled.flatMap((f) => f.levels.map((l) => l.x));
    const range: [number, number] = xs.length ? [Math.min(...xs), Math.max(...xs)] : [-1, 1];
    return psychometricCurvesSvg(
      pooled.map((f) => ({ directionDeg: f.directionDeg, points: f.levels, curve: f.fit ? { link: f.fit.link, threshold: f.fit.threshold, spread: f.fit.spread, lapse: f.fit.lapse } : null })),
      range,
      { title: `Psychometric curves by direction — ${stamp}`, description: 'Proportion of anchor B answers against the position towards anchor B (fraction of ρmax), pooled over participants; point area grows with the number of trials; lines are the fitted functions.', xLabel: 'position towards B (× ρmax)' },
    );
  }
  const estimates = (value: (f: (typeof pooled)[number]) => number | undefined, interval: (f: (typeof pooled)[number]) => readonly [number, number] | undefined) =>
    pooled.flatMap((f) => (f.fit ? [{ directionDeg: f.directionDeg, value: value(f) as number, interval: interval(f) ?? null }] : []));
  if (plot === 'slopes') {
    return slopePolarSvg(estimates((f) => f.fit?.slopeAtThreshold, (f) => f.intervals?.slopeAtThreshold), {
      title: `Slope at the PSE by direction — ${stamp}`,
      description: 'Polar plot: each diameter at both of its ends, the slope at the PSE (per ρmax) as the radius, with 95 % bootstrap intervals; a circle means equal slopes.',
    });
  }
  return pseByDirectionSvg(estimates((f) => f.fit?.threshold, (f) => f.intervals?.threshold), {
    title: `PSE by direction — ${stamp}`,
    description: 'The point of subjective equality of each direction (fraction of ρmax towards anchor B) with its 95 % bootstrap interval; the dashed line is no bias.',
    yLabel: 'PSE (× ρmax towards B)',
  });
}

export async function resultsPlotSvg(db: Db, actor: LabActor, studyId: string, plot: PlotKind): Promise<string> {
  return plotSvgOf(await readyReport(db, actor, studyId), plot);
}
