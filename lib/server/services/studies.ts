import 'server-only';
import { randomInt } from 'node:crypto';
import { z } from 'zod';
import { conflict, notFound, validationError, type FieldErrors } from '@/lib/errors';
import type { Db, DbHandle } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import { findEditionById, getEditionSnapshot, listEditionChoices, type EditionListRow } from '@/db/repositories/editions';
import {
  deleteStudy as deleteRow,
  getStudy as getRow,
  insertStudy,
  listStudies as listRows,
  lockStudy,
  setStudyInvite,
  setStudyState,
  updateStudy as updateRow,
  type StudyListRow,
  type StudyTexts,
} from '@/db/repositories/studies';
import { buildTrialPlan, checkFlashRate, checkStudyDesign, countPlannedTrials, estimateDuration, summarizePlan, type StudyDesign } from '@/lib/study';
import type { Page, PageQuery } from '@/lib/schemas/common';
import { EDITION_STATE_LABELS } from '@/lib/schemas/edition';
import type { CreateStudyInput, StudyDesignInput, StudyDesignValue, StudyValue, TrialPlanValue, UpdateStudyInput } from '@/lib/schemas/study';
import { inviteUrl, newInvite } from '../study-invite';
import { authorize, type LabActor } from './access';

/** Seeds are unsigned 32-bit integers (lib/sequence's MAX_SEED + 1 values). */
const SEED_SPACE = 0x1_0000_0000;
/** Editions offered in the study form. */
const EDITION_CHOICES = 200;

const StoredStimuliSchema = z.object({ stimuli: z.array(z.object({ id: z.string() })) });

/** An edition to choose in the form: Approved ones come first. */
export interface StudyEditionChoice {
  id: string;
  label: string;
  state: EditionListRow['state'];
  stimulusCount: number;
}

function toValue(row: StudyListRow): StudyValue {
  const design = row.design as StudyDesignValue;
  const core = design as StudyDesign;
  const flash = checkFlashRate(core);
  return {
    id: row.id,
    name: row.name,
    state: row.state,
    edition: { id: row.edition_id, spaceId: row.space_id, spaceName: row.space_name, number: row.edition_number, state: row.edition_state, stimulusCount: row.stimulus_count },
    editionWarning: row.edition_warning,
    design,
    consentText: row.consent_text,
    instructionsText: row.instructions_text,
    debriefText: row.debrief_text,
    finishCodePrefix: row.finish_code_prefix,
    targetParticipants: row.target_participants,
    plannedTrials: countPlannedTrials(core, row.stimulus_count),
    estimatedSeconds: estimateDuration(core, row.stimulus_count).seconds,
    flash: { peakPerSecond: flash.peakPerSecond, isAboveLimit: flash.isAboveLimit },
    inviteUrl: row.invite_nonce ? inviteUrl(row.invite_nonce) : null,
    inviteRotatedAt: row.invite_rotated_at?.toISOString() ?? null,
    version: row.version,
    createdBy: row.created_by_name,
    updatedBy: row.updated_by_name,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
    openedAt: row.opened_at?.toISOString() ?? null,
    closedAt: row.closed_at?.toISOString() ?? null,
  };
}

/** The warning kept with a study set up on an edition nobody has approved. */
function editionWarningFor(edition: EditionListRow): string | null {
  if (edition.state === 'approved') return null;
  return `Edition ${edition.number} of “${edition.space_name}” was ${EDITION_STATE_LABELS[edition.state]}, not Approved, when this study was set up: no reviewer has approved its stimuli.`;
}

async function stimulusIdsOf(db: DbHandle, editionId: string): Promise<string[]> {
  return StoredStimuliSchema.parse(await getEditionSnapshot(db, editionId)).stimuli.map((s) => s.id);
}

/** The edition (of this lab) and the checked design, or a validation error naming each field. */
async function resolveDesign(db: DbHandle, actor: LabActor, editionId: string, input: StudyDesignInput, seed: number): Promise<{ edition: EditionListRow; design: StudyDesign }> {
  const edition = await findEditionById(db, actor.labId, editionId);
  if (!edition) throw validationError('study', 'Choose an edition of this lab.', { editionId: ['No such edition in this lab'] });
  const design: StudyDesign = { seed, stimulusSizeDeg: input.stimulusSizeDeg, categorisation: input.categorisation, similarity: input.similarity };
  const issues = checkStudyDesign(design, edition.stimulus_count);
  if (issues.length) {
    const fields: FieldErrors = {};
    for (const i of issues) (fields[`design.${i.field}`] ??= []).push(i.message);
    throw validationError('study', issues.map((i) => i.message).join(' '), fields);
  }
  return { edition, design };
}

