import { defineRoute } from '@/lib/api/define-route';
import { idParamsSchema } from '@/lib/schemas/common';
import { evaluateVocabulary } from '@/lib/services/vocabulary/evaluate-vocabulary';

// Run the fleet's labelled set against a version and the published one.
export const POST = defineRoute({ roles: ['trainer'], params: idParamsSchema }, async ({ user, params }) =>
  Response.json(await evaluateVocabulary({ fleetId: user.fleetId, versionId: params.id })),
);
