import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { uniqueSuffix } from '../support/db';
import { callRoute, createLabWithEveryRole, linkIn, mailTo, sessionCookie, type TestLab } from '../support/actors';

const tokenFrom = (link: string) => decodeURIComponent(new URL(link).pathname.split('/').pop()!);

async function invite(lab: TestLab, email: string, role = 'reviewer') {
  return callRoute(api.createLabInvitation, { params: { lab: lab.slug }, body: { email, role }, cookie: lab.members.owner.cookie });
}

async function latestLink(email: string): Promise<string> {
  for (let i = 0; i < 50; i++) {
    const mails = await mailTo(email);
    if (mails[0]) return linkIn(mails[0].text);
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail for ${email}`);
}

describe('the invitation life cycle', () => {
  let lab: TestLab;
  beforeAll(async () => {
    lab = await createLabWithEveryRole(getDb());
  });
  afterAll(async () => {
    await getDb().destroy();
  });

  it('invites by e-mail; a new user accepts once, with a password, and joins with the role', async () => {
    const email = `new-${uniqueSuffix()}@test.example`;
    const created = await invite(lab, email, 'experimenter');
    expect(created.status).toBe(201);
    const link = await latestLink(email);
    expect(link).toContain('/invite/');
    const token = tokenFrom(link);

    const weak = await callRoute(api.acceptInvitationAsNewUserRoute, { body: { token, name: 'New Person', password: 'short' } });
    expect(weak.status).toBe(400);
    expect((weak.body as { errors: Record<string, unknown> }).errors.password).toBeDefined();

    const accepted = await callRoute(api.acceptInvitationAsNewUserRoute, { body: { token, name: 'New Person', password: 'a long enough password' } });
    expect(accepted.status).toBe(201);
    const userId = (accepted.body as { userId: string }).userId;

    const members = await callRoute(api.listLabMembers, { params: { lab: lab.slug }, cookie: lab.members.owner.cookie });
    expect((members.body as { items: { userId: string; role: string }[] }).items).toContainEqual(expect.objectContaining({ userId, role: 'experimenter' }));

    // The link works once.
    const again = await callRoute(api.acceptInvitationAsNewUserRoute, { body: { token, name: 'Someone', password: 'a long enough password' } });
    expect(again.status).toBe(400);
    expect((again.body as { detail: string }).detail).toMatch(/already used/);
  });

  it('refuses to invite someone who is already a member, or twice', async () => {
    const member = await invite(lab, lab.members.designer.email);
    expect(member.status).toBe(409);
    expect((member.body as { errors: Record<string, string[]> }).errors.email?.[0]).toMatch(/Already a member/);
    const email = `twice-${uniqueSuffix()}@test.example`;
    expect((await invite(lab, email)).status).toBe(201);
    expect((await invite(lab, email)).status).toBe(409);
  });

  it('an expired link is refused and changes nothing', async () => {
    const email = `late-${uniqueSuffix()}@test.example`;
    await invite(lab, email);
    const token = tokenFrom(await latestLink(email));
    await getDb().updateTable('invitations').set({ expires_at: new Date(Date.now() - 1000) }).where('email', '=', email).execute();
    const r = await callRoute(api.acceptInvitationAsNewUserRoute, { body: { token, name: 'Late', password: 'a long enough password' } });
    expect(r.status).toBe(400);
    expect((r.body as { detail: string }).detail).toMatch(/expired/);
    expect(await getDb().selectFrom('users').select('id').where('email', '=', email).executeTakeFirst()).toBeUndefined();
  });

  it('revoke and resend: a revoked link fails; a resent link replaces the old one', async () => {
    const email = `resend-${uniqueSuffix()}@test.example`;
    const created = await invite(lab, email);
    const id = (created.body as { id: string }).id;
    const first = tokenFrom(await latestLink(email));
    const resent = await callRoute(api.resendLabInvitation, { params: { lab: lab.slug, invitationId: id }, cookie: lab.members.owner.cookie });
    expect(resent.status).toBe(200);
    let second = first;
    for (let i = 0; i < 50 && second === first; i++) {
      second = tokenFrom(await latestLink(email));
      if (second === first) await new Promise((r) => setTimeout(r, 100));
    }
    expect(second).not.toBe(first);
    const old = await callRoute(api.acceptInvitationAsNewUserRoute, { body: { token: first, name: 'X', password: 'a long enough password' } });
    expect(old.status).toBe(400);

    const revoked = await callRoute(api.revokeLabInvitation, { params: { lab: lab.slug, invitationId: id }, cookie: lab.members.owner.cookie });
    expect(revoked.status).toBe(204);
    const r = await callRoute(api.acceptInvitationAsNewUserRoute, { body: { token: second, name: 'X', password: 'a long enough password' } });
    expect(r.status).toBe(400);
    expect((r.body as { detail: string }).detail).toMatch(/withdrawn/);
  });

  it('an existing user accepts only while signed in as the invited address', async () => {
    const other = await createLabWithEveryRole(getDb());
    const invitee = other.members.designer;
    await invite(lab, invitee.email, 'designer');
    const token = tokenFrom(await latestLink(invitee.email));

    const wrong = await callRoute(api.joinLab, { params: { lab: lab.slug }, body: { token }, cookie: other.members.owner.cookie });
    expect(wrong.status).toBe(403);
    expect((wrong.body as { detail: string }).detail).toMatch(/signed in as/);

    const right = await callRoute(api.joinLab, { params: { lab: lab.slug }, body: { token }, cookie: await sessionCookie(invitee.id) });
    expect(right.status).toBe(201);
    const labs = await callRoute(api.listLabs, { cookie: invitee.cookie });
    expect((labs.body as { items: { slug: string }[] }).items.map((l) => l.slug).sort()).toEqual([lab.slug, other.slug].sort());
  });

  it('writes an audit event for every change', async () => {
    const events = await getDb().selectFrom('audit_events').select('action').where('lab_id', '=', lab.id).execute();
    const actions = new Set(events.map((e) => e.action));
    for (const a of ['invitation.create', 'invitation.accept', 'invitation.resend', 'invitation.revoke']) expect(actions).toContain(a);
  });
});
