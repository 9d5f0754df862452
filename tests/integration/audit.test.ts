import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { ROLES } from '@/lib/server/policy';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';

describe('the audit log API', () => {
  let lab: TestLab;
  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
    for (const role of ['reviewer', 'experimenter', 'reviewer'] as const) {
      const r = await callRoute(api.changeLabMemberRole, { params: { lab: lab.slug, userId: lab.members.designer.id }, body: { role }, cookie: lab.members.owner.cookie });
      expect(r.status).toBe(200);
    }
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  it('every member reads it, newest first, with who did it; pages by cursor without repeats', async () => {
    for (const role of ROLES) {
      const r = await callRoute(api.listAuditEventsRoute, { params: { lab: lab.slug }, cookie: lab.members[role].cookie });
      expect(r.status).toBe(200);
    }
    const first = await callRoute(api.listAuditEventsRoute, { params: { lab: lab.slug }, query: { limit: '2' }, cookie: lab.members.reviewer.cookie });
    const page1 = first.body as { items: { id: string; action: string; actor: string; details: { to?: string } }[]; nextCursor: string };
    expect(page1.items.map((e) => e.details.to)).toEqual(['reviewer', 'experimenter']);
    expect(page1.items[0]!.action).toBe('member.role-change');
    expect(page1.items[0]!.actor).toMatch(/^owner /);
    const second = await callRoute(api.listAuditEventsRoute, { params: { lab: lab.slug }, query: { limit: '2', cursor: page1.nextCursor }, cookie: lab.members.reviewer.cookie });
    const page2 = second.body as { items: { id: string; details: { to?: string } }[] };
    expect(page2.items.map((e) => e.details.to)).toEqual(['reviewer']);
    expect(page2.items.some((e) => page1.items.some((p) => p.id === e.id))).toBe(false);
  });

  it('another lab sees nothing (404), and a malformed cursor is a 400', async () => {
    const other = await createLabWithEveryRole(getDb());
    expect((await callRoute(api.listAuditEventsRoute, { params: { lab: lab.slug }, cookie: other.members.owner.cookie })).status).toBe(404);
    expect((await callRoute(api.listAuditEventsRoute, { params: { lab: lab.slug }, query: { cursor: 'bm9wZQ' }, cookie: lab.members.owner.cookie })).status).toBe(400);
  });
});
