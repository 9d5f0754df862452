import 'server-only';
import { conflict, forbidden, notFound, validationError } from '@/lib/errors';
import type { Db } from '@/db/client';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import {
  getEdition as getEditionRow,
  getEditionSnapshot as getSnapshotRow,
  insertComment,
  insertEdition,
  listComments as listCommentRows,
  listEditions as listEditionRows,
  listLabEditions as listLabEditionRows,
  lockSpaceForFreeze,
  setCommentResolved,
  supersedeReturned,
  transitionEdition,
  updateChangeNote,
  type CommentListRow,
  type EditionListRow,
} from '@/db/repositories/editions';
import { listMembersOfLab } from '@/db/repositories/memberships';
import { buildSnapshot, contentHash, diffEditions, diffParameters, type EditionSnapshot } from '@/lib/edition';
import { BoundaryError } from '@/lib/boundary';
import { ENGINE_VERSION } from '@/lib/shape/engine-version';
import type { ShapeDescriptor } from '@/lib/shape';
import type { Page, PageQuery } from '@/lib/schemas/common';
import {
  EDITION_STATE_LABELS,
  EditionSnapshotSchema,
  type Edition,
  type EditionComment,
  type EditionDiffValue,
  type EditionSnapshotValue,
  type LabEditionsQuery,
} from '@/lib/schemas/edition';
import { getEnv } from '../env';
import { logEvent } from '../log';
import { sendMail } from '../mail/mailer';
import { editionDecidedMail, editionSubmittedMail } from '../mail/templates';
import { authorize, type LabActor } from './access';
import { getShapeSpace, toDefinition } from './shape-spaces';

const person = (id: string | null, name: string | null) => (id ? { id, name: name ?? 'Former member' } : null);

function toEdition(row: EditionListRow): Edition {
  return {
    id: row.id,
    spaceId: row.space_id,
    spaceName: row.space_name,
    number: row.number,
    state: row.state,
    contentHash: row.content_hash,
    engineVersion: row.engine_version,
    stimulusCount: row.stimulus_count,
    changeNote: row.change_note,
    author: person(row.author_id, row.author_name),
    createdAt: row.created_at.toISOString(),
    submittedBy: person(row.submitted_by, row.submitted_by_name),
    submittedAt: row.submitted_at?.toISOString() ?? null,
    decidedBy: person(row.decided_by, row.decided_by_name),
    decidedAt: row.decided_at?.toISOString() ?? null,
    decisionNote: row.decision_note,
    supersededBy: row.superseded_by_number,
    openComments: Number(row.open_comments ?? 0),
  };
}

function toComment(row: CommentListRow): EditionComment {
  return {
    id: row.id,
    stimulusId: row.stimulus_id,
    body: row.body,
    author: person(row.author_id, row.author_name),
    createdAt: row.created_at.toISOString(),
    resolvedBy: person(row.resolved_by, row.resolved_by_name),
    resolvedAt: row.resolved_at?.toISOString() ?? null,
  };
}

function editionUrl(actor: LabActor, spaceId: string, number: number): string {
  return `${getEnv().APP_URL}/labs/${encodeURIComponent(actor.labSlug)}/spaces/${spaceId}/editions/${number}`;
}

/** Mail is sent after the change commits; a failed delivery is logged and never undoes the change. */
async function deliver(mails: Parameters<typeof sendMail>[0][]): Promise<void> {
  for (const m of mails) {
    try {
      await sendMail(m);
    } catch (error) {
      logEvent('error', 'mail failed', { to: m.to, subject: m.subject, error: error instanceof Error ? error.message : String(error) });
    }
  }
}

export async function listEditions(db: Db, actor: LabActor, spaceId: string, query: PageQuery): Promise<Page<Edition>> {
  authorize(actor, 'edition:read');
  await getShapeSpace(db, actor, spaceId);
  return toPage(await listEditionRows(db, actor.labId, spaceId, query), query.limit, (r) => r.created_at, toEdition);
}

/** The lab's editions across its spaces, newest first; `state` narrows them (scripts ask for `approved`). */
export async function listLabEditions(db: Db, actor: LabActor, query: LabEditionsQuery): Promise<Page<Edition>> {
  authorize(actor, 'edition:read');
  return toPage(await listLabEditionRows(db, actor.labId, query), query.limit, (r) => r.created_at, toEdition);
}

export async function getEdition(db: Db, actor: LabActor, spaceId: string, number: number): Promise<Edition> {
  authorize(actor, 'edition:read');
  return toEdition(await getEditionRow(db, actor.labId, spaceId, number));
}

export async function getEditionSnapshot(db: Db, actor: LabActor, spaceId: string, number: number): Promise<EditionSnapshotValue> {
  authorize(actor, 'edition:read');
  const row = await getEditionRow(db, actor.labId, spaceId, number);
  return EditionSnapshotSchema.parse(await getSnapshotRow(db, row.id));
}

