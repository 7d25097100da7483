import { defineRoute } from '@/lib/api/define-route';
import { getDb } from '@/lib/db';
import { listDriverInspections } from '@/lib/db/inspections';
import { startInspectionBodySchema } from '@/lib/schemas/inspections';
import { startInspection } from '@/lib/services/inspections/start-inspection';

export const POST = defineRoute({ roles: ['driver'], body: startInspectionBodySchema }, async ({ user, body }) => {
  const { inspection, created } = await startInspection({ fleetId: user.fleetId, actorId: user.id, body });
  return Response.json({ inspection }, { status: created ? 201 : 200 });
});

export const GET = defineRoute({ roles: ['driver'] }, async ({ user }) =>
  Response.json({
    inspections: await listDriverInspections(getDb(), { fleetId: user.fleetId, driverId: user.id, limit: 20 }),
  }),
);
