import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { findFleetSettings } from '@/lib/db/fleets';
import { AppError } from '@/lib/errors';
import { updateFleetSettingsBodySchema } from '@/lib/schemas/fleet';
import { updateFleetSettings } from '@/lib/services/people/update-fleet-settings';

export const GET = defineRoute({ roles: ['admin'] }, async ({ user }) => {
  const fleet = await findFleetSettings(getDb(), { fleetId: user.fleetId });
  if (!fleet) throw new AppError('not_found', 'This fleet no longer exists.');
  return Response.json({ fleet });
});

export const PATCH = defineRoute({ roles: ['admin'], body: updateFleetSettingsBodySchema }, async ({ user, body }) =>
  Response.json(await updateFleetSettings({ fleetId: user.fleetId, actorId: user.id, ...body })),
);
