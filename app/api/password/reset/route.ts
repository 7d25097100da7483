import { defineRoute } from '@/lib/api/define-route';
import { resetPasswordBodySchema } from '@/lib/schemas/password';
import { resetPassword } from '@/lib/services/people/change-password';

/** A new password from a "forgot password" link; every session of the account ends. */
export const POST = defineRoute({ roles: 'public', body: resetPasswordBodySchema }, async ({ body }) => {
  await resetPassword(body);
  return Response.json({ changed: true });
});
