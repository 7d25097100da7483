import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { idParamsSchema } from '@/lib/schemas/common';
import { updateDraftBodySchema } from '@/lib/schemas/vocabulary';
import { getVocabularyVersionOrThrow } from '@/lib/services/vocabulary/get-vocabulary-version-or-throw';
import { updateDraftGrammar } from '@/lib/services/vocabulary/update-draft-grammar';

export const GET = defineRoute({ roles: ['trainer'], params: idParamsSchema }, async ({ user, params }) =>
  Response.json(await getVocabularyVersionOrThrow(getDb(), { fleetId: user.fleetId, id: params.id })),
);

// The editor saves the whole grammar document of the draft; a published version answers 409.
export const PUT = defineRoute(
  { roles: ['trainer'], params: idParamsSchema, body: updateDraftBodySchema, maxBodyBytes: 4 * 1024 * 1024 },
  async ({ user, params, body }) =>
    Response.json(
      await updateDraftGrammar({
        fleetId: user.fleetId,
        actorId: user.id,
        id: params.id,
        grammar: body.grammar,
        label: body.label,
        baseUpdatedAt: body.baseUpdatedAt,
      }),
    ),
);
