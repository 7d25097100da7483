import { defineRoute } from '@/lib/api/define-route';
import { readSessionState } from '@/lib/auth/read-session-user';
import { issueSessionCookie } from '@/lib/auth/issue-session-cookie';
import { roles } from '@/lib/auth/roles';
import { AppError } from '@/lib/errors';
import { changePasswordBodySchema } from '@/lib/schemas/password';
import { changePassword } from '@/lib/services/people/change-password';

/**
 * Change one's own password (open with a temporary password too: that is what it is for).
 * Every other session of the account ends; this one carries on with a fresh cookie.
 */
export const PUT = defineRoute(
  { roles, body: changePasswordBodySchema, allowTemporaryPassword: true },
  async ({ req, user, body }) => {
    const session = await readSessionState(req.headers);
    if (!session) throw new AppError('unauthenticated', 'Sign in first.');
    const { sessionVersion } = await changePassword({ userId: user.id, fleetId: user.fleetId, ...body });
    return Response.json(
      { changed: true },
      {
        headers: { 'set-cookie': await issueSessionCookie(session.token, sessionVersion), 'cache-control': 'no-store' },
      },
    );
  },
);
