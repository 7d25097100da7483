import { defineRoute } from '@/lib/api/define-route';
import { forgotPasswordBodySchema } from '@/lib/schemas/password';
import { requestPasswordReset } from '@/lib/services/people/change-password';

/** "Forgot password": the same answer whether or not the address has an account. */
export const POST = defineRoute({ roles: 'public', body: forgotPasswordBodySchema }, async ({ body }) => {
  await requestPasswordReset(body);
  return Response.json({
    message: 'If this address has a RigCall account, a link to choose a new password is on its way.',
  });
});
