import { notFound } from '@/lib/errors';
import type { DbHandle } from '../client';
import type { EditionCommentRow, EditionRow, EditionState } from '../database';
import { beforeCursor } from '../pagination';

/** An edition without its snapshot, with the names of the people on it. */
export type EditionListRow = Omit<EditionRow, 'snapshot'> & {
  space_name: string;
  author_name: string | null;
  submitted_by_name: string | null;
  decided_by_name: string | null;
  superseded_by_number: number | null;
  open_comments: number | null;
};

function withJoins(db: DbHandle) {
  return db
    .selectFrom('editions')
    .innerJoin('shape_spaces', 'shape_spaces.id', 'editions.space_id')
    .leftJoin('users as author', 'author.id', 'editions.author_id')
    .leftJoin('users as submitter', 'submitter.id', 'editions.submitted_by')
    .leftJoin('users as decider', 'decider.id', 'editions.decided_by')
    .leftJoin('editions as successor', 'successor.id', 'editions.superseded_by')
    .select([
      'editions.id',
      'editions.lab_id',
      'editions.space_id',
      'editions.number',
      'editions.content_hash',
      'editions.engine_version',
      'editions.stimulus_count',
      'editions.change_note',
      'editions.author_id',
      'editions.created_at',
      'editions.state',
      'editions.submitted_by',
      'editions.submitted_at',
      'editions.decided_by',
      'editions.decided_at',
      'editions.decision_note',
      'editions.superseded_by',
      'shape_spaces.name as space_name',
      'author.name as author_name',
      'submitter.name as submitted_by_name',
      'decider.name as decided_by_name',
      'successor.number as superseded_by_number',
    ])
    .select((eb) =>
      eb
        .selectFrom('edition_comments')
        .whereRef('edition_comments.edition_id', '=', 'editions.id')
        .where('edition_comments.resolved_at', 'is', null)
        .select((e) => e.fn.countAll<number>().as('n'))
        .as('open_comments'),
    );
}

/** A space's editions, newest first, keyset-paginated; fetches `limit + 1` rows. */
export function listEditions(db: DbHandle, labId: string, spaceId: string, page: { cursor?: string | undefined; limit: number }): Promise<EditionListRow[]> {
  let q = withJoins(db).where('editions.lab_id', '=', labId).where('editions.space_id', '=', spaceId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'editions.created_at', 'editions.id'));
  return q.orderBy('editions.created_at', 'desc').orderBy('editions.id', 'desc').limit(page.limit + 1).execute();
}

/** Every edition of the lab, or those in one state, newest first, keyset-paginated; fetches `limit + 1` rows. */
export function listLabEditions(db: DbHandle, labId: string, page: { state?: EditionRow['state'] | undefined; cursor?: string | undefined; limit: number }): Promise<EditionListRow[]> {
  let q = withJoins(db).where('editions.lab_id', '=', labId);
  if (page.state) q = q.where('editions.state', '=', page.state);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'editions.created_at', 'editions.id'));
  return q.orderBy('editions.created_at', 'desc').orderBy('editions.id', 'desc').limit(page.limit + 1).execute();
}

/** Approved editions across the lab, newest first (what studies and packs start from). */
export function listApprovedEditions(db: DbHandle, labId: string, limit: number): Promise<EditionListRow[]> {
  return withJoins(db).where('editions.lab_id', '=', labId).where('editions.state', '=', 'approved').orderBy('editions.decided_at', 'desc').limit(limit).execute();
}

/** Every edition of the lab for choosing one (studies): Approved first, then the rest, newest first. */
export function listEditionChoices(db: DbHandle, labId: string, limit: number): Promise<EditionListRow[]> {
  return withJoins(db)
    .where('editions.lab_id', '=', labId)
    .orderBy((eb) => eb.case().when('editions.state', '=', 'approved').then(0).else(1).end())
    .orderBy('editions.created_at', 'desc')
    .limit(limit)
    .execute();
}

/** The lab's edition with this id, or undefined (also for an edition of another lab). */
export function findEditionById(db: DbHandle, labId: string, id: string): Promise<EditionListRow | undefined> {
  return withJoins(db).where('editions.lab_id', '=', labId).where('editions.id', '=', id).executeTakeFirst();
}

export async function getEdition(db: DbHandle, labId: string, spaceId: string, number: number): Promise<EditionListRow> {
  const row = await withJoins(db).where('editions.lab_id', '=', labId).where('editions.space_id', '=', spaceId).where('editions.number', '=', number).executeTakeFirst();
  if (!row) throw notFound('edition', `This space has no edition ${number}.`);
  return row;
}

/**
 * The lab's edition with this content hash, or undefined. Re-freezing an unchanged space repeats a hash, so when
 * several editions share it the one numbered `preferNumber` wins, then the newest.
 */
