import 'server-only';
import type { Session } from 'next-auth';
import { redirect } from 'next/navigation';
import { auth } from './index';
import type { Role } from './roles';

export type SessionUser = Session['user'];

/** For pages: the signed-in user, or a redirect to the sign-in page. */
export async function requireUser(): Promise<SessionUser> {
  const session = await auth();
  if (!session) redirect('/sign-in');
  return session.user;
}

/** For pages: the signed-in user holding one of these roles; others go to a plain refusal page. */
export async function requireRole(...allowed: Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!allowed.some((r) => user.roles.includes(r))) redirect('/not-allowed');
  return user;
}
