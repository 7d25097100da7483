import { defineRoute } from '@/lib/api/define-route';
import { importGrammarBodySchema } from '@/lib/schemas/vocabulary';
import { importGrammar } from '@/lib/services/vocabulary/import-grammar';

// Load grammars/ files into the fleet's draft.
export const POST = defineRoute(
  { roles: ['trainer'], body: importGrammarBodySchema, maxBodyBytes: 4 * 1024 * 1024 },
  async ({ user, body }) => Response.json(await importGrammar({ fleetId: user.fleetId, actorId: user.id, body })),
);
