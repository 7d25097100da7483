import 'server-only';
import { encode, type JWT } from 'next-auth/jwt';
import { getEnv } from '@/lib/env';
import { sessionMaxAgeSeconds } from './config';

/** next-auth's cookie name: the __Secure- prefix when the app is served over https. */
export function sessionCookieName(): string {
  return getEnv().NEXTAUTH_URL?.startsWith('https://') ? '__Secure-next-auth.session-token' : 'next-auth.session-token';
}

/**
 * A Set-Cookie value that carries this session on under a new session version (after a password
 * change, which ends every other session). The sign-in time is kept, so the session still ends
 * one shift after sign-in.
 */
export async function issueSessionCookie(token: JWT, sessionVersion: number): Promise<string> {
  const signedInAt = token.signedInAt ?? Math.floor(Date.now() / 1000);
  const left = Math.max(1, signedInAt + sessionMaxAgeSeconds - Math.floor(Date.now() / 1000));
  const value = await encode({
    secret: getEnv().NEXTAUTH_SECRET,
    token: { ...token, sv: sessionVersion, signedInAt },
    maxAge: left,
  });
  const secure = sessionCookieName().startsWith('__Secure-');
  return `${sessionCookieName()}=${value}; Path=/; HttpOnly; SameSite=Lax; Max-Age=${left}${secure ? '; Secure' : ''}`;
}
