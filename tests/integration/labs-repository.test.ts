import { afterAll, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { AppError } from '@/lib/errors';
import { getLabBySlug, insertLab, listLabsByIds } from '@/db/repositories/labs';
import { insertAuditEvent, listAuditEventsForLab } from '@/db/repositories/audit-events';
import { toPage } from '@/db/pagination';
import { testDb, uniqueSuffix } from '../support/db';

const db = testDb();
afterAll(() => db.destroy());

describe('labs repository', () => {
  it('pages through labs with a keyset cursor, without gaps or repeats', async () => {
    const suffix = uniqueSuffix();
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push((await insertLab(db, { slug: `lab-${suffix}-${i}`, name: `Lab ${i}` })).id);
    // Rows made within one millisecond, microseconds apart, as a fast insert loop makes them: a cursor carries a
    // JavaScript Date, so the rows between its millisecond and the row it came from must not be skipped.
    for (const [i, id] of ids.entries()) {
      await sql`UPDATE labs SET created_at = ${`2026-03-01T10:00:00.1234${i}1Z`}::timestamptz WHERE id = ${id}`.execute(db);
    }

    const seen: string[] = [];
    let cursor: string | undefined;
    for (let guard = 0; guard < 10; guard++) {
      const rows = await listLabsByIds(db, ids, { cursor, limit: 2 });
      const page = toPage(rows, 2, (r) => r.created_at, (r) => r.id);
      seen.push(...page.items);
      if (!page.nextCursor) break;
      cursor = page.nextCursor;
    }
    expect(seen.sort()).toEqual([...ids].sort());
  });

  it('rejects a malformed cursor as a validation error', async () => {
    await expect(listLabsByIds(db, ['00000000-0000-0000-0000-000000000000'], { cursor: 'bm90LWpzb24', limit: 2 })).rejects.toMatchObject({
      code: 'validation:pagination',
    });
  });

  it('get… throws not-found; the slug format is enforced by the database', async () => {
    await expect(getLabBySlug(db, 'no-such-lab-here')).rejects.toBeInstanceOf(AppError);
    await expect(insertLab(db, { slug: 'Bad Slug', name: 'x' })).rejects.toThrow(/labs_slug_format/);
  });

  it('records audit events per lab', async () => {
    const lab = await insertLab(db, { slug: `audit-${uniqueSuffix()}`, name: 'Audit lab' });
    await insertAuditEvent(db, { labId: lab.id, actorUserId: null, action: 'lab.create', subjectType: 'lab', subjectId: lab.id, details: { name: 'Audit lab' } });
    const events = await listAuditEventsForLab(db, lab.id);
    expect(events).toHaveLength(1);
    expect(events[0]?.details).toEqual({ name: 'Audit lab' });
  });
});
