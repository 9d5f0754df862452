import type { DbHandle as Handle } from '../client';
import type { AuditEventRow } from '../database';

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

export function listAuditEventsForLab(db: Handle, labId: string, limit = 100): Promise<AuditEventRow[]> {
  return db
    .selectFrom('audit_events')
    .selectAll()
    .where('lab_id', '=', labId)
    .orderBy('created_at', 'desc')
    .limit(limit)
    .execute();
}
