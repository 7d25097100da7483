import 'server-only';
import bcrypt from 'bcryptjs';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { z } from 'zod';
import { getDb } from '@/lib/db';
import { bumpSessionVersion, findUserForSignIn, recordSignIn } from '@/lib/db/users';
import type { SessionUser } from '@/lib/schemas/session';
import {
  clearSignInFailures,
  findSignInDelay,
  readClientAddress,
  signInKeys,
  recordSignInFailure,
  SignInLockedError,
} from './rate-limit';
import { isRole, type Role } from './roles';

declare module 'next-auth' {
  interface Session {
    user: SessionUser;
  }
  interface User {
    id: string;
    fleetId: string;
    roles: Role[];
    sessionVersion: number;
  }
}
declare module 'next-auth/jwt' {
  interface JWT {
    uid: string;
    fleetId: string;
    roles: Role[];
    /** The account's session version when this session began (app_user.session_version). */
    sv?: number;
    /** When this session began, in seconds since the epoch; refreshing the cookie keeps it. */
    signedInAt?: number;
  }
}

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  password: z.string().min(1).max(200),
});

/**
 * Session lifetime: one long shift from sign-in. A driver signs in again the next day. The cookie
 * is re-issued on reads, but the sign-in time inside it is kept and checked on every request
 * (lib/auth/read-session-user.ts), so no amount of activity stretches a session past this.
 */
export const sessionMaxAgeSeconds = 14 * 60 * 60;

export class TemporaryPasswordExpiredError extends Error {
  constructor() {
    super('This temporary password has expired. Ask your fleet admin to invite you again, or use “Forgot password”.');
    this.name = 'TemporaryPasswordExpiredError';
  }
}

export const authOptions: NextAuthOptions = {
  session: { strategy: 'jwt', maxAge: sessionMaxAgeSeconds },
  pages: { signIn: '/sign-in', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      name: 'RigCall',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(raw, req) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        // Throttled per account (and address, behind a trusted proxy) before the password is even compared.
        const keys = signInKeys(parsed.data.email, readClientAddress(req?.headers));
        const wait = await findSignInDelay(keys);
        if (wait > 0) throw new SignInLockedError(wait);
        const user = await findUserForSignIn(parsed.data.email);
        // Compare against a dummy hash when the user is unknown, so timing does not tell.
        const hash = user?.passwordHash ?? '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.wRZ0M8bqZbWbZfXyY9kDMQsL2yXS';
        const ok = await bcrypt.compare(parsed.data.password, hash);
        if (!user || !ok || !user.active) {
          await recordSignInFailure(keys);
          return null;
        }
        if (
          user.mustChangePassword &&
          user.temporaryPasswordExpiresAt &&
          user.temporaryPasswordExpiresAt.getTime() <= Date.now()
        )
          throw new TemporaryPasswordExpiredError();
        await clearSignInFailures(keys);
        await recordSignIn(user.id);
        return {
          id: user.id,
          name: user.name,
          email: user.email,
          fleetId: user.fleetId,
          roles: user.roles.filter(isRole),
          sessionVersion: user.sessionVersion,
        };
      },
    }),
  ],
  events: {
    // Signing out ends every session of the account, including copies of this cookie.
    async signOut({ token }) {
      const uid = (token as { uid?: unknown } | null)?.uid;
      if (typeof uid === 'string') await bumpSessionVersion(getDb(), { userId: uid });
    },
  },
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.fleetId = user.fleetId;
        token.roles = user.roles;
        token.sv = user.sessionVersion;
        token.signedInAt = Math.floor(Date.now() / 1000);
      }
      // Later reads pass the token through unchanged: the sign-in time is never moved forward.
      return token;
    },
    session({ session, token }) {
      session.user = {
        id: token.uid,
        name: token.name ?? '',
        email: token.email ?? '',
        fleetId: token.fleetId,
        roles: token.roles,
      };
      return session;
    },
  },
};
