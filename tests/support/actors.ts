import { encode } from 'next-auth/jwt';
import bcrypt from 'bcryptjs';
import type { Db } from '@/db/client';
import { insertLab } from '@/db/repositories/labs';
import { insertMembership } from '@/db/repositories/memberships';
import { insertUser } from '@/db/repositories/users';
import type { Role } from '@/lib/schemas/roles';
import { getEnv } from '@/lib/server/env';
import { sessionCookieName } from '@/lib/server/auth/session';
import { toHandler, type RouteSpec } from '@/lib/server/http';
import { uniqueSuffix } from './db';

export const TEST_PASSWORD = 'correct horse battery';
// Cost 4 keeps fixtures fast; the product's own hashing is exercised by the sign-up and sign-in tests.
const FIXTURE_HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

/** A session cookie exactly as next-auth would set it for this user and session version. */
export async function sessionCookie(userId: string, sessionVersion = 1): Promise<string> {
  const token = await encode({ token: { uid: userId, sv: sessionVersion }, secret: getEnv().AUTH_SECRET });
  return `${sessionCookieName()}=${token}`;
}

export interface TestLab {
  id: string;
  slug: string;
  members: Record<Role, { id: string; email: string; cookie: string }>;
}

/** A fresh lab with one member per role, each with a ready session cookie. */
export async function createLabWithEveryRole(db: Db): Promise<TestLab> {
  const s = uniqueSuffix();
  const lab = await insertLab(db, { slug: `lab-${s}`, name: `Test lab ${s}` });
  const members = {} as TestLab['members'];
  for (const role of ['owner', 'designer', 'experimenter', 'reviewer'] as const) {
    const user = await insertUser(db, { email: `${role}-${s}@test.example`, name: `${role} ${s}`, passwordHash: FIXTURE_HASH });
    await insertMembership(db, lab.id, user.id, role);
    members[role] = { id: user.id, email: user.email, cookie: await sessionCookie(user.id) };
  }
  return { id: lab.id, slug: lab.slug, members };
}

/** Calls a registered route's handler as a real request would. */
export async function callRoute(
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- any route of the registry
  route: RouteSpec<any, any, any, any>,
  opts: {
    params?: Record<string, string>;
    body?: unknown;
    cookie?: string;
    /** A lab API token, sent as `Authorization: Bearer …`. */
    bearer?: string;
    query?: Record<string, string>;
    /** A file body as text with its content type, instead of JSON. */
    text?: { type: string; content: string };
    headers?: Record<string, string>;
  } = {},
): Promise<{ status: number; body: unknown; headers: Headers }> {
  let path: string = route.path;
  for (const [k, v] of Object.entries(opts.params ?? {})) path = path.replace(`{${k}}`, encodeURIComponent(v));
  const url = new URL(`http://127.0.0.1${path}`);
  for (const [k, v] of Object.entries(opts.query ?? {})) url.searchParams.set(k, v);
  const headers: Record<string, string> = { ...opts.headers };
  if (opts.cookie) headers.cookie = opts.cookie;
  if (opts.bearer) headers.authorization = `Bearer ${opts.bearer}`;
  if (opts.body !== undefined) headers['content-type'] = 'application/json';
  if (opts.text) headers['content-type'] = opts.text.type;
  const payload = opts.text ? opts.text.content : opts.body === undefined ? undefined : JSON.stringify(opts.body);
  const req = new Request(url, { method: route.method, headers, body: payload });
  const res = await toHandler(route)(req, { params: Promise.resolve(opts.params ?? {}) });
  const text = await res.text();
  const isJson = (res.headers.get('content-type') ?? '').includes('json');
  return { status: res.status, body: text ? (isJson ? JSON.parse(text) : text) : undefined, headers: res.headers };
}

/** Messages the local mail catcher holds for an address, newest first. */
export async function mailTo(address: string): Promise<{ subject: string; text: string }[]> {
  const url = getEnv().MAIL_CATCHER_URL;
  if (!url) throw new Error('MAIL_CATCHER_URL is not set');
  const res = await fetch(`${url}/messages?to=${encodeURIComponent(address)}`);
  return (await res.json()) as { subject: string; text: string }[];
}

/** The first link in a message's text. */
export function linkIn(text: string): string {
  const m = /(https?:\/\/\S+)/.exec(text);
  if (!m?.[1]) throw new Error(`no link in: ${text}`);
  return m[1];
}
