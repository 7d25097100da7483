import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { findFleetUnit } from '@/lib/db/units';
import { AppError } from '@/lib/errors';
import { unitParamsSchema, updateUnitBodySchema } from '@/lib/schemas/units';
import { updateUnit } from '@/lib/services/units/update-unit';

export const GET = defineRoute({ roles: ['admin'], params: unitParamsSchema }, async ({ user, params }) => {
  const unit = await findFleetUnit(getDb(), { fleetId: user.fleetId, id: params.id });
  if (!unit) throw new AppError('not_found', 'There is no such unit in this fleet.');
  return Response.json({ unit });
});

export const PATCH = defineRoute(
  { roles: ['admin'], params: unitParamsSchema, body: updateUnitBodySchema },
  async ({ user, params, body }) =>
    Response.json(await updateUnit({ fleetId: user.fleetId, actorId: user.id, unitId: params.id, ...body })),
);
