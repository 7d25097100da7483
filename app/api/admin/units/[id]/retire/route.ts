import { defineRoute } from '@/lib/api/define-route';
import { retireUnitBodySchema, unitParamsSchema } from '@/lib/schemas/units';
import { retireUnit } from '@/lib/services/units/retire-unit';

/** Retire a unit: kept with its records, no longer offered for new inspections. */
export const POST = defineRoute(
  { roles: ['admin'], params: unitParamsSchema, body: retireUnitBodySchema },
  async ({ user, params, body }) =>
    Response.json(
      await retireUnit({ fleetId: user.fleetId, actorId: user.id, unitId: params.id, reason: body.reason ?? null }),
    ),
);
