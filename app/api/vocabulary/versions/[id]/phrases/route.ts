import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { addPhraseBodySchema } from '@/lib/schemas/vocabulary';
import { addFieldPhrase } from '@/lib/services/vocabulary/add-field-phrase';

// Add what a driver said as a phrase of a term in the draft (the inbox's one-click action).
export const POST = defineRoute(
  { roles: ['trainer'], params: idParamsSchema, body: addPhraseBodySchema },
  async ({ user, params, body }) =>
    Response.json(await addFieldPhrase({ fleetId: user.fleetId, actorId: user.id, versionId: params.id, body }), {
      status: 201,
    }),
);