const textsOf = (v: { name: string; consentText: string; instructionsText: string; debriefText: string; finishCodePrefix: string; targetParticipants: number }): StudyTexts => ({
  name: v.name,
  consentText: v.consentText,
  instructionsText: v.instructionsText,
  debriefText: v.debriefText,
  finishCodePrefix: v.finishCodePrefix,
  targetParticipants: v.targetParticipants,
});

const audit = (db: DbHandle, actor: LabActor, action: string, id: string, details: Record<string, unknown>) =>
  insertAuditEvent(db, { labId: actor.labId, actorUserId: actor.userId, action, subjectType: 'study', subjectId: id, details });

export async function listStudies(db: Db, actor: LabActor, query: PageQuery): Promise<Page<StudyValue>> {
  authorize(actor, 'study:read');
  return toPage(await listRows(db, actor.labId, query), query.limit, (r) => r.updated_at, toValue);
}

export async function getStudy(db: Db, actor: LabActor, id: string): Promise<StudyValue> {
  authorize(actor, 'study:read');
  return toValue(await getRow(db, actor.labId, id));
}

/** The editions a study can be set up on: Approved first; others carry the "not approved" warning. */
export async function listStudyEditions(db: Db, actor: LabActor): Promise<StudyEditionChoice[]> {
  authorize(actor, 'study:read');
  const rows = await listEditionChoices(db, actor.labId, EDITION_CHOICES);
  return rows.map((r) => ({ id: r.id, label: `${r.space_name} · edition ${r.number}`, state: r.state, stimulusCount: r.stimulus_count }));
}

export async function createStudy(db: Db, actor: LabActor, input: CreateStudyInput & { instructionsText: string; debriefText: string; finishCodePrefix: string }): Promise<StudyValue> {
  authorize(actor, 'study:write');
  const id = await db.transaction().execute(async (trx) => {
    const { edition, design } = await resolveDesign(trx, actor, input.editionId, input.design, input.design.seed ?? randomInt(0, SEED_SPACE));
    const { id } = await insertStudy(trx, actor.labId, actor.userId, textsOf(input), { editionId: edition.id, design, editionWarning: editionWarningFor(edition) });
    await audit(trx, actor, 'study.create', id, { name: input.name, edition: edition.number, space: edition.space_name });
    return id;
  });
  return getStudy(db, actor, id);
}

/**
 * Changes a study. Texts, name and target change in any state but Closed; the edition and the design only while
 * the study is a Draft (the database refuses it too). `version` must be the one the edit started from.
 */
export async function updateStudy(db: Db, actor: LabActor, id: string, patch: UpdateStudyInput): Promise<StudyValue> {
  authorize(actor, 'study:write');
  await db.transaction().execute(async (trx) => {
    const current = await lockStudy(trx, actor.labId, id);
    if (current.state === 'closed') throw conflict('study', 'This study is closed; it can no longer change.');
    const changesDesign = patch.design !== undefined || (patch.editionId !== undefined && patch.editionId !== current.edition_id);
    if (changesDesign && current.state !== 'draft') {
      throw conflict('study', 'Opening fixed this study’s design: only its name, texts and target can change now.', { design: ['Fixed since the study opened'] });
    }
    if (current.version !== patch.version) {
      throw conflict('study', `Someone saved this study after you opened it (now version ${current.version}). Reload to see their change.`, { version: ['Out of date'] });
    }
    const before = toValue(current);
    const texts = textsOf({ ...before, ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)) } as StudyValue);
    let designWrite = null;
    if (changesDesign) {
      const designInput = patch.design ?? before.design;
      const { edition, design } = await resolveDesign(trx, actor, patch.editionId ?? current.edition_id, designInput, designInput.seed ?? before.design.seed);
      designWrite = { editionId: edition.id, design, editionWarning: editionWarningFor(edition) };
    }
    const row = await updateRow(trx, actor.labId, id, patch.version, actor.userId, texts, designWrite);
    if (!row) throw conflict('study', 'Someone saved this study at the same time. Reload to see their change.', { version: ['Out of date'] });
    await audit(trx, actor, 'study.update', id, { version: row.version, design: changesDesign });
  });
  return getStudy(db, actor, id);
}

