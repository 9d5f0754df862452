import 'server-only';
import { notFound, redirect } from 'next/navigation';
import { AppError } from '@/lib/errors';
import { findUserById } from '@/db/repositories/users';
import type { UserRow } from '@/db/database';
import { getPagePrincipal } from './auth/principal';
import { getDb } from './db';
import { resolveLabActor, type LabActor } from './services/access';

/** The signed-in user for a page, or a redirect to sign-in that comes back here. */
export async function requirePageUser(returnTo: string): Promise<UserRow> {
  const principal = await getPagePrincipal();
  const user = principal.kind === 'user' ? await findUserById(getDb(), principal.userId) : undefined;
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
  return user;
}

/** The caller as a member of the page's lab; a lab they are not in is a 404, as in the API. */
export async function requireLabPageActor(labSlug: string, returnTo = `/labs/${labSlug}`): Promise<{ actor: LabActor; user: UserRow }> {
  const user = await requirePageUser(returnTo);
  try {
    const actor = await resolveLabActor(getDb(), { kind: 'user', userId: user.id }, labSlug);
    return { actor, user };
  } catch (error) {
    if (error instanceof AppError && error.kind === 'not_found') notFound();
    throw error;
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A page's id segment must be a UUID; anything else is the 404 page, not a database error. */
export function requireUuidSegment(value: string): void {
  if (!UUID.test(value)) notFound();
}

/** The service's answer, with its not-found error shown as the 404 page. */
export async function orNotFound<T>(work: Promise<T>): Promise<T> {
  try {
    return await work;
  } catch (error) {
    if (error instanceof AppError && error.kind === 'not_found') notFound();
    throw error;
  }
}