/**
 * Freezes the space as it is now — seed, definition, boundaries, normalisation, engine version and every
 * stimulus — into edition N + 1 (Draft). Returned editions of the space are superseded by it.
 */
export async function freezeEdition(
  db: Db,
  actor: LabActor,
  spaceId: string,
  input: { changeNote: string; spaceVersion?: number | undefined; boundariesVersion?: number | undefined },
): Promise<Edition> {
  authorize(actor, 'edition:freeze');
  const number = await db.transaction().execute(async (trx) => {
    const next = await lockSpaceForFreeze(trx, actor.labId, spaceId);
    const space = await getShapeSpace(trx, actor, spaceId);
    if (input.spaceVersion !== undefined && input.spaceVersion !== space.version) {
      throw conflict('edition', `The space was saved again (now version ${space.version}) after you opened it. Reload, check it, then freeze.`, { spaceVersion: ['Out of date'] });
    }
    if (input.boundariesVersion !== undefined && input.boundariesVersion !== space.boundariesVersion) {
      throw conflict('edition', 'The boundaries were changed after you opened the space. Reload, check them, then freeze.', { boundariesVersion: ['Out of date'] });
    }
    let snapshot: EditionSnapshot;
    try {
      snapshot = buildSnapshot({
        engineVersion: ENGINE_VERSION,
        space: { id: space.id, name: space.name },
        seed: { id: space.seedShape.id, name: space.seedShape.name },
        definition: toDefinition(space.seedShape.descriptor as ShapeDescriptor, { ...space, equalize: space.equalization !== null }, space.equalization),
        boundaries: space.boundaries.map((b) => ({ key: b.key, label: b.label, angleDeg: b.angleDeg, ...(b.prototypeDistance === null ? {} : { prototypeDistance: b.prototypeDistance }) })),
      });
    } catch (error) {
      if (error instanceof BoundaryError) throw validationError('edition', error.message, { boundaries: [error.message] });
      throw error;
    }
    const hash = contentHash(snapshot);
    const { id } = await insertEdition(trx, {
      labId: actor.labId,
      spaceId,
      number: next,
      snapshot,
      contentHash: hash,
      engineVersion: ENGINE_VERSION,
      stimulusCount: snapshot.stimuli.length,
      changeNote: input.changeNote,
      authorId: actor.userId,
    });
    const superseded = await supersedeReturned(trx, spaceId, id);
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: 'edition.freeze',
      subjectType: 'edition',
      subjectId: id,
      details: { space: space.name, number: next, hash, stimuli: snapshot.stimuli.length, superseded },
    });
    return next;
  });
  return getEdition(db, actor, spaceId, number);
}

function stateLabel(row: EditionListRow): string {
  return EDITION_STATE_LABELS[row.state];
}

/** Draft → In review, by a Designer or Owner; mails the lab's reviewers and owners (the submitter aside). */
export async function submitEdition(db: Db, actor: LabActor, spaceId: string, number: number): Promise<Edition> {
  authorize(actor, 'edition:submit');
  const row = await getEditionRow(db, actor.labId, spaceId, number);
  if (row.state !== 'draft') throw conflict('edition', `Edition ${number} is ${stateLabel(row)}; only a Draft can be submitted for review.`);
  await db.transaction().execute(async (trx) => {
    if (!(await transitionEdition(trx, row.id, 'draft', 'in_review', { submitted_by: actor.userId, submitted_at: new Date() }))) {
      throw conflict('edition', `Edition ${number} changed state meanwhile; reload it.`);
    }
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'edition.submit', subjectType: 'edition', subjectId: row.id, details: { space: row.space_name, number } });
  });
  const members = await listMembersOfLab(db, actor.labId);
  const submitter = members.find((m) => m.user_id === actor.userId)?.name ?? 'A lab member';
  await deliver(
    members
      .filter((m) => (m.role === 'reviewer' || m.role === 'owner') && m.user_id !== actor.userId)
      .map((m) => editionSubmittedMail({ to: m.email, submitter, spaceName: row.space_name, number, changeNote: row.change_note, url: editionUrl(actor, spaceId, number) })),
  );
  return getEdition(db, actor, spaceId, number);
}

