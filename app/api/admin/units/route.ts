import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { listFleetUnits } from '@/lib/db/units';
import { createUnitBodySchema, listUnitsQuerySchema } from '@/lib/schemas/units';
import { createUnit } from '@/lib/services/units/create-unit';

/** The fleet's tractors and trailers; ?kind=tractor|trailer, ?retired=include|exclude|only. */
export const GET = defineRoute({ roles: ['admin'], query: listUnitsQuerySchema }, async ({ user, query }) =>
  Response.json({ units: await listFleetUnits(getDb(), { fleetId: user.fleetId, ...query }) }),
);

export const POST = defineRoute({ roles: ['admin'], body: createUnitBodySchema }, async ({ user, body }) =>
  Response.json(
    await createUnit({
      fleetId: user.fleetId,
      actorId: user.id,
      ...body,
      plate: body.plate ?? null,
      plateJurisdiction: body.plateJurisdiction ?? null,
      vin: body.vin ?? null,
      make: body.make ?? null,
      model: body.model ?? null,
      year: body.year ?? null,
    }),
    { status: 201 },
  ),
);
