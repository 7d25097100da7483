import { defineRoute } from '@/lib/api/define-route';
import { acknowledgeBodySchema } from '@/lib/schemas/inspections';
import { recordAcknowledgement } from '@/lib/services/inspections/record-acknowledgement';

export const POST = defineRoute({ roles: ['driver'], body: acknowledgeBodySchema }, async ({ user, body }) => {
  const { acknowledgement, created } = await recordAcknowledgement({
    fleetId: user.fleetId,
    actorId: user.id,
    actorName: user.name,
    body,
  });
  return Response.json({ acknowledgement }, { status: created ? 201 : 200 });
});