export async function deleteStudy(db: Db, actor: LabActor, id: string): Promise<void> {
  authorize(actor, 'study:write');
  await db.transaction().execute(async (trx) => {
    const current = await lockStudy(trx, actor.labId, id);
    if (current.state !== 'draft') throw conflict('study', 'Only a Draft study can be deleted; close an open study instead.');
    if (!(await deleteRow(trx, actor.labId, id))) throw notFound('study', 'No such study in this lab.');
    await audit(trx, actor, 'study.delete', id, { name: current.name });
  });
}

/**
 * Opens a Draft study: its design is fixed from now on and an invite link is made. The caller confirms that the
 * lab's ethics board approved the study and that consent will be taken (the schema requires it).
 */
export async function openStudy(db: Db, actor: LabActor, id: string): Promise<StudyValue> {
  authorize(actor, 'study:write');
  await db.transaction().execute(async (trx) => {
    const current = await lockStudy(trx, actor.labId, id);
    if (current.state !== 'draft') throw conflict('study', `This study is ${current.state === 'open' ? 'already open' : 'closed'}.`);
    const design = current.design as StudyDesign;
    const issues = checkStudyDesign(design, current.stimulus_count);
    if (issues.length) throw validationError('study', issues.map((i) => i.message).join(' '), Object.fromEntries(issues.map((i) => [`design.${i.field}`, [i.message]])));
    await setStudyState(trx, id, 'open', actor.userId);
    const invite = newInvite();
    await setStudyInvite(trx, id, { nonce: invite.nonce, tokenHash: invite.tokenHash }, actor.userId);
    await audit(trx, actor, 'study.open', id, { name: current.name, ethicsConfirmed: true });
  });
  return getStudy(db, actor, id);
}

/** Closes an Open study: no new participants; the record and its design stay. */
export async function closeStudy(db: Db, actor: LabActor, id: string): Promise<StudyValue> {
  authorize(actor, 'study:write');
  await db.transaction().execute(async (trx) => {
    const current = await lockStudy(trx, actor.labId, id);
    if (current.state !== 'open') throw conflict('study', current.state === 'draft' ? 'This study has not been opened.' : 'This study is already closed.');
    await setStudyState(trx, id, 'closed', actor.userId);
    await audit(trx, actor, 'study.close', id, { name: current.name });
  });
  return getStudy(db, actor, id);
}

/** A new invite link for an Open study; the previous link stops working at once. */
export async function rotateStudyInvite(db: Db, actor: LabActor, id: string): Promise<StudyValue> {
  authorize(actor, 'study:write');
  await db.transaction().execute(async (trx) => {
    const current = await lockStudy(trx, actor.labId, id);
    if (current.state !== 'open') throw conflict('study', 'Only an Open study has an invite link.');
    const invite = newInvite();
    await setStudyInvite(trx, id, { nonce: invite.nonce, tokenHash: invite.tokenHash }, actor.userId);
    await audit(trx, actor, 'study.invite.rotate', id, {});
  });
  return getStudy(db, actor, id);
}

/** Revokes the invite link: nobody new can join until a new link is made. */
export async function revokeStudyInvite(db: Db, actor: LabActor, id: string): Promise<StudyValue> {
  authorize(actor, 'study:write');
  await db.transaction().execute(async (trx) => {
    const current = await lockStudy(trx, actor.labId, id);
    if (!current.invite_nonce) throw conflict('study', 'This study has no active invite link.');
    await setStudyInvite(trx, id, null, actor.userId);
    await audit(trx, actor, 'study.invite.revoke', id, {});
  });
  return getStudy(db, actor, id);
}

/** A participant's plan as a session will regenerate it (same seed, same index), with its counts. */
export async function getStudyPlan(db: Db, actor: LabActor, id: string, participant: number): Promise<TrialPlanValue> {
  authorize(actor, 'study:read');
  const row = await getRow(db, actor.labId, id);
  const design = row.design as StudyDesign;
  const plan = buildTrialPlan(design, { stimulusIds: await stimulusIdsOf(db, row.edition_id) }, participant);
  const summary = summarizePlan(plan, design.categorisation);
  return { participant: plan.participant, keys: plan.keys, trials: [...plan.trials], summary: { ...summary, cells: [...summary.cells], stimulusUse: { ...summary.stimulusUse } } };
}
