import 'server-only';
import { headers } from 'next/headers';
import { redirect } from 'next/navigation';
import { cache } from 'react';
import type { SessionUser } from '@/lib/schemas/session';
import { readSessionUser } from './read-session-user';
import type { Role } from './roles';

export type { SessionUser };

/** For pages: the signed-in user or null, read once per request (layout and page share it). */
export const findPageUser = cache(async (): Promise<SessionUser | null> => readSessionUser(await headers()));

/** For pages: the signed-in user, or a redirect to the sign-in page. */
export async function requireUser(): Promise<SessionUser> {
  const user = await findPageUser();
  if (!user) redirect('/sign-in');
  return user;
}

/** For pages: the signed-in user holding one of these roles; others go to a plain refusal page. */
export async function requireRole(...allowed: Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!allowed.some((r) => user.roles.includes(r))) redirect('/not-allowed');
  return user;
}
