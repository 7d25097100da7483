import 'server-only';
import { getToken } from 'next-auth/jwt';
import { findActiveUser } from '@/lib/db/users';
import { getEnv } from '@/lib/env';
import type { SessionUser } from '@/lib/schemas/session';
import { isRole } from './roles';

function readCookies(header: string | null): Map<string, string> {
  const map = new Map<string, string>();
  for (const part of (header ?? '').split(';')) {
    const i = part.indexOf('=');
    if (i > 0) map.set(part.slice(0, i).trim(), decodeURIComponent(part.slice(i + 1).trim()));
  }
  return map;
}

/**
 * The signed-in user of a request, or null: the session cookie in these headers, checked against
 * the database, so a deactivated user is out at once and a changed role counts on the next
 * request. Route handlers pass `req.headers`; pages go through `lib/auth/guards.ts`.
 */
export async function readSessionUser(headers: Headers): Promise<SessionUser | null> {
  const token = await getToken({
    req: { headers, cookies: readCookies(headers.get('cookie')) } as never,
    secret: getEnv().NEXTAUTH_SECRET,
  });
  if (!token?.uid) return null;
  const user = await findActiveUser(token.uid);
  if (!user) return null;
  return { id: user.id, name: user.name, email: user.email, fleetId: user.fleetId, roles: user.roles.filter(isRole) };
}
