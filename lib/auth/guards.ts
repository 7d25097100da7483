import 'server-only';
import type { Session } from 'next-auth';
import { redirect } from 'next/navigation';
import { findActiveUser } from '@/lib/db/users';
import { auth } from './index';
import { isRole, type Role } from './roles';

export type SessionUser = Session['user'];

/**
 * For pages: the signed-in user, or a redirect to the sign-in page. The account is read again,
 * so a deactivated user is out at once and a changed role shows on the next page.
 */
export async function requireUser(): Promise<SessionUser> {
  const session = await auth();
  if (!session) redirect('/sign-in');
  const current = await findActiveUser(session.user.id);
  if (!current) redirect('/sign-in');
  return {
    ...session.user,
    name: current.name,
    email: current.email,
    fleetId: current.fleetId,
    roles: current.roles.filter(isRole),
  };
}

/** For pages: the signed-in user holding one of these roles; others go to a plain refusal page. */
export async function requireRole(...allowed: Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!allowed.some((r) => user.roles.includes(r))) redirect('/not-allowed');
  return user;
}
