// The working inputs of every API operation, in an order where each call may use what an earlier one made. The
// OpenAPI contract test calls each once as documented; the authorisation matrix and the fuzzer reuse the same
// inputs, so a route added here is covered by all three (and a route missing here fails all three).
import { expect } from 'vitest';
import * as api from '@/lib/server/api';
import { insertMembership } from '@/db/repositories/memberships';
import { insertUser } from '@/db/repositories/users';
import { getDb } from '@/lib/server/db';
import { registeredRoutes, type AnyRouteSpec } from '@/lib/server/http';
import type { PolicyAction } from '@/lib/server/policy';
import { startBoss } from '@/lib/server/jobs/boss';
import { startPackWorker } from '@/lib/server/jobs/pack-worker';
import { renderPng } from '@/lib/render/render-png';
import { DEFAULT_RENDER_OPTIONS } from '@/lib/schemas/render';
import { DEFAULT_RUN_ORDER_DEFINITION } from '@/lib/schemas/run-order';
import { callRoute, sessionCookie, TEST_PASSWORD, type TestLab } from './actors';
import { formulaCellsIn } from './csv-safety';
import { TEST_SEED, testSpaceSettings } from './editions';
import { uniqueSuffix } from './db';
import { categorisation, SCREEN } from './study-designs';

export type RecipeRole = keyof TestLab['members'];
/** Who makes a recipe's call: a member of the lab by role, the lab's write token, nobody, or a given session. */
export type RecipeCaller = RecipeRole | 'token' | 'anonymous' | { cookie: string };

/** One call of an operation: who calls it, with what, and the status it must answer. */
export interface RecipeCall {
  as?: RecipeCaller;
  params?: Record<string, string>;
  query?: Record<string, string>;
  body?: unknown;
  text?: { type: string; content: string };
  status: number;
  /** The policy action the service asks for with these inputs, when narrower than the route's (the matrix reads it). */
  action?: PolicyAction;
}

export interface Recipe {
  id: string;
  /** The call, built when it is made (it may read ids an earlier call made). */
  call: () => RecipeCall;
  /** Runs once the call answered, with its body. */
  after?: (body: unknown) => Promise<void> | void;
  /** Runs just before the call is built. */
  before?: () => Promise<void>;
}

export interface RecipeBook {
  lab: TestLab;
  /** A write-scope lab API token made by the lab's Owner (what `as: 'token'` sends). */
  token: string;
  /** Ids made along the way, by name. */
  ids: Record<string, string>;
  recipes: Recipe[];
  /** Stops the pack worker the recipes started (call it when done). */
  close: () => Promise<void>;
}

const SPACE = testSpaceSettings({ kind: 'rings', rings: 1, spokes: 4 });
export const CATEGORISATION = categorisation({ directionsDeg: [0, 90], practiceTrials: 2, catchRate: 0.1, timing: { fixationMs: 500, probeMs: 300, blankMs: 200, responseMs: 2000, itiMs: 600 } });
const PROFILE = { resolutionPx: { width: 1920, height: 1080 }, widthCm: 53.1, pixelsPerCm: null, viewingDistanceCm: 57 };
const CSV_CIRCLE = Array.from({ length: 64 }, (_, i) => `${Math.cos((2 * Math.PI * i) / 64).toFixed(6)},${Math.sin((2 * Math.PI * i) / 64).toFixed(6)}`).join('\n');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Starts pg-boss and a pack worker; returns the stop function. */
async function startRecipeWorker(): Promise<() => Promise<void>> {
  const boss = await startBoss({ supervise: true, maintenanceIntervalSeconds: 1 });
  const stopWorker = await startPackWorker({ db: getDb(), boss, pool: { render: renderPng }, pollingIntervalSeconds: 0.5 });
  return async () => {
    await stopWorker();
    await boss.stop({ graceful: false, wait: true });
  };
}

