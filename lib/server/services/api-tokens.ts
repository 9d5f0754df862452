import 'server-only';
import { notFound } from '@/lib/errors';
import type { Db } from '@/db/client';
import type { LabApiTokenRow } from '@/db/database';
import { toPage } from '@/db/pagination';
import { insertAuditEvent } from '@/db/repositories/audit-events';
import { findApiToken, insertApiToken, listApiTokens as listRows, revokeApiToken as revokeRow, type ApiTokenListRow } from '@/db/repositories/api-tokens';
import type { ApiTokenValue, CreateApiTokenInput, CreatedApiToken } from '@/lib/schemas/api-token';
import type { Page, PageQuery } from '@/lib/schemas/common';
import { mintApiToken } from '../auth/api-token-auth';
import { authorize, type LabActor } from './access';

const DAY_MS = 24 * 3600 * 1000;

function toValue(row: LabApiTokenRow & { created_by_name?: string | null }, now = new Date()): ApiTokenValue {
  return {
    id: row.id,
    name: row.name,
    scope: row.scope,
    prefix: row.token_prefix,
    createdBy: row.created_by_name ?? null,
    createdAt: row.created_at.toISOString(),
    expiresAt: row.expires_at.toISOString(),
    lastUsedAt: row.last_used_at?.toISOString() ?? null,
    revokedAt: row.revoked_at?.toISOString() ?? null,
    state: row.revoked_at ? 'revoked' : row.expires_at.getTime() <= now.getTime() ? 'expired' : 'active',
  };
}

/** The lab's API tokens, newest first (Owners only): never the secrets, only their first characters. */
export async function listApiTokens(db: Db, actor: LabActor, page: PageQuery): Promise<Page<ApiTokenValue>> {
  authorize(actor, 'tokens:manage');
  const rows = await listRows(db, actor.labId, page);
  return toPage(rows, page.limit, (r: ApiTokenListRow) => r.created_at, (r) => toValue(r));
}

/** Makes a token for the lab; the answer carries the secret, which is shown this once and stored only hashed. */
export async function createApiToken(db: Db, actor: LabActor, input: Required<CreateApiTokenInput>): Promise<CreatedApiToken> {
  authorize(actor, 'tokens:manage');
  const { token, hash, prefix } = mintApiToken();
  return db.transaction().execute(async (trx) => {
    const row = await insertApiToken(trx, {
      labId: actor.labId,
      name: input.name,
      scope: input.scope,
      tokenHash: hash,
      tokenPrefix: prefix,
      createdBy: actor.userId,
      expiresAt: new Date(Date.now() + input.expiresInDays * DAY_MS),
    });
    await insertAuditEvent(trx, {
      labId: actor.labId,
      actorUserId: actor.userId,
      action: 'api-token.create',
      subjectType: 'api-token',
      subjectId: row.id,
      details: { name: input.name, scope: input.scope, expiresAt: row.expires_at.toISOString() },
    });
    return { ...toValue(row), token };
  });
}

/** Revokes a token at once: its next request is 401. Revoking one already revoked is 404. */
export async function revokeApiToken(db: Db, actor: LabActor, tokenId: string): Promise<ApiTokenValue> {
  authorize(actor, 'tokens:manage');
  return db.transaction().execute(async (trx) => {
    const row = await revokeRow(trx, actor.labId, tokenId, actor.userId);
    if (!row) {
      const existing = await findApiToken(trx, actor.labId, tokenId);
      throw notFound('token', existing ? 'That token is revoked already.' : 'No such API token in this lab.');
    }
    await insertAuditEvent(trx, { labId: actor.labId, actorUserId: actor.userId, action: 'api-token.revoke', subjectType: 'api-token', subjectId: row.id, details: { name: row.name } });
    return toValue(row);
  });
}
