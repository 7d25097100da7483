import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { publishBodySchema } from '@/lib/schemas/vocabulary';
import { publishVersion } from '@/lib/services/vocabulary/publish-version';

// Publish the draft; 409 when it lowers accuracy and no override reason is given.
export const POST = defineRoute(
  { roles: ['trainer'], params: idParamsSchema, body: publishBodySchema },
  async ({ user, params, body }) =>
    Response.json(await publishVersion({ fleetId: user.fleetId, actorId: user.id, id: params.id, body })),
);
