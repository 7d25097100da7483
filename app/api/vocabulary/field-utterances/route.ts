import { defineRoute } from '@/lib/api/define-route';
import { dismissUtterancesBodySchema } from '@/lib/schemas/vocabulary';
import { dismissFieldUtterances } from '@/lib/services/vocabulary/dismiss-field-utterances';
import { listFieldUtterances } from '@/lib/services/vocabulary/list-field-utterances';

// The inbox: what drivers said that matched nothing, matched unsurely, or was corrected.
export const GET = defineRoute({ roles: ['trainer'] }, async ({ user }) =>
  Response.json(await listFieldUtterances({ fleetId: user.fleetId })),
);

// Dismiss utterances that need no phrase (chatter, noise).
export const PATCH = defineRoute({ roles: ['trainer'], body: dismissUtterancesBodySchema }, async ({ user, body }) =>
  Response.json(await dismissFieldUtterances({ fleetId: user.fleetId, actorId: user.id, ids: body.ids })),
);
