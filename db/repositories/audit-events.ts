import type { DbHandle as Handle } from '../client';
import type { AuditEventRow } from '../database';
import { beforeCursor } from '../pagination';

export interface NewAuditEvent {
  labId: string | null;
  actorUserId: string | null;
  action: string;
  subjectType: string;
  subjectId: string | null;
  details?: Record<string, unknown>;
}

/** Appends one audit event; call inside the transaction of the change it records. */
export async function insertAuditEvent(db: Handle, event: NewAuditEvent): Promise<void> {
  await db
    .insertInto('audit_events')
    .values({
      lab_id: event.labId,
      actor_user_id: event.actorUserId,
      action: event.action,
      subject_type: event.subjectType,
      subject_id: event.subjectId,
      details: JSON.stringify(event.details ?? {}),
    })
    .execute();
}

/** A lab's audit events, newest first, with the actor's name, keyset-paginated; fetches `limit + 1` rows. */
export async function listAuditEventsForLab(
  db: Handle,
  labId: string,
  page: { cursor?: string | undefined; limit: number } = { limit: 100 },
): Promise<(AuditEventRow & { actor_name: string | null })[]> {
  let q = db
    .selectFrom('audit_events')
    .leftJoin('users', 'users.id', 'audit_events.actor_user_id')
    .selectAll('audit_events')
    .select('users.name as actor_name')
    .where('audit_events.lab_id', '=', labId);
  if (page.cursor) q = q.where(beforeCursor(page.cursor, 'audit_events.created_at', 'audit_events.id'));
  return q.orderBy('audit_events.created_at', 'desc').orderBy('audit_events.id', 'desc').limit(page.limit + 1).execute();
}
