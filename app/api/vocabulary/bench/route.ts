import { defineRoute } from '@/lib/api/define-route';
import { benchBodySchema } from '@/lib/schemas/vocabulary';
import { runTestBench } from '@/lib/services/vocabulary/run-test-bench';

// One typed or spoken utterance through the draft and the published version.
export const POST = defineRoute({ roles: ['trainer'], body: benchBodySchema }, async ({ user, body }) =>
  Response.json(await runTestBench({ fleetId: user.fleetId, body })),
);
