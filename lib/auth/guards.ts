import 'server-only';
import { headers } from 'next/headers';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import type { SessionUser } from '@/lib/schemas/session';
import { readSessionState, type SessionState } from './read-session-user';
import type { Role } from './roles';

export type { SessionUser };

/** For pages: the session or null, read once per request (layout and page share it). */
export const findPageSession = cache(async (): Promise<SessionState | null> => readSessionState(await headers()));

/** For pages: the signed-in user or null; null too while a temporary password is to be replaced. */
export async function findPageUser(): Promise<SessionUser | null> {
  const session = await findPageSession();
  return session && !session.mustChangePassword ? session.user : null;
}

/**
 * For pages: the signed-in user, or a redirect to the sign-in page; someone who signed in with
 * a temporary password goes to the change-password page and nowhere else until it is changed.
 */
export async function requireUser(): Promise<SessionUser> {
  const session = await findPageSession();
  if (!session) redirect('/sign-in');
  if (session.mustChangePassword) redirect('/change-password');
  return session.user;
}

/** For the change-password page: any signed-in user, temporary password or not. */
export async function requirePasswordChanger(): Promise<SessionState> {
  const session = await findPageSession();
  if (!session) redirect('/sign-in?next=%2Fchange-password');
  return session;
}

/** For pages: the signed-in user holding one of these roles; others go to a plain refusal page. */
export async function requireRole(...allowed: Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!allowed.some((r) => user.roles.includes(r))) redirect('/not-allowed');
  return user;
}
