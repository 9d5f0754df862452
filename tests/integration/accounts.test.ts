import { afterAll, describe, expect, it } from 'vitest';
import * as api from '@/lib/server/api';
import { getDb } from '@/lib/server/db';
import { INVALID_CREDENTIALS_MESSAGE, verifyCredentials } from '@/lib/server/services/accounts';
import { findUserByEmail } from '@/db/repositories/users';
import { getEnv } from '@/lib/server/env';
import { uniqueSuffix } from '../support/db';
import { callRoute, linkIn, mailTo, sessionCookie } from '../support/actors';

afterAll(async () => {
  await getDb().destroy();
});

const PASSWORD = 'a perfectly long password';

async function signUpFresh() {
  const email = `person-${uniqueSuffix()}@test.example`;
  const r = await callRoute(api.createAccount, { body: { name: 'Person', email, password: PASSWORD, labName: 'Vision Group' } });
  return { email, r };
}

describe('sign-up', () => {
  it('creates a user and a lab in which they are Owner', async () => {
    const { email, r } = await signUpFresh();
    expect(r.status).toBe(201);
    const { labSlug, userId } = r.body as { labSlug: string; userId: string };
    expect(labSlug).toMatch(/^vision-group/);
    const labs = await callRoute(api.listLabs, { cookie: await sessionCookie(userId) });
    expect((labs.body as { items: { slug: string; role: string }[] }).items).toEqual([expect.objectContaining({ slug: labSlug, role: 'owner' })]);
    expect((await findUserByEmail(getDb(), email))?.password_hash).toMatch(/^\$2[aby]\$12\$/);
  });

  it('refuses a duplicate e-mail (any case) with a field error and writes nothing', async () => {
    const { email } = await signUpFresh();
    const labsBefore = await getDb().selectFrom('labs').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    const dup = await callRoute(api.createAccount, { body: { name: 'Again', email: email.toUpperCase(), password: PASSWORD, labName: 'Other' } });
    expect(dup.status).toBe(409);
    expect((dup.body as { errors: Record<string, string[]> }).errors.email).toBeDefined();
    const labsAfter = await getDb().selectFrom('labs').select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow();
    expect(labsAfter.n).toBe(labsBefore.n);
  });

  it('refuses a weak password with a field error', async () => {
    const r = await callRoute(api.createAccount, { body: { name: 'P', email: `weak-${uniqueSuffix()}@test.example`, password: 'short', labName: 'Lab' } });
    expect(r.status).toBe(400);
    expect((r.body as { errors: Record<string, string[]> }).errors.password?.[0]).toMatch(/at least 10/);
  });
});

describe('credentials', () => {
  it('an unknown e-mail and a wrong password get the same message', async () => {
    const { email } = await signUpFresh();
    const ip = `10.0.0.${Math.floor(Math.random() * 200)}`;
    const unknown = await verifyCredentials(getDb(), `nobody-${uniqueSuffix()}@test.example`, PASSWORD, ip).catch((e: Error) => e);
    const wrong = await verifyCredentials(getDb(), email, 'not the password', ip).catch((e: Error) => e);
    expect((unknown as Error).message).toBe(INVALID_CREDENTIALS_MESSAGE);
    expect((wrong as Error).message).toBe(INVALID_CREDENTIALS_MESSAGE);
    const ok = await verifyCredentials(getDb(), email, PASSWORD, ip);
    expect(ok.email).toBe(email);
  });

  it('limits attempts per e-mail, in PostgreSQL, then answers 429-class errors with a retry time', async () => {
    const { email } = await signUpFresh();
    const limit = getEnv().SIGNIN_LIMIT_PER_EMAIL;
    for (let i = 0; i < limit; i++) {
      await expect(verifyCredentials(getDb(), email, 'wrong', '10.1.1.1')).rejects.toMatchObject({ code: 'unauthenticated:credentials' });
    }
    // Even the right password is refused once the limit is spent.
    await expect(verifyCredentials(getDb(), email, PASSWORD, '10.1.1.2')).rejects.toMatchObject({ code: 'rate_limited:sign-in', status: 429 });
    const row = await getDb().selectFrom('rate_limits' as never).selectAll().where('key' as never, '=', `signin-email:${email}` as never).executeTakeFirst();
    expect(row).toBeDefined();
  });
});

describe('session version', () => {
  it('"sign out everywhere" ends every existing session at once', async () => {
    const { r } = await signUpFresh();
    const { userId } = r.body as { userId: string };
    const cookie = await sessionCookie(userId, 1);
    expect((await callRoute(api.listLabs, { cookie })).status).toBe(200);
    expect((await callRoute(api.signOutEverywhereRoute, { cookie })).status).toBe(200);
    expect((await callRoute(api.listLabs, { cookie })).status).toBe(401);
    expect((await callRoute(api.listLabs, { cookie: await sessionCookie(userId, 2) })).status).toBe(200);
  });

  it('a password reset works once, expires, and signs out old sessions', async () => {
    const { email, r } = await signUpFresh();
    const { userId } = r.body as { userId: string };
    const oldCookie = await sessionCookie(userId, 1);
    expect((await callRoute(api.requestPasswordResetRoute, { body: { email } })).status).toBe(202);
    // The same answer for an unknown address, and no mail.
    const ghost = `ghost-${uniqueSuffix()}@test.example`;
    expect((await callRoute(api.requestPasswordResetRoute, { body: { email: ghost } })).status).toBe(202);

    let mails = await mailTo(email);
    for (let i = 0; i < 50 && mails.length === 0; i++) {
      await new Promise((res) => setTimeout(res, 100));
      mails = await mailTo(email);
    }
    const token = new URL(linkIn(mails[0]!.text)).searchParams.get('token')!;
    const confirm = await callRoute(api.confirmPasswordReset, { body: { token, password: 'my brand new password' } });
    expect(confirm.status).toBe(200);
    expect((await callRoute(api.confirmPasswordReset, { body: { token, password: 'yet another password' } })).status).toBe(400);
    expect((await callRoute(api.listLabs, { cookie: oldCookie })).status).toBe(401);
    await expect(verifyCredentials(getDb(), email, 'my brand new password', '10.2.2.2')).resolves.toMatchObject({ email });
    expect(await mailTo(ghost)).toEqual([]);

    // An expired token is refused.
    await callRoute(api.requestPasswordResetRoute, { body: { email } });
    await getDb().updateTable('password_reset_tokens').set({ expires_at: new Date(Date.now() - 1) }).where('user_id', '=', userId).where('used_at', 'is', null).execute();
    for (let i = 0; i < 50 && (await mailTo(email)).length < 2; i++) await new Promise((res) => setTimeout(res, 100));
    const token2 = new URL(linkIn((await mailTo(email))[0]!.text)).searchParams.get('token')!;
    expect((await callRoute(api.confirmPasswordReset, { body: { token: token2, password: 'one more password' } })).status).toBe(400);
  });
});
