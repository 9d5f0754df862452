import 'server-only';
import { z } from 'zod';
import { OkSchema } from '@/lib/schemas/account';
import { pageOf, PageQuerySchema } from '@/lib/schemas/common';
import {
  CreateExclusionSchema,
  ExclusionPathSchema,
  ManualExclusionSchema,
  PlotPathSchema,
  ResultSettingsSchema,
  ResultsPathSchema,
  StudyReportSchema,
  StudyResultsSchema,
} from '@/lib/schemas/study-results';
import { getDb } from '../db';
import { defineRoute } from '../http';
import { paginate } from '../pagination';
import {
  createManualExclusion,
  getResultSettings,
  getStudyResults,
  listManualExclusions,
  removeManualExclusion,
  resultsFitsCsv,
  resultsPlotSvg,
  resultsTrialsCsv,
  retryStudyResults,
  studyReport,
  updateResultSettings,
} from '../services/study-results';

const tags = ['study results'];
const BASE = '/api/v1/labs/{lab}/studies/{studyId}/results';
const file = (body: string, type: string, name: string) =>
  new Response(body, { headers: { 'content-type': type, 'content-disposition': `attachment; filename="${name}"`, 'cache-control': 'no-store' } });

export const getStudyResultsRoute = defineRoute({
  id: 'getStudyResults',
  method: 'GET',
  path: BASE,
  summary: 'The categorisation results for the current data and settings: ready (with the report), or queued / running with progress',
  tags,
  access: { kind: 'lab', action: 'results:read' },
  params: ResultsPathSchema,
  response: StudyResultsSchema,
  handler: ({ labActor, params }) => getStudyResults(getDb(), labActor(), params.studyId),
});

export const retryStudyResultsRoute = defineRoute({
  id: 'retryStudyResults',
  method: 'POST',
  path: `${BASE}/retry`,
  summary: 'Compute the results again after a failure',
  tags,
  access: { kind: 'lab', action: 'results:write' },
  params: ResultsPathSchema,
  response: StudyResultsSchema,
  handler: ({ labActor, params }) => retryStudyResults(getDb(), labActor(), params.studyId),
});

export const getResultSettingsRoute = defineRoute({
  id: 'getResultSettings',
  method: 'GET',
  path: `${BASE}/settings`,
  summary: 'How the results are computed: link, lapse, resamples, seed, α and the exclusion rules',
  tags,
  access: { kind: 'lab', action: 'results:read' },
  params: ResultsPathSchema,
  response: ResultSettingsSchema,
  handler: ({ labActor, params }) => getResultSettings(getDb(), labActor(), params.studyId),
});

export const updateResultSettingsRoute = defineRoute({
  id: 'updateResultSettings',
  method: 'PUT',
  path: `${BASE}/settings`,
  summary: 'Change how the results are computed (the next read computes them for these settings)',
  tags,
  access: { kind: 'lab', action: 'results:write' },
  params: ResultsPathSchema,
  body: ResultSettingsSchema,
  response: ResultSettingsSchema,
  handler: ({ labActor, params, body }) => updateResultSettings(getDb(), labActor(), params.studyId, body),
});

export const listResultExclusionsRoute = defineRoute({
  id: 'listResultExclusions',
  method: 'GET',
  path: `${BASE}/exclusions`,
  summary: 'Every manual exclusion decision, oldest first, removed ones included (the record)',
  tags,
  access: { kind: 'lab', action: 'results:read' },
  params: ResultsPathSchema,
  query: PageQuerySchema,
  response: pageOf(ManualExclusionSchema),
  handler: async ({ labActor, params, query }) => paginate(await listManualExclusions(getDb(), labActor(), params.studyId), query, (e) => e.id),
});

export const createResultExclusionRoute = defineRoute({
  id: 'createResultExclusion',
  method: 'POST',
  path: `${BASE}/exclusions`,
  summary: 'Exclude a session or one trial from the results, or keep one an automatic rule left out, with a reason',
  tags,
  access: { kind: 'lab', action: 'results:write' },
  params: ResultsPathSchema,
  body: CreateExclusionSchema,
  response: ManualExclusionSchema,
  successStatus: 201,
  handler: ({ labActor, params, body }) => createManualExclusion(getDb(), labActor(), params.studyId, body),
});

export const removeResultExclusionRoute = defineRoute({
  id: 'removeResultExclusion',
  method: 'DELETE',
  path: `${BASE}/exclusions/{exclusionId}`,
  summary: 'Withdraw a manual exclusion decision (it stays in the record, marked removed)',
  tags,
  access: { kind: 'lab', action: 'results:write' },
  params: ExclusionPathSchema,
  response: OkSchema,
  successStatus: 204,
  handler: async ({ labActor, params }) => {
    await removeManualExclusion(getDb(), labActor(), params.studyId, params.exclusionId);
    return { ok: true as const };
  },
});

export const downloadResultsReportRoute = defineRoute({
  id: 'downloadResultsReport',
  method: 'GET',
  path: `${BASE}/report`,
  summary: 'report.json: the results with settings, exclusions and every fit, stamped with the study and edition hash',
  tags,
  access: { kind: 'lab', action: 'results:read' },
  errors: [409],
  params: ResultsPathSchema,
  response: StudyReportSchema,
  handler: async ({ labActor, params }) => {
    const report = StudyReportSchema.parse(await studyReport(getDb(), labActor(), params.studyId));
    return file(`${JSON.stringify(report, null, 2)}\n`, 'application/json; charset=utf-8', 'report.json');
  },
});

export const downloadResultsTrialsCsvRoute = defineRoute({
  id: 'downloadResultsTrialsCsv',
  method: 'GET',
  path: `${BASE}/trials/csv`,
  summary: 'trials.csv: one row per stored trial, stamped, with the position towards B, the anchor chosen and exclusions',
  tags,
  access: { kind: 'lab', action: 'results:read' },
  produces: 'text/csv',
  params: ResultsPathSchema,
  response: z.string(),
  handler: async ({ labActor, params }) => file(await resultsTrialsCsv(getDb(), labActor(), params.studyId), 'text/csv; charset=utf-8', 'trials.csv'),
});

export const downloadResultsFitsCsvRoute = defineRoute({
  id: 'downloadResultsFitsCsv',
  method: 'GET',
  path: `${BASE}/fits/csv`,
  summary: 'fits.csv: one row per fit (pooled and per participant) with 95 % intervals and goodness of fit, stamped',
  tags,
  access: { kind: 'lab', action: 'results:read' },
  produces: 'text/csv',
  errors: [409],
  params: ResultsPathSchema,
  response: z.string(),
  handler: async ({ labActor, params }) => file(await resultsFitsCsv(getDb(), labActor(), params.studyId), 'text/csv; charset=utf-8', 'fits.csv'),
});

export const downloadResultsPlotRoute = defineRoute({
  id: 'downloadResultsPlot',
  method: 'GET',
  path: `${BASE}/plots/{plot}`,
  summary: 'A plot of the results as SVG: curves (per direction), slopes (polar) or pse',
  tags,
  access: { kind: 'lab', action: 'results:read' },
  produces: 'image/svg+xml',
  errors: [409],
  params: PlotPathSchema,
  response: z.string(),
  handler: async ({ labActor, params }) => file(await resultsPlotSvg(getDb(), labActor(), params.studyId, params.plot), 'image/svg+xml; charset=utf-8', `${params.plot}.svg`),
});
