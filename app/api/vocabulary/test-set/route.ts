import { z } from 'zod';
import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { saveTestSetBodySchema } from '@/lib/schemas/vocabulary';
import { loadTestSet } from '@/lib/services/vocabulary/load-test-set';
import { saveTestSet } from '@/lib/services/vocabulary/save-test-set';

const testSetQuerySchema = z.object({ format: z.enum(['json', 'jsonl']).default('json') });

// The fleet's labelled set (or the repository's): a summary, or ?format=jsonl to download it.
export const GET = defineRoute({ roles: ['trainer'], query: testSetQuerySchema }, async ({ user, query }) => {
  const set = await loadTestSet(getDb(), { fleetId: user.fleetId });
  if (query.format === 'jsonl') {
    return new Response(set.jsonl, {
      headers: {
        'content-type': 'application/x-ndjson; charset=utf-8',
        'content-disposition': 'attachment; filename="labelled-utterances.jsonl"',
        'cache-control': 'no-store',
      },
    });
  }
  return Response.json({ name: set.name, source: set.source, count: set.items.length, updatedAt: set.updatedAt });
});

// Import a labelled JSONL set as the fleet's own.
export const PUT = defineRoute(
  { roles: ['trainer'], body: saveTestSetBodySchema, maxBodyBytes: 3 * 1024 * 1024 },
  async ({ user, body }) => Response.json(await saveTestSet({ fleetId: user.fleetId, actorId: user.id, body })),
);
