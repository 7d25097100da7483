import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { listVocabularyVersions } from '@/lib/db/vocabulary';
import { createVersionBodySchema } from '@/lib/schemas/vocabulary';
import { createDraftVersion } from '@/lib/services/vocabulary/create-draft-version';

// The fleet's vocabulary versions: the open draft and every published one.
export const GET = defineRoute({ roles: ['trainer'] }, async ({ user }) =>
  Response.json({ versions: await listVocabularyVersions(getDb(), { fleetId: user.fleetId }) }),
);

// Open the fleet's draft (201), or return the one already open (200).
export const POST = defineRoute({ roles: ['trainer'], body: createVersionBodySchema }, async ({ user, body }) => {
  const { version, created } = await createDraftVersion({ fleetId: user.fleetId, actorId: user.id, body });
  return Response.json(version, { status: created ? 201 : 200 });
});