/** In review → Approved or Returned, by a Reviewer or Owner who is not the edition's author; mails the author. */
export async function decideEdition(db: Db, actor: LabActor, spaceId: string, number: number, input: { decision: 'approve' | 'return'; note: string }): Promise<Edition> {
  authorize(actor, 'edition:decide');
  const row = await getEditionRow(db, actor.labId, spaceId, number);
  if (row.author_id === actor.userId) throw forbidden('edition', `You froze edition ${number}, so someone else must review it.`);
  if (row.state !== 'in_review') throw conflict('edition', `Edition ${number} is ${stateLabel(row)}; only an edition In review can be approved or returned.`);
  const to = input.decision === 'approve' ? 'approved' : 'returned';
  await db.transaction().execute(async (trx) => {
    if (!(await transitionEdition(trx, row.id, 'in_review', to, { decided_by: actor.userId, decided_at: new Date(), decision_note: input.note }))) {
      throw conflict('edition', `Edition ${number} changed state meanwhile; reload it.`);
    }
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: input.decision === 'approve' ? 'edition.approve' : 'edition.return',
      subjectType: 'edition',
      subjectId: row.id,
      details: { space: row.space_name, number, note: input.note },
    });
  });
  const members = await listMembersOfLab(db, actor.labId);
  const author = members.find((m) => m.user_id === row.author_id);
  const decider = members.find((m) => m.user_id === actor.userId)?.name ?? 'A reviewer';
  if (author) {
    await deliver([editionDecidedMail({ to: author.email, decider, spaceName: row.space_name, number, approved: to === 'approved', note: input.note, url: editionUrl(actor, spaceId, number) })]);
  }
  return getEdition(db, actor, spaceId, number);
}

/** Only a Draft's change note may be edited; the snapshot never changes. */
export async function updateEdition(db: Db, actor: LabActor, spaceId: string, number: number, input: { changeNote: string }): Promise<Edition> {
  authorize(actor, 'edition:freeze');
  const row = await getEditionRow(db, actor.labId, spaceId, number);
  if (row.state !== 'draft') {
    throw conflict(
      'edition',
      `Edition ${number} is ${stateLabel(row)}, and an edition that has gone to review never changes. To change the space, freeze a new edition.`,
    );
  }
  await db.transaction().execute(async (trx) => {
    await updateChangeNote(trx, row.id, input.changeNote);
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'edition.note', subjectType: 'edition', subjectId: row.id, details: { number } });
  });
  return getEdition(db, actor, spaceId, number);
}

export async function listComments(db: Db, actor: LabActor, spaceId: string, number: number): Promise<EditionComment[]> {
  authorize(actor, 'edition:read');
  const row = await getEditionRow(db, actor.labId, spaceId, number);
  return (await listCommentRows(db, row.id)).map(toComment);
}

/** A comment on the whole edition, or pinned to one of its stimulus ids (layout or prototype). */
export async function addComment(db: Db, actor: LabActor, spaceId: string, number: number, input: { body: string; stimulusId: string | null }): Promise<EditionComment> {
  authorize(actor, 'edition:comment');
  const row = await getEditionRow(db, actor.labId, spaceId, number);
  if (input.stimulusId !== null) {
    const snapshot = EditionSnapshotSchema.parse(await getSnapshotRow(db, row.id));
    if (!snapshot.stimuli.some((s) => s.id === input.stimulusId)) {
      throw validationError('comment', `Edition ${number} has no stimulus "${input.stimulusId}".`, { stimulusId: ['No such stimulus in this edition'] });
    }
  }
  const id = await db.transaction().execute(async (trx) => {
    const c = await insertComment(trx, { labId: actor.labId, editionId: row.id, stimulusId: input.stimulusId, body: input.body, authorId: actor.userId });
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'edition.comment', subjectType: 'edition', subjectId: row.id, details: { number, stimulus: input.stimulusId } });
    return c.id;
  });
  const comment = (await listCommentRows(db, row.id)).find((c) => c.id === id)!;
  return toComment(comment);
}

export async function resolveComment(db: Db, actor: LabActor, spaceId: string, number: number, commentId: string, resolved: boolean): Promise<EditionComment> {
  authorize(actor, 'edition:comment');
  const row = await getEditionRow(db, actor.labId, spaceId, number);
  if (!(await setCommentResolved(db, row.id, commentId, resolved ? actor.userId : null))) throw notFound('comment', 'No such comment on this edition.');
  return toComment((await listCommentRows(db, row.id)).find((c) => c.id === commentId)!);
}

/** What changed from edition `from` to edition `to`: parameters as JSON Pointer rows, stimuli matched by id. */
export async function diffEditionsOf(db: Db, actor: LabActor, spaceId: string, from: number, to: number): Promise<EditionDiffValue> {
  const [before, after] = await Promise.all([getEditionSnapshot(db, actor, spaceId, from), getEditionSnapshot(db, actor, spaceId, to)]);
  const params = (s: EditionSnapshotValue) => ({ seed: s.seed, definition: s.definition, boundaries: s.boundaries, engineVersion: s.engineVersion });
  const stimuli = diffEditions(before.stimuli, after.stimuli);
  return {
    from,
    to,
    parameters: diffParameters(params(before), params(after)).map((p) => ({ path: p.path, before: p.before, after: p.after })),
    added: [...stimuli.added],
    removed: [...stimuli.removed],
    changed: stimuli.changed.map((c) => ({ id: c.id, fields: [...c.fields], before: c.before, after: c.after })),
    unchangedCount: stimuli.unchanged.length,
  };
}