/** The request options (cookie or bearer) of a caller. */
export function authOf(book: RecipeBook, who: RecipeCaller): { cookie?: string; bearer?: string } {
  if (who === 'anonymous') return {};
  if (who === 'token') return { bearer: book.token };
  if (typeof who === 'object') return { cookie: who.cookie };
  return { cookie: book.lab.members[who].cookie };
}

/** Makes a recipe's call exactly as described, as its own caller. */
export function callRecipe(book: RecipeBook, route: AnyRouteSpec, call: RecipeCall): ReturnType<typeof callRoute> {
  return callRoute(route, {
    ...authOf(book, call.as ?? 'owner'),
    ...(call.params ? { params: call.params } : {}),
    ...(call.query ? { query: call.query } : {}),
    ...(call.body !== undefined ? { body: call.body } : {}),
    ...(call.text ? { text: call.text } : {}),
  });
}

/** The registered routes by id. */
export function routesById(): Map<string, AnyRouteSpec> {
  return new Map(registeredRoutes().map((r) => [r.id, r]));
}

/**
 * Makes what the recipes need besides each other (a write token, a member to change and remove, things to
 * delete) in `lab`, and returns the recipes in call order.
 */
export async function prepareRouteRecipes(lab: TestLab): Promise<RecipeBook> {
  const ids: Record<string, string> = {};
  // The pack worker starts only once the first pack was cancelled while still queued, so that cancel never races
  // a worker that has already picked the job up.
  let stopWorker: (() => Promise<void>) | undefined;
  const book: RecipeBook = { lab, token: '', ids, recipes: [], close: async () => stopWorker?.() };
  const L = () => ({ lab: lab.slug });
  const space = () => ({ lab: lab.slug, spaceId: ids.space! });
  const edition = (n: number) => ({ ...space(), number: String(n) });
  const pack = () => ({ lab: lab.slug, packId: ids.pack! });
  const suffix = uniqueSuffix();
  const answerTo = (n: number) => {
    const [index, key] = (JSON.parse(ids.trials!) as [number, string | null][])[n]!;
    return { clientTrialId: '6f1c2b0e-3d4a-4b5c-9d6e-7f8091a2b3c4', trialIndex: index, responseKey: key ?? 'f', rating: null, rtMs: 512, achievedMs: 300, onsetMs: 100, offsetMs: 400, wasTabHidden: false, leftFullScreen: false };
  };
  const waitForPack = async (done: (state: string) => boolean) => {
    for (let i = 0; i < 200; i++) {
      const r = await callRoute(api.getPackRoute, { params: pack(), cookie: lab.members.reviewer.cookie });
      const state = (r.body as { state: string }).state;
      if (done(state)) return state;
      await sleep(250);
    }
    throw new Error('the pack did not finish');
  };

  // In order: each call may use what an earlier one made (`ids`), and `after` runs once it answered.
  const calls: [string, () => RecipeCall, ((body: unknown) => Promise<void> | void)?][] = [
    ['getHealth', () => ({ as: 'anonymous', status: 200 })],
    ['getOpenApiDocument', () => ({ as: 'anonymous', status: 200 })],
    ['createAccount', () => ({ as: 'anonymous', body: { name: 'New Person', email: `new-${suffix}@test.example`, password: TEST_PASSWORD, labName: `Lab ${suffix}` }, status: 201 }), async (b) => {
      ids.newUser = (b as { userId: string }).userId;
    }],
    ['requestPasswordReset', () => ({ as: 'anonymous', body: { email: lab.members.owner.email }, status: 202 })],
    // Needs the secret from the e-mail: a made-up one is refused, and the refusal is documented too.
    ['confirmPasswordReset', () => ({ as: 'anonymous', body: { token: 'x'.repeat(40), password: TEST_PASSWORD }, status: 400 })],
    ['acceptInvitationAsNewUser', () => ({ as: 'anonymous', body: { token: 'x'.repeat(40), name: 'Someone', password: TEST_PASSWORD }, status: 400 })],
    ['listLabs', () => ({ as: 'owner', status: 200 })],
    ['listLabMembers', () => ({ as: 'token', params: L(), status: 200 })],
    ['createLabInvitation', () => ({ as: 'owner', params: L(), body: { email: `invitee-${suffix}@test.example`, role: 'reviewer' }, status: 201 }), (b) => {
      ids.invitation = (b as { id: string }).id;
    }],
    ['listLabInvitations', () => ({ as: 'owner', params: L(), status: 200 })],
    ['resendLabInvitation', () => ({ as: 'owner', params: { ...L(), invitationId: ids.invitation! }, status: 200 })],
    ['revokeLabInvitation', () => ({ as: 'owner', params: { ...L(), invitationId: ids.invitation! }, status: 204 })],
    ['joinLab', () => ({ as: 'reviewer', params: L(), body: { token: 'y'.repeat(40) }, status: 400 })],
    ['changeLabMemberRole', () => ({ as: 'owner', params: { ...L(), userId: ids.extra! }, body: { role: 'experimenter' }, status: 200 })],
    // Any member may leave (the route needs lab:read); removing someone else needs members:manage.
    ['removeLabMember', () => ({ as: 'owner', params: { ...L(), userId: ids.extra! }, action: 'members:manage', status: 204 })],
    ['listAuditEvents', () => ({ as: 'token', params: L(), status: 200 })],
    ['createSeedShape', () => ({ as: 'designer', params: L(), body: { name: `Seed ${suffix}`, descriptor: TEST_SEED }, status: 201 }), (b) => {
      ids.seed = (b as { id: string }).id;
    }],
    ['listSeedShapes', () => ({ as: 'token', params: L(), status: 200 })],
    ['getSeedShape', () => ({ as: 'token', params: { ...L(), seedShapeId: ids.seed! }, status: 200 })],
    ['updateSeedShape', () => ({ as: 'designer', params: { ...L(), seedShapeId: ids.seed! }, body: { name: `Seed ${suffix} renamed`, version: 1 }, status: 200 })],
    ['fitSeedShapeFromUpload', () => ({ as: 'designer', params: L(), query: { family: 'radial', harmonics: '4' }, text: { type: 'text/csv', content: CSV_CIRCLE }, status: 200 })],
    ['createShapeSpace', () => ({ as: 'designer', params: L(), body: { name: `Space ${suffix}`, seedShapeId: ids.seed!, ...SPACE }, status: 201 }), (b) => {
      ids.space = (b as { id: string }).id;
    }],
    ['listShapeSpaces', () => ({ as: 'token', params: L(), status: 200 })],
    ['getShapeSpace', () => ({ as: 'token', params: space(), status: 200 })],
    ['updateShapeSpace', () => ({ as: 'designer', params: space(), body: { name: `Space ${suffix} b`, version: 1 }, status: 200 })],
    ['listSpaceStimuli', () => ({ as: 'token', params: space(), query: { limit: '3' }, status: 200 })],
    ['putSpaceBoundaries', () => ({ as: 'designer', params: space(), body: { boundaries: [{ key: 'split', angleDeg: 30 }], version: 1 }, status: 200 })],
    ['freezeEdition', () => ({ as: 'designer', params: space(), body: { changeNote: 'first' }, status: 201 }), (b) => {
      ids.edition = (b as { id: string }).id;
    }],
    ['listEditions', () => ({ as: 'token', params: space(), status: 200 })],
    ['getEdition', () => ({ as: 'token', params: edition(1), status: 200 })],
    ['updateEdition', () => ({ as: 'designer', params: edition(1), body: { changeNote: 'first, with a note' }, status: 200 })],
    ['getEditionSnapshot', () => ({ as: 'token', params: edition(1), status: 200 })],
    ['submitEdition', () => ({ as: 'designer', params: edition(1), status: 200 })],
    ['decideEdition', () => ({ as: 'reviewer', params: edition(1), body: { decision: 'approve' }, status: 200 })],
    ['listLabEditions', () => ({ as: 'token', params: L(), query: { state: 'approved' }, status: 200 })],
    ['addEditionComment', () => ({ as: 'reviewer', params: edition(1), body: { body: 'Looks even.', stimulusId: null }, status: 201 }), (b) => {
      ids.comment = (b as { id: string }).id;
    }],
    ['listEditionComments', () => ({ as: 'token', params: edition(1), status: 200 })],
    ['resolveEditionComment', () => ({ as: 'designer', params: { ...edition(1), commentId: ids.comment! }, body: { resolved: true }, status: 200 })],
    ['diffEditions', () => ({ as: 'token', params: space(), query: { from: '1', to: '1' }, status: 200 })],
    ['createDisplayProfile', () => ({ as: 'experimenter', params: L(), body: { name: `Screen ${suffix}`, ...PROFILE }, status: 201 }), (b) => {
      ids.profile = (b as { id: string }).id;
    }],
    ['listDisplayProfiles', () => ({ as: 'token', params: L(), status: 200 })],
    ['getDisplayProfile', () => ({ as: 'token', params: { ...L(), profileId: ids.profile! }, status: 200 })],
    ['updateDisplayProfile', () => ({ as: 'experimenter', params: { ...L(), profileId: ids.profile! }, body: { viewingDistanceCm: 60, version: 1 }, status: 200 })],
    ['createPack', () => ({ as: 'token', params: edition(1), body: { displayProfileId: ids.profile!, render: { ...DEFAULT_RENDER_OPTIONS, sizeDeg: 2, canvasDeg: 3, samples: 128 } }, status: 202 }), (b) => {
      ids.pack = (b as { id: string }).id;
    }],
    ['listPacks', () => ({ as: 'token', params: L(), status: 200 })],
    ['cancelPack', () => ({ as: 'token', params: pack(), status: 200 }), async () => {
      await waitForPack((s) => s === 'cancelled');
      stopWorker = await startRecipeWorker();
    }],
    ['retryPack', () => ({ as: 'token', params: pack(), status: 200 }), async () => {
      expect(await waitForPack((s) => s === 'succeeded' || s === 'failed')).toBe('succeeded');
    }],
    ['getPack', () => ({ as: 'token', params: pack(), status: 200 })],
    ['getPackManifest', () => ({ as: 'token', params: pack(), status: 200 }), (b) => {
      ids.manifest = JSON.stringify(b);
    }],
    ['packDownloadLink', () => ({ as: 'token', params: pack(), status: 200 })],
    ['checkPack', () => ({ as: 'token', params: L(), body: { manifest: ids.manifest!, sums: '0'.repeat(64) + '  manifest.json\n' }, status: 200 })],
    ['createStudy', () => ({ as: 'token', params: L(), body: { name: `Study ${suffix}`, editionId: ids.edition!, consentText: 'I agree to take part.', targetParticipants: 12, design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null } }, status: 201 }), (b) => {
      ids.study = (b as { id: string }).id;
    }],
    ['listStudies', () => ({ as: 'token', params: L(), status: 200 })],
    ['getStudy', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['updateStudy', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, body: { name: `Study ${suffix} b`, version: 1 }, status: 200 })],
    ['getStudyPlan', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, query: { participant: '2' }, status: 200 })],
    ['openStudy', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, body: { confirmEthics: true }, status: 200 }), (b) => {
      ids.inviteToken = new URL((b as { inviteUrl: string }).inviteUrl).pathname.split('/').pop()!;
    }],
    ['getJoinStudy', () => ({ as: 'anonymous', params: { token: ids.inviteToken! }, status: 200 })],
    ['startParticipantSession', () => ({ as: 'anonymous', params: { token: ids.inviteToken! }, body: { screen: SCREEN }, status: 201 }), (b) => {
      const s = b as { sessionCode: string; trials: { index: number; correctKey: string | null }[] };
      ids.sessionCode = s.sessionCode;
      ids.trials = JSON.stringify(s.trials.map((t) => [t.index, t.correctKey]));
    }],
    ['submitTrialResponse', () => ({ as: 'anonymous', params: { token: ids.inviteToken!, code: ids.sessionCode! }, body: answerTo(0), status: 200 })],
    ['resumeParticipantSession', () => ({ as: 'anonymous', params: { token: ids.inviteToken!, code: ids.sessionCode! }, status: 200 })],
    // One trial of many is stored: finishing is refused, and the refusal is documented.
    ['finishParticipantSession', () => ({ as: 'anonymous', params: { token: ids.inviteToken!, code: ids.sessionCode! }, status: 409 })],
    ['listStudySessions', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 }), (b) => {
      ids.session = (b as { items: { id: string }[] }).items[0]!.id;
    }],
    ['listStudyTrials', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['downloadStudyTrialsCsv', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 }), (b) => {
      expect(formulaCellsIn(String(b)), 'the trials CSV neutralises formula cells').toEqual([]);
    }],
    ['getStudyResults', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['getResultSettings', () => ({ as: 'reviewer', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['updateResultSettings', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, body: { link: 'probit', lapseMode: 'fixed', lapseValue: 0.02, resamples: 1000, seed: 5, alpha: 0.05, catchAccuracyMin: 0.5, rtMadK: 3 }, status: 200 })],
    ['createResultExclusion', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, body: { sessionId: ids.session!, trialIndex: null, action: 'keep', reason: 'Checked by hand' }, status: 201 }), (b) => {
      ids.resultExclusion = (b as { id: string }).id;
    }],
    ['listResultExclusions', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['removeResultExclusion', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study!, exclusionId: ids.resultExclusion! }, status: 204 })],
    ['retryStudyResults', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['downloadResultsReport', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['downloadResultsTrialsCsv', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 }), (b) => {
      expect(formulaCellsIn(String(b)), 'the results trials.csv neutralises formula cells').toEqual([]);
    }],
    ['downloadResultsFitsCsv', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 }), (b) => {
      expect(formulaCellsIn(String(b)), 'fits.csv neutralises formula cells').toEqual([]);
    }],
    ['downloadResultsPlot', () => ({ as: 'token', params: { ...L(), studyId: ids.study!, plot: 'curves' }, status: 200 })],
    ['getStudySimilarity', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['downloadStudySimilarityCsv', () => ({ as: 'token', params: { ...L(), studyId: ids.study! }, status: 200 }), (b) => {
      expect(formulaCellsIn(String(b)), 'similarity.csv neutralises formula cells').toEqual([]);
    }],
    // A categorisation-only study has no pair ratings, hence no RDMs, and one answer gives no slopes: both refusals are documented.
    ['downloadStudySimilarityRdm', () => ({ as: 'token', params: { ...L(), studyId: ids.study!, rdm: 'design' }, status: 409 })],
    ['createEqualizedSpace', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, body: { basis: 'slopes' }, status: 409 })],
    ['getSpaceOrigin', () => ({ as: 'token', params: space(), status: 200 })],
    ['setStudySessionExclusion', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study!, sessionId: ids.session! }, body: { isExcluded: true, reason: 'Test run' }, status: 200 })],
    ['withdrawParticipantSession', () => ({ as: 'anonymous', body: { sessionCode: ids.sessionCode! }, status: 200 })],
    ['deleteStudySession', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study!, sessionId: ids.session! }, status: 204 })],
    ['rotateStudyInvite', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['revokeStudyInvite', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['closeStudy', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.study! }, status: 200 })],
    ['createRunOrder', () => ({ as: 'token', params: edition(1), body: { name: `Scan ${suffix}`, definition: DEFAULT_RUN_ORDER_DEFINITION }, status: 201 }), (b) => {
      ids.runOrder = (b as { id: string }).id;
    }],
    ['listRunOrders', () => ({ as: 'token', params: edition(1), status: 200 })],
    ['getRunOrder', () => ({ as: 'token', params: { ...L(), runOrderId: ids.runOrder! }, status: 200 })],
    ['updateRunOrder', () => ({ as: 'experimenter', params: { ...L(), runOrderId: ids.runOrder! }, body: { name: `Scan ${suffix} b`, definition: { ...DEFAULT_RUN_ORDER_DEFINITION, runs: 2 }, version: 1 }, status: 200 })],
    ['downloadRunOrder', () => ({ as: 'token', params: { ...L(), runOrderId: ids.runOrder! }, status: 200 })],
    ['deleteRunOrder', () => ({ as: 'experimenter', params: { ...L(), runOrderId: ids.runOrder! }, status: 204 })],
    ['deleteStudy', () => ({ as: 'experimenter', params: { ...L(), studyId: ids.spareStudy! }, status: 204 })],
    ['createApiToken', () => ({ as: 'owner', params: L(), body: { name: `Script ${suffix}`, scope: 'read', expiresInDays: 7 }, status: 201 }), (b) => {
      ids.token = (b as { id: string }).id;
    }],
    ['listApiTokens', () => ({ as: 'owner', params: L(), status: 200 })],
    ['revokeApiToken', () => ({ as: 'owner', params: { ...L(), tokenId: ids.token! }, status: 200 })],
    ['deleteDisplayProfile', () => ({ as: 'experimenter', params: { ...L(), profileId: ids.spareProfile! }, status: 204 })],
    ['deleteShapeSpace', () => ({ as: 'designer', params: { ...L(), spaceId: ids.spareSpace! }, status: 204 })],
    ['deleteSeedShape', () => ({ as: 'designer', params: { ...L(), seedShapeId: ids.spareSeed! }, status: 204 })],
    ['signOutEverywhere', () => ({ as: { cookie: ids.newUserCookie! }, status: 200 })],
  ];

  // What the calls above need besides each other: a token, a member to change and remove, things to delete.
  const made = await callRoute(api.createApiTokenRoute, { params: L(), body: { name: 'contract', scope: 'write', expiresInDays: 1 }, cookie: lab.members.owner.cookie });
  const token = (made.body as { token: string }).token;
  const extra = await insertUser(getDb(), { email: `extra-${suffix}@test.example`, name: 'Extra', passwordHash: null });
  await insertMembership(getDb(), lab.id, extra.id, 'reviewer');
  ids.extra = extra.id;
  const spareSeed = await callRoute(api.createSeedShapeRoute, { params: L(), body: { name: `Spare ${suffix}`, descriptor: TEST_SEED }, cookie: lab.members.designer.cookie });
  ids.spareSeed = (spareSeed.body as { id: string }).id;
  const spareSpace = await callRoute(api.createShapeSpaceRoute, { params: L(), body: { name: `Spare space ${suffix}`, seedShapeId: ids.spareSeed, ...SPACE }, cookie: lab.members.designer.cookie });
  ids.spareSpace = (spareSpace.body as { id: string }).id;
  const spareProfile = await callRoute(api.createDisplayProfileRoute, { params: L(), body: { name: `Spare screen ${suffix}`, ...PROFILE }, cookie: lab.members.experimenter.cookie });
  ids.spareProfile = (spareProfile.body as { id: string }).id;

  // A Draft study to delete, made when the edition exists (just before its call).
  const makeSpareStudy = async () => {
    const r = await callRoute(api.createStudyRoute, {
      params: L(),
      body: { name: `Spare study ${suffix}`, editionId: ids.edition, consentText: 'I agree.', targetParticipants: 1, design: { stimulusSizeDeg: 4, categorisation: CATEGORISATION, similarity: null } },
      cookie: lab.members.experimenter.cookie,
    });
    ids.spareStudy = (r.body as { id: string }).id;
  };

  book.token = token;
  const befores: Record<string, () => Promise<void>> = {
    signOutEverywhere: async () => {
      ids.newUserCookie = await sessionCookie(ids.newUser!);
    },
    deleteStudy: makeSpareStudy,
  };
  book.recipes = calls.map(([id, call, after]) => ({ id, call, ...(after ? { after } : {}), ...(befores[id] ? { before: befores[id] } : {}) }));
  return book;
}
