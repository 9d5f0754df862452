import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { POLICY_ACTIONS, ROLES, can, type PolicyAction, type Role } from '@/lib/server/policy';
import { callRoute, createLabWithEveryRole, type TestLab } from '../support/actors';

// The roles as the product defines them (issue 3), written out independently of lib/server/policy.ts:
// Owner: everything. Designer: seed shapes, spaces (also from a study's equalisation), boundaries, editions (freeze, submit).
// Experimenter: boundaries, new spaces from a study's perceptual equalisation, norming studies (and their sessions), run orders, stimulus packs. Reviewer: reads everything, comments,
// approves or returns editions. Display profiles serve packs and studies, so the three making roles edit them.
const WRITES: Record<Role, PolicyAction[]> = {
  owner: [...POLICY_ACTIONS],
  designer: ['seed:write', 'space:write', 'space:derive', 'boundary:write', 'edition:freeze', 'edition:submit', 'edition:comment', 'profile:write'],
  experimenter: ['boundary:write', 'space:derive', 'study:write', 'session:manage', 'runorder:write', 'results:write', 'pack:create', 'edition:comment', 'profile:write'],
  reviewer: ['edition:comment', 'edition:decide'],
};
const isRead = (a: PolicyAction) => a.endsWith(':read');

describe('the policy table', () => {
  for (const role of ROLES) {
    for (const action of POLICY_ACTIONS) {
      const expected = isRead(action) || WRITES[role].includes(action);
      it(`${role} × ${action} → ${expected ? 'allowed' : 'denied'}`, () => {
        expect(can(role, action)).toBe(expected);
      });
    }
  }
});

describe('member routes, role by role, against real PostgreSQL', () => {
  let lab: TestLab;
  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  it('every role reads the member list; nobody outside the lab sees that it exists', async () => {
    for (const role of ROLES) {
      const r = await callRoute(api.listLabMembers, { params: { lab: lab.slug }, cookie: lab.members[role].cookie });
      expect(r.status).toBe(200);
      expect((r.body as { items: unknown[] }).items).toHaveLength(4);
    }
    const other = await createLabWithEveryRole(getDb());
    const r = await callRoute(api.listLabMembers, { params: { lab: lab.slug }, cookie: other.members.owner.cookie });
    expect(r.status).toBe(404);
    const anon = await callRoute(api.listLabMembers, { params: { lab: lab.slug } });
    expect(anon.status).toBe(401);
  });

  it('only the Owner changes members or invites; others get 403 and nothing changes', async () => {
    for (const role of ['designer', 'experimenter', 'reviewer'] as const) {
      const patch = await callRoute(api.changeLabMemberRole, {
        params: { lab: lab.slug, userId: lab.members.reviewer.id },
        body: { role: 'owner' },
        cookie: lab.members[role].cookie,
      });
      expect(patch.status).toBe(403);
      const invite = await callRoute(api.createLabInvitation, {
        params: { lab: lab.slug },
        body: { email: `x-${role}@test.example`, role: 'reviewer' },
        cookie: lab.members[role].cookie,
      });
      expect(invite.status).toBe(403);
      const del = await callRoute(api.removeLabMember, { params: { lab: lab.slug, userId: lab.members.owner.id }, cookie: lab.members[role].cookie });
      expect(del.status).toBe(403);
    }
    const list = await callRoute(api.listLabMembers, { params: { lab: lab.slug }, cookie: lab.members.owner.cookie });
    const roles = (list.body as { items: { role: string }[] }).items.map((m) => m.role).sort();
    expect(roles).toEqual(['designer', 'experimenter', 'owner', 'reviewer']);
  });

  it('a role change takes effect on the very next request', async () => {
    const demote = await callRoute(api.changeLabMemberRole, {
      params: { lab: lab.slug, userId: lab.members.designer.id },
      body: { role: 'reviewer' },
      cookie: lab.members.owner.cookie,
    });
    expect(demote.status).toBe(200);
    const labs = await callRoute(api.listLabs, { cookie: lab.members.designer.cookie });
    const mine = (labs.body as { items: { slug: string; role: string }[] }).items.find((l) => l.slug === lab.slug);
    expect(mine?.role).toBe('reviewer');
  });

  it('the last Owner can be neither demoted nor removed', async () => {
    const demote = await callRoute(api.changeLabMemberRole, {
      params: { lab: lab.slug, userId: lab.members.owner.id },
      body: { role: 'designer' },
      cookie: lab.members.owner.cookie,
    });
    expect(demote.status).toBe(409);
    expect((demote.body as { errors: Record<string, string[]> }).errors.role?.[0]).toMatch(/at least one Owner/);
    const leave = await callRoute(api.removeLabMember, { params: { lab: lab.slug, userId: lab.members.owner.id }, cookie: lab.members.owner.cookie });
    expect(leave.status).toBe(409);
  });

  it('a tampered session token is anonymous (401)', async () => {
    const cookie = lab.members.owner.cookie;
    const tampered = cookie.slice(0, -6) + (cookie.endsWith('AAAAAA') ? 'BBBBBB' : 'AAAAAA');
    const r = await callRoute(api.listLabMembers, { params: { lab: lab.slug }, cookie: tampered });
    expect(r.status).toBe(401);
  });
});