export function findEditionByHash(db: DbHandle, labId: string, hash: string, preferNumber?: number): Promise<EditionListRow | undefined> {
  return withJoins(db)
    .where('editions.lab_id', '=', labId)
    .where('editions.content_hash', '=', hash)
    .orderBy((eb) => eb.case().when('editions.number', '=', preferNumber ?? 0).then(0).else(1).end())
    .orderBy('editions.created_at', 'desc')
    .limit(1)
    .executeTakeFirst();
}

export async function getEditionSnapshot(db: DbHandle, editionId: string): Promise<unknown> {
  const row = await db.selectFrom('editions').select('snapshot').where('id', '=', editionId).executeTakeFirstOrThrow();
  return row.snapshot;
}

/** Locks the space row, so concurrent freezes number their editions one after the other. */
export async function lockSpaceForFreeze(db: DbHandle, labId: string, spaceId: string): Promise<number> {
  await db.selectFrom('shape_spaces').select('id').where('lab_id', '=', labId).where('id', '=', spaceId).forUpdate().executeTakeFirst();
  const r = await db.selectFrom('editions').select((eb) => eb.fn.max<number>('number').as('n')).where('space_id', '=', spaceId).executeTakeFirst();
  return Number(r?.n ?? 0) + 1;
}

export interface NewEdition {
  labId: string;
  spaceId: string;
  number: number;
  snapshot: unknown;
  contentHash: string;
  engineVersion: string;
  stimulusCount: number;
  changeNote: string;
  authorId: string;
}

export function insertEdition(db: DbHandle, e: NewEdition): Promise<{ id: string }> {
  return db
    .insertInto('editions')
    .values({
      lab_id: e.labId,
      space_id: e.spaceId,
      number: e.number,
      snapshot: JSON.stringify(e.snapshot),
      content_hash: e.contentHash,
      engine_version: e.engineVersion,
      stimulus_count: e.stimulusCount,
      change_note: e.changeNote,
      author_id: e.authorId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
}

/** Points every Returned, not yet superseded edition of the space at its successor. */
export async function supersedeReturned(db: DbHandle, spaceId: string, successorId: string): Promise<number> {
  const r = await db
    .updateTable('editions')
    .set({ superseded_by: successorId })
    .where('space_id', '=', spaceId)
    .where('state', '=', 'returned')
    .where('superseded_by', 'is', null)
    .executeTakeFirst();
  return Number(r.numUpdatedRows);
}

/** Moves an edition from `from` to `to` with the review fields; false if it was no longer in `from`. */
export async function transitionEdition(
  db: DbHandle,
  editionId: string,
  from: EditionState,
  to: EditionState,
  fields: { submitted_by?: string; submitted_at?: Date; decided_by?: string; decided_at?: Date; decision_note?: string },
): Promise<boolean> {
  const r = await db.updateTable('editions').set({ state: to, ...fields }).where('id', '=', editionId).where('state', '=', from).executeTakeFirst();
  return r.numUpdatedRows > 0n;
}

export async function updateChangeNote(db: DbHandle, editionId: string, changeNote: string): Promise<void> {
  await db.updateTable('editions').set({ change_note: changeNote }).where('id', '=', editionId).execute();
}

export type CommentListRow = EditionCommentRow & { author_name: string | null; resolved_by_name: string | null };

export function listComments(db: DbHandle, editionId: string): Promise<CommentListRow[]> {
  return db
    .selectFrom('edition_comments')
    .leftJoin('users as author', 'author.id', 'edition_comments.author_id')
    .leftJoin('users as resolver', 'resolver.id', 'edition_comments.resolved_by')
    .selectAll('edition_comments')
    .select(['author.name as author_name', 'resolver.name as resolved_by_name'])
    .where('edition_comments.edition_id', '=', editionId)
    .orderBy('edition_comments.created_at')
    .orderBy('edition_comments.id')
    .execute();
}

export function insertComment(db: DbHandle, c: { labId: string; editionId: string; stimulusId: string | null; body: string; authorId: string }): Promise<{ id: string }> {
  return db
    .insertInto('edition_comments')
    .values({ lab_id: c.labId, edition_id: c.editionId, stimulus_id: c.stimulusId, body: c.body, author_id: c.authorId })
    .returning('id')
    .executeTakeFirstOrThrow();
}

export async function setCommentResolved(db: DbHandle, editionId: string, commentId: string, userId: string | null): Promise<boolean> {
  const r = await db
    .updateTable('edition_comments')
    .set(userId ? { resolved_by: userId, resolved_at: new Date() } : { resolved_by: null, resolved_at: null })
    .where('edition_id', '=', editionId)
    .where('id', '=', commentId)
    .executeTakeFirst();
  return r.numUpdatedRows > 0n;
}
