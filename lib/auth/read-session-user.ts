import 'server-only';
import { getToken, type JWT } from 'next-auth/jwt';
import { sessionMaxAgeSeconds } from './config';
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

// Decoding a session cookie derives the key (HKDF) and decrypts the token, on every request of
// a walk. The same cookie always decodes to the same token, so the result is kept per process for
// a few minutes, keyed by the cookie's own bytes; the account check below still runs every time.
const decoded = new Map<string, { token: JWT | null; until: number }>();
const keepDecodedMs = 5 * 60 * 1000;

async function decodeSessionCookie(headers: Headers): Promise<JWT | null> {
  const cookies = readCookies(headers.get('cookie'));
  const raw = [...cookies]
    .filter(([name]) => name.includes('next-auth.session-token'))
    .map(([name, value]) => `${name}=${value}`)
    .sort()
    .join(';');
  const now = Date.now();
  const kept = raw ? decoded.get(raw) : undefined;
  if (kept && kept.until > now) return kept.token;
  const token = await getToken({ req: { headers, cookies } as never, secret: getEnv().NEXTAUTH_SECRET });
  if (raw) {
    if (decoded.size >= 20_000) decoded.delete(decoded.keys().next().value!);
    // Never past the token's own expiry.
    const expires = typeof token?.exp === 'number' ? token.exp * 1000 : Infinity;
    decoded.set(raw, { token, until: Math.min(now + keepDecodedMs, expires) });
  }
  return token;
}

export type SessionState = {
  user: SessionUser;
  /** Signed in with a temporary password: only the change-password page and route are open. */
  mustChangePassword: boolean;
  /** The decoded token, for re-issuing the cookie after a password change. */
  token: JWT;
};

/**
 * The session of a request, or null: the cookie in these headers, checked against the database
 * on every request. It is refused when the account is inactive, when the session version it was
 * issued under is no longer the account's (sign-out, password change, deactivation or role
 * change since), or when it began more than one shift ago, however often it was refreshed.
 */
export async function readSessionState(headers: Headers): Promise<SessionState | null> {
  const token = await decodeSessionCookie(headers);
  if (!token?.uid) return null;
  const signedInAt = token.signedInAt;
  if (typeof signedInAt !== 'number' || Date.now() / 1000 - signedInAt > sessionMaxAgeSeconds) return null;
  const user = await findActiveUser(token.uid);
  if (!user || token.sv !== user.sessionVersion) return null;
  return {
    user: { id: user.id, name: user.name, email: user.email, fleetId: user.fleetId, roles: user.roles.filter(isRole) },
    mustChangePassword: user.mustChangePassword,
    token,
  };
}

/**
 * The signed-in user of a request, or null (see readSessionState). A user who still has to
 * replace a temporary password counts as signed in here; callers decide what stays open.
 * Route handlers pass `req.headers`; pages go through `lib/auth/guards.ts`.
 */
export async function readSessionUser(headers: Headers): Promise<SessionUser | null> {
  return (await readSessionState(headers))?.user ?? null;
}
