import 'server-only';
import type { Db } from '@/db/client';
import { toPage } from '@/db/pagination';
import { listAuditEventsForLab } from '@/db/repositories/audit-events';
import type { AuditEvent } from '@/lib/schemas/audit';
import type { Page, PageQuery } from '@/lib/schemas/common';
import { authorize, type LabActor } from './access';

/** The lab's audit log, newest first. */
export async function listAuditEvents(db: Db, actor: LabActor, query: PageQuery): Promise<Page<AuditEvent>> {
  authorize(actor, 'audit:read');
  const rows = await listAuditEventsForLab(db, actor.labId, query);
  return toPage(rows, query.limit, (r) => r.created_at, (r) => ({
    id: r.id,
    action: r.action,
    subjectType: r.subject_type,
    subjectId: r.subject_id,
    actor: r.actor_name,
    details: r.details,
    at: r.created_at.toISOString(),
  }));
}
