import type { DbHandle } from '../client';
import type { ApiTokenScope, LabApiTokenRow } from '../database';
import { beforeCursor } from '../pagination';

export type ApiTokenListRow = LabApiTokenRow & { created_by_name: string | null };

/** A lab's API tokens, newest first, keyset-paginated; fetches `limit + 1` rows. */
export function listApiTokens(db: DbHandle, labId: string, page: { cursor?: string | undefined; limit: number }): Promise<ApiTokenListRow[]> {
  let q = db
    .selectFrom('lab_api_tokens')
    .leftJoin('users', 'users.id', 'lab_api_tokens.created_by')
    .selectAll('lab_api_tokens')
    .select('users.name as created_by_name')
    .where('lab_api_tokens.lab_id', '=', labId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'lab_api_tokens.created_at', 'lab_api_tokens.id'));
  return q.orderBy('lab_api_tokens.created_at', 'desc').orderBy('lab_api_tokens.id', 'desc').limit(page.limit + 1).execute();
}

export function insertApiToken(
  db: DbHandle,
  t: { labId: string; name: string; scope: ApiTokenScope; tokenHash: string; tokenPrefix: string; createdBy: string; expiresAt: Date },
): Promise<LabApiTokenRow> {
  return db
    .insertInto('lab_api_tokens')
    .values({ lab_id: t.labId, name: t.name, scope: t.scope, token_hash: t.tokenHash, token_prefix: t.tokenPrefix, created_by: t.createdBy, expires_at: t.expiresAt })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** The token with this hash, with its lab's slug, whatever its state (the caller checks expiry and revocation). */
export function findApiTokenByHash(db: DbHandle, tokenHash: string): Promise<(LabApiTokenRow & { lab_slug: string }) | undefined> {
  return db
    .selectFrom('lab_api_tokens')
    .innerJoin('labs', 'labs.id', 'lab_api_tokens.lab_id')
    .selectAll('lab_api_tokens')
    .select('labs.slug as lab_slug')
    .where('lab_api_tokens.token_hash', '=', tokenHash)
    .executeTakeFirst();
}

/** Records a use, at most once a minute per token, so a busy script does not write on every request. */
export async function touchApiToken(db: DbHandle, id: string, now: Date): Promise<void> {
  await db
    .updateTable('lab_api_tokens')
    .set({ last_used_at: now })
    .where('id', '=', id)
    .where((eb) => eb.or([eb('last_used_at', 'is', null), eb('last_used_at', '<', new Date(now.getTime() - 60_000))]))
    .execute();
}

/** Revokes a live token of the lab; undefined when there is none (unknown, or revoked already). */
export function revokeApiToken(db: DbHandle, labId: string, id: string, by: string): Promise<LabApiTokenRow | undefined> {
  return db
    .updateTable('lab_api_tokens')
    .set({ revoked_at: new Date(), revoked_by: by })
    .where('lab_id', '=', labId)
    .where('id', '=', id)
    .where('revoked_at', 'is', null)
    .returningAll()
    .executeTakeFirst();
}

export function findApiToken(db: DbHandle, labId: string, id: string): Promise<LabApiTokenRow | undefined> {
  return db.selectFrom('lab_api_tokens').selectAll().where('lab_id', '=', labId).where('id', '=', id).executeTakeFirst();
}
