import 'server-only';
import bcrypt from 'bcryptjs';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { z } from 'zod';
import { findUserForSignIn, recordSignIn } from '@/lib/db/users';
import type { SessionUser } from '@/lib/schemas/session';
import {
  clearSignInFailures,
  findSignInLockout,
  readClientAddress,
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
  }
}
declare module 'next-auth/jwt' {
  interface JWT {
    uid: string;
    fleetId: string;
    roles: Role[];
  }
}

const credentialsSchema = z.object({
  email: z.string().trim().toLowerCase().email().max(254),
  password: z.string().min(1).max(200),
});

/** Session lifetime: one long shift. A driver signs in again the next day. */
export const sessionMaxAgeSeconds = 14 * 60 * 60;

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
        // Throttled per account and per address before the password is even compared.
        const keys = { account: parsed.data.email, address: readClientAddress(req?.headers) };
        const wait = await findSignInLockout(keys);
        if (wait > 0) throw new SignInLockedError(wait);
        const user = await findUserForSignIn(parsed.data.email);
        // Compare against a dummy hash when the user is unknown, so timing does not tell.
        const hash = user?.passwordHash ?? '$2b$10$CwTycUXWue0Thq9StjUM0uJ8.wRZ0M8bqZbWbZfXyY9kDMQsL2yXS';
        const ok = await bcrypt.compare(parsed.data.password, hash);
        if (!user || !ok || !user.active) {
          await recordSignInFailure(keys);
          return null;
        }
        await clearSignInFailures(keys);
        await recordSignIn(user.id);
        return {
          id: user.id,
          name: user.name,
          email: user.email,
          fleetId: user.fleetId,
          roles: user.roles.filter(isRole),
        };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user) {
        token.uid = user.id;
        token.fleetId = user.fleetId;
        token.roles = user.roles;
      }
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
