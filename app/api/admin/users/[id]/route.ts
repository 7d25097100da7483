import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { findFleetUser } from '@/lib/db/users';
import { AppError } from '@/lib/errors';
import { updateUserBodySchema, userParamsSchema } from '@/lib/schemas/users';
import { updateUser } from '@/lib/services/people/update-user';

export const GET = defineRoute({ roles: ['admin'], params: userParamsSchema }, async ({ user, params }) => {
  const found = await findFleetUser(getDb(), { fleetId: user.fleetId, id: params.id });
  if (!found) throw new AppError('not_found', 'There is no such user in this fleet.');
  return Response.json({ user: found });
});

/** Rename, change roles, deactivate (active: false) or reactivate (active: true). */
export const PATCH = defineRoute(
  { roles: ['admin'], params: userParamsSchema, body: updateUserBodySchema },
  async ({ user, params, body }) =>
    Response.json(await updateUser({ fleetId: user.fleetId, actorId: user.id, userId: params.id, ...body })),
);
